using System.Numerics;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Sequence impedances of a three-phase unit, each from its test connections solved on the unit
/// alone (IEC 60076-1 short-circuit and zero-sequence tests), against hand derivations from the
/// unit's stated impedances.
/// </summary>
public class SequenceImpedanceTests
{
    private static SequenceTest Test(string text, SequenceKind kind, string energised, string? shorted)
    {
        var e = Wn.Solved(text);
        return Assert.Single(e.SequenceImpedances).Tests.Single(t => t.Kind == kind && t.Energised == energised && t.Shorted == shorted);
    }

    private const string DeltaWye = """
        frequency 60 Hz
        core T1 construction bank rating 1500 kVA
        winding HV on T1 rated 13.8 kV delta H1 H2 H3
        winding LV on T1 rated 480 V wye X1 X2 X3 neutral X0
        impedance HV LV 5.75 % xr 6
        three-phase-supply utility H1 H2 H3 13.8 kV fault-level 250 MVA xr 12
        ground X0

        """;

    [Fact]
    public void A_delta_wye_unit_passes_its_short_circuit_impedance_in_zero_sequence_from_the_wye_side()
    {
        // R34 (IEC 60076-8 application guide, from memory): a wye-grounded/delta unit gives Z0 ≈ Z1
        // from the wye side. By hand: Z1 = 5.75 % on 1.5 MVA, at 13.8 kV 0.0575·13.8²/1.5 = 7.3 Ω per
        // phase, X/R 6; from the wye side the delta, closed in itself, is the short circuit, so Z0 is
        // the same 5.75 %, 0.0575·0.48²/1.5 = 8.832 mΩ, short-circuited or open alike.
        var z1 = Test(DeltaWye, SequenceKind.Positive, "HV", "LV");
        Wn.Near(0.0575 * 13.8e3 * 13.8e3 / 1.5e6, z1.Impedance.Magnitude, 1e-9, "Z1 ohms");
        Wn.Near(6, z1.Impedance.Imaginary / z1.Impedance.Real, 1e-9, "X/R");
        Wn.Near(0.0575, z1.PerUnit!.Value, 1e-9, "Z1 %");
        var z0 = Test(DeltaWye, SequenceKind.Zero, "LV", "HV");
        Wn.Near(0.0575 * 480 * 480 / 1.5e6, z0.Impedance.Magnitude, 1e-9, "Z0 ohms");
        Wn.Near(0.0575, Test(DeltaWye, SequenceKind.Zero, "LV", null).PerUnit!.Value, 1e-9, "Z0 open");
        // The delta has no neutral: no zero-sequence test from it.
        Assert.DoesNotContain(Wn.Solved(DeltaWye).SequenceImpedances[0].Tests, t => t.Kind == SequenceKind.Zero && t.Energised == "HV");
    }

    private const string ThreeLimb = """
        frequency 50 Hz
        core T1 construction three-limb rating 300 kVA zero-sequence 50 %
        winding HV on T1 turns 1000 rated 4160 V wye H1 H2 H3 neutral H0
        winding LV on T1 rated 480 V wye X1 X2 X3 neutral X0
        impedance HV LV 4 % xr 5
        three-phase-supply u H1 H2 H3 4160 V
        ground H0

        """;

    [Fact]
    public void A_three_limb_wye_wye_unit_has_its_zero_sequence_set_by_the_tank_path()
    {
        // R34 (IEC 60076-8 application guide, from memory): a three-limb wye-wye unit's zero-sequence
        // magnetising impedance is low (the tank path); here stated as 50 % on 300 kVA (an ideal core
        // otherwise). By hand, all in % on 300 kVA: open from HV, the tank path, j50 % (0.5·4160²/300e3
        // = 28.84 Ω) in series with HV's own resistance, half the pair's R = 4 %/√26 where the windings
        // state none; HV energised with LV short-circuited, HV's R/2 in series with j50 % in parallel
        // with the rest of the leakage, R/2 + jX (the path the flux takes outside the HV winding); LV energised with HV
        // short-circuited, the rest of the leakage in series with j50 % in parallel with HV's R/2; positive
        // sequence 4 %.
        var zsc = 0.04 * new Complex(1, 5) / Math.Sqrt(26);
        var zm = new Complex(0, 0.5);
        var open = new Complex(zsc.Real / 2, 0.5).Magnitude * 4160 * 4160 / 300e3;
        Wn.Near(open, Test(ThreeLimb, SequenceKind.Zero, "HV", null).Impedance.Magnitude, 1e-9, "Z0 open, ohms");
        Wn.Near(0.04, Test(ThreeLimb, SequenceKind.Positive, "HV", "LV").PerUnit!.Value, 1e-9, "Z1");
        var rest = zsc - zsc.Real / 2;
        Wn.Near((zsc.Real / 2 + rest * zm / (rest + zm)).Magnitude, Test(ThreeLimb, SequenceKind.Zero, "HV", "LV").PerUnit!.Value, 1e-9, "Z0 HV, LV shorted");
        Wn.Near((rest + zm * (zsc.Real / 2) / (zm + zsc.Real / 2)).Magnitude, Test(ThreeLimb, SequenceKind.Zero, "LV", "HV").PerUnit!.Value, 1e-9, "Z0 LV, HV shorted");
        // A bank's cores share no flux: with ideal cores the open-circuit zero sequence sees nothing but an open circuit.
        Assert.DoesNotContain(Wn.Solved(ThreeLimb.Replace("three-limb", "bank").Replace(" zero-sequence 50 %", "")).SequenceImpedances[0].Tests,
            t => t.Kind == SequenceKind.Zero && t.Shorted is null);
    }

    private static string Bank => File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "examples", "oak-hill-autotransformer-bank.wn"));

    [Fact]
    public void An_autotransformer_bank_with_a_delta_tertiary_gives_the_published_auto_impedance_and_the_tertiary_in_zero_sequence()
    {
        // R6 (Chapman, from memory, recomputed): Z_auto = Z_2w·(1 − V_X/V_H) on the auto's throughput
        // rating (R5: 75 MVA·230/115 = 150 MVA): 8 %·(1 − 115/230) = 4 %.
        Wn.Near(0.04, Test(Bank, SequenceKind.Positive, "S", "C").PerUnit!.Value, 1e-9, "Z1 HV-LV");
        Wn.Near(150e6, Test(Bank, SequenceKind.Positive, "S", "C").BasePower!.Value, 1e-12, "throughput");
        // R7 star equivalent on 75 MVA: Zs = (8 + 14 − 5)/2 = 8.5 %, Zc = (8 + 5 − 14)/2 = −0.5 %,
        // Zy = (14 + 5 − 8)/2 = 5.5 % (all X/R 40). Zero sequence from HV with LV short-circuited: the
        // closed tertiary in parallel with the common winding, Zs + Zc·Zy/(Zc + Zy) = 8.5 − 0.55 =
        // 7.95 % on 75 MVA at 115 kV, so 7.95·0.5 = 3.975 % on 150 MVA at 230 kV.
        Wn.Near(0.03975, Test(Bank, SequenceKind.Zero, "S", "C").PerUnit!.Value, 1e-9, "Z0 HV-LV with tertiary");
        // The zero-sequence magnetising impedance from LV is the common-to-tertiary impedance, 5 % on
        // 75 MVA = 10 % on 150 MVA (ideal cores: the tertiary carries it all).
        Wn.Near(0.10, Test(Bank, SequenceKind.Zero, "C", null).PerUnit!.Value, 1e-9, "Z0 open from LV");
    }

    [Fact]
    public void Sequence_checks_hold_and_fail_on_the_solved_value()
    {
        var e = Wn.Eval(DeltaWye + """
            expect positive-sequence HV LV near 5.75 % within 0.01 %
            expect zero-sequence LV HV near 0.008832 ohm within 0.1 %
            expect zero-sequence LV below 5 %

            """);
        Assert.Equal([true, true, false], e.Checks.Select(c => c.Passed));
        Assert.Contains("zero-sequence LV is 5.750 %", e.Single("expect-failed").Message);
    }
}

public class UnbalanceSequenceTests
{
    private static string Service(string sequence, string loadLines) => $"""
        frequency 60 Hz
        three-phase-supply service H1 H2 H3 480 V sequence {sequence} fault-level 10 kA xr 4
        three-phase-load motors H1 H2 H3 delta power 60 kW pf 0.85
        load welder {loadLines} impedance 4 ohm

        """;

    [Fact]
    public void The_unbalance_factor_is_taken_in_the_sequence_the_supply_runs_in()
    {
        // R35 (IEC 61000-2-12 / IEC 61000-4-30 definition): VUF = |V2|/|V1| with V1 the sequence that
        // runs. An acb source with the welder across lines 1 and 3 is the mirror of an abc source with
        // it across lines 1 and 2 (b and c swapped): the same factor, where the abc frame's |V2|/|V1|
        // would read its inverse.
        var abc = Wn.Solved(Service("abc", "H1 H2")).Normal!.ThreePhase.SetOf("service")!;
        var acb = Wn.Solved(Service("acb", "H1 H3")).Normal!.ThreePhase.SetOf("service")!;
        Assert.True(abc.Unbalance > 0.001);
        Assert.Equal(abc.Unbalance!.Value, acb.Unbalance!.Value, 12);
        Assert.Equal(1 / acb.VoltageSequence.Unbalance!.Value, acb.Unbalance!.Value, 9);
    }
}

using System.Numerics;
using WindingNotes.Solve;
using WindingNotes.Workspace;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// 'impedance HV Z' with Z a zigzag: the positive-sequence short-circuit impedance of the unit
/// (IEC 60076-1 short-circuit test, HV's lines energised, Z's lines shorted, its neutral open), met
/// by fitting the HV-to-half leakage of each limb's three-winding member, the halves' own leakage
/// from 'impedance Z Z'.
/// </summary>
public class ZigzagImpedanceTests
{
    private static string Unit(string hvz, string pair = "HV Z", string halves = "impedance Z Z 2 %") => $"""
        frequency 50 Hz
        core T1 construction three-limb rating 1000 kVA zero-sequence 50 %
        winding HV on T1 rated 11 kV wye H1 H2 H3
        winding Z on T1 rated 415 V zigzag X1 X2 X3 neutral X0
        impedance {pair} {hvz}
        {halves}
        three-phase-supply u H1 H2 H3 11 kV

        """;

    private static SequenceTest Test(Evaluation e, SequenceKind kind, string energised, string? shorted) =>
        Assert.Single(e.SequenceImpedances).Tests.Single(t => t.Kind == kind && t.Energised == energised && t.Shorted == shorted);

    [Fact]
    public void A_Yzn11_unit_reports_the_short_circuit_impedance_written_between_its_wye_and_its_zigzag()
    {
        var e = Wn.Solved(Unit("6 % xr 8"));
        Assert.Equal("Yzn11", Assert.Single(e.Normal!.ThreePhase.VectorGroups).Symbol);
        var z1 = Test(e, SequenceKind.Positive, "HV", "Z");
        Wn.Near(0.06, z1.PerUnit!.Value, 1e-9, "Z1 %");
        Wn.Near(8, z1.Impedance.Imaginary / z1.Impedance.Real, 1e-9, "X/R");

        // By hand: per limb, star branches HV Zh − Zzz/2, each half Zzz/2 (referred to HV). In the
        // test a limb's halves carry I_k and −I_(k−1), |I| each, and HV balances them, N_H·I_H =
        // n·(I_k − I_(k−1)), |I_H| = √3·n·|I|/N_H; the halves' loss 2·|I|²·Zzz/2 referred to HV is
        // |I_H|²·Zzz/3. So Z1 = Zh − Zzz/2 + Zzz/3 = Zh − Zzz/6, in per unit on a limb (the unit's
        // base for a wye): Zh = 6 %∠atan 8 + j·2 %/6, in ohms at 11 kV²/1 MVA = 121 Ω.
        var zh = 121 * (0.06 * new Complex(1, 8) / Math.Sqrt(65) + new Complex(0, 0.02 / 6));
        var fitted = e.Model.Impedances.Where(z => z.First.Winding.StartsWith("HV_", StringComparison.Ordinal)).ToList();
        Assert.Equal(6, fitted.Count);
        Assert.All(fitted, z => Assert.InRange((z.Value - zh).Magnitude / zh.Magnitude, 0, 1e-9));

        // The halves' leakage alone, as before: the zigzag's zero-sequence impedance with every other
        // winding open is 2 % on a limb (333.3 kVA) at a half's 415/3 V, a pure reactance.
        var z0 = Test(e, SequenceKind.Zero, "Z", null);
        Wn.Near(0.02 * (415.0 / 3) * (415.0 / 3) / (1e6 / 3), z0.Impedance.Magnitude, 1e-9, "Z0 ohms");
    }

    [Fact]
    public void The_short_circuit_impedance_is_affine_in_the_HV_to_half_leakage()
    {
        // The fit takes two solves for a line f(Zh) = a + b·Zh: a third and fourth at other Zh agree.
        var e = Wn.Solved(Unit("6 % xr 8"));
        var model = e.Model;
        var core = Assert.Single(model.ThreePhase.Cores);
        var hv = model.ThreePhase.Windings.Single(w => w.Name == "HV");
        var z = model.ThreePhase.Windings.Single(w => w.Name == "Z");
        var fitted = model.Impedances.Where(i => i.First.Winding.StartsWith("HV_", StringComparison.Ordinal)).ToHashSet();
        Complex At(Complex zh) => SequenceImpedances.Measure(model with
        {
            Impedances = [.. model.Impedances.Select(i => fitted.Contains(i) ? i with { Value = zh } : i)],
        }, core, SequenceKind.Positive, hv, z)!.Impedance;
        var (f1, f2, f3) = (At(new Complex(1, 5)), At(new Complex(2, 9)), At(new Complex(5, 21)));
        var b = (f2 - f1) / new Complex(1, 4);
        Assert.InRange((f1 + b * new Complex(4, 16) - f3).Magnitude / f3.Magnitude, 0, 1e-9);
        // A wye's phase is its line's star equivalent: the slope is 1.
        Assert.InRange((b - 1).Magnitude, 0, 1e-9);
    }

    [Fact]
    public void A_value_below_what_the_halves_give_is_one_error_with_the_least()
    {
        // By hand: Zh at least Zzz/2 (HV's star branch not negative) gives Z1 at least 2 %/2 − 2 %/6 = 0.6667 %.
        var e = Wn.Eval(Unit("0.5 %"));
        var d = Assert.Single(e.Errors());
        Assert.Equal("out-of-bounds", d.Code);
        Assert.Contains("at least what the leakage between its halves gives (0.6667 %)", d.Message);
        Assert.Equal("0.5 %", e.TextAt(d.Span));
    }

    [Fact]
    public void A_bare_magnitude_is_met_as_a_magnitude()
    {
        var z1 = Test(Wn.Solved(Unit("6 %")), SequenceKind.Positive, "HV", "Z");
        Wn.Near(0.06, z1.PerUnit!.Value, 1e-9, "Z1 %");
    }

    [Fact]
    public void Written_from_the_zigzag_it_is_the_same_per_unit_figure()
    {
        // The test from Z's lines with HV's shorted, in % on the same rating: the unit reports it from
        // HV (the first winding of the unit), and a two-winding short-circuit impedance in per unit is
        // the same from either side.
        var z1 = Test(Wn.Solved(Unit("6 % xr 8", pair: "Z HV")), SequenceKind.Positive, "HV", "Z");
        Wn.Near(0.06, z1.PerUnit!.Value, 1e-9, "Z1 %");
        Wn.Near(8, z1.Impedance.Imaginary / z1.Impedance.Real, 1e-9, "X/R");
    }

    [Fact]
    public void Without_the_halves_leakage_it_is_one_error_that_asks_for_it()
    {
        var e = Wn.Eval(Unit("6 % xr 8", halves: ""));
        var d = Assert.Single(e.Errors());
        Assert.Equal("missing-clause", d.Code);
        Assert.Contains("'impedance Z Z'", d.Message);
    }

    [Fact]
    public void In_ohms_it_is_per_phase_at_the_energised_lines()
    {
        // By hand: 7.26 Ω at 11 kV on 1 MVA is 7.26/121 = 6 %.
        var z1 = Test(Wn.Solved(Unit("7.26 ohm xr 8")), SequenceKind.Positive, "HV", "Z");
        Wn.Near(7.26, z1.Impedance.Magnitude, 1e-9, "Z1 ohms");
        Wn.Near(0.06, z1.PerUnit!.Value, 1e-9, "Z1 %");
    }
}

using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Ideal relations and autotransformer connections, each against the source REFERENCES.md names
/// for it (rows R1–R5, R23, R26–R28). Printed figures are rounded: compared within 1 %.
/// </summary>
public class AutotransformerReferenceTests
{
    // A 120/12 V, 100 VA two-winding unit, ideal windings.
    private const string Unit120x12 = """
        frequency 60 Hz
        core T rating 100 VA
        winding H on T rated 120 V from H1 to H2
        winding X on T rated 12 V from X1 to X2
        supply line H1 H2 120 V
        ground H2

        """;

    [Fact]
    public void R2_step_up_autotransformer_series_aiding()
    {
        // Chapman, Electric Machinery Fundamentals, step-up autotransformer example (from memory):
        // 132 V out; 1100 VA throughput; common winding 0.833 A, each winding at its rated current.
        var e = Wn.Solved(Unit120x12 + "join H1 X2\nload out X1 H2 apparent 1100 VA pf 1\n");
        var c = e.Normal!;
        Wn.Near(132, c.V("X1", "H2").Magnitude, 0.01, "output voltage");
        Wn.Near(1100, c.Totals.Throughput, 0.01, "throughput");
        Wn.Near(0.833, c.Section("H").Current.Magnitude, 0.01, "common winding current");
        Wn.Near(100.0 / 12, c.Section("X").Current.Magnitude, 0.01, "series winding current");
        Wn.Near(1, c.Section("X").Loading!.Value, 0.01, "series winding loading");
    }

    [Fact]
    public void R3_series_opposing_gives_108_volts()
    {
        // Common practice (polarity test by joined leads): 108 V out.
        var e = Wn.Solved(Unit120x12 + "join H1 X1\nload out X2 H2 impedance 1 kohm\n");
        Wn.Near(108, e.Normal!.V("X2", "H2").Magnitude, 0.01, "output voltage");
    }

    [Fact]
    public void R23_additive_and_subtractive_polarity()
    {
        // IEEE C57.12.80 definition (read on a page): with adjacent leads joined, additive polarity reads
        // more than the HV voltage (132 V), subtractive less (108 V).
        var additive = Wn.Solved(Unit120x12 + "join H1 X2\n").Normal!;
        Wn.Near(132, additive.V("X1", "H2").Magnitude, 1e-9, "additive");
        var subtractive = Wn.Solved(Unit120x12 + "join H1 X1\n").Normal!;
        Wn.Near(108, subtractive.V("X2", "H2").Magnitude, 1e-9, "subtractive");
    }

    [Fact]
    public void R4_and_R5_1100_220_volt_unit_as_a_1320_1100_volt_autotransformer()
    {
        // Published solved problem (1100/220 V, 15 kVA), read on a page: 90 kVA throughput; series
        // winding 68.18 A; common winding 13.64 A. R5 (any electric machines textbook):
        // S_auto = S_2w·V_H/(V_H − V_X) = 15·1320/220 = 90 kVA; transformed = S_load·(1 − V_X/V_H) = 15 kVA.
        var e = Wn.Solved("""
            frequency 50 Hz
            core T rating 15 kVA
            winding C on T rated 1100 V from C1 to C2
            winding S on T rated 220 V from S1 to S2
            supply line C1 C2 1100 V
            ground C2
            join C1 S2
            load out S1 C2 apparent 90 kVA pf 0.8
            """);
        var c = e.Normal!;
        Wn.Near(1320, c.V("S1", "C2").Magnitude, 1e-9, "high side");
        Wn.Near(90e3, c.Totals.Throughput, 0.01, "throughput");
        Wn.Near(68.18, c.Section("S").Current.Magnitude, 0.01, "series winding");
        Wn.Near(13.64, c.Section("C").Current.Magnitude, 0.01, "common winding");
        Wn.Near(15e3 * 1320 / 220, c.Totals.Throughput, 1e-9, "R5 throughput rating");
        Wn.Near(90e3 * (1 - 1100.0 / 1320), c.Totals.Transformed, 1e-9, "R5 transformed power");
    }

    [Fact]
    public void R26_boost_of_208_volts_with_a_240_by_24_volt_unit()
    {
        // Formula V_out = V_in(1 + V_s/V_p), S = I_s,rated·V_out (computed): 228.8 V; series winding
        // rated 41.67 A, so about 9.5 kVA of load at 228.8 V.
        var e = Wn.Solved("""
            frequency 60 Hz
            core K rating 1 kVA
            winding P on K rated 240 V from H1 to H2
            winding S on K rated 24 V from X1 to X2
            supply line H1 H2 208 V
            ground H2
            join H1 X2
            load motor X1 H2 apparent 9533 VA pf 0.85
            """);
        var c = e.Normal!;
        Wn.Near(228.8, c.V("X1", "H2").Magnitude, 1e-9, "output");
        Wn.Near(41.67, e.Network!.Windings.Single(w => w.Name == "S").RatedCurrent!.Value, 1e-3, "series rated current");
        Wn.Near(1.0, c.Section("S").Loading!.Value, 1e-3, "series winding at its rating");
    }

    // A bench variable autotransformer: 117 turns, the supply on a tap at 100 turns (N_tot/N_in = 1.17).
    private static string Variable(string brush) => $"""
        frequency 60 Hz
        core K rating 1 kVA
        winding W on K turns 117 from A to B
        tap IN on W at 100 turns
        brush BR on W at {brush}
        supply line IN A 120 V
        ground A
        load bench BR A impedance 50 ohm

        """;

    [Fact]
    public void R27_variable_autotransformer_reaches_117_percent_of_the_line()
    {
        // Common practice, no source: V_out,max = V_in·N_tot/N_in = 120 V · 1.17 = 140.4 V.
        Wn.Near(140.4, Wn.Solved(Variable("100 %")).Normal!.V("BR", "A").Magnitude, 1e-9, "brush at the top");
        Wn.Near(120 * 0.5 * 1.17, Wn.Solved(Variable("50 %")).Normal!.V("BR", "A").Magnitude, 1e-9, "brush half way");
        Assert.Equal(0, Wn.Solved(Variable("0 %")).Normal!.V("BR", "A").Magnitude, 9);
    }

    [Theory]
    [InlineData("50 %", "W:A-BR", "W:BR-IN", false)]
    [InlineData("100 %", "W:A-IN", "W:IN-BR", true)]
    public void R28_brush_and_section_currents_follow_from_ampere_turn_balance(string position, string common, string between, bool brushAbove)
    {
        // Follows from R1 (common practice). The brush carries the whole output current; the section
        // from the common end to the lower of tap and brush carries the difference of output and input
        // currents; the section between tap and brush carries the input current when the brush is
        // below the tap and the output current when it is above.
        var c = Wn.Solved(Variable(position)).Normal!;
        var output = c.Load("bench").Current;
        var input = c.Supply("line").Current;
        var brush = c.Sections.Where(s => s.Section.ToPoint == "BR").Aggregate(System.Numerics.Complex.Zero, (a, s) => a + s.Current)
                  - c.Sections.Where(s => s.Section.FromPoint == "BR").Aggregate(System.Numerics.Complex.Zero, (a, s) => a + s.Current);
        Assert.True((brush - output).Magnitude <= 1e-9 * output.Magnitude, $"brush {brush}, output {output}");
        Wn.Near((output - input).Magnitude, c.Section(common).Current.Magnitude, 1e-9, "common section");
        Wn.Near((brushAbove ? output : input).Magnitude, c.Section(between).Current.Magnitude, 1e-9, "section between tap and brush");
    }

    [Fact]
    public void R1_volts_per_turn_are_equal_and_ampere_turns_balance()
    {
        // Any electric machines textbook (standard physics): on one core every winding has the same
        // volts per turn, and Σ N·I = 0 with currents into the polarity end.
        var e = Wn.Solved("""
            frequency 50 Hz
            core K rating 2 kVA
            winding P on K turns 400 rated 400 V from P1 to P2
            winding S1 on K turns 100 from A1 to A2
            winding S2 on K turns 55 from B1 to B2
            tap M on S1 at 40 turns
            supply line P1 P2 400 V
            ground P2
            ground A2
            ground B2
            load a A1 A2 impedance 20 ohm
            load m M A2 impedance 7 + j3 ohm
            load b B1 B2 impedance 9 ohm
            """);
        var c = e.Normal!;
        var perTurn = c.Sections.Select(s => s.Voltage / s.Section.Turns).ToList();
        foreach (var v in perTurn) Wn.Near(perTurn[0].Magnitude, v.Magnitude, 1e-12, "volts per turn");
        var ampereTurns = c.Sections.Aggregate(System.Numerics.Complex.Zero, (sum, s) => sum + s.Section.Turns * s.Current);
        Assert.True(ampereTurns.Magnitude < 1e-9 * c.Section("P").Current.Magnitude * 400, $"Σ N·I = {ampereTurns}");
    }
}

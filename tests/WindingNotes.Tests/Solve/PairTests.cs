using System.Numerics;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// 'pair': two like single-phase units placed on three lines by a connection word. Each check is a
/// relation of the trade, derived by hand beside it; every value comes from the solved network.
/// </summary>
public class PairTests
{
    /// <summary>Two 50 kVA 480:480 V units in open delta (Vv) feeding a delta load; 0.001 % leakage, near ideal.</summary>
    private static string OpenDelta(string load) => $"""
        frequency 60 Hz
        unit-pair T H1 H2 H3 open-delta delta-output X1 X2 X3 rating 50 kVA primary-winding P 480 V secondary-winding S 480 V impedance 0.001 % xr 1
        three-phase-supply grid H1 H2 H3 480 V
        ground X2
        three-phase-load plant X1 X2 X3 delta apparent {load} pf 0.9

        """;

    [Fact]
    public void An_open_delta_pair_carries_57_7_percent_of_a_closed_bank_at_its_rated_current()
    {
        // R32 (any machines textbook): in open delta each unit carries the line current
        // I = S/(√3·V), so its rated current S_unit/V is reached at S = √3·S_unit: 86.6 kVA from two
        // 50 kVA units, 86.6 % of their 100 kVA and 57.7 % of the 150 kVA of a closed bank of three.
        var e = Wn.Solved(OpenDelta($"{Math.Sqrt(3) * 50} kVA"));
        var c = e.Normal!;
        foreach (var winding in new[] { "P_a", "P_b", "S_a", "S_b" })
            Wn.Near(1, c.Section(winding).Loading!.Value, 1e-4, $"{winding} at √3 times one unit's rating");
        // The unit's current is the line current: S_a carries line 1's, S_b line 3's.
        var load = c.ThreePhase.Sets.Single(s => s.Name == "plant");
        Wn.Near(load.LineCurrents[0].Magnitude, c.Section("S_a").Current.Magnitude, 1e-9, "S_a carries line 1");
        Wn.Near(load.LineCurrents[2].Magnitude, c.Section("S_b").Current.Magnitude, 1e-9, "S_b carries line 3");
        Assert.Equal(0.866, Math.Sqrt(3) * 50 / 100, 3);
        Assert.Equal(0.577, Math.Sqrt(3) * 50 / 150, 3);
        // Below the limit the pair is named with its rule; past it, a warning with the loading.
        var within = Wn.Solved(OpenDelta("80 kVA")).Single("caution-open-delta");
        Assert.Equal("cores 'T_a' and 'T_b' form an open delta on 'grid': the pair transforms at most √3 times one unit's rating, 86.6 % of the two ratings and 57.7 % of a closed bank of three", within.Message);
        var past = Wn.Solved(OpenDelta("100 kVA"));
        var warning = past.Single("open-delta-overload");
        // 100 kVA against 86.6 kVA: 115.5 % of rated current (the leakage adds a few parts in 1e5).
        Assert.Contains("form an open delta on 'grid' and are loaded past what the pair can transform", warning.Message);
        Wn.Near(100 / (Math.Sqrt(3) * 50), past.Normal!.Section("P_a").Loading!.Value, 1e-3, "loading at 100 kVA");
    }

    /// <summary>An ideal Scott-T pair of 10 kVA 480:120 V units, each output loaded with 4 Ω.</summary>
    private const string ScottT = """
        frequency 60 Hz
        unit-pair K H1 H2 H3 scott-t main-output X1 X2 teaser-output Y1 Y2 rating 10 kVA primary-winding P 480 V secondary-winding S 120 V
        three-phase-supply grid H1 H2 H3 480 V
        load lamps X1 X2 impedance 4 ohm
        load heater Y1 Y2 impedance 4 ohm
        ground X2
        ground Y2

        """;

    [Fact]
    public void A_Scott_T_pair_gives_two_outputs_in_quadrature_and_loads_the_lines_evenly()
    {
        // R33 (any machines textbook; the 86.6 % teaser tap is common practice). By hand, ideal units:
        // the main across H1–H2 gives 480/4 = 120 V. The teaser's 86.6 % tap stands across H3 and the
        // main's centre tap, (√3/2)·480 V, 90° from H1–H2, so its full winding has (√3/2)·480/0.866 V
        // and its secondary a quarter of that: 120·(√3/2)/0.866 V, 1.0000293 times the main's.
        var c = Wn.Solved(ScottT).Normal!;
        var main = c.V("X1", "X2");
        var teaser = c.V("Y1", "Y2");
        Wn.Near(120, main.Magnitude, 1e-9, "main output");
        Wn.Near(120 * Math.Sqrt(3) / 2 / 0.866, teaser.Magnitude, 1e-9, "teaser output");
        Assert.Equal(90, Math.Abs(Math.IEEERemainder((teaser / main).Phase * 180 / Math.PI, 360)), 9);
        // The centre tap stands midway between H1 and H2, and the teaser's tap with it.
        var mid = (c.PointVoltage("H1") + c.PointVoltage("H2")) / 2;
        Assert.True((c.PointVoltage("P_mc") - mid).Magnitude < 1e-9 * 480);
        Assert.True((c.PointVoltage("P_tt") - mid).Magnitude < 1e-9 * 480);
        // Line currents: the main's primary carries 30 A/4 = 7.5 A out of H1 and back at H2; the
        // teaser's primary (0.866·480 V of turns to the secondary's 120 V) carries
        // I3 = (V_teaser/4 Ω)·120/(0.866·480), in H3 and half of it back in each of H1 and H2, in
        // quadrature with the main's: |I1| = |I2| = √(7.5² + (I3/2)²), all three about 8.660 A.
        var i3 = teaser.Magnitude / 4 * 120 / (0.866 * 480);
        Wn.Near(i3, c.Supply("grid_c").Current.Magnitude, 1e-9, "line 3");
        var outer = Math.Sqrt(7.5 * 7.5 + i3 * i3 / 4);
        Wn.Near(outer, c.Supply("grid_a").Current.Magnitude, 1e-9, "line 1");
        Wn.Near(outer, c.Supply("grid_b").Current.Magnitude, 1e-9, "line 2");
        Wn.Near(i3, outer, 1e-4, "the lines load evenly");
    }

    [Fact]
    public void Every_unit_winding_and_tap_of_a_pair_is_reachable_by_name()
    {
        // A fault from the teaser's far end, a join to the main's centre tap and checks on each
        // winding: the names the pair gives are points and windings like any other.
        var e = Wn.Solved(ScottT + """
            load tapload P_mc H3 impedance 1000 ohm
            expect loading S_t below 100 %
            expect current P_m H1 P_mc below 20 A
            expect loading S below 100 %
            expect voltage P_t2 H3 above 400 V

            """);
        Assert.Equal(4, e.Checks.Length);
        Assert.True(e.AllChecksPass);
        var c = e.Normal!;
        Assert.Contains(c.Loads, l => l.Load.Name == "tapload");
        // The teaser's far end: its whole winding, (√3/2)·480/0.866 V from H3.
        Wn.Near(480 * Math.Sqrt(3) / 2 / 0.866, c.V("P_t2", "H3").Magnitude, 1e-9, "teaser's whole winding");
    }

    /// <summary>
    /// The pair's words are hyphenated, so names a file may already use (a core 'main', windings
    /// 'primary' and 'secondary', a supply 'output', a load 'teaser' or 'pair') stay names: a keyword
    /// cannot be a name, and no name has a hyphen.
    /// </summary>
    [Fact]
    public void Common_words_stay_free_for_names()
    {
        var c = Wn.Solved("""
            frequency 60 Hz
            core main rating 3 kVA
            winding primary on main rated 480 V from H1 to H2
            winding secondary on main rated 48 V from X1 to X2
            impedance primary secondary 2.5 % xr 1.2
            supply output H1 H2 480 V
            load teaser X1 X2 power 1 kW pf 1
            load pair X1 X2 power 1 kW pf 1
            ground H2
            ground X2
            """).Normal!;
        // Ratio 480:48 V: 48 V less the drop of about 1.1 % (2 kW at 48 V is 41.7 A of the 62.5 A rated,
        // through the resistive 2.5 %/√(1 + 1.2²) = 1.6 %; the reactive part adds little at pf 1), by hand.
        Wn.Near(48, c.V("X1", "X2").Magnitude, 0.02, "secondary voltage");
    }

    [Fact]
    public void A_Scott_T_with_open_delta_outputs_is_one_error()
    {
        var e = Wn.Eval(ScottT.Replace("main-output X1 X2 teaser-output Y1 Y2", "series X1 Y1"));
        var d = Assert.Single(e.Errors());
        Assert.Equal("wrong-kind", d.Code);
        Assert.Contains("a Scott-T's outputs are its main's and its teaser's secondaries", d.Message);
        var open = Wn.Eval(OpenDelta("80 kVA").Replace("delta-output X1 X2 X3", "main-output X1 X2 teaser-output X3 Y2"));
        Assert.Contains("'main-output' and 'teaser-output' are a Scott-T's outputs", Assert.Single(open.Errors()).Message);
        // A pair's winding name stands for both units: where one winding is meant, one error names them.
        var tap = Assert.Single(Wn.Eval(ScottT + "tap T1 on P at 10 %\n").Errors());
        Assert.Equal("'P' stands for both units of a pair here: name one of them ('P_m' or 'P_t')", tap.Message);
        var power = Assert.Single(Wn.Eval(ScottT + "expect current S X1 X2 below 10 A\n").Errors());
        Assert.Equal("'S' stands for both units of a pair here: name one of them ('S_m' or 'S_t')", power.Message);
        // Likewise an impedance line, an open-circuit test and a flux check: never left out unsaid.
        Assert.Equal("'P' stands for both units of a pair here: name one of them ('P_m' or 'P_t')", Assert.Single(Wn.Eval(ScottT + "impedance P S_m 3 %\n").Errors()).Message);
        Assert.Equal("'K' stands for both units of a pair here: name one of them ('K_m' or 'K_t')", Assert.Single(Wn.Eval(ScottT + "no-load K current 1 % loss 20 W at P_m 480 V\n").Errors()).Message);
        Assert.Equal("'K' stands for both units of a pair here: name one of them ('K_m' or 'K_t')", Assert.Single(Wn.Eval(ScottT + "expect flux K below 1.5 T\n").Errors()).Message);
        // Each unit's own lines are as for any core: K_m's open-circuit test at its primary.
        Assert.Empty(Wn.Solved(ScottT + "no-load K_m current 1 % loss 20 W at P_m 480 V\n").Errors());
    }

    [Theory]
    [InlineData("three-phase")]
    [InlineData("pair")]
    public void A_failing_check_of_a_whole_element_names_its_failing_phase_in_every_report(string form)
    {
        // A wye winding with one 8 Ω load on phase b alone: LV_b carries it all. A pair's secondary
        // with the teaser loaded 2 Ω harder than the main: S_t carries the most.
        var (text, phase) = form == "pair"
            ? (ScottT.Replace("load heater Y1 Y2 impedance 4 ohm", "load heater Y1 Y2 impedance 2 ohm") + "expect current S below 20 A\n", "S_t")
            : (ThreePhaseTests.Unit("delta H1 H2 H3", "wye X1 X2 X3 neutral X0") + "load heater X2 X0 impedance 8 ohm\nexpect current LV below 20 A\n", "LV_b");
        var e = Wn.Eval(text);
        Assert.False(Assert.Single(e.Checks).Passed);
        Assert.Contains($" on {phase}: expected below 20 A", e.Single("expect-failed").Message);
        Assert.Contains($" on {phase}: expected below 20 A", WindingNotes.Report.TextReport.Write(e));
        Assert.Contains($" on {phase}: expected below 20 A", WindingNotes.Report.MarkdownReport.Write(e));
        Assert.Contains($" on {phase}: expected below 20 A", WindingNotes.Report.JsonReport.Write(e));
    }
}

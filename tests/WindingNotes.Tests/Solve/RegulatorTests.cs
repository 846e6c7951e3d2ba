using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Step-voltage regulators: the range of regulation and the current rating at it, the two arrangements
/// of shunt and series winding, and a control wired backwards; values derived by hand in the comments.
/// The regulator is written with winding statements: a shunt winding of 1000 turns and a series winding
/// of 100 turns with a selector (brush R) and a reversing switch, 16 steps of 6.25 % of the series
/// winding each way, so a step is 6.25 turns, 0.625 % of the shunt winding (IEEE C57.15's ±10 % in 32
/// steps of 5/8 %, from memory; REFERENCES.md R42). Its windings are ideal.
/// </summary>
public class RegulatorTests
{
    // Type A (IEEE C57.15, from memory; R42): the shunt winding across the source S, the series winding
    // on the load side of it; the output is V_S·(1 + 0.00625·k) at position k.
    private static string TypeA(string changer, string rated = "rated-current 30 A", string shunt = "from N to S") => $"""
        frequency 60 Hz
        let sel = 0 %
        core K rating 333 kVA
        winding SH on K turns 1000 rated 7620 V {shunt}
        winding SER on K turns 100 rated 762 V {rated} from S1 to S2
        brush R on SER at sel
        join S S1
        supply grid S N 7200 V
        ground N
        load town R N impedance 200 ohm pf 1
        tap-changer REG on SER sets sel {changer}
        """;

    private static TapPosition Position(CaseResult c) => c.TapPositions.Single(t => t.Changer.Name == "REG");

    [Theory]
    // The rows of IEEE C57.15's table of current rating by range of regulation (from memory; REFERENCES.md R43),
    // then ranges between rows (the next wider row), beyond ±10 % (rated current) and below ±5 % (the ±5 % row).
    [InlineData(0.10, 1.00)]
    [InlineData(0.0875, 1.10)]
    [InlineData(0.075, 1.20)]
    [InlineData(0.0625, 1.35)]
    [InlineData(0.05, 1.60)]
    [InlineData(0.08125, 1.10)]
    [InlineData(0.09, 1.00)]
    [InlineData(0.055, 1.35)]
    [InlineData(0.125, 1.00)]
    [InlineData(0.03125, 1.60)]
    public void The_current_rating_goes_with_the_range_of_regulation(double range, double multiplier) =>
        Assert.Equal(multiplier, Regulators.Multiplier(range));

    [Fact]
    public void The_range_of_regulation_comes_from_the_windings_and_the_reachable_positions()
    {
        // Stated at +8: sel = 8·6.25 % = 50 %, output 7200·1.05 = 7560 V, load current 7560/200 = 37.8 A,
        // all of it through the part of the series winding between S1 and the selector.
        // Positions −16..16: range 16·6.25 turns/1000 turns = ±10 % → 100 % of 30 A = 30 A: 37.8 A is over.
        var full = Wn.Solved(TypeA("positions -16 to 16 step 6.25 % reversing at 8"));
        var r = Position(full.Normal!).Regulation!;
        Wn.Near(0.10, r.Range, 1e-12, "range ±10 %");
        Assert.Equal(("SER", "SH", 1.00), (r.Series, r.Shunt, r.Multiplier));
        Wn.Near(37.8, r.Current, 1e-9, "series winding current");
        Wn.Near(7560, full.Normal!.V("R", "N").Magnitude, 1e-9, "output at +8");
        var d = full.Single("regulator-current-high");
        Assert.Contains("REG's series winding SER, at a range of regulation of ±10.00 % (100.0 % of rated current), carries 37.80 A, above its current rating of 30.00 A", d.Message);
        // The series winding's loading is checked against the regulator's rating, once, not against its rated current as well.
        Assert.DoesNotContain(full.Diagnostics, x => x.Code == "loading-high");

        // Limited to −13..13: 13·0.625 % = ±8.125 %, between the rows, so the ±8.75 % row: 110 % of 30 A = 33 A, still over.
        var mid = Wn.Eval(TypeA("positions -13 to 13 step 6.25 % reversing at 8"));
        Wn.Near(0.08125, Position(mid.Normal!).Regulation!.Range, 1e-12, "range ±8.125 %");
        Wn.Near(33, Position(mid.Normal!).Regulation!.CurrentRating!.Value, 1e-12, "rating at ±8.125 %");
        Assert.Contains("above its current rating of 33.00 A", mid.Single("regulator-current-high").Message);

        // Limited to −8..8: ±5 % → 160 % of 30 A = 48 A, and 37.8 A is within it: no warning.
        var narrow = Wn.Solved(TypeA("positions -8 to 8 step 6.25 % reversing at 8"));
        Wn.Near(48, Position(narrow.Normal!).Regulation!.CurrentRating!.Value, 1e-12, "rating at ±5 %");
        Assert.DoesNotContain(narrow.Diagnostics, x => x.Code is "regulator-current-high" or "loading-high");
    }

    [Fact]
    public void A_regulator_rating_is_a_rating_warning_that_fail_on_names()
    {
        Assert.Contains("regulator-current-high", WindingNotes.Syntax.Grammar.RatingWarnings);
        Assert.Contains("regulator-current-high", RatingTally.Codes);
        var e = Wn.Eval(TypeA("positions -16 to 16 step 6.25 % reversing at 8") + "\nfail-on regulator-current-high\n");
        // fail-on makes the warning an error, and it is the only one.
        Assert.Equal("regulator-current-high", Assert.Single(e.Errors()).Code);
    }

    [Fact]
    public void A_tap_changer_without_a_reversing_switch_or_with_more_windings_on_its_core_is_no_regulator()
    {
        var plain = Wn.Solved(TypeA("positions -16 to 16 step 6.25 % at 8"));
        Assert.Null(Position(plain.Normal!).Regulation);
        var third = Wn.Solved(TypeA("positions -16 to 16 step 6.25 % reversing at 8").Replace("brush R on SER at sel", "brush R on SER at sel\nwinding TER on K turns 50 from T1 to T2\njoin T1 N\nload aux T2 N impedance 1000 ohm"));
        Assert.Null(Position(third.Normal!).Regulation);
    }

    [Fact]
    public void A_type_B_regulator_settles_where_its_shunt_winding_is_across_the_output()
    {
        // Type B (IEEE C57.15, from memory; R42): the source at the selector R, the series winding on the source
        // side, the shunt winding across the regulated output L (so its excitation follows the regulated voltage).
        // Ideal windings, n = 6.25·k turns between S1 (= L) and R: e = V_L/1000 a turn, V_R = V_L − n·e, so
        // V_L = V_R/(1 − 0.00625·k). Band 119..121 V at pt-ratio 63.5: V_L ≥ 7556.5 V →
        // 1 − 0.00625·k ≤ 7200/7556.5 = 0.952822 → k ≥ 7.55 → +8: V_L = 7200/0.95 = 7578.95 V, relay 119.35 V
        // (the type A regulator of the same windings settles at +8 too, on 7200·1.05 = 7560 V).
        // The series winding carries the source current: 7578.95/200 = 37.895 A out, × 1/0.95 in = 39.889 A.
        var e = Wn.Solved("""
            frequency 60 Hz
            let sel = 0 %
            core K rating 333 kVA
            winding SH on K turns 1000 rated 7620 V from L to N
            winding SER on K turns 100 rated 762 V rated-current 50 A from S1 to S2
            brush R on SER at sel
            join L S1
            supply grid R N 7200 V
            ground N
            load town L N impedance 200 ohm pf 1
            tap-changer REG on SER sets sel positions -16 to 16 step 6.25 % reversing regulate L N target 120 V bandwidth 2 V pt-ratio 63.5
            """);
        var tap = Position(e.Normal!);
        Assert.Equal(8, tap.Position);
        Assert.Equal(TapState.InBand, tap.State);
        Wn.Near(7200 / 0.95, e.Normal!.V("L", "N").Magnitude, 1e-9, "regulated output");
        Wn.Near(7200 / 0.95 / 63.5, tap.Relay!.Value, 1e-9, "relay");
        Wn.Near(7200 / 0.95 / 200 / 0.95, tap.Regulation!.Current, 1e-9, "series winding current, the source current");
        Wn.Near(0.10, tap.Regulation!.Range, 1e-12, "range ±10 %");
        Wn.Near(e.Normal!.Supply("grid").Current.Magnitude, tap.Regulation!.Current, 1e-9, "the source current");
    }

    [Fact]
    public void A_control_wired_backwards_is_said_once_at_the_tap_changer()
    {
        // The shunt winding connected the other way round makes the series winding buck at raising positions:
        // V_R = 7200·(1 − 0.00625·k). At 0 the relay sees 7200/63.5 = 113.39 V, below 119 V; the control raises
        // to +1 and sees 7155/63.5 = 112.68 V, further away. A real control runs on to +16 (6480 V, 102.05 V).
        var e = Wn.Eval(TypeA("positions -16 to 16 step 6.25 % reversing regulate R N target 120 V bandwidth 2 V pt-ratio 63.5", "rated-current 50 A", "from S to N"));
        var tap = Position(e.Normal!);
        Assert.Equal(16, tap.Position);
        Assert.Equal(TapState.Backwards, tap.State);
        Wn.Near(6480 / 63.5, tap.Relay!.Value, 1e-9, "relay at +16");
        var d = e.Single("tap-control-backwards");
        Assert.Contains("from 0 to +1, moved its relay away from it (113.4 V to 112.7 V)", d.Message);
        Assert.DoesNotContain(e.Diagnostics, x => x.Code == "tap-limit");
        Assert.Equal(e.Model.TapChangers.Single().NameSpan, d.Span);
    }
    [Fact]
    public void The_faults_at_each_tolerance_corner_are_solved_at_that_corner_s_settled_positions()
    {
        // Each corner of the tolerance is settled, then its fault solved at the positions it settled on (the
        // network kept from settling, not bound again): the band of the fault current equals the fault
        // currents of the two corners written out as plain values and evaluated on their own.
        const string file = """
            frequency 60 Hz
            let sel = 0 %
            core K rating 333 kVA
            winding SH on K turns 1000 rated 7620 V from N to S
            winding SER on K turns 100 rated 762 V rated-current 50 A from S1 to S2
            impedance SH SER 8 % +- 10 % xr 2
            brush R on SER at sel
            join S S1
            supply grid S N 7200 V fault-level 4 kA xr 6
            ground N
            load town R N impedance 200 ohm pf 0.9
            tap-changer REG on SER sets sel positions -16 to 16 step 6.25 % reversing regulate R N target 120 V bandwidth 2 V pt-ratio 63.5
            fault F1 R N
            """;
        static double Fault(Evaluation e) => e.Cases.Single(c => c.Case.Fault is not null).Solution.FaultCurrent.Magnitude;
        var band = Wn.Solved(file).Cases.Single(c => c.Case.Fault is not null).Bands.Single(b => b.Path == "faults.F1.i.rms");
        var corners = new[] { "7.2 %", "8.8 %" }.Select(z => Wn.Solved(file.Replace("8 % +- 10 %", z))).ToList();
        Assert.All(corners, c => Assert.Equal(TapState.InBand, Position(c.Normal!).State));
        Wn.Near(corners.Min(Fault), band.Min, 1e-9, "lower end of the band");
        Wn.Near(corners.Max(Fault), band.Max, 1e-9, "upper end of the band");
    }
}

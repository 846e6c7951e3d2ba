using System.Numerics;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Tap changers settled by their controls, and 'find', against values derived by hand in the comments.
/// The regulator below is a step-voltage regulator written with winding statements: a shunt winding of
/// 1000 turns across the source and a series winding of 100 turns (10 %), a selector (brush R) on it
/// and a reversing switch, so 16 steps of 6.25 % of the series winding are 16 steps of 5/8 % of the
/// source voltage: ±10 % in 32 steps of 5/8 %, as IEEE C57.15 (from memory; REFERENCES.md R42).
/// Its windings are ideal, so the output is V_S·(1 + 0.00625·k) exactly at position k.
/// </summary>
public class TapChangerTests
{
    private static string Regulator(string supply, string control, string load = "load town R N impedance 200 ohm pf 1", string extra = "") => $"""
        frequency 60 Hz
        let sel = 0 %
        core K rating 333 kVA
        winding SH on K turns 1000 rated 7620 V from N to S
        winding SER on K turns 100 rated 762 V from S1 to S2
        brush R on SER at sel
        join S S1
        supply grid S N {supply}
        ground N
        {load}
        tap-changer REG on SER sets sel positions -16 to 16 step 6.25 % reversing {control}
        {extra}
        """;

    private static TapPosition Position(CaseResult c, string name = "REG") => c.TapPositions.Single(t => t.Changer.Name == name);

    [Fact]
    public void A_regulator_raises_to_the_first_position_inside_its_band()
    {
        // Relay = 7200·(1 + 0.00625·k)/63.5 must reach 119 V (band 120 ± 1 V):
        // 1 + 0.00625·k ≥ 119·63.5/7200 = 1.04951 → k ≥ 7.92 → k = +8, relay 7560/63.5 = 119.06 V.
        var e = Wn.Solved(Regulator("7200 V", "regulate R N target 120 V bandwidth 2 V pt-ratio 63.5"));
        var tap = Position(e.Normal!);
        Assert.Equal(8, tap.Position);
        Assert.Equal(TapState.InBand, tap.State);
        Wn.Near(7560, e.Normal!.V("R", "N").Magnitude, 1e-9, "output at +8");
        Wn.Near(7560 / 63.5, tap.Relay!.Value, 1e-9, "relay");
    }

    [Fact]
    public void A_reversing_switch_takes_the_regulator_below_neutral_and_back()
    {
        // 7900 V in: relay at 0 is 124.4 V, above the band 119..121 V, so the regulator lowers:
        // 1 + 0.00625·k ≤ 121·63.5/7900 = 0.97259 → k ≤ −4.39 → k = −5, output 7900·0.96875 = 7653 V.
        var e = Wn.Solved(Regulator("vs", "regulate R N target 120 V bandwidth 2 V pt-ratio 63.5", extra: "sweep vs from 7000 V to 7900 V step 900 V").Replace("frequency 60 Hz", "frequency 60 Hz\nlet vs = 7900 V"));
        Assert.Equal(-5, Position(e.Normal!).Position);
        Wn.Near(7900 * 0.96875, e.Normal!.V("R", "N").Magnitude, 1e-9, "bucked output");
        // The series winding is in circuit reversed: the selector is 5/16 of it from S1, and S1 is above R.
        Wn.Near(7900 * 5 * 0.00625, e.Normal!.V("S1", "R").Magnitude, 1e-9, "series winding voltage");
        var points = Wn.Points(e);
        // At 7000 V the same control boosts: 1 + 0.00625·k ≥ 119·63.5/7000 = 1.07950 → k = +13 (relay 119.2 V).
        Assert.Equal([13, -5], points.Select(c => Position(c).Position));
        Wn.Near(7000 * (1 + 13 * 0.00625), points[0].V("R", "N").Magnitude, 1e-9, "boosted output");
    }

    [Fact]
    public void Line_drop_compensation_holds_the_load_centre_at_light_and_heavy_load()
    {
        // The feeder to the load centre C is 1 + j2 ohm, written as a 1:1 unit whose leakage impedance it is.
        // pt-ratio 60, ct 200 A: settings R + jX = (1 + j2)·200/60 = 3.333 + j6.667 V make the relay see
        // |V_C|/60. Target 122 V, band 121..123 V. V_C = V_R·Z_L/(Z_line + Z_L), V_R = 7200·(1 + 0.00625·k).
        // Light load 400 ohm: ratio 400/|401 + j2| = 0.997494, relay at 0 = 119.70 V →
        //   k ≥ (121/119.70 − 1)/0.00625 = 1.74 → +2 (121.20 V).
        // Heavy load 40 ohm at pf 0.9 (36 + j17.436): ratio 40/|37 + j19.436| = 0.957074, relay at 0 = 114.85 V →
        //   k ≥ (121/114.85 − 1)/0.00625 = 8.57 → +9 (121.31 V).
        const string control = "regulate R N target 122 V bandwidth 2 V pt-ratio 60 compensation rset xset line-current town ct 200 A";
        string Feeder(string load) => Regulator("7200 V", control, $"""
            let rset = 1 V * 200 / 60
            let xset = 2 V * 200 / 60
            core KL rating 10 MVA
            winding LA on KL turns 100 from A1 to A2
            winding LB on KL turns 100 from C to B2
            join R A1
            join N A2 B2
            impedance LA LB 1 + j2 ohm
            load town C N impedance {load}
            """);
        var light = Wn.Solved(Feeder("400 ohm"));
        var heavy = Wn.Solved(Feeder("36 + j17.436 ohm"));
        Assert.Equal(2, Position(light.Normal!).Position);
        Assert.Equal(9, Position(heavy.Normal!).Position);
        Wn.Near(light.Normal!.V("C", "N").Magnitude / 60, Position(light.Normal!).Relay!.Value, 1e-9, "the relay sees the load centre (light)");
        Wn.Near(heavy.Normal!.V("C", "N").Magnitude / 60, Position(heavy.Normal!).Relay!.Value, 1e-9, "the relay sees the load centre (heavy)");
        Wn.Near(121.31, Position(heavy.Normal!).Relay!.Value, 2e-4, "relay at +9, heavy");
        // Without compensation the regulator holds its own output: 120·(1 + 0.00625·k) ≥ 121 → k = +2, heavy or not.
        var plain = Wn.Solved(Feeder("36 + j17.436 ohm").Replace(" compensation rset xset line-current town ct 200 A", ""));
        Assert.Equal(2, Position(plain.Normal!).Position);
    }

    [Fact]
    public void A_band_out_of_reach_stops_at_the_limit_and_says_which()
    {
        // 6000 V in: at +16 the relay sees 6000·1.1/63.5 = 103.9 V, still below 119 V.
        var e = Wn.Eval(Regulator("6000 V", "regulate R N target 120 V bandwidth 2 V pt-ratio 63.5", extra: "expect position REG clear-of-limits"));
        Assert.NotNull(e.Normal);
        var tap = Position(e.Normal!);
        Assert.Equal(16, tap.Position);
        Assert.Equal(TapState.AtLimit, tap.State);
        var d = e.Single("tap-limit");
        Assert.Contains("highest position +16", d.Message);
        Assert.Contains("103.9 V", d.Message);
        Assert.False(e.Checks.Single().Passed);
    }

    [Fact]
    public void A_band_narrower_than_a_step_is_hunting_and_is_reported_not_looped()
    {
        // pt-ratio 60: the relay moves 0.75 V a step (120, 120.75 at 0 and +1); the band 120.125..120.625 V
        // lies between the two, so the control would alternate between 0 and +1.
        var e = Wn.Eval(Regulator("7200 V", "regulate R N target 120.375 V bandwidth 0.5 V pt-ratio 60"));
        var tap = Position(e.Normal!);
        Assert.Equal(TapState.Hunting, tap.State);
        var d = e.Single("tap-hunting");
        Assert.Contains("between positions +1 and 0", d.Message);
        Assert.Contains("750.0 mV", d.Message);
    }

    private const string Paralleled = """
        frequency 60 Hz
        let n1 = 100 turns
        let n2 = 100 turns
        core K1 rating 500 kVA
        winding HV1 on K1 turns 1000 from H1 to N1
        winding LV1 on K1 turns n1 from X1 to M1
        impedance LV1 HV1 0.05 + j0.5 ohm
        core K2 rating 500 kVA
        winding HV2 on K2 turns 1000 from H2 to N2
        winding LV2 on K2 turns n2 from X2 to M2
        impedance LV2 HV2 0.05 + j0.5 ohm
        join H1 H2
        join N1 N2 M1 M2
        join X1 X2
        supply grid H1 N1 7200 V
        ground N1
        """;

    [Fact]
    public void Paralleled_units_on_different_taps_circulate_current()
    {
        // No load: unit 1 at +2 (102.5 turns) opens at 7200·102.5/1000 = 738 V, unit 2 at 720 V. The 18 V
        // drives I = 18/|2·(0.05 + j0.5)| = 17.91 A round the loop through both leakage impedances.
        var e = Wn.Solved(Paralleled + """

            tap-changer T1 on LV1 sets n1 positions -8 to 8 step 1.25 turns at 2
            tap-changer T2 on LV2 sets n2 positions -8 to 8 step 1.25 turns
            """);
        var i1 = e.Normal!.Section("LV1").Current;
        var i2 = e.Normal!.Section("LV2").Current;
        Wn.Near(18 / Complex.Abs(new Complex(0.1, 1.0)), i1.Magnitude, 1e-6, "circulating current");
        Assert.True((i1 + i2).Magnitude < 1e-9, "no load: what leaves one unit enters the other");
    }

    [Fact]
    public void Paralleled_units_settle_in_the_order_written_and_a_follower_circulates_nothing()
    {
        // Both hold X 720 V/6 = 120 V (band 122 ± 1 V): the first written steps first and alone brings the bus into the band,
        // so the second stays at 0 and current circulates; as a follower it takes the master's position and none does.
        const string load = "load plant X1 M1 impedance 2 ohm pf 1";
        var both = Wn.Solved(Paralleled + $"""

            {load}
            tap-changer T1 on LV1 sets n1 positions -8 to 8 step 1.25 turns regulate X1 M1 target 122 V bandwidth 2 V pt-ratio 6
            tap-changer T2 on LV2 sets n2 positions -8 to 8 step 1.25 turns regulate X1 M1 target 122 V bandwidth 2 V pt-ratio 6
            """);
        // By hand: unit k opens at E_k = 7.2 V·n_k behind Z = 0.05 + j0.5 ohm, so the bus is
        // V_X = (E1 + E2)/2 · 2/(2 + Z/2) (Thevenin: the mean EMF behind Z/2), |2/(2.025 + j0.25)| = 0.980215.
        // T1 at +4: E1 = 756 V, V_X = 738·0.980215 = 723.40 V, relay 120.57 V, below 121 V; at +5: E1 = 765 V,
        // V_X = 742.5·0.980215 = 727.81 V, relay 121.30 V, in band (and T2's relay is the same: it stays at 0).
        // The circulating current (I1 − I2)/2 = (E1 − E2)/(2Z) = 45/(2·0.502494) = 44.777 A.
        var t1 = both.Normal!.TapPositions[0];
        var t2 = both.Normal!.TapPositions[1];
        Assert.Equal((5, 0), (t1.Position, t2.Position));
        Assert.Equal(TapState.InBand, t1.State);
        Wn.Near(742.5 * 2 / Complex.Abs(new Complex(2.025, 0.25)), both.Normal!.V("X1", "M1").Magnitude, 1e-9, "bus voltage");
        var circulating = (both.Normal!.Section("LV1").Current - both.Normal!.Section("LV2").Current) / 2;
        Wn.Near(45 / (2 * Complex.Abs(new Complex(0.05, 0.5))), circulating.Magnitude, 1e-9, "circulating current");

        var follower = Wn.Solved(Paralleled + $"""

            {load}
            tap-changer T1 on LV1 sets n1 positions -8 to 8 step 1.25 turns regulate X1 M1 target 122 V bandwidth 2 V pt-ratio 6
            tap-changer T2 on LV2 sets n2 positions -8 to 8 step 1.25 turns follows T1
            """);
        Assert.Equal(follower.Normal!.TapPositions[0].Position, follower.Normal!.TapPositions[1].Position);
        Assert.Equal(TapState.Follows, follower.Normal!.TapPositions[1].State);
        Assert.True((follower.Normal!.Section("LV1").Current - follower.Normal!.Section("LV2").Current).Magnitude < 1e-9, "no circulating current");
    }

    [Fact]
    public void A_found_value_substituted_back_gives_the_target()
    {
        // Without control, V_R = 7200·(1 + 0.1·sel): 7500 V needs sel = 300/720 = 41.667 %.
        var text = Regulator("7200 V", "at 0").Replace("tap-changer REG on SER sets sel positions -16 to 16 step 6.25 % reversing at 0", "find sel voltage R N equals 7500 V from 0 % to 100 %");
        var e = Wn.Solved(text);
        var found = e.Model.Lets["sel"].Real;
        Wn.Near(300.0 / 720, found, 1e-9, "found selector position");
        Wn.Near(7500, e.Normal!.V("R", "N").Magnitude, 1e-9, "every result is at the found value");
        Assert.Contains("sel = 41.67 %", e.Single("found").Message);
        // Substituted back as written, the file gives the target by itself.
        var back = Wn.Solved(text.Replace("let sel = 0 %", $"let sel = {found * 100:R} %").Replace("find sel voltage R N equals 7500 V from 0 % to 100 %", ""));
        Wn.Near(7500, back.Normal!.V("R", "N").Magnitude, 1e-12, "substituted back");
    }

    [Fact]
    public void Find_says_when_there_is_no_value_or_several()
    {
        var none = Wn.Eval(Regulator("7200 V", "at 0").Replace("tap-changer REG on SER sets sel positions -16 to 16 step 6.25 % reversing at 0", "find sel voltage R N equals 8500 V from 0 % to 100 %"));
        Assert.Null(none.Normal);
        Assert.Contains("runs from 7.200 kV to 7.920 kV", none.Single("find-none").Message);
        // Between the selector and a fixed tap M at the middle of the series winding the voltage is
        // |sel − 50 %|·762 V·(7200/7620): 180 V at sel = 50 % ± 180/720 = 25 % and 75 %: two roots.
        var several = Wn.Eval(Regulator("7200 V", "at 0", extra: "tap M on SER at 50 %").Replace("tap-changer REG on SER sets sel positions -16 to 16 step 6.25 % reversing at 0", "find sel voltage R M equals 180 V from 0 % to 100 %"));
        Assert.Null(several.Normal);
        var d = several.Single("find-several");
        Assert.Contains("25.00 %, 75.00 %", d.Message);
    }

    [Fact]
    public void Cascaded_regulators_settle_from_the_first_written()
    {
        // 7000 V in; the first regulator holds its output R in 119..121 V at pt 63.5:
        // 1 + 0.00625·k ≥ 119·63.5/7000 = 1.07950 → +13, R = 7000·1.08125 = 7568.75 V (119.19 V at the relay).
        // The second, fed from R, then finds its own output in the band at 0 and stays there.
        var e = Wn.Solved(Regulator("7000 V", "regulate R N target 120 V bandwidth 2 V pt-ratio 63.5", load: """
            let sel2 = 0 %
            core K2 rating 333 kVA
            winding SH2 on K2 turns 1000 rated 7620 V from N2 to U
            winding SER2 on K2 turns 100 rated 762 V from U1 to U2
            brush R2 on SER2 at sel2
            join R U U1
            join N N2
            load town R2 N impedance 200 ohm pf 1
            """, extra: "tap-changer REG2 on SER2 sets sel2 positions -16 to 16 step 6.25 % reversing regulate R2 N target 120 V bandwidth 2 V pt-ratio 63.5"));
        Assert.Equal(13, Position(e.Normal!).Position);
        Assert.Equal(0, Position(e.Normal!, "REG2").Position);
        Wn.Near(7568.75, e.Normal!.V("R2", "N").Magnitude, 1e-9, "far end");
    }
}

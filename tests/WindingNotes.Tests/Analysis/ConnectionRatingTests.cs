using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>
/// The two-winding rating an autotransformer connection needs is the series winding's voltage times
/// its current, whatever the wiring; the co-ratio is that over the throughput; the output is compared
/// with the voltage between the supply points it is fed from. All units here are ideal (no impedance
/// lines, no no-load test), so the figures are exact.
/// </summary>
public class ConnectionRatingTests
{
    // A 240/24 V unit at 1 V/turn.
    private static string Unit(string rating, string wiring) => $"""
        frequency 60 Hz
        core K1 rating {rating}
        winding HV on K1 turns 240 rated 240 V from H1 to H2
        winding LV on K1 turns 24 rated 24 V from X1 to X2
        {wiring}

        """;

    [Fact]
    public void Buck_with_the_common_winding_across_the_line_needs_the_series_winding_VA()
    {
        // 240 V across HV; LV joined at H1 and opposing, so the output X2–H2 is 240 − 24 = 216 V. A
        // 2.16 ohm load draws 216/2.16 = 100 A through LV: the series winding carries 24 V × 100 A =
        // 2.400 kVA (HV carries 240 V × 10 A, the same by ampere-turn balance). Throughput 216 × 100 =
        // 21.60 kVA, co-ratio 2400/21600 = 0.1111. The formula in voltages, (240 − 216)/240 = 0.1,
        // would say 2.160 kVA and stay silent on a 2.2 kVA core.
        var e = Wn.Solved(Unit("2.2 kVA", """
            supply mains H1 H2 240 V
            ground H2
            join H1 X1
            load heater X2 H2 impedance 2.16 ohm
            """));
        var a = e.Normal!.Connections.Single();
        Wn.Near(216, e.Normal.Load("heater").Voltage.Magnitude, 1e-12, "output");
        Wn.Near(2400, a.TwoWindingRating, 1e-9, "two-winding rating");
        Wn.Near(2400.0 / 21600, a.CoRatio!.Value, 1e-9, "co-ratio");
        Assert.StartsWith("the autotransformer connection needs a two-winding rating of 2.400 kVA (21.60 kVA throughput at a co-ratio of 0.1111)",
            e.Single("connection-rating").Message);
    }

    [Fact]
    public void Series_opposing_with_the_supply_across_both_windings_needs_the_series_winding_VA()
    {
        // 216 V across HV and LV in opposition (240 − 24 turns at 1 V/turn), the load across HV at 240 V.
        // A 24 ohm load takes 10 A, 2.400 kVA; the supply gives 2400/216 = 11.11 A through LV, so the
        // series winding carries 24 × 2400/216 = 266.7 VA and the co-ratio is 266.7/2400 = 0.1111
        // (the formula in voltages, (240 − 216)/240, would say 0.1 and 240 VA).
        var e = Wn.Solved(Unit("1 kVA", """
            supply mains X2 H2 216 V
            ground H2
            join H1 X1
            load motor H1 H2 impedance 24 ohm
            """));
        var a = e.Normal!.Connections.Single();
        Wn.Near(240, e.Normal.Load("motor").Voltage.Magnitude, 1e-12, "output");
        Wn.Near(24 * 2400.0 / 216, a.TwoWindingRating, 1e-9, "two-winding rating");
        Wn.Near(24.0 / 216, a.CoRatio!.Value, 1e-9, "co-ratio");
        // The output is above the supply it is fed from: 240 V against the 216 V of 'mains'.
        Assert.Contains("reaches 240.0 V, above the 216.0 V of supply 'mains'", e.Single("caution-above-supply").Message);
    }

    [Fact]
    public void A_boost_across_two_legs_of_a_split_phase_supply_is_compared_with_the_voltage_between_the_legs()
    {
        // 120/240 V split phase: HV across L1–L2 (240 V), LV adding 24 V at L1, the load from X1 to
        // L2 at 264 V. 26.4 ohm takes 10 A: throughput 2.640 kVA; LV carries 24 × 10 = 240 VA, so the
        // co-ratio is 24/264 = 0.09091 and a 1 kVA core is enough (one leg of 120 V would give
        // (264 − 120)/264 = 0.5455 and a false warning). The output is compared with the 240 V
        // between L1 and L2, the points it is fed from, not with one 120 V leg.
        var e = Wn.Solved(Unit("1 kVA", """
            supply leg1 L1 N 120 V
            supply leg2 N L2 120 V
            ground N
            join H1 L1 X2
            join H2 L2
            load pump X1 L2 impedance 26.4 ohm
            """));
        var c = e.Normal!;
        Wn.Near(264, c.Load("pump").Voltage.Magnitude, 1e-12, "output");
        Assert.All(c.Connections, a =>
        {
            Wn.Near(240, a.TwoWindingRating, 1e-9, "two-winding rating");
            Wn.Near(24.0 / 264, a.CoRatio!.Value, 1e-9, "co-ratio");
        });
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "connection-rating");
        Assert.Contains("reaches 264.0 V, above the 240.0 V between L1 and L2", e.Single("caution-above-supply").Message);
    }

    [Fact]
    public void A_boost_between_two_lines_is_compared_with_the_line_to_line_voltage()
    {
        // Lines A and B of a 120 V wye (208 V between them, 120·√3 = 207.85 V): HV across A–B, LV
        // adding at A, so the output is 207.85·264/240 = 228.63 V, in phase with the line-to-line
        // voltage. Compared with the 207.85 V between A and B it is above the supply; the series
        // winding carries 207.85/10 = 20.785 V × I, co-ratio 24/264.
        var e = Wn.Solved(Unit("1 kVA", """
            supply la A N 120 V angle 0 deg
            supply lb B N 120 V angle -120 deg
            ground N
            join H1 A X2
            join H2 B
            load pump X1 B impedance 50 ohm
            """));
        var c = e.Normal!;
        var line = 120 * Math.Sqrt(3);
        Wn.Near(line * 264 / 240, c.Load("pump").Voltage.Magnitude, 1e-12, "output");
        Assert.All(c.Connections, a => Wn.Near(24.0 / 264, a.CoRatio!.Value, 1e-9, "co-ratio"));
        Assert.Contains("above the 207.8 V between A and B", e.Single("caution-above-supply").Message);
    }
}

using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A solidly earthed three-phase supply ends its phases at earth, so earth is one of its supply points,
/// and so is the star point of one earthed through an impedance. A load is fed from a line wherever a
/// line reaches it along the windings, from earth or the star point only where none does; and only the
/// phases whose lines feed it make a connection with it. Checked by hand here.
/// </summary>
public class EarthFeedTests
{
    private static Evaluation Tapped(string winding, string tap) => Wn.Solved($"""
        frequency 50 Hz
        core K1 rating 10 kVA
        {winding}
        {tap}
        ground E
        three-phase-supply grid H1 H2 H3 400 V fault-level 10 MVA xr 5
        load heater T H2 impedance 40 ohm
        load aux H3 E impedance 100 ohm

        """);

    [Fact]
    public void A_tap_on_a_winding_from_a_line_to_earth_is_fed_from_the_line_whichever_way_the_winding_is_written()
    {
        // A 230-turn winding from line H1 to earth with a tap T 23 turns from earth (207 from H1), and a
        // heater from T to line H2. T is one section from H1 and one from earth, both supply points of the
        // solidly earthed supply: the search stopped at whichever section was written first, so written
        // from E the tap was taken as fed from earth through the 23 turns and the heater's output was set
        // against the 230.9 V from E to H2.
        var fromLine = Tapped("winding W on K1 turns 230 rated 230 V from H1 to E", "tap T on W at 207 turns");
        var fromEarth = Tapped("winding W on K1 turns 230 rated 230 V from E to H1", "tap T on W at 23 turns");
        foreach (var e in new[] { fromLine, fromEarth })
        {
            // The heater is fed between lines H1 and H2: a connection with each of phases a and b, both
            // compared with the voltage between H1 and H2, the series winding the 207 turns from H1.
            var n = e.Network!;
            var found = Connections.Find(n);
            Assert.Equal(["grid_a", "grid_b"], found.Select(c => c.Supply.Name));
            Assert.All(found, c =>
            {
                Assert.Equal((n.Node("H1"), n.Node("H2")), c.FedFrom);
                Assert.Equal(207, n.Sections[Assert.Single(c.Series)].Turns, 9);
            });
            // By hand: T stands at 23/230 of phase a's 400/√3 = 230.94 V, so the heater sees
            // |0.1 − 1∠−120°|·230.94 = |0.6 + j0.866|·230.94 = √1.11·230.94 = 243.3 V (the source's 0.016 Ω
            // drops well under 0.1 V of it). That is below the 400 V between H1 and H2: no caution of an
            // output above the supply (against the 230.9 V from E to H2 it read 105 %).
            var v = e.Normal!.Load("heater").Voltage.Magnitude;
            Wn.Near(Math.Sqrt(1.11) * 400 / Math.Sqrt(3), v, 2e-3, "heater voltage");
            Assert.DoesNotContain(e.Diagnostics, d => d.Code == "caution-above-supply");
            Assert.Contains(e.Diagnostics, d => d.Code == "caution-no-isolation");
        }
        Assert.Equal(fromLine.Normal!.Load("heater").Voltage.Magnitude, fromEarth.Normal!.Load("heater").Voltage.Magnitude, 9);
        Assert.Equal(Cautions(fromLine), Cautions(fromEarth));

        static string[] Cautions(Evaluation e) => [.. e.Diagnostics.Where(d => d.Code.StartsWith("caution-")).Select(d => $"{d.Code}: {d.Message}")];
    }

    [Fact]
    public void A_load_to_the_star_point_makes_a_connection_with_the_phase_that_feeds_it_only()
    {
        // Three phases written one by one, 230 V each from lines H1, H2, H3 to a star point N earthed
        // through 1 ohm. A booster on phase a (230 turns from H1 to N, 23 in series joined at H1) feeds a
        // heater from X1 to N: fed from H1 and N, across phase a. Phases b and c share only the star point
        // with the heater and feed it nothing, so they make no connection with it (each did: three
        // connections where there is one).
        var e = Wn.Solved("""
            frequency 50 Hz
            core K1 rating 10 kVA
            winding HV on K1 turns 230 rated 230 V from H1 to N
            winding LV on K1 turns 23 rated 23 V from X1 to X2
            impedance HV LV 4 % xr 2
            join H1 X2
            supply grid_a H1 N 230 V
            supply grid_b H2 N 230 V angle -120 deg
            supply grid_c H3 N 230 V angle 120 deg
            ground N impedance 1 ohm
            load heater X1 N impedance 10 ohm
            load aux H2 H3 impedance 100 ohm

            """);
        var n = e.Network!;
        var c = Assert.Single(Connections.Find(n));
        Assert.Equal("grid_a", c.Supply.Name);
        Assert.Equal((n.Node("H1"), n.Node("N")), c.FedFrom);
        Assert.Equal([n.Node("N")], c.Common.ToArray());
        Assert.Equal(23, n.Sections[Assert.Single(c.Series)].Turns, 9);
        Assert.Single(e.Normal!.Connections);
        // By hand: 1 + 23/230 = 1.1 times phase a's 230 V at no load (253 V), less the leakage drop of a
        // 6.4 kW heater on a 10 kVA unit at 4 % (at most about 2.6 % of it).
        var ratio = e.Normal.Load("heater").Voltage.Magnitude / (e.Normal.PointVoltage("H1") - e.Normal.PointVoltage("N")).Magnitude;
        Assert.InRange(ratio, 1.07, 1.1);
        var caution = Assert.Single(e.Diagnostics, d => d.Code == "caution-above-supply");
        Assert.Contains("of supply 'grid_a'", caution.Message);
    }
}

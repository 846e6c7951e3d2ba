using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>How the network is built and solved from what the document says (common practice where no source is named).</summary>
public class NetworkTests
{
    private const string Core = """
        frequency 50 Hz
        core K rating 1 kVA
        winding P on K turns 200 rated 230 V from P1 to P2
        supply s P1 P2 230 V
        ground P2

        """;

    [Theory]
    [InlineData("60 turns")]
    [InlineData("30 %")]
    [InlineData("69 V")]
    public void A_tap_in_turns_percent_or_volts_lands_on_the_same_turn(string at)
    {
        var c = Wn.Solved(Core + $"tap T on P at {at}\n").Normal!;
        // Counted from the from end, P1.
        Wn.Near(230 * 0.3, c.V("P1", "T").Magnitude, 1e-12, at);
    }

    [Fact]
    public void Turns_follow_from_rated_voltages_when_only_voltages_are_given()
    {
        var c = Wn.Solved(Core + "winding S on K rated 46 V from S1 to S2\nground S2\nload l S1 S2 impedance 10 ohm\n").Normal!;
        Wn.Near(46, c.V("S1", "S2").Magnitude, 1e-12, "secondary");
        Wn.Near(40, c.Section("S").Section.Turns, 1e-12, "turns from 230 V / 200 turns");
    }

    [Fact]
    public void Windings_that_disagree_on_volts_per_turn_get_a_warning()
    {
        var e = Wn.Eval(Core + "winding S on K turns 40 rated 48 V from S1 to S2\n");
        var d = e.Single("volts-per-turn");
        Assert.Equal("S", e.TextAt(d.Span));
        Assert.Equal(WindingNotes.Text.Severity.Warning, d.Severity);
    }

    [Fact]
    public void A_part_with_no_ground_gets_a_warning_and_its_first_node_as_reference()
    {
        var e = Wn.Solved(Core + "winding S on K turns 40 from S1 to S2\nload l S1 S2 impedance 10 ohm\n");
        var d = e.Single("no-ground");
        Assert.Contains("'S1'", d.Message);
        Assert.Equal(0, e.Normal!.PointVoltage("S1").Magnitude);
        Wn.Near(46, e.Normal.V("S2", "S1").Magnitude, 1e-12, "the voltage across it is still right");
    }

    [Fact]
    public void A_supply_drops_across_its_internal_impedance()
    {
        var c = Wn.Solved("frequency 50 Hz\nsupply s A N 100 V impedance 1 ohm\nground N\nload l A N impedance 9 ohm\n").Normal!;
        Wn.Near(90, c.V("A", "N").Magnitude, 1e-12, "divider");
    }

    [Fact]
    public void A_constant_current_load_draws_its_current_at_its_power_factor()
    {
        var c = Wn.Solved("frequency 50 Hz\nsupply s A N 100 V impedance 0.5 + j1 ohm\nground N\nload l A N current 8 A pf 0.6 lagging\n").Normal!;
        var l = c.Load("l");
        Wn.Near(8, l.Current.Magnitude, 1e-10, "current");
        Wn.Near(0.6, l.PowerFactor, 1e-10, "power factor");
        Assert.True(l.Power.Imaginary > 0, "lagging");
    }

    [Fact]
    public void A_constant_power_load_beyond_what_the_supply_can_give_does_not_converge()
    {
        // The most a 100 V source behind 1 ohm can deliver is 2.5 kW; ask for 10 kW.
        var e = Wn.Eval("frequency 50 Hz\nsupply s A N 100 V impedance 1 ohm\nground N\nload l A N power 10 kW\n");
        var d = e.Single("no-convergence");
        Assert.Equal("l", e.TextAt(d.Span));
        Assert.Empty(e.Cases);
    }

    [Fact]
    public void A_supply_shorted_by_a_join_is_an_error_at_the_supply()
    {
        var e = Wn.Eval("frequency 50 Hz\nsupply s A N 100 V\nground N\njoin A N\n");
        Assert.Equal("s", e.TextAt(e.Single("supply-shorted").Span));
    }

    [Fact]
    public void Two_grounded_units_are_solved_apart_and_agree_with_each_alone()
    {
        var one = Core + "winding S on K turns 20 from S1 to S2\nground S2\nload l S1 S2 impedance 2 ohm\n";
        var two = one + one.Replace("frequency 50 Hz\n", "").Replace("K", "Q").Replace("P", "R").Replace("S", "U").Replace(" s ", " t ").Replace("load l", "load m");
        var c = Wn.Solved(two).Normal!;
        Wn.Near(23, c.V("S1", "S2").Magnitude, 1e-12, "first unit");
        Wn.Near(23, c.V("U1", "U2").Magnitude, 1e-12, "second unit");
    }
}

using System.Text.RegularExpressions;
using CsCheck;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Networks that cannot be solved as written get a diagnostic that names what is wrong at its line,
/// never an exception (common practice: the annotated files in Data/diagnostics hold each message).
/// </summary>
public partial class IllPosedNetworkTests
{
    [GeneratedRegex(@"^(winding .*?) resistance \S+ ohm(.*)$", RegexOptions.Multiline)]
    private static partial Regex StatedResistance();

    [GeneratedRegex(@"^impedance .*$\n", RegexOptions.Multiline)]
    private static partial Regex ImpedanceLine();

    [GeneratedRegex(@"^ground .*$\n", RegexOptions.Multiline)]
    private static partial Regex GroundLine();

    [GeneratedRegex(@"\b[A-Z][A-Za-z0-9]*[ab]\b")]
    private static partial Regex Terminal();

    /// <summary>
    /// Random networks spoiled at random: windings made ideal, extra joins between any two points,
    /// grounds taken away, near-zero loads, a stiff second supply, faults anywhere. Whatever comes of
    /// it, the evaluation returns, and a file with no results says why with an error in the document.
    /// </summary>
    [Fact]
    public void Spoiled_networks_give_diagnostics_and_never_an_internal_error()
    {
        Gen.Int[0, int.MaxValue].Sample(seed =>
        {
            var random = new Random(seed);
            var text = RandomNetworks.Write(seed);
            if (random.Next(2) == 0) text = StatedResistance().Replace(text, "$1$2");
            if (random.Next(2) == 0) text = ImpedanceLine().Replace(text, "");
            if (random.Next(3) == 0) text = GroundLine().Replace(text, "", 1);
            var points = Terminal().Matches(text).Select(m => m.Value).Distinct().ToList();
            string Point() => points[random.Next(points.Count)];
            for (var n = random.Next(0, 3); n > 0; n--) text += $"join {Point()} {Point()}\n";
            if (random.Next(3) == 0) text += $"load tiny {Point()} {Point()} impedance 1e-12 ohm\n";
            if (random.Next(4) == 0) text += $"supply stiff {Point()} {Point()} 100 V\n";
            if (random.Next(3) == 0) text += $"fault F {Point()} {Point()}\n";

            var e = Wn.Eval(text);
            Assert.DoesNotContain(e.Diagnostics, d => d.Code == "internal-error");
            if (e.Cases.IsEmpty && !e.Model.Supplies.IsEmpty)
                Assert.True(e.Diagnostics.Any(d => d.IsError && d.Span.Length > 0), $"no results and no error (seed {seed})\n{text}");
        }, iter: 100);
    }

    [Fact]
    public void A_supply_shorted_through_ideal_windings_names_them_at_their_lines()
    {
        var e = Wn.Eval("""
            frequency 50 Hz
            core K rating 1 kVA
            winding A on K turns 100 rated 100 V from A1 to A2
            winding B on K turns 10 rated 10 V from B1 to B2
            supply bench A1 A2 100 V
            ground A2
            join B1 B2
            """);
        var d = e.Single("supply-shorted");
        Assert.Equal("supply bench A1 A2 100 V", e.TextAt(d.Span));
        Assert.Equal(["winding A on K turns 100 rated 100 V from A1 to A2", "winding B on K turns 10 rated 10 V from B1 to B2"],
            d.Related.Select(r => e.TextAt(r.Span)).Order());
        Assert.Empty(e.Cases);
    }

    [Fact]
    public void The_same_unit_with_leakage_solves_the_short()
    {
        var e = Wn.Solved("""
            frequency 50 Hz
            core K rating 1 kVA
            winding A on K turns 100 rated 100 V from A1 to A2
            winding B on K turns 10 rated 10 V from B1 to B2
            impedance A B 5 %
            supply bench A1 A2 100 V
            ground A2
            join B1 B2
            """);
        // 5 % on 1 kVA at 100 V: 0.5 ohm, so 200 A.
        Wn.Near(200, e.Normal!.Supply("bench").Current.Magnitude, 1e-12, "short-circuit current");
    }

    [Fact]
    public void An_open_winding_needs_no_ground_and_a_loaded_floating_one_does()
    {
        const string unit = """
            frequency 50 Hz
            core K rating 1 kVA
            winding P on K turns 200 rated 230 V from P1 to P2
            winding S on K turns 20 rated 23 V from S1 to S2
            supply s P1 P2 230 V
            ground P2

            """;
        Assert.DoesNotContain(Wn.Solved(unit).Diagnostics, d => d.Code == "no-ground");
        var loaded = Wn.Solved(unit + "load l S1 S2 impedance 5 ohm\n");
        Assert.Contains("'S1', 'S2'", loaded.Single("no-ground").Message);
        Wn.Near(23, loaded.Normal!.V("S1", "S2").Magnitude, 1e-12, "its voltage is still known");
    }

    [Fact]
    public void Loads_with_no_source_are_named_once_at_the_first()
    {
        var e = Wn.Solved("frequency 50 Hz\nsupply s A N 100 V\nground N\nload a A N impedance 10 ohm\nload b x y impedance 1 ohm\nload c y x impedance 2 ohm\n");
        var d = e.Single("no-source");
        Assert.Equal("b", e.TextAt(d.Span));
        Assert.Equal("c", e.TextAt(Assert.Single(d.Related).Span));
        Assert.Equal(0, e.Normal!.Load("b").Current.Magnitude);
    }

    [Fact]
    public void A_constant_power_load_left_alone_at_a_node_draws_nothing_and_the_rest_still_solves()
    {
        // The winding names a core that is not there, so the load on its terminal has nothing else at that node.
        var e = Wn.Eval("""
            frequency 60 Hz
            core K1 rating 0.5 kVA
            winding HV on K1 turns 240 rated 240 V from H1 to H2
            winding LV on K9 turns 24 rated 24 V from X1 to X2
            supply mains H1 H2 208 V
            ground H2
            join H1 X2
            load planer X1 H1 power 3.2 kW pf 0.82 lagging
            load heater H1 H2 impedance 10 ohm
            """);
        Assert.Equal("K9", e.TextAt(e.Single("unknown-name").Span));
        // A file with an error is not solved; the solver, handed the network all the same, copes.
        Assert.Null(e.Normal);
        var (solved, diagnostics) = SolveAsBuilt(e);
        Assert.Equal(["load-without-voltage"], diagnostics.Select(d => d.Code));
        Assert.Equal("planer", e.TextAt(diagnostics[0].Span));
        Assert.Equal(0, solved.Load("planer").Current.Magnitude);
        Wn.Near(20.8, solved.Load("heater").Current.Magnitude, 1e-12, "208 V across 10 ohm");
    }

    /// <summary>The normal case of the network the builder makes of a file, errors or not, and what solving it says.</summary>
    private static (WindingNotes.Solve.CaseResult Case, List<WindingNotes.Text.Diagnostic> Diagnostics) SolveAsBuilt(WindingNotes.Workspace.Evaluation e)
    {
        var network = WindingNotes.Model.NetworkBuilder.Build(e.Model);
        var p = WindingNotes.Solve.Points.Solve(network, WindingNotes.Kernel.CaseSpec.Normal, withFaults: false, default);
        return (p.Case!, [.. network.Diagnostics, .. p.Diagnostics]);
    }

    [Fact]
    public void A_chain_of_constant_power_loads_ending_nowhere_draws_nothing()
    {
        // X1 has load b alone, so b carries nothing (KCL); then X3 has load a alone, and so on.
        // The binder calls X1 a slip (a node nothing else touches); the solver, handed the network, copes.
        var e = Wn.Eval("frequency 60 Hz\nsupply mains H1 H2 208 V\nground H2\nload r H1 H2 impedance 10 ohm\nload a H1 X3 power 1 kW\nload b X3 X1 power 1 kW\n");
        Assert.Equal("X1", e.TextAt(e.Errors().Single(d => d.Code == "lonely-node").Span));
        var (solved, diagnostics) = SolveAsBuilt(e);
        Assert.Equal(["a", "b"], diagnostics.Where(d => d.Code == "load-without-voltage").Select(d => e.TextAt(d.Span)).Order());
        Assert.Equal(0, solved.Load("a").Current.Magnitude);
        Wn.Near(20.8, solved.Load("r").Current.Magnitude, 1e-12, "208 V across 10 ohm");
    }

    [Fact]
    public void Constant_power_loads_in_series_share_one_current()
    {
        // Nothing but the two loads at M: the current is (P1 + P2) / V, each load's voltage P / I (circuit laws).
        var e = Wn.Solved("frequency 50 Hz\nsupply s A N 200 V\nground N\nload a A M power 1 kW\nload b M N power 3 kW\n");
        Wn.Near(20, e.Normal!.Load("a").Current.Magnitude, 1e-9, "series current");
        Wn.Near(50, e.Normal!.Load("a").Voltage.Magnitude, 1e-9, "voltage of a");
        Wn.Near(150, e.Normal!.Load("b").Voltage.Magnitude, 1e-9, "voltage of b");
    }
}

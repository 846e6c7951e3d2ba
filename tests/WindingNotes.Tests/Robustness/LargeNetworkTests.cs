using System.Numerics;
using System.Text;
using WindingNotes.Report.Diagrams;
using WindingNotes.Solve;
using WindingNotes.Tests.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// Large files evaluate correctly: a file of a thousand lines of many units gives each unit the
/// numbers it gives alone, and one connected network of 300 sections obeys the ideal relations
/// exactly where they apply and the circuit laws everywhere.
/// </summary>
public class LargeNetworkTests
{
    /// <summary>A random network with a constant-current load (solved by Newton's method) and a fault of its own, through 20 ohm.</summary>
    public static string Unit(int seed) =>
        RandomNetworks.Write(seed) + "load LP S00a S00b current 50 mA pf 0.9 lagging\nfault F S00a S00b impedance 20 ohm\n";

    // Half a minute on two cores: in the category CI always runs and the quick loop leaves out.
    [Trait("Category", "Long")]
    [Fact]
    public void A_thousand_line_file_of_many_units_gives_each_unit_what_it_gives_alone()
    {
        var units = new List<(string Prefix, string Alone)>();
        var file = new StringBuilder("frequency 50 Hz\n");
        for (var u = 0; file.ToString().Count(c => c == '\n') < 1000; u++)
        {
            var alone = Unit(1000 + u);
            units.Add(($"u{u}_", alone));
            file.Append(FuzzInputs.Unit(alone, $"u{u}_"));
        }
        var text = file.ToString();
        Assert.InRange(text.Count(c => c == '\n'), 1000, 1100);
        var big = Wn.Solved(text);
        var normal = big.Normal!;
        CircuitLaws.Hold(big.Network!, normal, "the whole file");

        foreach (var (prefix, alone) in units)
        {
            var e = Wn.Solved(alone);
            Same(e.Normal!, normal, prefix, "normal case");
            Same(e.Cases.Single(c => c.Case.Name == "fault F"), big.Cases.Single(c => c.Case.Name == $"fault {prefix}F"), prefix, "fault case");
        }
    }

    /// <summary>Every voltage and current of the unit alone, found under its prefixed names in the whole file's case, to 1e-9.</summary>
    private static void Same(CaseResult alone, CaseResult inFile, string prefix, string what)
    {
        var scale = alone.Points.Max(p => p.Voltage.Magnitude);
        foreach (var (point, voltage) in alone.Points)
            Near(voltage, inFile.PointVoltage(prefix + point), scale, $"{what}: voltage of {prefix}{point}");
        var current = alone.Supplies.Max(s => s.Current.Magnitude);
        var sections = inFile.Sections.ToDictionary(s => (s.Winding.Name, s.Section.FromPoint, s.Section.ToPoint));
        foreach (var s in alone.Sections)
            Near(s.Current, sections[(prefix + s.Winding.Name, prefix + s.Section.FromPoint, prefix + s.Section.ToPoint)].Current, current, $"{what}: current in {prefix}{s.Section.Name}");
        foreach (var s in alone.Supplies)
            Near(s.Current, inFile.Supplies.Single(x => x.Supply.Name == prefix + s.Supply.Name).Current, current, $"{what}: current of {prefix}{s.Supply.Name}");
        foreach (var l in alone.Loads)
            Near(l.Current, inFile.Loads.Single(x => x.Load.Name == prefix + l.Load.Name).Current, current, $"{what}: current of {prefix}{l.Load.Name}");
        if (alone.Fault is { } fault) Near(fault.Current, inFile.Fault!.Current, fault.Current.Magnitude, $"{what}: fault current");
    }

    private static void Near(Complex expected, Complex actual, double scale, string what) =>
        Assert.True((actual - expected).Magnitude <= 1e-9 * scale, $"{what}: {actual} against {expected} alone");

    [Fact]
    public void Three_hundred_sections_of_one_ideal_winding_give_the_turns_ratio_at_every_tap()
    {
        // R1, any electric machines textbook (standard physics): volts per turn equal on one core, so
        // a tap n turns above the common end stands at V·n/N; and Σ N·I = 0, so the supply across all
        // N turns carries Σ I_k·n_k/N for loads I_k at taps n_k.
        const int turns = 3000, step = 10, volts = 3000;
        var o = new StringBuilder($"frequency 50 Hz\ncore K rating 500 kVA\nwinding W on K turns {turns} from A to B\nsupply mains A B {volts} V\nground B\n");
        for (var k = 1; k < turns / step; k++)
            o.Append($"tap T{k} on W at {k * step} turns\nload L{k} T{k} B impedance {10 + k % 7} + j{k % 5} ohm\n");
        var e = Wn.Solved(o.ToString());
        var c = e.Normal!;
        Assert.Equal(300, e.Network!.Sections.Length);
        var expectedSupply = Complex.Zero;
        for (var k = 1; k < turns / step; k++)
        {
            var above = turns - k * step;
            var v = new Complex(volts * (double)above / turns, 0);
            Near(v, c.V($"T{k}", "B"), volts, $"voltage at tap T{k}");
            var i = v / new Complex(10 + k % 7, k % 5);
            Near(i, c.Load($"L{k}").Current, i.Magnitude, $"current of L{k}");
            expectedSupply += i * above / turns;
        }
        Near(expectedSupply, c.Supply("mains").Current, expectedSupply.Magnitude, "supply current");
        CircuitLaws.Hold(e.Network!, c, "one ideal winding");
    }

    [Fact]
    public void A_chain_of_thirty_cores_is_one_network_of_300_sections_that_obeys_the_circuit_laws()
    {
        var e = Wn.Solved(Chain(30));
        Assert.Equal(300, e.Network!.Sections.Length);
        CircuitLaws.Hold(e.Network!, e.Normal!, "a chain of cores");
        // Each stage steps 400 V down by 400:380 turns and loads it lightly: the end of the chain sits
        // near 400·(380/400)^30 ≈ 86 V, a little below for the leakage and resistance on the way.
        var end = e.Normal!.V("S29a", "S29b").Magnitude;
        Assert.InRange(end, 0.9 * 400 * Math.Pow(380.0 / 400, 30), 400 * Math.Pow(380.0 / 400, 30));
        var diagram = NetworkDiagram.Draw(e);
        Assert.DoesNotContain("too many to draw", diagram.Svg);
    }

    /// <summary>
    /// Cores in a chain, each fed from the secondary of the one before: a primary of four sections
    /// and two secondaries of three, with leakage and resistance, light loads on the second secondary.
    /// </summary>
    public static string Chain(int cores)
    {
        var o = new StringBuilder("frequency 50 Hz\n");
        for (var c = 0; c < cores; c++)
        {
            o.Append($"core K{c} rating 10 kVA\n");
            o.Append($"winding P{c} on K{c} turns 400 from P{c}a to P{c}b resistance 0.2 ohm\n");
            for (var t = 1; t <= 3; t++) o.Append($"tap P{c}t{t} on P{c} at {t * 100} turns\n");
            o.Append($"winding S{c} on K{c} turns 380 from S{c}a to S{c}b resistance 0.18 ohm\n");
            o.Append($"winding Q{c} on K{c} turns 120 from Q{c}a to Q{c}b resistance 0.05 ohm\n");
            foreach (var w in new[] { "S", "Q" })
                for (var t = 1; t <= 2; t++) o.Append($"tap {w}{c}t{t} on {w}{c} at {t * (w == "S" ? 120 : 40)} turns\n");
            o.Append($"impedance P{c} S{c} 1 ohm xr 4\nimpedance P{c} Q{c} 2 ohm xr 3\nimpedance S{c} Q{c} 1.5 ohm xr 3\n");
            o.Append(c == 0 ? "supply mains P0a P0b 400 V impedance 0.01 + j0.05 ohm\nground P0b\n" : $"join S{c - 1}a P{c}a\njoin S{c - 1}b P{c}b\n");
            o.Append($"ground S{c}b\nground Q{c}b\nload L{c} Q{c}t1 Q{c}b impedance 400 + j100 ohm\n");
        }
        return o.ToString();
    }
}

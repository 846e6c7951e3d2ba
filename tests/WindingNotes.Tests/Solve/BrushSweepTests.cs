using System.Text;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Text;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The fast path of brush sweeps against the general one, point by point: every number of every
/// case (loaded and without loads) equal to 1e-9 of its size, and the same diagnostics. The
/// networks make it meet what it must hand back: brushes that cross taps and reach the winding's
/// ends, sweeps in volts, two brushes in a grid, constant-power loads; a brush that bounds a leakage
/// member changes the members and must take the general path.
/// </summary>
public class BrushSweepTests
{
    /// <summary>Twenty sections: a primary tapped seventeen times and a winding with a brush.</summary>
    public static string TwentySections(string sweep = "sweep BR from 1 % to 99 % points 60", string loads = "load heater BR A impedance 20 ohm")
    {
        var o = new StringBuilder("frequency 60 Hz\ncore K rating 5 kVA area 40 cm2 flux-limit 1.6 T\n");
        o.Append("winding P on K turns 480 rated 480 V from H1 to H2 resistance 1.2 ohm\n");
        for (var i = 1; i <= 17; i++) o.Append($"tap P{i} on P at {i * 26} turns\n");
        o.Append("winding W on K turns 240 rated 240 V from A to B resistance 0.3 ohm rated-current 20 A\n");
        o.Append("brush BR on W at 50 % range 0 % to 100 %\n");
        o.Append("impedance P W 4 % xr 3\n");
        o.Append("supply mains H1 H2 480 V fault-level 10 kA xr 5\nground H2\nground A\n");
        o.Append($"{loads}\nload lamp P9 H2 impedance 200 ohm\n{sweep}\n");
        return o.ToString();
    }

    private const string Bench = """
        frequency 60 Hz
        core VT rating 1.4 kVA area 18 cm2 flux-limit 1.5 T
        winding W on VT turns 234 rated 140.4 V from A to B resistance 0.55 ohm rated-current 8 A
        tap LINE on W at 200 turns
        tap MID on W at 117 turns
        brush BR on W at 50 % range 0 % to 100 % current-limit 8 A
        supply bench LINE A 120 V fault-level 2 kA xr 2
        ground A
        load heater BR A impedance 40 ohm
        sweep BR from 0 % to 100 % step 2.5 %
        """;

    public static TheoryData<string, string> Networks => new()
    {
        { "twenty sections", TwentySections() },
        { "bench: crosses taps, reaches both ends", Bench },
        { "in volts", Bench.Replace("sweep BR from 0 % to 100 % step 2.5 %", "sweep BR from 10 V to 130 V step 7 V") },
        { "constant-power load", TwentySections(loads: "load heater BR A power 2 kW pf 0.9 lagging") },
        { "two brushes in a grid", """
            frequency 50 Hz
            core K rating 2 kVA area 20 cm2 flux-limit 1.5 T
            winding P on K turns 230 rated 230 V from H1 to H2 resistance 0.8 ohm
            winding S on K turns 120 rated 120 V from X1 to X2 resistance 0.2 ohm
            tap S1 on S at 60 turns
            brush LO on S at 20 % range 0 % to 50 %
            brush HI on S at 80 % range 50 % to 100 %
            impedance P S 3 % xr 2
            supply mains H1 H2 230 V
            ground H2
            ground X1
            load a LO X1 impedance 10 ohm
            load b HI LO impedance 15 + j5 ohm
            sweep LO from 5 % to 45 % points 7
            sweep HI from 55 % to 95 % points 7
            """ },
    };

    [Theory]
    [MemberData(nameof(Networks))]
    public void Every_fast_point_equals_the_full_solve(string what, string text)
    {
        var syntax = Parser.Parse(text);
        var model = Binder.Bind(syntax);
        var axes = Sweeps.Plan(model, new DiagnosticBag());
        var sweep = new BrushSweep(syntax, model);
        var count = Sweeps.Count(axes);
        Assert.True(count > 10, what);
        for (long k = 0; k < count; k++)
        {
            var (overrides, labels) = Sweeps.Point(axes, k);
            var spec = CaseSpec.ForSweep(labels);
            Assert.True(sweep.Covers(overrides));
            var fast = sweep.Solve(overrides, spec, default);
            var full = Points.Solve(syntax, overrides, spec, withFaults: false, default);
            var where = $"{what} at {spec.Where}";
            Assert.Equal(Describe(full.Diagnostics), Describe(fast.Diagnostics));
            Assert.Equal(full.Solved, fast.Solved);
            if (!full.Solved) continue;
            AssertSame(full.Case!, fast.Case!, where);
            Assert.Equal(full.NoLoad is null, fast.NoLoad is null);
            if (full.NoLoad is { } noLoad) AssertSame(noLoad, fast.NoLoad!, where + " without loads");
        }
        // Most points take the fast path: all but the first of each run between taps (and those at a tap).
        Assert.True(sweep.Moved >= count / 2, $"{what}: only {sweep.Moved} of {count} points moved");
    }

    [Fact]
    public void A_brush_that_bounds_a_leakage_member_takes_the_general_path()
    {
        var text = TwentySections().Replace("impedance P W 4 % xr 3", "impedance P W:A-BR 4 % xr 3\nimpedance P W:BR-B 5 % xr 3");
        var syntax = Parser.Parse(text);
        var model = Binder.Bind(syntax);
        var axes = Sweeps.Plan(model, new DiagnosticBag());
        var sweep = new BrushSweep(syntax, model);
        for (long k = 0; k < Sweeps.Count(axes); k++)
        {
            var (overrides, labels) = Sweeps.Point(axes, k);
            sweep.Solve(overrides, CaseSpec.ForSweep(labels), default);
        }
        Assert.Equal(0, sweep.Moved);
    }

    internal static List<string> Describe(IEnumerable<Diagnostic> diagnostics) => [.. diagnostics.Select(d => $"{d.Code} {d.Span} {d.Message}")];

    internal static void AssertSame(CaseResult expected, CaseResult actual, string where)
    {
        var want = CaseValues.Of(expected).ToList();
        var got = CaseValues.Of(actual).ToList();
        Assert.Equal(want.Select(v => v.Path), got.Select(v => v.Path));
        var scale = want.GroupBy(v => v.Unit).ToDictionary(g => g.Key, g => g.Max(v => Math.Abs(v.Value)));
        foreach (var (w, g) in want.Zip(got))
            Assert.True(Math.Abs(w.Value - g.Value) <= 1e-9 * Math.Max(scale[w.Unit], 1e-300), $"{where}: {w.Path} full {w.Value} fast {g.Value}");
        Assert.Equal(expected.Case, actual.Case);
    }
}

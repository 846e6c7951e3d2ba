using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A load cycle's fast path against the general one: the network with its loads scaled, made from
/// the built network and solved by updating its factors, equal in every number to the network built
/// from the scaled model and solved in full (1e-9 of each unit's largest value). Impedance loads take
/// the update; constant-power loads (Newton's method) and a file of two units take what they must.
/// </summary>
public class LoadScalingTests
{
    private const string TwoUnits = """
        frequency 50 Hz
        core K1 rating 2 kVA area 20 cm2 flux-limit 1.5 T
        winding P1 on K1 turns 230 rated 230 V from H1 to H2 resistance 0.8 ohm
        winding S1 on K1 turns 120 rated 120 V from X1 to X2 resistance 0.2 ohm
        impedance P1 S1 3 % xr 2
        supply m1 H1 H2 230 V
        ground H2
        ground X2
        load a1 X1 X2 impedance 10 ohm
        core K2 rating 1 kVA area 12 cm2 flux-limit 1.5 T
        winding P2 on K2 turns 400 rated 400 V from J1 to J2 resistance 2 ohm
        winding S2 on K2 turns 48 rated 48 V from Y1 to Y2 resistance 0.01 ohm
        tap Y3 on S2 at 50 %
        impedance P2 S2 4 % xr 1.5
        supply m2 J1 J2 400 V fault-level 5 kA xr 4
        ground J2
        ground Y2
        load a2 Y1 Y2 impedance 3 + j1 ohm
        load b2 Y3 Y2 impedance 2 ohm
        """;

    public static TheoryData<string, string, bool> Networks => new()
    {
        { "twenty sections, impedance loads", BrushSweepTests.TwentySections(sweep: ""), true },
        { "two units, two parts", TwoUnits, true },
        { "constant-power load", BrushSweepTests.TwentySections(sweep: "", loads: "load heater BR A power 2 kW pf 0.9 lagging"), false },
    };

    [Theory]
    [MemberData(nameof(Networks))]
    public void Every_scaled_network_equals_the_one_built_and_solved_in_full(string what, string text, bool updated)
    {
        var model = Binder.Bind(Parser.Parse(text));
        Assert.False(model.HasErrors, what);
        var scaling = new LoadScaling(NetworkBuilder.Build(model));
        double[] factors = [0.05, 0.5, 0.8, 0.9999, 1.15, 1.5, 2.7];
        foreach (var k in factors)
        {
            var fast = scaling.Solve(scaling.At(k), default);
            var full = NetworkSolver.Solve(NetworkBuilder.Build(model with { Loads = [.. model.Loads.Select(l => l with { S0 = l.S0 * k })] }), CaseSpec.Normal);
            Assert.True(fast.Solved && full.Solved, what);
            AssertSame(Results.Compute(full, null), Results.Compute(fast, null), $"{what} at {k}");
        }
        Assert.Equal(updated ? factors.Length : 0, scaling.Updated);
    }

    private static void AssertSame(CaseResult expected, CaseResult actual, string where)
    {
        var want = CaseValues.Of(expected).ToList();
        var got = CaseValues.Of(actual).ToList();
        Assert.Equal(want.Select(v => v.Path), got.Select(v => v.Path));
        var scale = want.GroupBy(v => v.Unit).ToDictionary(g => g.Key, g => g.Max(v => Math.Abs(v.Value)));
        foreach (var (w, g) in want.Zip(got))
            Assert.True(Math.Abs(w.Value - g.Value) <= 1e-9 * Math.Max(scale[w.Unit], 1e-300), $"{where}: {w.Path} full {w.Value} fast {g.Value}");
    }
}

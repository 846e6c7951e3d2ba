using System.Globalization;
using System.Text;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Writes random well-formed networks in the notation: a supplied core, further cores fed from a
/// secondary of the one before, tapped secondaries, impedance loads within each part, and now and
/// then a secondary joined to the supply as an autotransformer.
/// </summary>
public static class RandomNetworks
{
    /// <param name="maxCores">The most cores; each brings up to a dozen unknowns, so many cores make a system for the sparse LU.</param>
    public static string Write(int seed, int maxCores = 2)
    {
        var random = new Random(seed);
        string N(double x) => x.ToString("G6", CultureInfo.InvariantCulture);
        double Between(double a, double b) => a + (b - a) * random.NextDouble();
        var o = new StringBuilder("frequency 50 Hz\n");
        var cores = random.Next(1, maxCores + 1);
        var feeders = new List<(string From, string To)>();
        for (var c = 0; c < cores; c++)
        {
            o.Append($"core K{c} rating {N(Between(1, 10))} kVA\n");
            var primaryTurns = random.Next(50, 500);
            o.Append($"winding P{c} on K{c} turns {primaryTurns} from P{c}a to P{c}b resistance {N(Between(0.01, 2))} ohm\n");
            if (c == 0)
            {
                o.Append($"supply mains P0a P0b {N(Between(100, 500))} V impedance {N(Between(0.001, 0.1))} + j{N(Between(0.001, 0.3))} ohm\n");
                o.Append("ground P0b\n");
            }
            else
            {
                var (from, to) = feeders[random.Next(feeders.Count)];
                o.Append($"join {from} P{c}a\njoin {to} P{c}b\n");
            }
            var secondaries = random.Next(1, 4);
            var autotransformer = c == 0 && random.Next(3) == 0;
            for (var s = 0; s < secondaries; s++)
            {
                var name = $"S{c}{s}";
                var turns = random.Next(5, 400);
                o.Append($"winding {name} on K{c} turns {turns} from {name}a to {name}b resistance {N(Between(0.001, 1))} ohm\n");
                o.Append($"impedance P{c} {name} {N(Between(0.5, 5))} ohm xr {N(Between(0.5, 10))}\n");
                var points = new List<string> { $"{name}a", $"{name}b" };
                for (var t = random.Next(0, 3); t > 0; t--)
                {
                    var tap = $"{name}t{t}";
                    o.Append($"tap {tap} on {name} at {random.Next(1, turns)} turns\n");
                    points.Add(tap);
                }
                // An autotransformer secondary rides on the supply and must not be grounded as well.
                if (autotransformer && s == 0) o.Append($"join P0a {name}b\n");
                else o.Append($"ground {name}b\n");
                for (var l = random.Next(1, 3); l > 0; l--)
                {
                    var a = points[random.Next(points.Count)];
                    var b = points[random.Next(points.Count)];
                    if (a == b) continue;
                    o.Append($"load L{name}{l} {a} {b} impedance {N(Between(1, 100))} + j{N(Between(0, 50))} ohm\n");
                }
                feeders.Add(($"{name}a", $"{name}b"));
            }
        }
        return o.ToString();
    }
}

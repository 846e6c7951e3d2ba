using System.Globalization;
using System.Text;
using BenchmarkDotNet.Attributes;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>
/// A 24-hour load cycle at one-minute steps on the 20-section network, evaluated whole (parse,
/// bind, solve, the cycle, checks): with 24 hourly cycle points, and with a cycle point every
/// minute (1,440 loads, each solved). Target: under 100 ms.
/// </summary>
[MemoryDiagnoser]
public class ThermalBenchmarks
{
    private string hourly = "", everyMinute = "";

    [GlobalSetup]
    public void Setup()
    {
        hourly = Cycle(60);
        everyMinute = Cycle(1);
    }

    /// <summary>The 20-section network without its sweep, a unit's thermal data, and a day of load with a point every <paramref name="minutes"/>.</summary>
    private static string Cycle(int minutes)
    {
        var twenty = Documents.TwentySections(2);
        var o = new StringBuilder(twenty[..twenty.IndexOf("sweep", StringComparison.Ordinal)]);
        o.Append("thermal K cooling ONAN top-oil-rise 55 K hot-spot-gradient 23 K loss-ratio 6\n");
        o.Append("load-cycle ambient 25 degC step 1 min\n");
        for (var m = 0; m < 1440; m += minutes)
        {
            var load = 0.8 + 0.35 * Math.Sin(2 * Math.PI * (m - 480) / 1440.0);
            o.Append(CultureInfo.InvariantCulture, $"cycle-point {m} min load {load:F4} pu\n");
        }
        o.Append("expect hot-spot below 140 degC\nexpect loss-of-life below 1000 h\n");
        return o.ToString();
    }

    [Benchmark]
    public Evaluation DayAtOneMinuteStepsHourlyLoads() => Evaluator.Evaluate(hourly, "cycle.wn");

    [Benchmark]
    public Evaluation DayAtOneMinuteStepsLoadEveryMinute() => Evaluator.Evaluate(everyMinute, "cycle.wn");
}

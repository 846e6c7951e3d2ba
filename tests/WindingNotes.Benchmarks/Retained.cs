using System.Diagnostics;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>
/// What a long sweep's evaluation holds once finished: the managed heap after a full collection with
/// the evaluation held, less the heap before it, for the twenty-section brush sweep and the let sweep
/// of a load at a given number of points (issue 19's memory figure). Run:
/// dotnet run -c Release --project tests/WindingNotes.Benchmarks -- retained 100000
/// </summary>
public static class Retained
{
    public static void Run(string[] args)
    {
        var points = args is [var n, ..] ? int.Parse(n, System.Globalization.CultureInfo.InvariantCulture) : 100_000;
        foreach (var (what, text) in new[] { ("brush sweep", Documents.TwentySections(points)), ("let sweep of a load", Documents.TwentySectionsLoadSweep(points)) })
        {
            var before = GC.GetTotalMemory(forceFullCollection: true);
            var clock = Stopwatch.StartNew();
            var evaluation = Evaluator.Evaluate(text, "retained.wn");
            clock.Stop();
            var after = GC.GetTotalMemory(forceFullCollection: true);
            var kept = evaluation.SweepColumns?.Count ?? 0;
            Console.WriteLine($"{what}, {points} points: retained {(after - before) / 1e6:F1} MB, {kept} points kept ({evaluation.Cases.Length} cases), {clock.Elapsed.TotalMilliseconds / points * 1000:F1} µs a point (wall), {evaluation.Diagnostics.Count(d => d.IsError)} errors");
            GC.KeepAlive(evaluation);
        }
    }
}

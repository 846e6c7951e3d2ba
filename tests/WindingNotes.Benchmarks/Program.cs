using BenchmarkDotNet.Running;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Benchmarks, measured and recorded (RESULTS.md beside this file), never asserted in unit tests.
/// Run: dotnet run -c Release --project tests/WindingNotes.Benchmarks -- --filter '*' --artifacts /tmp/wn-bench
/// (or `-- startup …` for the start-up of the command as installed: <see cref="Startup"/>; `-- retained N` for what an N-point sweep holds: <see cref="Retained"/>; `-- profile` for where a tolerance sample and a let sweep point spend their time: <see cref="Profile"/>; `-- stages 1 2 5` for every stage on files of 1, 2 and 5 MB: <see cref="Stages"/>).
/// </summary>
public static class Program
{
    public static void Main(string[] args)
    {
        if (args is ["startup", .. var rest]) Startup.Run(rest);
        else if (args is ["retained", .. var points]) Retained.Run(points);
        else if (args is ["profile"]) Profile.Run();
        else if (args is ["stages", .. var sizes]) Stages.Run(sizes);
        else if (args is ["spin", var what, var seconds]) Spin(what, double.Parse(seconds, System.Globalization.CultureInfo.InvariantCulture));
        else BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
    }

    /// <summary>
    /// One benchmark document evaluated over and over for so many seconds, for a sampling profiler
    /// (perf with DOTNET_PerfMapEnabled=1): `-- spin brush 30` (the 1,000-point brush sweep on twenty
    /// sections), `-- spin let 30` (the let sweep of a load) or `-- spin mc 30` (the Monte Carlo of 1,000 tolerance samples).
    /// </summary>
    private static void Spin(string what, double seconds)
    {
        var text = what switch
        {
            "let" => Documents.TwentySectionsLoadSweep(1000),
            "mc" => Documents.TwentySectionsMonteCarlo(),
            _ => Documents.TwentySections(1000),
        };
        // A few evaluations first, so the code measured is the optimised one.
        for (var i = 0; i < 5; i++) Workspace.Evaluator.Evaluate(text, "spin.wn");
        var process = System.Diagnostics.Process.GetCurrentProcess();
        var (cpu, allocated) = (process.TotalProcessorTime, GC.GetTotalAllocatedBytes(precise: true));
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var runs = 0;
        while (clock.Elapsed.TotalSeconds < seconds)
        {
            Workspace.Evaluator.Evaluate(text, "spin.wn");
            runs++;
        }
        process.Refresh();
        var points = runs * 1000.0;
        // Processor time (every thread: the collector's too) depends less on the machine's load than the wall clock.
        Console.WriteLine($"{what}: {runs} evaluations of 1,000 {(what == "mc" ? "samples" : "points")}, wall {clock.Elapsed.TotalMilliseconds * 1000 / points:F1} µs a point, processor {(process.TotalProcessorTime - cpu).TotalMilliseconds * 1000 / points:F1} µs a point, {(GC.GetTotalAllocatedBytes(precise: true) - allocated) / points / 1024:F1} KB a point");
    }
}

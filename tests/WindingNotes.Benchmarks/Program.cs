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
        else BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
    }
}

using BenchmarkDotNet.Running;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Benchmarks, measured and recorded (RESULTS.md beside this file), never asserted in unit tests.
/// Run: dotnet run -c Release --project tests/WindingNotes.Benchmarks -- --filter '*' --artifacts /tmp/wn-bench
/// (or `-- startup …` for the start-up of the command as installed: <see cref="Startup"/>).
/// </summary>
public static class Program
{
    public static void Main(string[] args)
    {
        if (args is ["startup", .. var rest]) Startup.Run(rest);
        else BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
    }
}

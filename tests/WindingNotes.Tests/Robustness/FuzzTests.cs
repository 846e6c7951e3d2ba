using System.Collections.Concurrent;
using System.Diagnostics;
using Xunit;
using Xunit.Abstractions;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// The fuzzer: seeded mutations of the examples and of generated files through every stage, report
/// and editor feature (<see cref="FuzzTarget"/>), each input under a time budget the test enforces.
/// CI runs 5,000 inputs; <c>WN_FUZZ_INPUTS=100000</c> runs the long one and <c>WN_FUZZ_SEED=N</c>
/// starts at seed N, so <c>WN_FUZZ_SEED=N WN_FUZZ_INPUTS=1</c> replays one failure (with
/// <c>WN_FUZZ_HUGE=1</c> for a five-megabyte one of the long run).
/// </summary>
public class FuzzTests(ITestOutputHelper output)
{
    private static int Setting(string name, int fallback) =>
        int.TryParse(Environment.GetEnvironmentVariable(name), out var value) ? value : fallback;

    [Trait("Category", "Long")]
    [Fact]
    public void Mutated_inputs_never_crash_hang_or_reach_outside_the_document()
    {
        var first = Setting("WN_FUZZ_SEED", 0);
        var count = Setting("WN_FUZZ_INPUTS", 5000);
        var failures = new ConcurrentBag<(int Seed, string Report)>();
        var slowest = new ConcurrentBag<(TimeSpan Time, int Seed, string Recipe)>();
        // Five-megabyte inputs cost seconds each: the short run leaves them to a test of their own;
        // WN_FUZZ_HUGE=1 turns them on for a replay of one (seeds 4999, 9999, …).
        var huge = Setting("WN_FUZZ_HUGE", count > 5000 ? 1 : 0) == 1;
        var clock = Stopwatch.StartNew();
        var processor = Process.GetCurrentProcess().TotalProcessorTime;
        Parallel.For(first, first + count, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, seed =>
        {
            var input = FuzzInputs.Make(seed, huge);
            var started = Stopwatch.GetTimestamp();
            if (FuzzRunner.Run(input) is { } report) failures.Add((seed, report));
            slowest.Add((Stopwatch.GetElapsedTime(started), seed, $"{input.BaseName}: {input.Recipe}"));
        });
        output.WriteLine($"{count} inputs from seed {first} in {clock.Elapsed.TotalSeconds:F1} s, {(Process.GetCurrentProcess().TotalProcessorTime - processor).TotalSeconds:F1} s of processor time; slowest:");
        foreach (var (time, seed, recipe) in slowest.OrderByDescending(s => s.Time).Take(8))
            output.WriteLine($"  {time.TotalMilliseconds,8:F0} ms  seed {seed}  {(recipe.Length > 160 ? recipe[..160] + "…" : recipe)}");
        var sorted = failures.OrderBy(f => f.Seed).ToList();
        // WN_FUZZ_OUT=DIR keeps every failure's report there, one file a seed, to work through.
        if (Environment.GetEnvironmentVariable("WN_FUZZ_OUT") is { Length: > 0 } folder)
        {
            Directory.CreateDirectory(folder);
            foreach (var (seed, report) in sorted) File.WriteAllText(Path.Combine(folder, $"input-{seed}.txt"), report);
        }
        foreach (var kind in sorted.GroupBy(f => Kind(f.Report)).OrderByDescending(g => g.Count()))
            output.WriteLine($"  {kind.Count(),6} x {kind.Key} (first: seed {kind.First().Seed})");
        Assert.True(sorted.Count == 0,
            $"{sorted.Count} of {count} inputs failed (replay one with WN_FUZZ_SEED=<seed> WN_FUZZ_INPUTS=1):\n\n" + string.Join("\n\n", sorted.Take(6).Select(f => f.Report)));
    }

    /// <summary>The first problem of a report without its numbers and quotes, to group failures of one kind.</summary>
    private static string Kind(string report)
    {
        var line = report.Split('\n').Skip(1).FirstOrDefault()?.Trim() ?? "";
        line = System.Text.RegularExpressions.Regex.Replace(line, @"'[^']*'|\d+", "#");
        return line.Length > 140 ? line[..140] : line;
    }

    [Theory]
    [MemberData(nameof(FuzzRegressions.Names), MemberType = typeof(FuzzRegressions))]
    public void Inputs_the_fuzzer_once_broke_stay_fixed(string name)
    {
        var (seed, text) = FuzzRegressions.Input(name);
        var report = FuzzRunner.Run(new FuzzInput(seed, name, text, text, "regression"));
        Assert.True(report is null, report);
    }

    [Trait("Category", "Long")]
    [Fact]
    public void Five_megabyte_files_are_read_within_their_budget()
    {
        // Seed 0 repeats the examples (every name defined again), seed 1 writes distinct units.
        foreach (var seed in new[] { 0, 1 })
        {
            var (name, text) = FuzzInputs.Huge(new Random(seed));
            var report = FuzzRunner.Run(new FuzzInput(seed, name, text, text, "as is"));
            Assert.True(report is null, report);
        }
    }
}

/// <summary>
/// Runs one input on a thread of its own, so a hang is reported instead of holding up the run: the
/// evaluation has a time limit, and the target cancels itself when it has worked well past that limit
/// (both in processor time of its thread, so a loaded machine does not make a slow input of a quick
/// one); a thread that does not come back even in wall-clock minutes (waiting on something, using no
/// processor time) is given up on as hung. A thread costs about a tenth of a millisecond against the
/// tens of milliseconds an input's work takes (RESULTS.md, long fuzz run).
/// </summary>
public static class FuzzRunner
{
    public static string? Run(FuzzInput input)
    {
        var limit = TimeSpan.FromSeconds(input.IsLarge ? 20 : 1);
        var target = new FuzzTarget(input, limit, limit + TimeSpan.FromSeconds(input.IsLarge ? 60 : 10));
        // The default stack, as the language server's and the command's threads have: a deep recursion must fail here too.
        var thread = new Thread(target.Run) { IsBackground = true, Name = $"fuzz {input.Seed}" };
        thread.Start();
        var done = thread.Join(TimeSpan.FromMinutes(input.IsLarge ? 30 : 10));
        var problems = done ? target.Problems.ToList() : [$"hung in step '{target.Step}'"];
        if (done && target.Overran && problems.Count == 0) problems.Add("ran past its time limit until the test cancelled it");
        if (problems.Count == 0) return null;
        return $"seed {input.Seed} ({input.BaseName}: {input.Recipe}):\n  " + string.Join("\n  ", problems.Take(5).Select(p => p.Length > 3000 ? p[..3000] + "…" : p))
            + (input.Text.Length <= 3000 ? $"\n--- input ---\n{input.Text}\n---" : $"\n--- input of {input.Text.Length} characters ---");
    }
}

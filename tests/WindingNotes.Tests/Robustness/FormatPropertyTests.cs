using System.Collections.Concurrent;
using Xunit;
using Xunit.Abstractions;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// The formatter's property over the fuzzer's corpus of mutated inputs: parse(format(x)) equals
/// parse(x), and the diagnostics of parsing and binding keep their codes and lines
/// (<see cref="FormatProperty"/>). CI runs 5,000 inputs; <c>WN_FORMAT_INPUTS=100000</c> the long run.
/// </summary>
public class FormatPropertyTests(ITestOutputHelper output)
{
    // A property run over 5,000 mutated inputs: in the category CI always runs and the quick loop leaves
    // out (a minute of it on two cores).
    [Trait("Category", "Long")]
    [Fact]
    public void Formatting_mutated_inputs_keeps_their_statements_and_diagnostic_lines()
    {
        var first = int.TryParse(Environment.GetEnvironmentVariable("WN_FUZZ_SEED"), out var s) ? s : 0;
        var count = int.TryParse(Environment.GetEnvironmentVariable("WN_FORMAT_INPUTS"), out var n) ? n : 5_000;
        var failures = new ConcurrentBag<(int Seed, string Report)>();
        Parallel.For(first, first + count, seed =>
        {
            var input = FuzzInputs.Make(seed, huge: false);
            if (FormatProperty.Problem(input.Text) is { } problem) failures.Add((seed, $"seed {seed} ({input.BaseName}: {input.Recipe}):\n{problem}"));
        });
        // WN_FUZZ_OUT=DIR keeps every failing input there exactly, as format-N.wn, to work through.
        if (Environment.GetEnvironmentVariable("WN_FUZZ_OUT") is { Length: > 0 } folder)
        {
            Directory.CreateDirectory(folder);
            foreach (var (seed, _) in failures) File.WriteAllText(Path.Combine(folder, $"format-{seed}.wn"), FuzzInputs.Make(seed, huge: false).Text);
        }
        output.WriteLine($"{count} inputs from seed {first}, {failures.Count} failed");
        foreach (var kind in failures.GroupBy(f => f.Report.Split('\n')[1]).OrderByDescending(g => g.Count()))
            output.WriteLine($"  {kind.Count(),6} x {kind.Key} (first: seed {kind.Min(f => f.Seed)})");
        Assert.True(failures.IsEmpty, $"{failures.Count} of {count} inputs changed meaning:\n\n" + string.Join("\n\n", failures.OrderBy(f => f.Seed).Take(5).Select(f => f.Report)));
    }
}

using WindingNotes.Tests.Robustness;
using WindingNotes.Tests.Support;
using WindingNotes.Text;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>
/// Every diagnostic has a real range: the line or lines that cause it, never the empty range at the
/// start of the file that a diagnostic made without a range falls back to (it shows as line 1,
/// column 1 and names nothing there). Over every example, annotated file, kept fuzz input and a
/// sample of fuzz inputs.
/// </summary>
public class DiagnosticRangeTests
{
    public static TheoryData<string> Files()
    {
        var data = new TheoryData<string>();
        foreach (var folder in new[] { "examples", "tests/WindingNotes.Tests/Data/diagnostics", "tests/WindingNotes.Tests/Data/fuzz" })
            foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, folder), "*.wn").OrderBy(f => f, StringComparer.Ordinal))
                data.Add($"{folder}/{Path.GetFileName(file)}");
        return data;
    }

    [Theory]
    [MemberData(nameof(Files))]
    public void Every_diagnostic_of_a_file_has_a_range(string name)
    {
        var text = File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, name)).Replace("\r\n", "\n");
        AssertRanges(Evaluator.Evaluate(text, name));
    }

    [Fact]
    public void Every_diagnostic_of_a_sample_of_fuzz_inputs_has_a_range()
    {
        for (var seed = 1; seed <= 150; seed++)
        {
            var input = FuzzInputs.Make(seed, huge: false);
            if (input.IsLarge) continue;
            AssertRanges(Evaluator.Evaluate(input.Text, $"fuzz {seed}"));
        }
    }

    /// <summary>No diagnostic without a range, unless the text is blank and there is no other place for it.</summary>
    private static void AssertRanges(Evaluation e)
    {
        if (e.Text.Text.Trim().Length == 0) return;
        foreach (var d in e.Diagnostics)
            Assert.False(d.Span == default(TextSpan), $"{e.Path}: {d.Code} has no range: {d.Shown}");
    }
}

using System.Text.RegularExpressions;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>
/// Diagnostics tests written in the notation: a comment <c># error 12-14 unknown-name: unknown core 'K9'</c>
/// above a line says that line has that diagnostic at those (one-based) columns. Every diagnostic of
/// the file must be announced so, and every announcement must come true.
/// </summary>
public partial class AnnotatedDiagnosticsTests
{
    [GeneratedRegex(@"^#\s*(error|warning|info|hint)\s+(\d+)-(\d+)\s+([a-z-]+):\s*(.*)$")]
    private static partial Regex Annotation();

    public static TheoryData<string> Files()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.TestsRoot(), "Data", "diagnostics"), "*.wn").OrderBy(f => f))
            data.Add(Path.GetFileName(file));
        return data;
    }

    [Theory]
    [MemberData(nameof(Files))]
    public void Diagnostics_are_where_the_file_says(string name)
    {
        var text = File.ReadAllText(Path.Combine(Snapshot.TestsRoot(), "Data", "diagnostics", name)).Replace("\r\n", "\n");
        var lines = text.Split('\n');
        var expected = new List<string>();
        for (var i = 0; i < lines.Length; i++)
        {
            var m = Annotation().Match(lines[i].Trim());
            if (!m.Success) continue;
            // The annotation speaks of the next line that is not itself an annotation.
            var target = i + 1;
            while (target < lines.Length && Annotation().IsMatch(lines[target].Trim())) target++;
            expected.Add($"{target + 1}:{m.Groups[2].Value}-{m.Groups[3].Value} {m.Groups[1].Value} {m.Groups[4].Value}: {m.Groups[5].Value}");
        }
        var evaluation = Evaluator.Evaluate(text, name);
        var actual = evaluation.Diagnostics.Select(d =>
        {
            var range = evaluation.Text.GetRange(d.Span);
            var end = range.End.Line == range.Start.Line ? range.End.Character : evaluation.Text.GetLineSpan(range.Start.Line).Length;
            return $"{range.Start.Line + 1}:{range.Start.Character + 1}-{end} {WindingNotes.Report.TextReport.Severity(d.Severity)} {d.Code}: {d.Shown}";
        }).ToList();
        Assert.Equal(expected.OrderBy(x => x, StringComparer.Ordinal), actual.OrderBy(x => x, StringComparer.Ordinal));
    }
}

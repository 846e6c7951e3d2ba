using WindingNotes.Report;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>Each example's text, JSON and Markdown reports, kept beside the tests and reviewed in the diff when they change.</summary>
public class ExampleSnapshotTests
{
    public static TheoryData<string> Examples()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").OrderBy(f => f))
            data.Add(Path.GetFileName(file));
        return data;
    }

    [Theory]
    [MemberData(nameof(Examples))]
    public void Example_reports_match_their_expected_files(string name)
    {
        var text = File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "examples", name));
        var evaluation = Evaluator.Evaluate(text, $"examples/{name}");
        Snapshot.Match(TextReport.Write(evaluation), $"Data/reports/{Path.GetFileNameWithoutExtension(name)}.txt");
        Snapshot.Match(JsonReport.Write(evaluation), $"Data/reports/{Path.GetFileNameWithoutExtension(name)}.json");
        Snapshot.Match(MarkdownReport.Write(evaluation), $"Data/reports/{Path.GetFileNameWithoutExtension(name)}.md");
    }
}

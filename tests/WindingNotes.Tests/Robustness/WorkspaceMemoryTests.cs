using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// The workspace keeps evaluations only for the documents used last, up to a budget of their texts'
/// length: an older one is dropped and evaluated again, to the same results, when next asked for.
/// Measured on counts of characters, never on time or memory.
/// </summary>
public class WorkspaceMemoryTests
{
    private static readonly string Text = Cursor.Example("alder-creek-boost.wn");

    [Fact]
    public void Past_the_budget_the_least_recently_used_evaluation_is_dropped_and_evaluated_again_when_asked_for()
    {
        // Room for two of the three documents.
        var workspace = new DocumentWorkspace(keptText: 2 * Text.Length);
        foreach (var name in new[] { "a", "b", "c" }) workspace.Open($"file:///{name}.wn", $"{name}.wn", 1, Text);
        var a = workspace.Evaluate("file:///a.wn")!;
        var b = workspace.Evaluate("file:///b.wn")!;
        Assert.Same(a, workspace.LastComplete("file:///a.wn")!.Value.Evaluation);

        // The third document's evaluation pushes out the first's, used longest ago; the second's stays.
        workspace.Evaluate("file:///c.wn");
        Assert.Null(workspace.LastComplete("file:///a.wn"));
        Assert.Same(b, workspace.LastComplete("file:///b.wn")!.Value.Evaluation);
        Assert.Same(b, workspace.Evaluate("file:///b.wn"));

        // Asked for again, the first is evaluated afresh, to the same results; now the third goes.
        var again = workspace.Evaluate("file:///a.wn")!;
        Assert.NotSame(a, again);
        Assert.True(again.Solved);
        Assert.Equal(a.Diagnostics.Select(d => (d.Code, d.Message, d.Span)), again.Diagnostics.Select(d => (d.Code, d.Message, d.Span)));
        Assert.Equal(a.Normal!.Points.Select(p => $"{p.Point} {p.Voltage.Real:R} {p.Voltage.Imaginary:R}"), again.Normal!.Points.Select(p => $"{p.Point} {p.Voltage.Real:R} {p.Voltage.Imaginary:R}"));
        Assert.Null(workspace.LastComplete("file:///c.wn"));
        Assert.NotNull(workspace.LastComplete("file:///b.wn"));
    }

    [Fact]
    public void The_document_just_evaluated_keeps_its_evaluation_even_when_it_alone_is_over_the_budget()
    {
        var workspace = new DocumentWorkspace(keptText: 10);
        workspace.Open("file:///a.wn", "a.wn", 1, Text);
        var a = workspace.Evaluate("file:///a.wn")!;
        Assert.Same(a, workspace.LastComplete("file:///a.wn")!.Value.Evaluation);
        Assert.Same(a, workspace.Evaluate("file:///a.wn"));
    }
}

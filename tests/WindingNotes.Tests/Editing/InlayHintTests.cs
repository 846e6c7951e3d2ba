using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using WindingNotes.Text;
using Xunit;

namespace WindingNotes.Tests.Editing;

public class InlayHintTests
{
    /// <summary>The document with each hint written after its line, between ⟨ ⟩.</summary>
    private static string Render(string text)
    {
        var evaluation = WindingNotes.Workspace.Evaluator.Evaluate(text, "test.wn");
        var hints = InlayHints.For(evaluation);
        return Cursor.Apply(text, hints.Select(h => new TextEdit(new TextRange(h.Position, h.Position), $"  ⟨{h.Label}⟩")));
    }

    [Fact]
    public void The_boost_example_shows_228_1_volts_at_the_load_line()
    {
        var text = Cursor.Example("alder-creek-boost.wn");
        var rendered = Render(text);
        var loadLine = rendered.Split('\n').Single(l => l.StartsWith("load planer"));
        Assert.Contains("⟨228.1 V, 17.11 A, P 3.200 kW, pf 0.8200 lagging⟩", loadLine);
        Snapshot.Match(rendered, "Data/editing/hints/alder-creek-boost.txt");
    }

    [Theory]
    [InlineData("cedar-hollow-bench-sweep.wn")]
    [InlineData("pine-ridge-fault-study.wn")]
    [InlineData("willow-bend-tolerance-band.wn")]
    [InlineData("maple-ford-station-unit.wn")]
    public void The_examples_show_their_results_at_line_ends(string example) =>
        Snapshot.Match(Render(Cursor.Example(example)), $"Data/editing/hints/{Path.GetFileNameWithoutExtension(example)}.txt");

    [Fact]
    public void Three_phase_lines_show_line_to_line_voltages_and_the_vector_group()
    {
        var lines = Render(Cursor.Example("maple-ford-station-unit.wn")).Split('\n');
        Assert.EndsWith("⟨Dyn11⟩", lines.Single(l => l.StartsWith("core T1")));
        Assert.Contains("⟨ab 461.2 V, bc 462.3 V, ca 462.8 V; unbalance 0.2027 %⟩", lines.Single(l => l.StartsWith("three-phase-load pumps")));
    }

    [Fact]
    public void Every_kind_of_line_has_its_hint() => Snapshot.Match(Render(Fixtures.Tapped), "Data/editing/hints/tapped.txt");

    [Fact]
    public void Only_the_requested_lines_get_hints()
    {
        var evaluation = WindingNotes.Workspace.Evaluator.Evaluate(Cursor.Example("alder-creek-boost.wn"), "test.wn");
        var hints = InlayHints.For(evaluation, new TextRange(new Position(8, 0), new Position(10, 0)));
        Assert.Equal([8], hints.Select(h => h.Position.Line));
    }

    [Fact]
    public void A_file_that_does_not_solve_has_no_result_hints_but_keeps_its_let_values()
    {
        var evaluation = WindingNotes.Workspace.Evaluator.Evaluate("let v = 2 * 120 V\ncore K1\nwinding W on K9 turns 10 from A to B\n", "test.wn");
        Assert.Equal(["= 240.0 V"], InlayHints.For(evaluation).Select(h => h.Label));
    }
}

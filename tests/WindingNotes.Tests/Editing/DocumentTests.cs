using System.Text;
using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Editing;

/// <summary>Features over the whole document: outline, colouring, formatting.</summary>
public class DocumentTests
{
    private static string Outline(IEnumerable<OutlineSymbol> symbols, int depth = 0)
    {
        var o = new StringBuilder();
        foreach (var s in symbols)
        {
            o.Append(new string(' ', 2 * depth)).Append($"{s.Kind} {s.Name} {Cursor.Show(s.Range)} name {Cursor.Show(s.SelectionRange)}: {s.Detail}\n");
            o.Append(Outline(s.Children, depth + 1));
        }
        return o.ToString();
    }

    [Fact]
    public void The_outline_nests_windings_and_taps_under_their_cores() =>
        Snapshot.Match(Outline(DocumentSymbols.For(Evaluator.Evaluate(Fixtures.Tapped, "test.wn"))), "Data/editing/symbols/tapped.txt");

    [Fact]
    public void Every_token_is_coloured_by_its_place_in_the_form()
    {
        var text = Fixtures.Tapped + "\nwindng X on K2\n";
        var evaluation = Evaluator.Evaluate(text, "test.wn");
        var lines = evaluation.Text;
        var o = new StringBuilder();
        foreach (var t in SemanticTokens.For(evaluation))
        {
            var word = lines.GetLineText(t.Line).Substring(t.Character, t.Length);
            o.Append($"{t.Line}:{t.Character} {word} {t.Class}{(t.Defines ? " defines" : "")}\n");
        }
        Snapshot.Match(o.ToString(), "Data/editing/tokens/tapped.txt");
    }

    [Fact]
    public void Formatting_is_the_canonical_layout_as_one_minimal_edit_and_idempotent()
    {
        const string messy = "# kept   comment\nfrequency   60 Hz\ncore K1   rating 0.5 kVA\nwinding W on K1 from A to B   turns 10 # ends\nground A\n";
        var evaluation = Evaluator.Evaluate(messy, "test.wn");
        var edits = Formatting.Edits(evaluation);
        var edit = Assert.Single(edits);
        Assert.Equal("1:10-3:38", Cursor.Show(edit.Range));
        var formatted = Cursor.Apply(messy, edits);
        Assert.Equal("# kept   comment\nfrequency 60 Hz\ncore K1 rating 0.5 kVA\nwinding W on K1 turns 10 from A to B # ends\nground A\n", formatted);
        Assert.Empty(Formatting.Edits(Evaluator.Evaluate(formatted, "test.wn")));
    }

    [Fact]
    public void Formatting_keeps_an_unparsed_line_and_non_ascii_text()
    {
        const string text = "core K1  area 40 cm²\nwinding W on K1 turns 10 from A to B resistance 1 Ω   ± 5 %\nbroken (( line\n";
        var evaluation = Evaluator.Evaluate(text, "test.wn");
        Assert.Equal("core K1 area 40 cm²\nwinding W on K1 turns 10 from A to B resistance 1 Ω ± 5 %\nbroken (( line\n", Cursor.Apply(text, Formatting.Edits(evaluation)));
    }
}

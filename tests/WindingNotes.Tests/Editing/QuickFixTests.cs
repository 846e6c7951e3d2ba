using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using WindingNotes.Text;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Editing;

public class QuickFixTests
{
    private static string Fixes(string text, TextRange range)
    {
        var evaluation = Evaluator.Evaluate(text, "test.wn");
        return string.Concat(QuickFixes.For(evaluation, range).Select(f =>
            $"== {f.Title}{(f.Preferred ? " (preferred)" : "")} for {f.Diagnostic.Code}\n{Cursor.Apply(text, f.Edits)}"));
    }

    private static TextRange Line(int line) => new(new Position(line, 0), new Position(line, 200));

    [Fact]
    public void A_mistyped_core_is_underlined_and_fixed_by_did_you_mean()
    {
        var text = Cursor.Example("alder-creek-boost.wn").Replace("winding HV on K1", "winding HV on K9");
        var evaluation = Evaluator.Evaluate(text, "test.wn");
        var error = evaluation.Diagnostics.Single(d => d.Code == "unknown-name");
        Assert.Equal("K9", evaluation.Text[error.Span]);
        Assert.Equal("4:14-4:16", Cursor.Show(evaluation.Text.GetRange(error.Span)));
        var fix = Assert.Single(QuickFixes.For(evaluation, Line(4)));
        Assert.Equal("Change 'K9' to 'K1'", fix.Title);
        Assert.Equal(Cursor.Example("alder-creek-boost.wn"), Cursor.Apply(text, fix.Edits));
    }

    [Fact]
    public void A_part_without_ground_gets_one() =>
        Snapshot.Match(Fixes("frequency 60 Hz\ncore K1 rating 1 kVA\nwinding A on K1 turns 100 rated 120 V from A1 to A2\nwinding B on K1 turns 50 rated 60 V from B1 to B2 # isolated\nsupply s A1 A2 120 V\nground A2\nload l B1 B2 impedance 10 ohm\n", Line(3)), "Data/editing/fixes/no-ground.txt");

    [Fact]
    public void A_file_without_frequency_gets_one_below_its_heading_comments() =>
        // The note stands at the first line that says something (line 2), the fix inserts above it.
        Snapshot.Match(Fixes("# heading\n\ncore K1 rating 1 kVA\n", Line(2)), "Data/editing/fixes/no-frequency.txt");

    [Fact]
    public void A_mistyped_statement_and_unit_are_fixed() =>
        Snapshot.Match(Fixes("frequency 60 Hz\nwindng W on K1\ncore K1 rating 1 kWA\n", new TextRange(new Position(0, 0), new Position(3, 0))), "Data/editing/fixes/spelling.txt");
}

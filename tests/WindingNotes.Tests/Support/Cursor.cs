using System.Text;
using WindingNotes.Editing;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Tests.Support;

/// <summary>
/// Fixtures for editor features: notation with a cursor marker <c>$0</c>, evaluated without it, and
/// the helpers that print a feature's answer as text for an expected file.
/// </summary>
public static class Cursor
{
    public const string Marker = "$0";

    public static (Evaluation Evaluation, Position Position) Parse(string fixture)
    {
        fixture = fixture.Replace("\r\n", "\n");
        var offset = fixture.IndexOf(Marker, StringComparison.Ordinal);
        if (offset < 0) throw new ArgumentException("the fixture has no $0 cursor marker");
        var text = fixture.Remove(offset, Marker.Length);
        var evaluation = Evaluator.Evaluate(text, "test.wn");
        return (evaluation, evaluation.Text.GetPosition(offset));
    }

    public static string Example(string name) => File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "examples", name)).Replace("\r\n", "\n");

    public static string Show(TextRange r) => $"{r.Start.Line}:{r.Start.Character}-{r.End.Line}:{r.End.Character}";

    /// <summary>The text with the edits applied (edits do not overlap; applied from the last).</summary>
    public static string Apply(string text, IEnumerable<TextEdit> edits)
    {
        var source = new SourceText(text);
        var builder = new StringBuilder(text);
        foreach (var edit in edits.OrderByDescending(e => source.GetOffset(e.Range.Start)))
        {
            var start = source.GetOffset(edit.Range.Start);
            var end = source.GetOffset(edit.Range.End);
            builder.Remove(start, end - start).Insert(start, edit.NewText);
        }
        return builder.ToString();
    }

    /// <summary>The text with each range wrapped in [ ], to show references and diagnostics in place.</summary>
    public static string Mark(string text, IEnumerable<TextRange> ranges)
    {
        var source = new SourceText(text);
        var edits = ranges.SelectMany(r => new[]
        {
            (Offset: source.GetOffset(r.End), Text: "]"),
            (Offset: source.GetOffset(r.Start), Text: "["),
        }).OrderByDescending(x => x.Offset).ThenBy(x => x.Text == "[" ? 1 : 0);
        var builder = new StringBuilder(text);
        foreach (var (offset, mark) in edits) builder.Insert(offset, mark);
        return builder.ToString();
    }
}

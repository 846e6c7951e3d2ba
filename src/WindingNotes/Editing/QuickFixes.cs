using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

/// <summary>A fix for one diagnostic: a title, the edits, and whether it is the one to apply by default.</summary>
public sealed record QuickFix(string Title, Diagnostic Diagnostic, IReadOnlyList<TextEdit> Edits, bool Preferred = false);

/// <summary>
/// Quick fixes for the diagnostics that have an obvious one: a hint with a replacement ("did you
/// mean 'K1'?"), a part of the network without a ground, a file without a frequency.
/// </summary>
public static class QuickFixes
{
    public static IReadOnlyList<QuickFix> For(Evaluation evaluation, TextRange range)
    {
        var text = evaluation.Text;
        var span = TextSpan.FromBounds(text.GetOffset(range.Start), text.GetOffset(range.End));
        var fixes = new List<QuickFix>();
        foreach (var d in evaluation.Diagnostics.Where(d => d.Span.Start <= span.End && span.Start <= d.Span.End))
        {
            foreach (var hint in d.Hints.Where(h => h.Replacement is not null))
                fixes.Add(new QuickFix($"Change '{text[hint.Span]}' to '{hint.Replacement}'", d, [new TextEdit(text.GetRange(hint.Span), hint.Replacement!)], Preferred: true));
            if (d.Code == "no-ground") fixes.Add(Ground(evaluation, d));
            if (d.Code == "default-frequency")
            {
                fixes.Add(Frequency(evaluation, d, "50 Hz", "Add 'frequency 50 Hz' (the frequency assumed)", preferred: true));
                fixes.Add(Frequency(evaluation, d, "60 Hz", "Add 'frequency 60 Hz'", preferred: false));
            }
        }
        return fixes;
    }

    /// <summary>Grounds the point the diagnostic is at, on a new line after the statement that names it.</summary>
    private static QuickFix Ground(Evaluation evaluation, Diagnostic d)
    {
        var point = evaluation.Text[d.Span];
        var line = evaluation.Syntax.Lines.First(l => l.Span.Touches(d.Span.Start));
        var at = evaluation.Text.GetPosition(line.Span.End);
        return new QuickFix($"Add 'ground {point}'", d, [new TextEdit(new TextRange(at, at), $"{Newline(evaluation)}ground {point}")]);
    }

    /// <summary>Puts the frequency before the first statement, below the comments that head the file.</summary>
    private static QuickFix Frequency(Evaluation evaluation, Diagnostic d, string value, string title, bool preferred)
    {
        // The note stands at the first line that says something: the frequency goes above it.
        var at = new Position(evaluation.Text.GetPosition(d.Span.Start).Line, 0);
        return new QuickFix(title, d, [new TextEdit(new TextRange(at, at), $"frequency {value}{Newline(evaluation)}")], preferred);
    }

    private static string Newline(Evaluation evaluation) => evaluation.Text.Text.Contains("\r\n") ? "\r\n" : "\n";
}

using WindingNotes.Syntax;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

/// <summary>
/// Formatting with the canonical formatter (the one the command line uses), as the one edit that
/// spans what changed: the text before the first difference and after the last stays untouched, so
/// the editor keeps its marks and the cursor where nothing moved.
/// </summary>
public static class Formatting
{
    public static IReadOnlyList<TextEdit> Edits(Evaluation evaluation)
    {
        var before = evaluation.Text.Text;
        var after = Formatter.Format(evaluation.Syntax);
        if (before == after) return [];
        var prefix = 0;
        var limit = Math.Min(before.Length, after.Length);
        while (prefix < limit && before[prefix] == after[prefix]) prefix++;
        var suffix = 0;
        while (suffix < limit - prefix && before[^(suffix + 1)] == after[^(suffix + 1)]) suffix++;
        // Never split a surrogate pair or a CRLF between the kept and the replaced text.
        while (prefix > 0 && (char.IsHighSurrogate(before[prefix - 1]) || before[prefix - 1] == '\r')) prefix--;
        while (suffix > 0 && (char.IsLowSurrogate(before[^suffix]) || before[^suffix] == '\n')) suffix--;
        var span = Text.TextSpan.FromBounds(prefix, before.Length - suffix);
        return [new TextEdit(evaluation.Text.GetRange(span), after[prefix..(after.Length - suffix)])];
    }
}

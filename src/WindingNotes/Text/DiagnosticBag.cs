using System.Collections;
using System.Collections.Immutable;

namespace WindingNotes.Text;

/// <summary>
/// Collects diagnostics. The wording of every message lives with the stage that reports it: each
/// stage's <c>Messages*.cs</c> (Syntax/, Model/, Solve/) adds one <c>ReportX</c> extension member a
/// message, in its own namespace, built on <see cref="Error"/>, <see cref="Warning"/> and <see cref="Info"/>;
/// this class knows no stage's types.
/// </summary>
public sealed class DiagnosticBag : IEnumerable<Diagnostic>
{
    private readonly List<Diagnostic> items = [];

    public int Count => items.Count;

    public bool HasErrors => items.Exists(d => d.IsError);

    public void Add(Diagnostic diagnostic) => items.Add(diagnostic);

    public void AddRange(IEnumerable<Diagnostic> diagnostics) => items.AddRange(diagnostics);

    public ImmutableArray<Diagnostic> ToImmutable() => [.. items];

    public IEnumerator<Diagnostic> GetEnumerator() => items.GetEnumerator();

    IEnumerator IEnumerable.GetEnumerator() => GetEnumerator();

    public Diagnostic Error(string code, TextSpan span, string message) => Put(Severity.Error, code, span, message);

    public Diagnostic Warning(string code, TextSpan span, string message) => Put(Severity.Warning, code, span, message);

    public Diagnostic Info(string code, TextSpan span, string message) => Put(Severity.Information, code, span, message);

    private Diagnostic Put(Severity severity, string code, TextSpan span, string message)
    {
        var diagnostic = new Diagnostic(severity, code, Printable(message), span);
        items.Add(diagnostic);
        return diagnostic;
    }

    /// <summary>
    /// A message as it may be shown: control and format characters the text quotes (an escape, a
    /// carriage return, a right-to-left override; not a tab or a line break) are written as
    /// <c>\uXXXX</c>, so a message never acts on the terminal or the editor that shows it.
    /// </summary>
    public static string Printable(string message)
    {
        if (!message.Any(IsHidden)) return message;
        var o = new System.Text.StringBuilder(message.Length + 16);
        foreach (var c in message) o.Append(IsHidden(c) ? $"\\u{(int)c:X4}" : c.ToString());
        return o.ToString();
    }

    private static bool IsHidden(char c) =>
        (char.IsControl(c) && c is not ('\t' or '\n')) || char.GetUnicodeCategory(c) == System.Globalization.UnicodeCategory.Format;

    /// <summary>Replaces the last diagnostic with a copy (to attach hints or related spans).</summary>
    public Diagnostic Amend(Diagnostic diagnostic, Func<Diagnostic, Diagnostic> change)
    {
        var index = items.LastIndexOf(diagnostic);
        var changed = change(diagnostic);
        items[index] = changed;
        return changed;
    }

    public Diagnostic WithSuggestion(Diagnostic diagnostic, string? suggestion, TextSpan span) =>
        suggestion is null
            ? diagnostic
            : Amend(diagnostic, d => d with { Hints = [new DiagnosticHint($"did you mean '{suggestion}'?", span, suggestion)] });
}

using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report;

/// <summary>Diagnostics as compilers print them: <c>path:line:col: severity code: message</c>, one-based.</summary>
public static class DiagnosticLines
{
    public static string Format(Evaluation evaluation, Diagnostic d)
    {
        var p = evaluation.Text.GetPosition(d.Span.Start);
        var hints = string.Concat(d.Hints.Select(h => $" ({h.Message})"));
        return $"{evaluation.Path}:{p.Line + 1}:{p.Character + 1}: {TextReport.Severity(d.Severity)} {d.Code}: {d.Shown}{hints}";
    }

    /// <summary>A check of a file that was not solved, in the same form: it neither passed nor failed.</summary>
    public static string NotEvaluated(Evaluation evaluation, Solve.CheckResult check)
    {
        var p = evaluation.Text.GetPosition(check.Expect.Line.Start);
        return $"{evaluation.Path}:{p.Line + 1}:{p.Character + 1}: not evaluated: {check.Expect.Text}";
    }
}

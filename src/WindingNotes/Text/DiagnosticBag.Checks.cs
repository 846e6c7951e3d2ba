using WindingNotes.Model;

namespace WindingNotes.Text;

// Messages of the checks.
public sealed partial class DiagnosticBag
{
    public Diagnostic ReportCheckFailed(ExpectModel expect, double value) =>
        Error("expect-failed", expect.Line, $"{expect.MeasureText} is {Show(value, expect.Unit)}: expected {expect.ConditionText}");

    public Diagnostic ReportCannotCheck(ExpectModel expect, string problem) =>
        Error("expect-unknown", expect.Line, $"cannot check {expect.MeasureText}: {problem}");

    /// <summary>A measured value in the unit of its check; fractions as percent.</summary>
    public static string Show(double value, string unit) => unit == "%" ? Numbers.Format(value * 100, "%") : Numbers.Format(value, unit);
}

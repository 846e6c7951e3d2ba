using WindingNotes.Model;

namespace WindingNotes.Text;

// Messages of the solving stage about three-phase results.
public sealed partial class DiagnosticBag
{
    public Diagnostic ReportVectorGroupFailed(ExpectModel expect, string? found) =>
        Error("expect-failed", expect.Line, $"{expect.MeasureText} is {found ?? "unknown"}: expected {expect.ConditionText}");
}

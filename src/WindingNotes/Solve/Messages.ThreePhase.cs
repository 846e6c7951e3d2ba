using WindingNotes.Text;
using WindingNotes.Model;

namespace WindingNotes.Solve;

// Messages of the solving stage about three-phase results.
public static partial class SolveMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportVectorGroupFailed(ExpectModel expect, string? found) =>
            bag.Error("expect-failed", expect.Line, $"{expect.MeasureText} is {found ?? "unknown"}: expected {expect.ConditionText}");

        public Diagnostic ReportOpenDelta(TextSpan span, string first, string second, string set, string? winding, double? loading) => winding is null
            ? bag.Info("caution-open-delta", span,
                $"cores '{first}' and '{second}' form an open delta on '{set}': the pair transforms at most √3 times one unit's rating, 86.6 % of the two ratings and 57.7 % of a closed bank of three")
            : bag.Warning("open-delta-overload", span,
                $"cores '{first}' and '{second}' form an open delta on '{set}' and are loaded past what the pair can transform (√3 times one unit's rating, 57.7 % of a closed bank of three): '{winding}' carries {Numbers.Format(loading!.Value * 100, "%")} of its rated current");
    }
}

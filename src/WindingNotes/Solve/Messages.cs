using WindingNotes.Model;

namespace WindingNotes.Text;

// Messages of the solver and the checks. The class is one; each stage keeps its wording in its own folder.
public sealed partial class DiagnosticBag
{
    public Diagnostic ReportSingular(IReadOnlyList<(string Kind, string Name, TextSpan Span)> elements, string prefix)
    {
        var named = elements.Where(e => e.Kind != "node").DefaultIfEmpty(elements.FirstOrDefault()).ToList();
        var list = string.Join(", ", named.Take(6).Select(e => $"{e.Kind} '{e.Name}'"));
        var d = Error("singular", named[0].Span,
            $"{prefix}the network has no unique solution: {list} (ideally coupled sections in a loop, or a source shorted through ideal windings); give the windings resistance or leakage impedance, or remove the loop");
        return Amend(d, x => x with { Related = [.. elements.Skip(1).Where(e => e.Span != named[0].Span).Select(e => new RelatedSpan($"{e.Kind} '{e.Name}'", e.Span))] });
    }

    public Diagnostic ReportIllConditioned(IReadOnlyList<(string Kind, string Name, TextSpan Span)> elements, double residual, string prefix)
    {
        var span = elements.Count > 0 ? elements[0].Span : default;
        return Warning("ill-conditioned", span,
            $"{prefix}the network is ill-conditioned (relative residual {Numbers.Plain(residual, 2)}): results may be inaccurate; look for impedances that differ by many orders of magnitude");
    }

    public Diagnostic ReportNoConvergence(IReadOnlyList<LoadModel> loads, int iterations, string prefix)
    {
        var span = loads.Count > 0 ? loads[0].NameSpan : default;
        var names = string.Join(", ", loads.Select(l => $"'{l.Name}'"));
        var d = Error("no-convergence", span,
            $"{prefix}the loads {names} did not converge in {iterations} iterations: the supply may be too weak for the demand");
        return Amend(d, x => x with { Related = [.. loads.Skip(1).Select(l => new RelatedSpan($"load '{l.Name}'", l.NameSpan))] });
    }

    public Diagnostic ReportLoadWithoutVoltage(LoadModel load, string prefix) =>
        Warning("load-without-voltage", load.NameSpan, $"{prefix}load '{load.Name}' has no voltage across it and draws nothing");

    public Diagnostic ReportInternalError(Exception e) =>
        Error("internal-error", default, $"internal error, please report it: {e.GetType().Name}: {e.Message}");

    public Diagnostic ReportCheckFailed(ExpectModel expect, double value) =>
        Error("expect-failed", expect.Line, $"{expect.MeasureText} is {Show(value, expect.Unit)}: expected {expect.ConditionText}");

    public Diagnostic ReportCannotCheck(ExpectModel expect, string problem) =>
        Error("expect-unknown", expect.Line, $"cannot check {expect.MeasureText}: {problem}");

    /// <summary>A measured value in the unit of its check; fractions as percent.</summary>
    public static string Show(double value, string unit) => unit == "%" ? Numbers.Format(value * 100, "%") : Numbers.Format(value, unit);
}

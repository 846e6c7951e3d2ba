using System.Globalization;
using System.Numerics;
using System.Text;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report;

/// <summary>
/// The text report's content as Markdown tables, for a pull request comment or a design record:
/// each case, the sweep points as one table per kind of result, the checks, the cautions and the
/// closing note. Cells are never padded, so a changed value rewrites its own row and no other.
/// </summary>
public static class MarkdownReport
{
    public static string Write(Evaluation evaluation)
    {
        var o = new StringBuilder();
        o.Append("## Results: ").Append(Code(evaluation.Path.Length == 0 ? "(standard input)" : evaluation.Path)).Append("\n\n");
        // What a reviewer reads first: the checks, the ratings crossed and the cautions; the tables follow.
        o.Append(Summary(evaluation)).Append('\n');
        WriteChecks(o, evaluation);
        WriteRatings(o, evaluation);
        o.Append("\n### Cautions\n\n");
        var cautions = evaluation.Diagnostics.Where(IsCaution).ToList();
        foreach (var d in cautions)
            o.Append("- line ").Append(TextReport.Location(evaluation, d)).Append(": ").Append(Cell(d.Shown)).Append(d.Acknowledged ? " (acknowledged)" : "").Append('\n');
        if (cautions.Count == 0) o.Append(evaluation.Cases.IsEmpty ? "None found, but the network was not solved.\n" : "None apply.\n");
        var diagnostics = evaluation.Diagnostics.Where(d => !IsCaution(d) && !IsRating(d)).ToList();
        if (diagnostics.Count > 0)
        {
            o.Append("\n### Diagnostics\n\n");
            Table(o, 4, ["at", "severity", "code", "message"], diagnostics.Select(d =>
                new[] { TextReport.Location(evaluation, d), TextReport.Severity(d.Severity), Code(d.Code), d.Shown }));
        }
        if (evaluation.Cases.IsEmpty) o.Append("\nNo results: the network was not solved.\n");
        foreach (var c in evaluation.Cases.Where(c => !c.Case.IsSweepPoint)) WriteCase(o, c);
        WriteSweep(o, evaluation.SweepColumns);
        ThermalReport.Markdown(o, evaluation.Thermal);
        ThreePhaseReport.SequenceMarkdown(o, evaluation.SequenceImpedances);
        ThreePhaseReport.ParallelMarkdown(o, evaluation.Parallel);
        o.Append("\n> ").Append(Cautions.Judgement).Append('\n');
        return o.ToString();
    }

    /// <summary>Every winding, core, brush or connection over its rating, at its line; none only where the network was solved.</summary>
    private static void WriteRatings(StringBuilder o, Evaluation evaluation)
    {
        o.Append("\n### Ratings crossed\n\n");
        var ratings = evaluation.Diagnostics.Where(IsRating).ToList();
        foreach (var d in ratings)
            o.Append("- line ").Append(TextReport.Location(evaluation, d)).Append(": ").Append(Cell(d.Shown)).Append('\n');
        if (ratings.Count == 0)
            o.Append(evaluation.Cases.IsEmpty ? "Not evaluated: the network was not solved.\n" : "None: no rating the file gives is exceeded.\n");
    }

    private static bool IsRating(Diagnostic d) => RatingTally.Codes.Contains(d.Code);

    /// <summary>One line a reviewer reads first: the checks and the count of errors and warnings.</summary>
    public static string Summary(Evaluation evaluation)
    {
        var errors = evaluation.Diagnostics.Count(d => d.IsError);
        var warnings = evaluation.Diagnostics.Count(d => d.Severity == Severity.Warning);
        var passed = evaluation.Checks.Count(c => c.Passed);
        var state = evaluation.Checks.Length == 0 ? "no checks" : $"{passed} of {evaluation.Checks.Length} checks pass" + NotEvaluated(evaluation);
        return $"**{state}**; {Count(errors, "error")}, {Count(warnings, "warning")}";
    }

    private static string NotEvaluated(Evaluation evaluation) =>
        evaluation.Checks.Count(c => !c.Evaluated) is > 0 and var n ? $", {n} not evaluated" : "";

    private static string Count(int n, string what) => $"{n} {what}{(n == 1 ? "" : "s")}";

    private static bool IsCaution(Diagnostic d) => d.Code.StartsWith("caution");

    private static void WriteCase(StringBuilder o, CaseResult c)
    {
        o.Append("\n### Case ").Append(c.Case.Name).Append('\n');
        foreach (var key in (string[])["nodes", "sections", "windings", "taps", "tapChangers"]) WriteGroup(o, ResultTable.Named(key), c);
        if (!c.Cores.IsEmpty)
        {
            var noLoad = c.Cores.Any(k => k.NoLoadCurrent is not null);
            o.Append('\n');
            Table(o, 1, ["core", "volts per turn", "peak flux", "flux limit", "core loss", .. If(noLoad, "no-load current")], c.Cores.Select(k => (string[])
            [
                k.Core.Name, k.VoltsPerTurn is { } e ? V(e.Magnitude, "V") : "unknown", k.Flux is { } b ? V(b, "T") : TextReport.FluxUnknown(k),
                k.Core.FluxLimit is { } limit ? V(limit, "T") : "", k.LossKnown ? V(k.Loss, "W") : "unknown",
                .. If(noLoad, k.NoLoadCurrent is { } i0 ? $"{V(i0.Magnitude, "A")} in {k.NoLoadWinding!.Name}" : ""),
            ]));
        }
        WriteGroup(o, ResultTable.Named("supplies"), c);
        if (c.Fault is { } fault)
        {
            o.Append('\n');
            Table(o, 2, ["fault", "between", "current", "angle", "peak", "X/R", "peak factor"],
            [[
                fault.Fault.Name, $"{fault.Fault.A.Name} and {fault.Fault.B.Name}", V(fault.Current.Magnitude, "A"), Angle(fault.Current),
                V(fault.Peak, "A"), double.IsFinite(fault.XR) ? Numbers.Fixed(fault.XR) : "infinite", Numbers.Fixed(fault.PeakFactor),
            ]]);
            o.Append('\n').Append($"Fault {fault.Fault.Name}: {FaultDutyReport.Method(fault)}.\n");
            WriteBands(o, c);
            return;
        }
        if (c.ShortCircuit is { } sc)
        {
            FaultDutyReport.Markdown(o, sc);
            WriteBands(o, c);
            return;
        }
        WriteGroup(o, ResultTable.Named("loads"), c);
        o.Append('\n');
        var t = c.Totals;
        // The load of highest efficiency, where the case has both copper and core loss.
        string[] best = t is { MaxEfficiencyLoad: { } load, MaxEfficiencyFraction: { } fraction, MaxEfficiency: { } max }
            ? [$"{V(load, "VA")} ({TextReport.Percent(fraction)} of this load)", TextReport.Percent(max)]
            : [];
        Table(o, 0, ["copper loss", "core loss", "efficiency", "throughput", "transformed", .. If(best.Length > 0, "best load", "efficiency there")],
        [[V(t.CopperLoss, "W"), TextReport.CoreLoss(t), t.Efficiency is { } eff ? TextReport.Percent(eff) : t.CoreLossKnown ? "" : "unknown without the core loss", V(t.Throughput, "VA"), V(t.Transformed, "VA"), .. best]]);
        ThreePhaseReport.Markdown(o, c);
        WriteBands(o, c);
    }

    /// <summary>A group of the results table as a table after a blank line: the elements' names, then its columns (a phasor's angle beside it where the column has one); nothing where it lists no element.</summary>
    private static void WriteGroup(StringBuilder o, ResultGroup group, CaseResult c)
    {
        var items = group.When(c) ? group.Items(c).Where(e => group.Listed(e.Item)).ToList() : [];
        if (items.Count == 0) return;
        var columns = group.Columns.Where(k => k.When(c)).ToList();
        o.Append('\n');
        Table(o, 1 + columns.TakeWhile(k => k.IsName).Count(),
            [group.Element, .. columns.SelectMany(k => k.Angle is { } angle ? [k.Header, angle] : new[] { k.Header })],
            items.Select(e => (string[])[e.Name ?? "", .. columns.SelectMany(k => Cells(group.Shown(k, e.Item), k.Angle is not null))]));
    }

    /// <summary>A column's cells: empty where the element has no value; a phasor's magnitude, and its angle where the column shows it.</summary>
    private static IEnumerable<string> Cells((object? Value, string Unit) shown, bool angle) => shown.Value switch
    {
        null => angle ? ["", ""] : [""],
        Complex v when shown.Unit != "pf" => angle ? [V(v.Magnitude, shown.Unit), Angle(v)] : [V(v.Magnitude, shown.Unit)],
        var value => [TextReport.Shown(value, shown.Unit)],
    };

    private static void WriteBands(StringBuilder o, CaseResult c)
    {
        if (c.Bands.IsEmpty) return;
        o.Append("\nBands over the tolerances:\n\n");
        Table(o, 1, ["result", "lowest", "highest"], c.Bands.Select(b => new[] { Code(b.Path), TextReport.Value(b.Min, b.Unit), TextReport.Value(b.Max, b.Unit) }));
    }

    private static void WriteSweep(StringBuilder o, SweepColumns? sweep)
    {
        if (sweep is not { Count: > 0 }) return;
        o.Append("\n### Sweep ").Append(SweepTables.Heading(sweep)).Append('\n');
        var axes = sweep.Points[0].Length;
        foreach (var table in SweepTables.Tables(sweep))
        {
            o.Append('\n').Append(table.Title).Append(":\n\n");
            Table(o, axes, [.. table.Header], table.Rows.Select(r => r.ToArray()));
        }
    }

    private static void WriteChecks(StringBuilder o, Evaluation evaluation)
    {
        if (evaluation.Checks.IsEmpty) return;
        o.Append("\n### Checks\n\n");
        Table(o, 3, ["", "line", "expectation", "value"], evaluation.Checks.Select(check => new[]
        {
            !check.Evaluated ? "not evaluated" : check.Passed ? "pass" : "**FAIL**",
            (evaluation.Text.GetPosition(check.Expect.Line.Start).Line + 1).ToString(CultureInfo.InvariantCulture),
            Code(check.Expect.Text),
            TextReport.CheckValue(check) is { Length: > 0 } v ? v : "not measured",
        }));
    }

    /// <summary>
    /// A table with its header: the first <paramref name="textColumns"/> columns left-aligned, the
    /// numbers after them right-aligned by the header's colons, never by padding.
    /// </summary>
    public static void Table(StringBuilder o, int textColumns, string[] header, IEnumerable<string[]> rows)
    {
        o.Append('|');
        foreach (var h in header) o.Append(' ').Append(Cell(h)).Append(" |");
        o.Append("\n|");
        for (var i = 0; i < header.Length; i++) o.Append(i < textColumns ? "---|" : "--:|");
        o.Append('\n');
        foreach (var row in rows)
        {
            o.Append('|');
            foreach (var cell in row) o.Append(' ').Append(Cell(cell)).Append(" |");
            o.Append('\n');
        }
    }

    /// <summary>Markdown tables break on a bare '|' and on line breaks.</summary>
    public static string Cell(string text) => text.Replace("|", "\\|").Replace("\r", "").Replace("\n", " ");

    public static string Code(string text) => $"`{text.Replace("`", "'")}`";

    private static string V(double value, string unit) => Numbers.Format(value, unit);

    /// <summary>Columns or cells that a table has only when some row needs them.</summary>
    private static string[] If(bool present, params string[] items) => present ? items : [];

    private static string Angle(Complex v) => $"{TextReport.Degrees(v):F2}°".Replace("-0.00°", "0.00°");
}

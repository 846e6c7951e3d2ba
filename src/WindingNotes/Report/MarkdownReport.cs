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
        WriteSweep(o, [.. evaluation.Cases.Where(c => c.Case.IsSweepPoint)]);
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
        o.Append("\n### Case ").Append(c.Case.Name).Append("\n\n");
        Table(o, 1, ["node", "voltage", "angle"], c.Points.Select(p => new[] { p.Point, V(p.Voltage.Magnitude, "V"), Angle(p.Voltage) }));

        // Under a fault the loading is the multiple of rated current a winding carries.
        var density = c.Sections.Any(s => s.CurrentDensity is not null);
        o.Append('\n');
        Table(o, 3, ["section", "from", "to", "turns", "current", "angle", "apparent", c.Fault is null ? "loading" : "times rated", .. If(density, "current density"), "loss"],
            c.Sections.Select(s => (string[])
            [
                s.Section.Name, s.Section.FromPoint, s.Section.ToPoint, Numbers.Plain(s.Section.Turns),
                V(s.Current.Magnitude, "A"), Angle(s.Current), V(s.Apparent, "VA"),
                s.Loading is not { } l ? "" : c.Fault is null ? TextReport.Percent(l) : Numbers.Fixed(l),
                .. If(density, s.CurrentDensity is { } j ? Numbers.Format(j / 1e6, "A/mm2") : ""),
                s.Loss > 0 ? V(s.Loss, "W") : "",
            ]));
        var split = c.Sections.GroupBy(s => s.Winding.Name).Where(g => g.Count() > 1 && g.Sum(s => s.Loss) > 0).ToList();
        if (split.Count > 0)
        {
            o.Append('\n');
            Table(o, 1, ["winding", "loss"], split.Select(g => new[] { g.Key, V(g.Sum(s => s.Loss), "W") }));
        }
        if (!c.Taps.IsEmpty)
        {
            o.Append('\n');
            Table(o, 2, ["tap", "winding", "current out", "angle"], c.Taps.Select(t => new[] { t.Point, t.Winding.Name, V(t.Current.Magnitude, "A"), Angle(t.Current) }));
        }
        if (!c.TapPositions.IsEmpty)
        {
            o.Append('\n');
            var regulators = c.TapPositions.Any(t => t.Regulation is not null);
            Table(o, 1, ["tap changer", "setting", .. If(regulators, "regulation")], c.TapPositions.Select(t => (string[])
                [t.Changer.Name, TextReport.TapText(t), .. If(regulators, t.Regulation is { } r ? TextReport.RegulationText(r) : "")]));
        }
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
        o.Append('\n');
        Table(o, 1, ["supply", "voltage", "current", "angle", "P", "Q", "S", "pf"], c.Supplies.Select(s => new[]
        {
            s.Supply.Name, V(s.Voltage.Magnitude, "V"), V(s.Current.Magnitude, "A"), Angle(s.Current),
            V(s.Power.Real, "W"), V(s.Power.Imaginary, "var"), V(s.Power.Magnitude, "VA"), TextReport.PowerFactor(s.Power),
        }));
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
        if (!c.Loads.IsEmpty)
        {
            var auto = !c.Connections.IsEmpty;
            o.Append('\n');
            Table(o, 1, ["load", "voltage", "angle", "current", "P", "Q", "S", "pf", "regulation", .. If(auto, "co-ratio", "two-winding rating needed")],
                c.Loads.Select(l =>
                {
                    var a = c.Connections.FirstOrDefault(x => x.Connection.Load == l.Load);
                    return (string[])
                    [
                        l.Load.Name, V(l.Voltage.Magnitude, "V"), Angle(l.Voltage), V(l.Current.Magnitude, "A"),
                        V(l.Power.Real, "W"), V(l.Power.Imaginary, "var"), V(l.Power.Magnitude, "VA"), TextReport.PowerFactor(l.Power),
                        l.Regulation is { } r ? TextReport.Percent(r) : "",
                        .. If(auto, a?.CoRatio is { } coRatio ? Numbers.Fixed(coRatio) : "", a is null ? "" : V(a.TwoWindingRating, "VA")),
                    ];
                }));
        }
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

    private static void WriteBands(StringBuilder o, CaseResult c)
    {
        if (c.Bands.IsEmpty) return;
        o.Append("\nBands over the tolerances:\n\n");
        Table(o, 1, ["result", "lowest", "highest"], c.Bands.Select(b => new[] { Code(b.Path), TextReport.Value(b.Min, b.Unit), TextReport.Value(b.Max, b.Unit) }));
    }

    private static void WriteSweep(StringBuilder o, IReadOnlyList<CaseResult> points)
    {
        if (points.Count == 0) return;
        o.Append("\n### Sweep ").Append(SweepTables.Heading(points)).Append('\n');
        var axes = points[0].Case.Sweep.Length;
        foreach (var table in SweepTables.Tables(points))
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

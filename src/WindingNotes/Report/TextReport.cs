using WindingNotes.Model;
using System.Diagnostics;
using System.Numerics;
using System.Text;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report;

/// <summary>
/// The plain report. One result a line, in source order, every number in engineering notation
/// with four significant figures. Names are padded to a fixed width, never to the widest name, so a
/// changed value rewrites its own line and no other.
/// </summary>
public static class TextReport
{
    private const int NameWidth = 12;

    /// <param name="title">whether to begin with the "Results for PATH" line</param>
    public static string Write(Evaluation evaluation, bool title = true)
    {
        var o = new StringBuilder();
        Write(o, null, evaluation, title);
        return o.ToString();
    }

    /// <summary>
    /// The report written to <paramref name="output"/> as it is made, a few thousand characters at a
    /// time: a large file's report is never held whole (its builder's pieces, then a string of it, were
    /// a third of what the 1,000-line report allocated, all of it fresh memory for the collector).
    /// </summary>
    public static void Write(Evaluation evaluation, TextWriter output, bool title = true) =>
        Write(new StringBuilder(2 * FlushAt), output, evaluation, title);

    /// <summary>How many characters gather before they are written out.</summary>
    private const int FlushAt = 8192;

    /// <summary>Writes out what has gathered once it is <see cref="FlushAt"/> characters (or with <paramref name="all"/>, whatever it is), where there is an output to write to.</summary>
    private static void Flush(StringBuilder o, TextWriter? output, bool all = false)
    {
        if (output is null || (o.Length < FlushAt && !(all && o.Length > 0))) return;
        output.Write(o);
        o.Clear();
    }

    private static void Write(StringBuilder o, TextWriter? output, Evaluation evaluation, bool title)
    {
        if (title) o.Append("Results for ").Append(evaluation.Path.Length == 0 ? "(standard input)" : evaluation.Path).Append('\n');
        var findings = evaluation.Diagnostics.Where(d => !d.Code.StartsWith("caution")).ToList();
        if (findings.Count > 0)
        {
            o.Append("\nDiagnostics\n");
            foreach (var d in findings)
            {
                o.Append("  ").Append(Location(evaluation, d)).Append(' ').Append(Severity(d.Severity)).Append(' ').Append(d.Code).Append(": ").Append(d.Shown).Append('\n');
                Flush(o, output);
            }
        }
        if (evaluation.Cases.IsEmpty)
            o.Append(evaluation.Model.HasErrors ? "\nNo results: the file has errors, so it was not solved.\n" : "\nNo results: the network was not solved.\n");
        foreach (var c in evaluation.Cases.Where(c => !c.Case.IsSweepPoint))
        {
            WriteCase(o, c);
            Flush(o, output);
        }
        SweepTables.Write(o, evaluation.SweepColumns);
        ThermalReport.Text(o, evaluation.Thermal);
        ThreePhaseReport.SequenceText(o, evaluation.SequenceImpedances);
        ThreePhaseReport.ParallelText(o, evaluation.Parallel);
        Flush(o, output);
        WriteChecks(o, output, evaluation);
        o.Append("\nCautions\n");
        foreach (var d in evaluation.Diagnostics.Where(d => d.Code.StartsWith("caution")))
        {
            o.Append("  ").Append(Location(evaluation, d)).Append(' ').Append(d.Shown).Append(d.Acknowledged ? " (acknowledged)" : "").Append('\n');
            Flush(o, output);
        }
        o.Append("  ").Append(Cautions.Judgement).Append('\n');
        Flush(o, output, all: true);
    }

    private static readonly string[] NamedGroups = ["nodes", "sections", "windings", "taps", "tapChangers"];

    private static void WriteCase(StringBuilder o, CaseResult c)
    {
        o.Append("\nCase ").Append(c.Case.Name).Append('\n');
        foreach (var key in NamedGroups) WriteGroup(o, ResultTable.Named(key), c);
        if (!c.Cores.IsEmpty)
        {
            Heading(o, "Cores");
            var coreWidth = Width(c.Cores.Select(k => k.Core.Name));
            foreach (var k in c.Cores)
            {
                var parts = new List<string>();
                if (k.VoltsPerTurn is { } e) parts.Add($"{Numbers.Format(e.Magnitude, "V")}/turn");
                if (k.Flux is { } b) parts.Add($"peak flux {Numbers.Format(b, "T")}" + (k.Core.FluxLimit is { } limit ? $" (limit {Numbers.Format(limit, "T")})" : ""));
                else parts.Add(FluxUnknown(k));
                parts.Add(k.LossKnown ? $"core loss {Numbers.Format(k.Loss, "W")}" : "core loss unknown (no 'no-load' line)");
                if (k.NoLoadCurrent is { } i0) parts.Add($"no-load current {Numbers.Format(i0.Magnitude, "A")} in {k.NoLoadWinding!.Name}");
                Line(o, k.Core.Name, string.Join(", ", parts), coreWidth);
            }
        }
        WriteGroup(o, ResultTable.Named("supplies"), c);
        WriteGroup(o, ResultTable.Named("loads"), c);
        if (c.Fault is { } fault)
        {
            Heading(o, "Fault");
            var xr = double.IsFinite(fault.XR) ? Numbers.Fixed(fault.XR) : "infinite";
            var faultWidth = Width([fault.Fault.Name, "method"]);
            Line(o, fault.Fault.Name, $"{fault.Fault.A.Name} to {fault.Fault.B.Name}: {Phasor(fault.Current, "A")}, peak {Numbers.Format(fault.Peak, "A")} (X/R {xr}, factor {Numbers.Fixed(fault.PeakFactor)})", faultWidth);
            Line(o, "method", FaultDutyReport.Method(fault), faultWidth);
            WriteBands(o, c);
            return;
        }
        if (c.ShortCircuit is { } sc)
        {
            // Its lines are gathered first: the block's name column is as wide as its names.
            var lines = new List<(string Name, string Text)>();
            FaultDutyReport.Text(o, sc, t => Heading(o, t), (n, t) => lines.Add((n, t)));
            var width = Width(lines.Select(l => l.Name));
            foreach (var (name, text) in lines) Line(o, name, text, width);
            WriteBands(o, c);
            return;
        }
        Heading(o, "Totals");
        Line(o, "copper loss", Numbers.Format(c.Totals.CopperLoss, "W"));
        Line(o, "core loss", CoreLoss(c.Totals));
        if (c.Totals.Efficiency is { } eff) Line(o, "efficiency", Percent(eff));
        else if (!c.Totals.CoreLossKnown) Line(o, "efficiency", "unknown without the core loss");
        Line(o, "throughput", Numbers.Format(c.Totals.Throughput, "VA"));
        Line(o, "transformed", Numbers.Format(c.Totals.Transformed, "VA"));
        if (c.Totals is { MaxEfficiencyLoad: { } best, MaxEfficiencyFraction: { } fraction, MaxEfficiency: { } max })
            Line(o, "best load", $"{Numbers.Format(best, "VA")} ({Percent(fraction)} of this load), efficiency {Percent(max)} there");
        ThreePhaseReport.Text(o, c);
        WriteBands(o, c);
    }

    /// <summary>A group of the results table: its heading, then a line an element listed of its columns' phrases; nothing where it lists none.</summary>
    private static void WriteGroup(StringBuilder o, ResultGroup group, CaseResult c)
    {
        var items = group.When(c) ? group.Items(c).Where(e => group.Listed(e.Item)).ToList() : [];
        if (items.Count == 0) return;
        Heading(o, group.Heading);
        // Each column's field found once a group, not once a line.
        var columns = group.Columns.Where(k => k.When(c)).Select(k => (Column: k, Field: group.FieldOf(k))).ToList();
        var width = Width(items.Select(e => e.Name ?? ""));
        foreach (var (name, item) in items)
        {
            NameColumn(o, "    ", name ?? "", width);
            foreach (var (column, field) in columns)
            {
                var (value, unit) = ResultGroup.Shown(column, field, item);
                if (value is not null) Phrase(o, column.Text, value, unit);
            }
            o.Append('\n');
        }
    }

    /// <summary>A column's phrase with its value in place of each <c>{}</c>.</summary>
    private static void Phrase(StringBuilder o, string text, object value, string unit)
    {
        var from = 0;
        for (var at = text.IndexOf("{}", StringComparison.Ordinal); at >= 0; at = text.IndexOf("{}", from, StringComparison.Ordinal))
        {
            AppendShown(o.Append(text, from, at - from), value, unit);
            from = at + 2;
        }
        o.Append(text, from, text.Length - from);
    }

    /// <summary>A value of the results table in its unit: a phasor in polar form, a power factor with its sense, turns as a plain number, a name as it is.</summary>
    public static string Shown(object value, string unit) => Made(AppendShown(Spare(), value, unit));

    /// <summary><see cref="Shown"/>'s text appended.</summary>
    public static StringBuilder AppendShown(StringBuilder o, object value, string unit) => value switch
    {
        Complex s when unit == "pf" => AppendPowerFactor(o, s),
        Complex v => AppendPhasor(o, v, unit),
        double x when unit == "turns" => Numbers.AppendPlain(o, x),
        double x => AppendValue(o, x, unit),
        int k => o.Append(k.ToString(System.Globalization.CultureInfo.InvariantCulture)),
        _ => o.Append(value.ToString() ?? ""),
    };

    /// <summary>Why a core shows no flux density: what is missing to compute it.</summary>
    public static string FluxUnknown(CoreResult k) =>
        k.VoltsPerTurn is null ? "flux unknown: give the windings' turns" + (k.Core.Source.Area is null ? " and the core's area" : "")
        : "flux unknown: give the core's area";

    /// <summary>The total core loss, or "unknown" where a core has no open-circuit test.</summary>
    public static string CoreLoss(Totals t) => t.CoreLossKnown ? Numbers.Format(t.CoreLoss, "W") : "unknown (no 'no-load' line)";

    private static void WriteBands(StringBuilder o, CaseResult c)
    {
        if (c.Bands.IsEmpty) return;
        Heading(o, "Bands over the tolerances");
        foreach (var b in c.Bands) o.Append("    ").Append(b.Path).Append(' ').Append(Value(b.Min, b.Unit)).Append(" to ").Append(Value(b.Max, b.Unit)).Append('\n');
    }

    /// <summary>A number in its unit, fractions as percent.</summary>
    public static string Value(double value, string unit) => Made(AppendValue(Spare(), value, unit));

    /// <summary><see cref="Value"/>'s text appended.</summary>
    public static StringBuilder AppendValue(StringBuilder o, double value, string unit) =>
        unit == "%" ? Numbers.Append(o, value * 100, "%") : unit.Length == 0 ? Numbers.AppendFixed(o, value) : Numbers.Append(o, value, unit);

    private static void WriteChecks(StringBuilder o, TextWriter? output, Evaluation evaluation)
    {
        if (evaluation.Checks.IsEmpty) return;
        o.Append("\nChecks\n");
        foreach (var check in evaluation.Checks)
        {
            var line = evaluation.Text.GetPosition(check.Expect.Line.Start).Line + 1;
            o.Append("  ").Append(Verdict(check)).Append("  line ").Append(line).Append(": ").Append(check.Expect.Text);
            if (CheckValue(check) is { Length: > 0 } value) o.Append(" (").Append(value).Append(')');
            o.Append('\n');
            Flush(o, output);
        }
    }

    /// <summary>"pass", "FAIL", or "not evaluated" where the file was not solved.</summary>
    public static string Verdict(CheckResult check) => !check.Evaluated ? "not evaluated" : check.Passed ? "pass" : "FAIL";

    /// <summary>"3 of 4 checks passed", with how many were not evaluated, apart.</summary>
    public static string CheckCount(int passed, int checks, int notEvaluated) =>
        $"{passed} of {checks} check{(checks == 1 ? "" : "s")} passed" + (notEvaluated > 0 ? $", {notEvaluated} not evaluated" : "");

    /// <summary>
    /// "117.7 V", or with sweep points and tolerances "69.98 V; 0.000 V to 139.9 V over 11 points;
    /// fails at 2: BR=90 %, BR=100 %"; empty when the value could not be measured.
    /// </summary>
    public static string CheckValue(CheckResult check)
    {
        if (check.Expect.Measure == MeasureKind.VectorGroup) return check.Shown ?? "";
        if (check.Value is not { } v) return "";
        var value = SolveMessages.Show(v, check.Expect.Unit);
        if ((check.Points > 1 || check.Min != check.Max) && check.Min is { } min && check.Max is { } max)
            value += $"; {SolveMessages.Show(min, check.Expect.Unit)} to {SolveMessages.Show(max, check.Expect.Unit)} over {check.Points} point{(check.Points == 1 ? "" : "s")}{(check.Min != check.Max && check.Points == 1 ? " and the tolerance band" : "")}";
        if (!check.Failures.IsEmpty && check.Points > 1)
            value += $"; fails at {check.Failing}: {SolveMessages.ListPoints(check.Failures)}";
        return value;
    }

    private static void Heading(StringBuilder o, string title) => o.Append("  ").Append(title).Append('\n');

    private static void Line(StringBuilder o, string name, string text, int width = NameWidth) => Named(o, "    ", name, width, text);

    /// <summary>The longest name a block's name column widens to; a longer one stands on its own line (<see cref="Named"/>).</summary>
    private const int WidestName = 24;

    /// <summary>
    /// The width of a block's name column: its longest name's of those up to <see cref="WidestName"/>,
    /// at least <paramref name="least"/>. One width a block, so its texts stand in one column; a block of
    /// short names is as it was.
    /// </summary>
    internal static int Width(IEnumerable<string> names, int least = NameWidth) =>
        Math.Max(least, names.Select(n => n.Length).Where(n => n <= WidestName).DefaultIfEmpty(0).Max());

    /// <summary>
    /// A line of a block: its name in a column of <paramref name="width"/> (<see cref="Width"/>), then its
    /// text. A name longer than even the widest column (a long name of the file's) stands on its own line
    /// and its text begins the next at the column, so the block's texts stay in one column.
    /// </summary>
    internal static void Named(StringBuilder o, string indent, string name, int width, string text) =>
        NameColumn(o, indent, name, width).Append(text).Append('\n');

    /// <summary>A line of a block up to its text: <see cref="Named"/> without the text and the line's end.</summary>
    private static StringBuilder NameColumn(StringBuilder o, string indent, string name, int width)
    {
        o.Append(indent).Append(name);
        if (name.Length > width) o.Append('\n').Append(' ', indent.Length + width);
        else o.Append(' ', width - name.Length);
        return o.Append(' ');
    }

    /// <summary>A builder for the text of one value, kept between uses: the string made of it is the only allocation.</summary>
    [ThreadStatic] private static StringBuilder? spare;

    private static StringBuilder Spare()
    {
        var o = spare ?? new StringBuilder(64);
        spare = null;
        return o.Clear();
    }

    private static string Made(StringBuilder o)
    {
        var text = o.ToString();
        if (o.Capacity <= 1024) spare = o;
        return text;
    }

    public static string Location(Evaluation evaluation, Diagnostic d)
    {
        var p = evaluation.Text.GetPosition(d.Span.Start);
        return $"{p.Line + 1}:{p.Character + 1}";
    }

    public static string Severity(Severity s) => s switch
    {
        Text.Severity.Error => "error",
        Text.Severity.Warning => "warning",
        Text.Severity.Information => "info",
        _ => "hint",
    };

    /// <summary>"228.1 V angle -0.04 deg": the notation's own polar form, so a reader can paste it back.</summary>
    public static string Phasor(Complex v, string unit) => Made(AppendPhasor(Spare(), v, unit));

    /// <summary><see cref="Phasor"/>'s text appended.</summary>
    public static StringBuilder AppendPhasor(StringBuilder o, Complex v, string unit)
    {
        Numbers.Append(o, v.Magnitude, unit).Append(" angle ");
        Span<char> degrees = stackalloc char[40];
        if (!Degrees(v).TryFormat(degrees, out var n, "F2", System.Globalization.CultureInfo.InvariantCulture)) throw new UnreachableException();
        // An angle that rounds to zero is written without a sign.
        return o.Append(degrees[..n] is "-0.00" ? "0.00" : degrees[..n]).Append(" deg");
    }

    public static double Degrees(Complex v) => v == Complex.Zero ? 0 : v.Phase * 180 / Math.PI;

    public static string Percent(double fraction) => Numbers.Format(fraction * 100, "%");

    /// <summary>P, Q, S and the power factor with its sense.</summary>
    public static string Powers(Complex s) =>
        $"P {Numbers.Format(s.Real, "W")}, Q {Numbers.Format(s.Imaginary, "var")}, S {Numbers.Format(s.Magnitude, "VA")}, pf {PowerFactor(s)}";

    /// <summary>"0.8200 lagging": the power factor with its sense (none at unity).</summary>
    public static string PowerFactor(Complex s) => Made(AppendPowerFactor(Spare(), s));

    /// <summary><see cref="PowerFactor"/>'s text appended.</summary>
    public static StringBuilder AppendPowerFactor(StringBuilder o, Complex s)
    {
        var pf = s.Magnitude == 0 ? 1 : Math.Abs(s.Real) / s.Magnitude;
        var sense = s.Imaginary > 1e-9 * s.Magnitude ? " lagging" : s.Imaginary < -1e-9 * s.Magnitude ? " leading" : "";
        return Numbers.AppendFixed(o, pf).Append(sense);
    }
}

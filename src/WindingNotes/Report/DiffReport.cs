using System.Globalization;
using System.Text;
using WindingNotes.Text;

namespace WindingNotes.Report;

/// <summary>A <see cref="ResultDiff"/> for a terminal (text) or a pull request comment (Markdown).</summary>
public static class DiffReport
{
    public static string Text(ResultDiff diff)
    {
        var o = new StringBuilder();
        o.Append("Results of ").Append(diff.NewName).Append(" against ").Append(diff.OldName)
            .Append(" (changes above ").Append(Percent(diff.Threshold)).Append(")\n");
        if (!diff.Checks.IsEmpty)
        {
            o.Append("\nExpectations\n");
            foreach (var c in diff.Checks)
                o.Append("  ").Append(State(c)).Append("  ").Append(c.Line is { } line ? $"line {line}: " : "").Append(c.Text)
                    .Append(c.OldText is { } was ? $" (was {was})" : "").Append(Values(c) is { Length: > 0 } v ? $": {v}" : "").Append('\n');
        }
        if (!diff.Values.IsEmpty || !diff.CasesAdded.IsEmpty || !diff.CasesRemoved.IsEmpty)
        {
            o.Append("\nResults\n");
            foreach (var name in diff.CasesAdded) o.Append("  case ").Append(name).Append(": new\n");
            foreach (var name in diff.CasesRemoved) o.Append("  case ").Append(name).Append(": gone\n");
            foreach (var v in diff.Values)
                o.Append("  ").Append(v.Case).Append(": ").Append(v.Label).Append(": ").Append(Show(v.Old, v.Unit)).Append(" -> ")
                    .Append(Show(v.New, v.Unit)).Append(" (").Append(Change(v)).Append(")\n");
        }
        if (!diff.Diagnostics.IsEmpty)
        {
            o.Append("\nDiagnostics\n");
            foreach (var d in diff.Diagnostics)
                o.Append("  ").Append(d.Added ? "new " : "gone").Append("  ").Append(TextReport.Severity(d.Severity)).Append(' ').Append(d.Code).Append(": ").Append(d.Message).Append('\n');
        }
        o.Append('\n').Append(Summary(diff)).Append('\n');
        return o.ToString();
    }

    public static string Markdown(ResultDiff diff)
    {
        var o = new StringBuilder();
        o.Append("### Results of ").Append(MarkdownReport.Code(diff.NewName)).Append(" against ").Append(MarkdownReport.Code(diff.OldName)).Append("\n\n");
        o.Append(diff.Regressed ? "**" + Summary(diff) + "**" : Summary(diff)).Append('\n');
        if (!diff.Checks.IsEmpty)
        {
            o.Append('\n');
            MarkdownReport.Table(o, 4, ["expectation", "line", "was", "now", "old value", "new value", "change"], diff.Checks.Select(c => new[]
            {
                MarkdownReport.Code(c.Text) + (c.OldText is { } was ? $" (was {MarkdownReport.Code(was)})" : ""), c.Line?.ToString(CultureInfo.InvariantCulture) ?? "", Word(c.Old),
                c.Regressed ? "**FAIL**" : Word(c.New), Show(c.OldValue, c.Unit), Show(c.NewValue, c.Unit),
                c.OldValue is { } a && c.NewValue is { } b ? Change(new ValueChange("", "", c.Unit, a, b)) : "",
            }));
        }
        if (!diff.Values.IsEmpty || !diff.CasesAdded.IsEmpty || !diff.CasesRemoved.IsEmpty)
        {
            o.Append('\n');
            MarkdownReport.Table(o, 2, ["case", "result", "old", "new", "change"],
                diff.CasesAdded.Select(n => new[] { n, "the whole case", "", "new", "" })
                    .Concat(diff.CasesRemoved.Select(n => new[] { n, "the whole case", "", "gone", "" }))
                    .Concat(diff.Values.Select(v => new[] { v.Case, v.Label, Show(v.Old, v.Unit), Show(v.New, v.Unit), Change(v) })));
        }
        if (!diff.Diagnostics.IsEmpty)
        {
            o.Append('\n');
            MarkdownReport.Table(o, 4, ["", "severity", "code", "message"], diff.Diagnostics.Select(d => new[]
            {
                d.Added ? "new" : "gone", TextReport.Severity(d.Severity), MarkdownReport.Code(d.Code), d.Message,
            }));
        }
        return o.ToString();
    }

    /// <summary>"1 expectation now fails; 4 results moved by more than 0.100 %".</summary>
    public static string Summary(ResultDiff diff)
    {
        var parts = new List<string>();
        var failing = diff.Checks.Count(c => c.Regressed);
        if (failing > 0) parts.Add($"{failing} expectation{(failing == 1 ? " now fails" : "s now fail")}");
        var passing = diff.Checks.Count(c => c.Old == CheckState.Fail && c.New == CheckState.Pass);
        if (passing > 0) parts.Add($"{passing} now pass{(passing == 1 ? "es" : "")}");
        var moved = diff.Values.Count(v => v.Old is not null && v.New is not null);
        parts.Add(moved == 0 ? $"no result moved by more than {Percent(diff.Threshold)}" : $"{moved} result{(moved == 1 ? "" : "s")} moved by more than {Percent(diff.Threshold)}");
        var added = diff.Values.Count(v => v.Old is null) + diff.CasesAdded.Length;
        var gone = diff.Values.Count(v => v.New is null) + diff.CasesRemoved.Length;
        if (added > 0) parts.Add($"{added} new");
        if (gone > 0) parts.Add($"{gone} gone");
        return string.Join("; ", parts);
    }

    private static string State(CheckChange c) => (c.Old, c.New) switch
    {
        (CheckState.Pass, CheckState.Fail) => "now FAIL (was pass)",
        (CheckState.Fail, CheckState.Pass) => "now pass (was FAIL)",
        (CheckState.Absent, var s) => $"new, {Word(s)}",
        (var s, CheckState.Absent) => $"gone (was {Word(s)})",
        (var s, _) => $"still {Word(s)}",
    };

    private static string Word(CheckState s) => s switch { CheckState.Pass => "pass", CheckState.Fail => "FAIL", _ => "" };

    private static string Values(CheckChange c) => (c.OldValue, c.NewValue) switch
    {
        ({ } a, { } b) => $"{Show(a, c.Unit)} -> {Show(b, c.Unit)} ({Change(new ValueChange("", "", c.Unit, a, b))})",
        (null, { } b) => Show(b, c.Unit),
        ({ } a, null) => $"was {Show(a, c.Unit)}",
        _ => "",
    };

    private static string Show(double? value, string unit) => value is not { } v ? "-" : unit switch
    {
        "deg" => $"{v:F2} deg".Replace("-0.00 deg", "0.00 deg"),
        _ => DiagnosticBag.Show(v, unit),
    };

    /// <summary>"+1.797 %" of the old value; for an angle its shift, "+0.96 deg".</summary>
    private static string Change(ValueChange v)
    {
        if (v.Old is not { } a) return "new";
        if (v.New is not { } b) return "gone";
        if (v.Unit == "deg") return Signed(ResultDiff.AngleChange(a, b).ToString("F2", CultureInfo.InvariantCulture)) + " deg";
        return ResultDiff.Relative(a, b) is { } r ? Signed(Numbers.Format(r * 100, "%")) : "from zero";
    }

    private static string Signed(string number) => number.StartsWith('-') ? number : "+" + number;

    private static string Percent(double fraction) => Numbers.Plain(fraction * 100) + " %";
}

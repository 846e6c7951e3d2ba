using System.Globalization;
using System.Net;
using System.Text;
using WindingNotes.Solve;
using WindingNotes.Text;

namespace WindingNotes.Report;

/// <summary>
/// A <see cref="ResultDiff"/> for a terminal (text) or a pull request comment (Markdown), in the
/// order a reviewer decides: a one-line summary, expectations that changed, ratings crossed, the
/// largest moves and the diagnostics that changed, then every result that moved, by element (in
/// Markdown each element folded under a line of its own, so the comment fits on a screen).
/// </summary>
public static class DiffReport
{
    /// <summary>The largest moves shown ahead of the rest.</summary>
    public const int Largest = 5;

    /// <summary>A result that moved, as shown: grouped under its element (and case, other than the normal case).</summary>
    private sealed record Row(string Group, string Label, string Field, string Old, string New, string Change, double? Size);

    public static string Text(ResultDiff diff)
    {
        var o = new StringBuilder();
        o.Append("Results of ").Append(diff.NewName).Append(" against ").Append(diff.OldName)
            .Append(" (changes above ").Append(Percent(diff.Threshold)).Append(")\n");
        o.Append(Summary(diff)).Append('\n');
        if (!diff.Checks.IsEmpty)
        {
            o.Append("\nExpectations\n");
            foreach (var c in diff.Checks)
                o.Append("  ").Append(State(c)).Append("  ").Append(c.Line is { } line ? $"line {line}: " : "").Append(c.Text)
                    .Append(c.OldText is { } was ? $" (was {was})" : "").Append(Values(c) is { Length: > 0 } v ? $": {v}" : "").Append('\n');
        }
        var crossed = diff.Diagnostics.Where(d => d.RatingCrossed).ToList();
        if (crossed.Count > 0)
        {
            o.Append("\nRatings crossed\n");
            foreach (var d in crossed) o.Append("  ").Append(Crossing(d)).Append("  ").Append(d.New ?? d.Old).Append('\n');
        }
        var rows = Rows(diff);
        var largest = LargestMoves(rows);
        if (largest.Count > 0)
        {
            o.Append("\nLargest moves\n");
            foreach (var r in largest) o.Append("  ").Append(r.Label).Append(": ").Append(Line(r)).Append('\n');
        }
        var others = diff.Diagnostics.Where(d => !d.RatingCrossed).ToList();
        if (others.Count > 0)
        {
            o.Append("\nDiagnostics\n");
            foreach (var d in others)
                o.Append("  ").Append(Word(d)).Append("  ").Append(TextReport.Severity(d.Severity)).Append(' ').Append(d.Code).Append(": ").Append(Message(d, "->")).Append('\n');
        }
        if (rows.Count > 0)
        {
            o.Append("\nResults by element\n");
            foreach (var group in rows.GroupBy(r => r.Group))
            {
                o.Append("  ").Append(group.Key).Append('\n');
                foreach (var r in group) o.Append("    ").Append(r.Field).Append(": ").Append(Line(r)).Append('\n');
            }
        }
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
                c.OldValue is { } a && c.NewValue is { } b ? Change(c.Unit, a, b) : "",
            }));
        }
        var crossed = diff.Diagnostics.Where(d => d.RatingCrossed).ToList();
        if (crossed.Count > 0)
        {
            o.Append("\nRatings crossed:\n\n");
            foreach (var d in crossed) o.Append("- ").Append(Crossing(d)).Append(": ").Append(MarkdownReport.Cell(d.New ?? d.Old!)).Append('\n');
        }
        var rows = Rows(diff);
        var largest = LargestMoves(rows);
        if (largest.Count > 0)
        {
            o.Append("\nLargest moves:\n\n");
            MarkdownReport.Table(o, 1, ["result", "old", "new", "change"], largest.Select(r => new[] { r.Label, r.Old, r.New, r.Change }));
        }
        var others = diff.Diagnostics.Where(d => !d.RatingCrossed).ToList();
        if (others.Count > 0)
        {
            o.Append("\nDiagnostics:\n\n");
            MarkdownReport.Table(o, 4, ["", "severity", "code", "message"], others.Select(d => new[]
            {
                Word(d), TextReport.Severity(d.Severity), MarkdownReport.Code(d.Code), Message(d, "→"),
            }));
        }
        foreach (var group in rows.GroupBy(r => r.Group))
        {
            o.Append("\n<details><summary>").Append(WebUtility.HtmlEncode(GroupLine(group.Key, [.. group]))).Append("</summary>\n\n");
            MarkdownReport.Table(o, 1, ["result", "old", "new", "change"], group.Select(r => new[] { r.Field, r.Old, r.New, r.Change }));
            o.Append("\n</details>\n");
        }
        return o.ToString();
    }

    /// <summary>"1 expectation now fails; 2 ratings crossed; 4 results moved by more than 0.1 %": the line a pull request comment starts with.</summary>
    public static string Summary(ResultDiff diff)
    {
        var parts = new List<string>();
        var failing = diff.Checks.Count(c => c.Regressed);
        if (failing > 0) parts.Add($"{failing} expectation{(failing == 1 ? " now fails" : "s now fail")}");
        var passing = diff.Checks.Count(c => c.Old == CheckState.Fail && c.New == CheckState.Pass);
        if (passing > 0) parts.Add($"{passing} now pass{(passing == 1 ? "es" : "")}");
        var crossed = diff.Diagnostics.Count(d => d.RatingCrossed);
        if (crossed > 0) parts.Add($"{crossed} rating{(crossed == 1 ? "" : "s")} crossed");
        var rows = Rows(diff);
        var moved = rows.Count(r => r.Size is not null);
        parts.Add(moved == 0 ? $"no result moved by more than {Percent(diff.Threshold)}" : $"{moved} result{(moved == 1 ? "" : "s")} moved by more than {Percent(diff.Threshold)}");
        var added = rows.Count(r => r.Change == "new");
        var gone = rows.Count(r => r.Change == "gone");
        if (added > 0) parts.Add($"{added} new");
        if (gone > 0) parts.Add($"{gone} gone");
        var diagnostics = diff.Diagnostics.Count(d => !d.RatingCrossed);
        if (diagnostics > 0) parts.Add($"{diagnostics} diagnostic{(diagnostics == 1 ? "" : "s")} changed");
        return string.Join("; ", parts);
    }

    /// <summary>Every result that moved as a row: cases that came or went, values, results over a sweep (by their largest move), bands (by their ends).</summary>
    private static List<Row> Rows(ResultDiff diff)
    {
        var rows = new List<Row>();
        rows.AddRange(diff.CasesAdded.Select(n => new Row("cases", $"case {n}", $"case {n}", "", "", "new", null)));
        rows.AddRange(diff.CasesRemoved.Select(n => new Row("cases", $"case {n}", $"case {n}", "", "", "gone", null)));
        foreach (var v in diff.Values)
        {
            var group = v.Case == "normal" ? v.Element : $"{v.Case}: {v.Element}";
            var label = v.Case == "normal" ? v.Label : $"{v.Case}: {v.Label}";
            rows.Add(new Row(group, label, Field(v.Label, v.Element), Show(v.Old, v.Unit), Show(v.New, v.Unit), Change(v.Unit, v.Old, v.New), v.Size));
        }
        foreach (var s in diff.Sweeps)
        {
            var at = s.Largest;
            var change = $"{Change(s.Unit, at.Old, at.New)} at {s.Where}; {s.Moved} of {s.Points} point{(s.Points == 1 ? "" : "s")}";
            rows.Add(new Row($"sweep: {s.Element}", $"{s.Label} over the sweep", $"{Field(s.Label, s.Element)} over the sweep", Show(at.Old, s.Unit), Show(at.New, s.Unit), change, at.Size));
        }
        foreach (var b in diff.Bands)
        {
            var group = b.Case == "normal" ? "bands" : $"{b.Case}: bands";
            var low = new ValueChange(b.Case, "", "", b.Unit, b.OldMin, b.NewMin);
            var high = new ValueChange(b.Case, "", "", b.Unit, b.OldMax, b.NewMax);
            var change = b.OldMin is null ? "new" : b.NewMin is null ? "gone" : $"low {Change(b.Unit, b.OldMin, b.NewMin)}, high {Change(b.Unit, b.OldMax, b.NewMax)}";
            var size = low.Size is { } a && high.Size is { } c ? Math.Max(a, c) : low.Size ?? high.Size;
            rows.Add(new Row(group, $"{(b.Case == "normal" ? "" : b.Case + ": ")}band of {b.Label}", b.Label,
                Range(b.OldMin, b.OldMax, b.Unit), Range(b.NewMin, b.NewMax, b.Unit), change, size));
        }
        return rows;
    }

    private static List<Row> LargestMoves(List<Row> rows) =>
        [.. rows.Where(r => r.Size is not null).OrderByDescending(r => r.Size).Take(Largest)];

    /// <summary>"section HV: 5 results, the most: loss +76.28 %".</summary>
    private static string GroupLine(string group, List<Row> rows)
    {
        var most = rows.Where(r => r.Size is not null).MaxBy(r => r.Size);
        var count = $"{rows.Count} result{(rows.Count == 1 ? "" : "s")}";
        return most is null ? $"{group}: {count}" : $"{group}: {count}, the most: {most.Field} {most.Change}";
    }

    private static string Field(string label, string element) => label.StartsWith(element) && label.Length > element.Length ? label[element.Length..].Trim() : label;

    private static string Line(Row r) => r.Old.Length == 0 && r.New.Length == 0 ? r.Change : $"{r.Old} -> {r.New} ({r.Change})";

    private static string Range(double? min, double? max, string unit) => min is null || max is null ? "-" : $"{Show(min, unit)} to {Show(max, unit)}";

    private static string State(CheckChange c) => (c.Old, c.New) switch
    {
        (CheckState.Pass, CheckState.Fail) => "now FAIL (was pass)",
        (CheckState.Fail, CheckState.Pass) => "now pass (was FAIL)",
        (CheckState.Absent, var s) => $"new, {Word(s)}",
        (var s, CheckState.Absent) => $"gone (was {Word(s)})",
        (var s, _) => $"still {Word(s)}",
    };

    private static string Word(CheckState s) => s switch { CheckState.Pass => "pass", CheckState.Fail => "FAIL", _ => "" };

    private static string Word(DiagnosticChange d) => d.Added ? "new" : d.Gone ? "gone" : "changed";

    private static string Crossing(DiagnosticChange d) => d.Added ? "now over" : "no longer over";

    /// <summary>The message; for one whose numbers changed, each changed number as "228.1 -> 227.9".</summary>
    private static string Message(DiagnosticChange d, string arrow)
    {
        if (d.Old is null || d.New is null) return d.New ?? d.Old ?? "";
        var old = ResultDiff.NumbersIn(d.Old);
        var i = 0;
        return ResultDiff.ReplaceNumbers(d.New, number =>
        {
            var was = i < old.Count ? old[i++] : number;
            return was == number ? number : $"{was} {arrow} {number}";
        });
    }

    private static string Values(CheckChange c) => (c.OldValue, c.NewValue) switch
    {
        ({ } a, { } b) => $"{Show(a, c.Unit)} -> {Show(b, c.Unit)} ({Change(c.Unit, a, b)})",
        (null, { } b) => Show(b, c.Unit),
        ({ } a, null) => $"was {Show(a, c.Unit)}",
        _ => "",
    };

    private static string Show(double? value, string unit) => value is not { } v ? "-" : unit switch
    {
        "deg" => $"{v:F2} deg".Replace("-0.00 deg", "0.00 deg"),
        _ => SolveMessages.Show(v, unit),
    };

    /// <summary>
    /// "+1.797 %" of the old value; for a percent quantity (loading, efficiency, regulation) its
    /// change in percentage points, "-30.1 points", since a percent of a percent misleads; for an
    /// angle its shift, "+0.96 deg".
    /// </summary>
    private static string Change(string unit, double? old, double? @new)
    {
        if (old is not { } a) return "new";
        if (@new is not { } b) return "gone";
        if (unit == "deg") return Signed(ResultDiff.AngleChange(a, b).ToString("F2", CultureInfo.InvariantCulture)) + " deg";
        if (unit == "%") return Signed(Numbers.Plain((b - a) * 100, 3)) + " points";
        return ResultDiff.Relative(a, b) is { } r ? Signed(Numbers.Format(r * 100, "%")) : "from zero";
    }

    private static string Signed(string number) => number.StartsWith('-') || number == "0" ? number : "+" + number;

    private static string Percent(double fraction) => Numbers.Plain(fraction * 100) + " %";
}

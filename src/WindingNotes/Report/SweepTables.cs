using System.Numerics;
using System.Text;
using WindingNotes.Solve;

namespace WindingNotes.Report;

/// <summary>
/// Sweep points as tables in the text report: one row a point, one column a result, every column
/// the same fixed width (never the widest entry's), so a changed value rewrites only its own row.
/// A column with an entry too long for it (a section of a tapped winding, 'SERIES:B1-SEL', in its
/// header) is as wide as that entry and a space: an entry never pushes the columns after it out of line.
/// A result a point does not have shows as "-".
/// </summary>
public static class SweepTables
{
    private const int Width = 13;

    /// <summary>One table: its title, its header (the swept names, then the results) and a row per point.</summary>
    public sealed record Table(string Title, IReadOnlyList<string> Header, IReadOnlyList<IReadOnlyList<string>> Rows);

    /// <summary>
    /// "BR (11 points; 12 with the file as written)", or "BR by load (121 points; ...)" for a grid: checks and
    /// rating warnings count the case as written beside the sweep points, and the two counts must agree.
    /// </summary>
    public static string Heading(IReadOnlyList<CaseResult> points) =>
        $"{string.Join(" by ", points[0].Case.Sweep.Select(v => v.Name))} ({points.Count} point{(points.Count == 1 ? "" : "s")}; {points.Count + 1} with the file as written)";

    public static void Write(StringBuilder o, IReadOnlyList<CaseResult> points)
    {
        if (points.Count == 0) return;
        o.Append("\nSweep ").Append(Heading(points)).Append('\n');
        foreach (var table in Tables(points))
        {
            o.Append("  ").Append(table.Title).Append('\n');
            var widths = Widths(table);
            Row(o, table.Header, widths);
            foreach (var row in table.Rows) Row(o, row, widths);
        }
    }

    /// <summary>The tables of a sweep, for the text and Markdown reports alike: each group's <see cref="ResultGroup.Sweep"/> of the results table.</summary>
    public static IEnumerable<Table> Tables(IReadOnlyList<CaseResult> points)
    {
        if (points.Count == 0) yield break;
        var axes = points[0].Case.Sweep.Select(v => v.Name).ToList();
        var (sectionColumn, note) = SectionColumns(points);
        foreach (var group in ResultTable.Case)
            foreach (var sweep in group.Sweep)
            {
                // A section's column is named by SectionColumns, the table's title noting it where a brush renames sections.
                IEnumerable<(string, string)> Cells(CaseResult c) => group.When(c) ? group.Items(c).SelectMany(e => sweep.Columns.SelectMany(k =>
                    Cell(group.Shown(k, e.Item), sweep.Columns.Length) is { } text ? [(Header(e.Item is SectionResult s ? sectionColumn(s) : e.Name, k.Header), text)] : Array.Empty<(string, string)>())) : [];
                if (Build(sweep.Title + (group.Key == "sections" ? note : ""), axes, points, Cells) is { } table) yield return table;
            }
    }

    /// <summary>"mains I": the element's name and the column's header, or either alone.</summary>
    private static string Header(string? name, string header) => name is null ? header : header.Length == 0 ? name : $"{name} {header}";

    /// <summary>A value as a sweep table shows it: a phasor's magnitude; where it is missing, "-" in a table of several columns, else no cell.</summary>
    private static string? Cell((object? Value, string Unit) shown, int columns) => shown.Value switch
    {
        null => columns > 1 ? "-" : null,
        Complex v => TextReport.Value(v.Magnitude, shown.Unit),
        double x => TextReport.Value(x, shown.Unit),
        var other => other.ToString(),
    };

    /// <summary>
    /// Column names for sections. Where a brush passes a fixed tap, a winding's sections change names
    /// mid-sweep (W:A-BR, W:BR-LINE become W:A-LINE, W:LINE-BR); that winding's columns are then named
    /// by the point each section ends at (W:..BR, W:..LINE), which every point has, so no column
    /// starts or stops mid-way.
    /// </summary>
    private static (Func<SectionResult, string> Column, string Note) SectionColumns(IReadOnlyList<CaseResult> points)
    {
        var named = new Dictionary<string, string>(StringComparer.Ordinal);
        var moving = new SortedSet<string>(StringComparer.Ordinal);
        foreach (var c in points)
            foreach (var w in c.Sections.GroupBy(s => s.Winding.Name))
            {
                var names = string.Join(" ", w.Select(s => s.Section.Name));
                if (!named.TryAdd(w.Key, names) && named[w.Key] != names) moving.Add(w.Key);
            }
        if (moving.Count == 0) return (s => s.Section.Name, "");
        return (s => moving.Contains(s.Winding.Name) ? $"{s.Winding.Name}:..{s.Section.ToPoint}" : s.Section.Name,
            $" ({string.Join(", ", moving)} by the point each section ends at)");
    }

    private static Table? Build(string title, List<string> axes, IReadOnlyList<CaseResult> points, Func<CaseResult, IEnumerable<(string Column, string Text)>> cells)
    {
        var rows = points.Select(p => cells(p).ToList()).ToList();
        var columns = rows.SelectMany(r => r.Select(c => c.Column)).Distinct().ToList();
        if (columns.Count == 0) return null;
        var body = new List<IReadOnlyList<string>>();
        for (var i = 0; i < points.Count; i++)
        {
            var byColumn = rows[i].GroupBy(c => c.Column).ToDictionary(g => g.Key, g => g.First().Text);
            body.Add([.. points[i].Case.Sweep.Select(v => v.Text), .. columns.Select(c => byColumn.GetValueOrDefault(c, "-"))]);
        }
        return new Table(title, [.. axes.Select(a => $"{a}="), .. columns], body);
    }

    /// <summary>Each column's width: <see cref="Width"/>, or its longest entry and a space where that is longer.</summary>
    private static int[] Widths(Table table)
    {
        var widths = table.Header.Select(h => Math.Max(Width, h.Length + 1)).ToArray();
        foreach (var row in table.Rows)
            for (var i = 0; i < row.Count && i < widths.Length; i++) widths[i] = Math.Max(widths[i], row[i].Length + 1);
        return widths;
    }

    private static void Row(StringBuilder o, IReadOnlyList<string> cells, int[] widths)
    {
        var line = new StringBuilder("    ");
        for (var i = 0; i < cells.Count; i++) line.Append(cells[i].PadRight((i < widths.Length ? widths[i] : Width) - 1)).Append(' ');
        o.Append(line.ToString().TrimEnd()).Append('\n');
    }
}

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
    public static string Heading(SweepColumns sweep) =>
        $"{string.Join(" by ", sweep.Points[0].Select(v => v.Name))} ({sweep.Count} point{(sweep.Count == 1 ? "" : "s")}; {sweep.Count + 1} with the file as written)";

    public static void Write(StringBuilder o, SweepColumns? sweep)
    {
        if (sweep is not { Count: > 0 }) return;
        o.Append("\nSweep ").Append(Heading(sweep)).Append('\n');
        foreach (var table in Tables(sweep))
        {
            o.Append("  ").Append(table.Title).Append('\n');
            var widths = Widths(table);
            Row(o, table.Header, widths);
            foreach (var row in table.Rows) Row(o, row, widths);
        }
    }

    /// <summary>The tables of a sweep, for the text and Markdown reports alike: each group's <see cref="ResultGroup.Sweep"/> of the results table, read from the kept points' columns.</summary>
    public static IEnumerable<Table> Tables(SweepColumns sweep)
    {
        if (sweep.Count == 0) yield break;
        var axes = sweep.Points[0].Select(v => v.Name).ToList();
        var points = Enumerable.Range(0, sweep.Count).Select(i => Point.Of(sweep, i)).ToList();
        var (sectionColumn, note) = SectionColumns(points);
        foreach (var group in ResultTable.Case)
            for (var t = 0; t < group.Sweep.Length; t++)
            {
                var table = group.Sweep[t];
                var units = table.Columns.Select(k => k.Read is not null ? k.Unit : group.Fields.First(f => f.Key == k.Field).Unit).ToArray();
                var keys = table.Columns.Select((k, i) => k.Read is not null ? CaseLeaves.ShownKey(t, i) : k.Field!).ToArray();
                // A section's column is named by SectionColumns, the table's title noting it where a brush renames sections.
                IEnumerable<(string, string)> Cells(Point p) => p.Groups.TryGetValue(group.Key, out var elements) ? elements.SelectMany(e => table.Columns.SelectMany((k, i) =>
                    Cell(e.Leaves.GetValueOrDefault(keys[i]), units[i], table.Columns.Length) is { } text ? [(Header(group.Key == "sections" ? sectionColumn(e) : e.Name, k.Header), text)] : Array.Empty<(string, string)>())) : [];
                if (Build(table.Title + (group.Key == "sections" ? note : ""), axes, sweep, points, Cells) is { } built) yield return built;
            }
    }

    /// <summary>"mains I": the element's name and the column's header, or either alone.</summary>
    private static string Header(string? name, string header) => name is null ? header : header.Length == 0 ? name : $"{name} {header}";

    /// <summary>A value as a sweep table shows it: a phasor's magnitude; where it is missing, "-" in a table of several columns, else no cell.</summary>
    private static string? Cell(object? value, string unit, int columns) => value switch
    {
        null => columns > 1 ? "-" : null,
        Complex v => TextReport.Value(v.Magnitude, unit),
        double x => TextReport.Value(x, unit),
        var other => other.ToString(),
    };

    /// <summary>
    /// Column names for sections. Where a brush passes a fixed tap, a winding's sections change names
    /// mid-sweep (W:A-BR, W:BR-LINE become W:A-LINE, W:LINE-BR); that winding's columns are then named
    /// by the point each section ends at (W:..BR, W:..LINE), which every point has, so no column
    /// starts or stops mid-way.
    /// </summary>
    private static (Func<Element, string> Column, string Note) SectionColumns(List<Point> points)
    {
        var named = new Dictionary<string, string>(StringComparer.Ordinal);
        var moving = new SortedSet<string>(StringComparer.Ordinal);
        foreach (var p in points)
            foreach (var w in p.Groups.GetValueOrDefault("sections", []).GroupBy(Winding))
            {
                var names = string.Join(" ", w.Select(s => s.Name));
                if (!named.TryAdd(w.Key, names) && named[w.Key] != names) moving.Add(w.Key);
            }
        if (moving.Count == 0) return (s => s.Name!, "");
        return (s => moving.Contains(Winding(s)) ? $"{Winding(s)}:..{s.Leaves["to"]}" : s.Name!,
            $" ({string.Join(", ", moving)} by the point each section ends at)");

        static string Winding(Element s) => (string)s.Leaves["winding"]!;
    }

    private static Table? Build(string title, List<string> axes, SweepColumns sweep, List<Point> points, Func<Point, IEnumerable<(string Column, string Text)>> cells)
    {
        var rows = points.Select(p => cells(p).ToList()).ToList();
        var columns = rows.SelectMany(r => r.Select(c => c.Column)).Distinct().ToList();
        if (columns.Count == 0) return null;
        var body = new List<IReadOnlyList<string>>();
        for (var i = 0; i < points.Count; i++)
        {
            var byColumn = rows[i].GroupBy(c => c.Column).ToDictionary(g => g.Key, g => g.First().Text);
            body.Add([.. sweep.Points[i].Select(v => v.Text), .. columns.Select(c => byColumn.GetValueOrDefault(c, "-"))]);
        }
        return new Table(title, [.. axes.Select(a => $"{a}="), .. columns], body);
    }

    /// <summary>An element of a group at a point: its name (null for a group that is one object) and its values by key, as its leaves give them.</summary>
    private sealed record Element(string? Name, Dictionary<string, object?> Leaves);

    /// <summary>A kept point's groups (those the point has), each its elements in order, read from the columns.</summary>
    private sealed class Point : ICaseLeaves
    {
        public Dictionary<string, List<Element>> Groups { get; } = new(StringComparer.Ordinal);
        private readonly List<string> open = [];
        private Element? element;
        private int depth;

        public static Point Of(SweepColumns sweep, int point)
        {
            var p = new Point();
            sweep.Walk(point, p, shown: true);
            return p;
        }

        public void Open(string key, bool array)
        {
            open.Add(key);
            if (open.Count == 1)
            {
                var elements = Groups[key] = [];
                // A group that is one object (totals) has its values at its own level.
                if (ResultTable.Case.FirstOrDefault(g => g.Key == key) is { Single: not null }) Start(new Element(null, []));
            }
            else if (open.Count == 2 && element is null) Start(new Element(key, []));

            void Start(Element e)
            {
                Groups[open[0]].Add(element = e);
                depth = open.Count;
            }
        }

        public void Close()
        {
            open.RemoveAt(open.Count - 1);
            if (open.Count < depth) element = null;
        }

        private void Leaf(string key, object? value)
        {
            if (element is not null && open.Count == depth) element.Leaves.TryAdd(key, value);
        }

        public void Number(string key, ResultField field, double value) => Leaf(key, value);

        public void Null(string key, ResultField field) => Leaf(key, null);

        public void Integer(string key, ResultField field, int value) => Leaf(key, value);

        public void Word(string key, ResultField field, string value) => Leaf(key, value);

        public void Boolean(string key, ResultField field, bool value) => Leaf(key, value);

        public void Phasor(string key, ResultField field, Complex value) => Leaf(key, value);
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

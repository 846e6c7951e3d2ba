using System.Text;
using WindingNotes.Solve;
using WindingNotes.Text;

namespace WindingNotes.Report;

/// <summary>
/// Sweep points as tables in the text report: one row a point, one column a result, every column
/// the same fixed width (never the widest entry's), so a changed value rewrites only its own row.
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
            Row(o, table.Header);
            foreach (var row in table.Rows) Row(o, row);
        }
    }

    /// <summary>The tables of a sweep, for the text and Markdown reports alike.</summary>
    public static IEnumerable<Table> Tables(IReadOnlyList<CaseResult> points)
    {
        if (points.Count == 0) yield break;
        var axes = points[0].Case.Sweep.Select(v => v.Name).ToList();
        var (column, note) = SectionColumns(points);
        var tables = new List<Table?>
        {
            Build("Nodes, voltage", axes, points, c => c.Points.Select(p => (p.Point, TextReport.Value(p.Voltage.Magnitude, "V")))),
            Build($"Sections, current{note}", axes, points, c => c.Sections.Select(s => (column(s), TextReport.Value(s.Current.Magnitude, "A")))),
        };
        if (points.Any(c => c.Sections.Any(s => s.Loading is not null)))
            tables.Add(Build($"Sections, loading{note}", axes, points, c => c.Sections.Where(s => s.Loading is not null).Select(s => (column(s), TextReport.Percent(s.Loading!.Value)))));
        if (points.Any(c => !c.Taps.IsEmpty))
            tables.Add(Build("Taps, current out of the winding", axes, points, c => c.Taps.Select(t => (t.Point, TextReport.Value(t.Current.Magnitude, "A")))));
        if (points.Any(c => !c.TapPositions.IsEmpty))
            tables.Add(Build("Tap changers, position", axes, points, c => c.TapPositions.Select(t => (t.Changer.Name, t.State is TapState.AtLimit or TapState.Hunting or TapState.Backwards ? $"{t.Position} ({t.StateText})" : $"{t.Position}"))));
        if (points.Any(c => c.Cores.Any(k => k.Flux is not null)))
            tables.Add(Build("Cores, peak flux", axes, points, c => c.Cores.Where(k => k.Flux is not null).Select(k => (k.Core.Name, TextReport.Value(k.Flux!.Value, "T")))));
        tables.Add(Build("Supplies, current and power", axes, points, c => c.Supplies.SelectMany(s => new[]
        {
            ($"{s.Supply.Name} I", TextReport.Value(s.Current.Magnitude, "A")),
            ($"{s.Supply.Name} P", TextReport.Value(s.Power.Real, "W")),
        })));
        if (points.Any(c => !c.Loads.IsEmpty))
            tables.Add(Build("Loads, voltage, current, power, regulation", axes, points, c => c.Loads.SelectMany(l => new[]
            {
                ($"{l.Load.Name} V", TextReport.Value(l.Voltage.Magnitude, "V")),
                ($"{l.Load.Name} I", TextReport.Value(l.Current.Magnitude, "A")),
                ($"{l.Load.Name} P", TextReport.Value(l.Power.Real, "W")),
                ($"{l.Load.Name} reg", l.Regulation is { } r ? TextReport.Percent(r) : "-"),
            })));
        tables.Add(Build("Totals", axes, points, c => new[]
        {
            ("copper loss", TextReport.Value(c.Totals.CopperLoss, "W")),
            ("core loss", c.Totals.CoreLossKnown ? TextReport.Value(c.Totals.CoreLoss, "W") : "-"),
            ("efficiency", c.Totals.Efficiency is { } e ? TextReport.Percent(e) : "-"),
        }));
        foreach (var t in tables.OfType<Table>()) yield return t;
    }

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

    private static void Row(StringBuilder o, IEnumerable<string> cells)
    {
        var line = new StringBuilder("    ");
        foreach (var cell in cells) line.Append(cell.PadRight(Width - 1)).Append(' ');
        o.Append(line.ToString().TrimEnd()).Append('\n');
    }
}

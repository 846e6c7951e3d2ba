using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report.Diagrams;

/// <summary>
/// Results against the swept value: one panel per unit, stacked over one x axis, a line per result
/// (and per value of any further sweep axis), a mark at each point. A result a point does not have
/// (a section the brush has moved past) leaves a gap in its line. Results are chosen by their path
/// in the JSON report, with '*' for any one name: <c>loads.*.v.rms</c>, <c>sections.W:*.loading</c>.
/// </summary>
public static class SweepPlot
{
    /// <summary>What a sweep is usually run to see: the load voltages and the loading of the windings.</summary>
    public static readonly IReadOnlyList<string> DefaultResults = ["loads.*.v.rms", "sections.*.loading"];

    private const double PlotWidth = 560, PanelHeight = 190, PanelGap = 34, Left = 84, Top = 70, NameSize = 10, ValueSize = 9;

    private static readonly string[] Palette = ["#1f4e79", "#b3541e", "#4f7a28", "#7b3f98", "#0f7c86", "#a83250", "#6b5b2a", "#3d5a80", "#c27c0e", "#2e6b4f"];

    private sealed record Series(string Path, string Label, string Unit, List<(double X, double Y)?> Points, int Colour);

    /// <summary>The plot, or null with the reason when there is nothing to plot.</summary>
    public static Drawing? Draw(Evaluation evaluation, IReadOnlyList<string>? results, out string? problem)
    {
        problem = null;
        // The sweep's columns: one array per result over the points kept, as the study filled them.
        var points = evaluation.SweepColumns?.Points ?? [];
        if (points.Length == 0)
        {
            // A file with a load cycle and no sweep: its day is what varies.
            if (evaluation.Thermal is { } day && evaluation.Model.Sweeps.IsEmpty) return Cycle(evaluation, day, results, out problem);
            problem = evaluation.Model.Sweeps.IsEmpty ? "the file has no sweep" : "the sweep was not run: see the file's diagnostics";
            return null;
        }
        var axis = points[0][0].Name;
        var sweep = evaluation.Model.Sweeps.FirstOrDefault(s => s.Target.Name == axis);
        var xUnit = sweep is null ? "" : SweepAxis.Unit(sweep);
        var columns = evaluation.SweepColumns!.Columns.Where(c => c.Values.Any(v => !double.IsNaN(v))).ToDictionary(c => c.Path);
        var paths = columns.Keys.ToList();

        var explicitly = results is { Count: > 0 };
        var patterns = explicitly ? results! : DefaultResults;
        var chosen = new List<string>();
        foreach (var pattern in patterns)
        {
            var match = Glob(pattern);
            var found = paths.Where(match).ToList();
            if (found.Count == 0 && explicitly)
            {
                problem = $"no result of the sweep matches '{pattern}'; results are named as in the JSON report, such as {string.Join(", ", paths.Take(3))}";
                return null;
            }
            chosen.AddRange(found.Where(f => !chosen.Contains(f)));
        }
        if (chosen.Count == 0) chosen.AddRange(paths.Where(Glob("nodes.*.v.rms")));

        // A further sweep axis makes a line per value of it.
        string Group(ImmutableArray<SweepValue> point) => string.Join(" ", point.Skip(1));
        var groups = points.Select(Group).Distinct().ToList();
        var series = new List<Series>();
        foreach (var path in chosen)
            foreach (var group in groups)
            {
                var line = new List<(double, double)?>();
                string? unit = null;
                var column = columns[path];
                for (var i = 0; i < points.Length; i++)
                {
                    if (Group(points[i]) != group) continue;
                    if (double.IsFinite(column.Values[i]))
                    {
                        line.Add((points[i][0].Value, column.Values[i]));
                        unit ??= column.Unit;
                    }
                    else line.Add(null);
                }
                var label = ResultValues.Readable(path) + (group.Length > 0 ? $" ({group})" : "");
                series.Add(new Series(path, label, unit ?? "", line, series.Count % Palette.Length));
            }
        var name = evaluation.Path.Length == 0 ? "standard input" : evaluation.Path;
        var count = series.Count == 0 ? 0 : series.Max(s => s.Points.Count);
        return Plot($"Sweep of {axis} in {name}", $"{count} point{(count == 1 ? "" : "s")} of the sweep; a gap where a point does not have the result.", $"{axis} ({UnitName(xUnit)})", xUnit, series, marks: true);
    }

    /// <summary>
    /// The load cycle's day against the time of day: each unit's hot-spot and top oil (a dry-type
    /// unit's average winding temperature) with the ambient in one panel, the load in another. Results
    /// by name: 'hot-spot', 'top-oil', 'ambient', 'load' (all when left out).
    /// </summary>
    private static Drawing? Cycle(Evaluation evaluation, ThermalResult day, IReadOnlyList<string>? results, out string? problem)
    {
        problem = null;
        string[] known = ["hot-spot", "top-oil", "ambient", "load"];
        var wanted = results is { Count: > 0 } ? results : known;
        if (wanted.FirstOrDefault(w => !known.Contains(w)) is { } unknown)
        {
            problem = $"no result of the load cycle is called '{unknown}': its results are {string.Join(", ", known)}";
            return null;
        }
        var hours = day.Times.Select(t => t / 3600).ToList();
        List<(double X, double Y)?> Line(IEnumerable<double> ys) => [.. hours.Zip(ys, (x, y) => ((double X, double Y)?)(x, y))];
        var series = new List<Series>();
        void Add(string label, string unit, IEnumerable<double> ys) => series.Add(new Series(label, label, unit, Line(ys), series.Count % Palette.Length));
        foreach (var u in day.Units)
        {
            if (wanted.Contains("hot-spot")) Add($"{u.Unit.Core} hot-spot", "degC", u.HotSpot);
            if (wanted.Contains("top-oil")) Add($"{u.Unit.Core} {(u.Unit.Dry ? "winding average" : "top oil")}", "degC", u.TopOil);
        }
        if (wanted.Contains("ambient")) Add("ambient", "degC", day.Ambient);
        if (wanted.Contains("load")) Add($"load ({day.LoadUnit})", day.LoadUnit, day.Load);
        var name = evaluation.Path.Length == 0 ? "standard input" : evaluation.Path;
        return Plot($"Load cycle of {name}", $"the day after {day.Days - 1} days of the same cycle, a sample every {Numbers.Plain(day.Cycle.Step)} s; the load and ambient are those of the step ending at each sample.",
            "time of day (h)", "h", series, marks: false);
    }

    /// <summary>
    /// Whether a result's path matches a pattern whose '*' stands for any characters but '.' (one part of
    /// the path or a piece of it); the rest compares exactly. Matched by hand: a regular expression would
    /// bring .NET's regular expression engines into the native command, whose start-up writes out every
    /// type it carries.
    /// </summary>
    internal static Func<string, bool> Glob(string pattern)
    {
        var parts = pattern.Split('*');
        return path => Matches(path, 0, parts, 0);
    }

    private static bool Matches(string path, int at, string[] parts, int part)
    {
        if (!path.AsSpan(at).StartsWith(parts[part], StringComparison.Ordinal)) return false;
        at += parts[part].Length;
        if (part == parts.Length - 1) return at == path.Length;
        // The '*' after this part takes the characters before a '.', as few or as many as the rest needs.
        for (var end = at; ; end++)
        {
            if (Matches(path, end, parts, part + 1)) return true;
            if (end == path.Length || path[end] == '.') return false;
        }
    }

    private static Drawing Plot(string title, string note, string axisLabel, string xUnit, List<Series> series, bool marks)
    {
        var svg = new Svg();
        var panels = series.GroupBy(s => s.Unit).ToList();
        var xs = series.SelectMany(s => s.Points).OfType<(double X, double Y)>().Select(p => p.X).ToList();
        var (xLow, xHigh, xStep) = Scales.Axis(xs.DefaultIfEmpty(0).Min(), xs.DefaultIfEmpty(1).Max(), 8);
        double X(double x) => Left + (x - xLow) / (xHigh - xLow) * PlotWidth;

        var legendX = Left + PlotWidth + 24;
        var legendY = Top;
        var y0 = Top;
        foreach (var panel in panels)
        {
            var unit = panel.Key;
            var ys = panel.SelectMany(s => s.Points).OfType<(double X, double Y)>().Select(p => p.Y).ToList();
            var (yLow, yHigh, yStep) = Scales.Axis(ys.DefaultIfEmpty(0).Min(), ys.DefaultIfEmpty(1).Max(), 5);
            var top = y0;
            double Y(double y) => top + PanelHeight - (y - yLow) / (yHigh - yLow) * PanelHeight;

            svg.Rect(Left, top, PlotWidth, PanelHeight, "frame");
            foreach (var t in Ticks(yLow, yHigh, yStep))
            {
                svg.Line(Left, Y(t), Left + PlotWidth, Y(t), "gridline");
                svg.Text(Tick(t, unit), Left - 6, Y(t) + 3.5, "tick", ValueSize, Anchor.End);
            }
            foreach (var t in Ticks(xLow, xHigh, xStep)) svg.Line(X(t), top, X(t), top + PanelHeight, "gridline");
            svg.Text(UnitName(unit), Left, top - 6, "strong", NameSize);

            foreach (var s in panel)
            {
                var colour = Palette[s.Colour];
                // A line through each run of points that have the result; a mark at every point.
                var run = new List<(double, double)>();
                void Flush()
                {
                    if (run.Count > 1) svg.Raw($"<polyline class=\"series\" stroke=\"{colour}\" points=\"{string.Join(" ", run.Select(p => $"{Svg.N(p.Item1)},{Svg.N(p.Item2)}"))}\"/>");
                    run.Clear();
                }
                foreach (var p in s.Points)
                {
                    if (p is not { } point)
                    {
                        Flush();
                        continue;
                    }
                    run.Add((X(point.X), Y(point.Y)));
                    if (marks) svg.Raw($"<circle cx=\"{Svg.N(X(point.X))}\" cy=\"{Svg.N(Y(point.Y))}\" r=\"2.3\" fill=\"{colour}\"/>");
                }
                Flush();
                legendY += 15;
                svg.Raw($"<line x1=\"{Svg.N(legendX)}\" y1=\"{Svg.N(legendY - 3.5)}\" x2=\"{Svg.N(legendX + 18)}\" y2=\"{Svg.N(legendY - 3.5)}\" stroke=\"{colour}\" stroke-width=\"2\"/>");
                svg.Text(s.Label, legendX + 24, legendY, "name", NameSize);
            }
            legendY += 10;
            y0 += PanelHeight + PanelGap;
        }
        var bottom = y0 - PanelGap;
        foreach (var t in Ticks(xLow, xHigh, xStep))
            svg.Text(Tick(t, xUnit), X(t), bottom + 14, "tick", ValueSize, Anchor.Middle);
        svg.Text(axisLabel, Left + PlotWidth / 2, bottom + 32, "strong", NameSize, Anchor.Middle);

        var width = legendX + 24 + series.Select(s => Svg.TextWidth(s.Label, NameSize)).DefaultIfEmpty(0).Max() + 24;
        width = Math.Max(width, Math.Max(Svg.TextWidth(title, 13), Svg.TextWidth(note, ValueSize)) + 48);
        svg.Text(title, 24, 28, "title", 13);
        svg.Text(note, 24, 46, "note", ValueSize);
        var height = svg.Notes(24, Math.Max(bottom + 40, legendY + 10) + 13, width - 48) + 20;
        return new Drawing(svg.Document(width, height, Css), svg.TextBoxes, width, height);
    }

    private static IEnumerable<double> Ticks(double low, double high, double step)
    {
        var n = (int)Math.Round((high - low) / step);
        for (var k = 0; k <= n; k++) yield return low + k * step;
    }

    /// <summary>A tick's value, short: "40 %", "1.5 kV", "0.95".</summary>
    private static string Tick(double value, string unit)
    {
        if (Math.Abs(value) < 1e-12) value = 0;
        return unit == "%" ? Numbers.Short(value * 100, "%", 4) : Numbers.Short(value, unit, 4);
    }

    private static string UnitName(string unit) => unit switch { "%" => "%", "" => "ratio", var u => u };

    private const string Css = Symbols.Css + """
        .frame{stroke:#9aa5ae;stroke-width:1;fill:none}
        .gridline{stroke:#e4e8ec;stroke-width:1}
        .tick{font-size:9px;fill:#3e4c59}
        .series{fill:none;stroke-width:1.8;stroke-linejoin:round}

        """;
}

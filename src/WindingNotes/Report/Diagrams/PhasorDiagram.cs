using System.Numerics;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report.Diagrams;

/// <summary>
/// The phasors of one case on polar grids: each node's voltage from the reference, each winding
/// section's voltage laid from the node at its far end to the node at its polarity end (so a boost
/// winding is seen adding to the supply), and the currents of supplies, loads and faults on a scale
/// of their own. Nodes at very different voltages (the two sides of a step-down unit) get a grid
/// each, so the low-voltage side is not a speck beside the high-voltage one. The levels are those of
/// the normal case, so under a fault a node shorted to the neutral keeps its level's grid; a section
/// and a current go on the grid of the node they start from, or of their other end where that one is
/// the reference (a load from the grounded neutral is on the secondary's grid, not the first). A
/// table lists every phasor, so none is lost where arrows crowd.
/// </summary>
public static class PhasorDiagram
{
    private const double NameSize = 10, ValueSize = 9;

    /// <summary>More texts than this do not fit on the grids legibly (a file of thousands of nodes would otherwise try each label against thousands).</summary>
    private const int MaxLabels = 400;

    /// <summary>Node voltages within this ratio of the highest on a grid share it.</summary>
    private const double LevelRatio = 3;

    /// <summary>A phasor; <see cref="Node"/> is the node it starts from, <see cref="Other"/> its other end (the same for a node voltage).</summary>
    private sealed record Arrow(string Name, Complex Tail, Complex Value, string Unit, string Style, string Key, int Node, int Other);

    public static Drawing Draw(Evaluation evaluation, CaseResult c)
    {
        var svg = new Svg();
        var arrows = Arrows(c);
        var reference = evaluation.Normal is { } normal && normal.Solution.Network == c.Solution.Network ? normal : c;
        var levels = Levels(reference);
        var members = levels.Select(_ => new List<Arrow>()).ToList();
        foreach (var a in arrows) members[LevelOf(levels, a)].Add(a);
        var panels = members.Select((m, i) => (Arrows: m, Nodes: levels[i].Names)).Where(p => p.Arrows.Count > 0).DefaultIfEmpty(([], [])).ToList();
        var radius = panels.Count == 1 ? 190.0 : 125.0;
        var taken = new List<Box>();
        var x = 24.0;
        var top = 82.0;
        foreach (var panel in panels)
        {
            var caption = panels.Count == 1 ? "" : "nodes " + Shorten(string.Join(", ", panel.Nodes), 2 * radius + 40);
            Panel(svg, taken, panel.Arrows, x + 16 + radius, top + 14 + radius, radius, caption);
            x += 2 * radius + 80;
        }

        // The table: every phasor with its magnitude and angle.
        var tx = x + 10;
        var ty = top;
        var magnitudeX = tx + 22 + arrows.Select(a => Svg.TextWidth(a.Key, NameSize)).Append(Svg.TextWidth("phasor", NameSize)).Max() + 16 + Svg.TextWidth("magnitude", NameSize);
        var angleX = magnitudeX + 12 + Svg.TextWidth("-179.99°", NameSize);
        svg.Text("phasor", tx + 22, ty, "strong", NameSize);
        svg.Text("magnitude", magnitudeX, ty, "strong", NameSize, Anchor.End);
        svg.Text("angle", angleX, ty, "strong", NameSize, Anchor.End);
        foreach (var a in panels.SelectMany(p => p.Arrows))
        {
            ty += 14;
            svg.Line(tx, ty - 3.5, tx + 16, ty - 3.5, a.Style);
            svg.Text(a.Key, tx + 22, ty, "name", NameSize);
            svg.Text(Numbers.Format(a.Value.Magnitude, a.Unit), magnitudeX, ty, "name", NameSize, Anchor.End);
            svg.Text($"{TextReport.Degrees(a.Value):F2}°".Replace("-0.00°", "0.00°"), angleX, ty, "name", NameSize, Anchor.End);
        }
        if (arrows.Count == 0) svg.Text("no phasor to draw: every voltage and current is zero", tx, ty += 14, "note", ValueSize);
        var width = Math.Max(angleX + 24, tx + 24 + (arrows.Count == 0 ? Svg.TextWidth("no phasor to draw: every voltage and current is zero", ValueSize) : 0));
        var name = evaluation.Path.Length == 0 ? "standard input" : evaluation.Path;
        var title = $"Phasors of {name}, case {c.Case.Name}";
        width = Math.Max(width, Svg.TextWidth(title, 13) + 48);
        svg.Text(title, 24, 28, "title", 13);
        svg.Text("Solid: node voltages from the reference. Thin: winding section voltages, from the far end to the polarity end.", 24, 46, "note", ValueSize);
        svg.Text("Dashed: currents of supplies, loads and faults, on their own scale. Angles in the frame of the supplies' angles.", 24, 59, "note", ValueSize);
        var height = svg.Notes(24, Math.Max(top + 2 * radius + 56, ty + 24) + 13, width - 48) + 20;
        return new Drawing(svg.Document(width, height, Css), svg.TextBoxes, width, height);
    }

    private static string Shorten(string text, double width)
    {
        var max = (int)(width / (ValueSize * Svg.CharWidth));
        return text.Length <= max ? text : text[..Math.Max(1, max - 1)] + "…";
    }

    private sealed record Level(HashSet<int> Nodes, List<string> Names);

    /// <summary>
    /// Groups of nodes by voltage level in a case: from the highest down, each group holds the nodes
    /// within <see cref="LevelRatio"/> of its first; nodes at zero (the reference) are in none.
    /// </summary>
    private static List<Level> Levels(CaseResult c)
    {
        var network = c.Solution.Network;
        var scale = c.Points.Select(p => p.Voltage.Magnitude).DefaultIfEmpty(0).Max();
        var nodes = c.Points.Select(p => (Node: network.Node(p.Point), p.Voltage.Magnitude)).DistinctBy(p => p.Node)
            .Where(p => p.Magnitude > 1e-9 * scale).ToList();
        var levels = new List<Level>();
        double top = 0;
        foreach (var (node, magnitude) in nodes.OrderByDescending(p => p.Magnitude))
        {
            if (levels.Count == 0 || magnitude * LevelRatio < top)
            {
                levels.Add(new Level([], []));
                top = magnitude;
            }
            levels[^1].Nodes.Add(node);
        }
        if (levels.Count == 0) levels.Add(new Level([], []));
        // Captions name the nodes in the order of the file.
        foreach (var (node, _) in nodes) levels.First(l => l.Nodes.Contains(node)).Names.Add(network.Nodes[node].Name);
        return levels;
    }

    /// <summary>The level of the node an arrow starts from, else of its other end, else the first (both ends at the reference).</summary>
    private static int LevelOf(List<Level> levels, Arrow a)
    {
        var i = levels.FindIndex(l => l.Nodes.Contains(a.Node));
        if (i < 0) i = levels.FindIndex(l => l.Nodes.Contains(a.Other));
        return Math.Max(0, i);
    }

    private static void Panel(Svg svg, List<Box> taken, List<Arrow> arrows, double cx, double cy, double radius, string caption)
    {
        var voltages = arrows.Where(a => a.Unit == "V").ToList();
        var currents = arrows.Where(a => a.Unit == "A").ToList();
        var vMax = voltages.Select(a => Math.Max((a.Tail + a.Value).Magnitude, a.Tail.Magnitude)).DefaultIfEmpty(0).Max();
        var iMax = currents.Select(a => a.Value.Magnitude).DefaultIfEmpty(0).Max();
        // Round rings, as many as the larger of the two scales needs (at most five).
        var vStep = Scales.Step(vMax, 5);
        var iStep = Scales.Step(iMax, 5);
        var rings = Math.Max(1, (int)Math.Max(Math.Ceiling(vMax / vStep - 1e-9), iMax > 0 ? Math.Ceiling(iMax / iStep - 1e-9) : 0));

        if (caption.Length > 0) svg.Text(caption, cx - radius - 8, cy - radius - 16, "note", ValueSize);
        // Ring values on the upright axis, voltages above the centre and currents below it.
        for (var ring = 1; ring <= rings; ring++)
        {
            var r = radius * ring / rings;
            svg.Circle(cx, cy, r, "grid");
            if (vMax > 0) svg.Text(Numbers.Format(vStep * ring, "V"), cx + 3, cy - r - 3, "vgrid", ValueSize);
            if (iMax > 0) svg.Text(Numbers.Format(iStep * ring, "A"), cx + 3, cy + r + 10, "igrid", ValueSize);
        }
        svg.Line(cx - radius - 8, cy, cx + radius + 8, cy, "axis");
        svg.Line(cx, cy - radius - 8, cx, cy + radius + 8, "axis");
        svg.Text("0°", cx + radius + 10, cy + 3.5, "note", ValueSize);
        taken.AddRange(svg.TextBoxes);
        taken.Add(new Box(cx - 6, cy - 6, 12, 12));

        (double X, double Y) At(Complex v, string unit)
        {
            var scale = radius / rings / (unit == "V" ? vStep : iStep);
            return (cx + v.Real * scale, cy - v.Imaginary * scale);
        }

        foreach (var a in arrows)
        {
            var (x0, y0) = At(a.Tail, a.Unit);
            var (x1, y1) = At(a.Tail + a.Value, a.Unit);
            ArrowLine(svg, x0, y0, x1, y1, a.Style);
            if (a.Style != "section") Label(svg, taken, a.Name, x0, y0, x1, y1, a.Style == "current" ? "ilabel" : "vlabel");
        }
    }

    private static List<Arrow> Arrows(CaseResult c)
    {
        var network = c.Solution.Network;
        var arrows = new List<Arrow>();
        var scaleV = c.Points.Select(p => p.Voltage.Magnitude).DefaultIfEmpty(0).Max();
        var seen = new HashSet<int>();
        foreach (var (point, v) in c.Points)
        {
            var node = network.Node(point);
            if (!seen.Add(node) || v.Magnitude <= 1e-9 * scaleV) continue;
            arrows.Add(new Arrow(network.Nodes[node].Name, Complex.Zero, v, "V", "voltage", $"V {network.Nodes[node].Name}", node, node));
        }
        foreach (var s in c.Sections)
            if (s.Voltage.Magnitude > 1e-9 * scaleV)
                arrows.Add(new Arrow(s.Section.Name, c.PointVoltage(s.Section.ToPoint), s.Voltage, "V", "section", $"V {s.Section.Name}", s.Section.NodeA, s.Section.NodeB));
        var currents = c.Supplies.Select(s => (s.Supply.Name, s.Current, s.Supply.NodeP, s.Supply.NodeQ)).ToList();
        if (c.Case.Fault is { } fault) currents.Add((fault.Name, c.Solution.FaultCurrent, network.Node(fault.A.Name), network.Node(fault.B.Name)));
        // A bus fault: each line's current into the fault, from its line terminal (the earth current is their sum).
        else if (c.ShortCircuit is { } sc)
            currents.AddRange(sc.Fault.Lines.Select((l, p) => ($"{sc.Fault.Name} {l.Name}", sc.LineCurrents[p], network.Node(l.Name), network.EarthNode)));
        else currents.AddRange(c.Loads.Select(l => (l.Load.Name, l.Current, l.Load.NodeA, l.Load.NodeB)));
        var scaleI = currents.Select(x => x.Item2.Magnitude).DefaultIfEmpty(0).Max();
        foreach (var (name, i, node, other) in currents)
            if (i.Magnitude > 1e-9 * scaleI)
                arrows.Add(new Arrow(name, Complex.Zero, i, "A", "current", $"I {name}", node, other));
        return arrows;
    }

    internal static void ArrowLine(Svg svg, double x0, double y0, double x1, double y1, string style)
    {
        var length = Math.Sqrt((x1 - x0) * (x1 - x0) + (y1 - y0) * (y1 - y0));
        if (length < 1) return;
        var (ux, uy) = ((x1 - x0) / length, (y1 - y0) / length);
        var head = Math.Min(9, length / 2);
        svg.Line(x0, y0, x1 - ux * head * 0.6, y1 - uy * head * 0.6, style);
        var (bx, by) = (x1 - ux * head, y1 - uy * head);
        svg.Path($"M{Svg.N(x1)} {Svg.N(y1)} L{Svg.N(bx - uy * head * 0.38)} {Svg.N(by + ux * head * 0.38)} L{Svg.N(bx + uy * head * 0.38)} {Svg.N(by - ux * head * 0.38)} Z", style + "-head");
    }

    /// <summary>
    /// The name just past the tip; moved further out along the arrow while it would cover another label, left out if it cannot be placed
    /// or when the grids already hold <see cref="MaxLabels"/> texts (each one is tried against all of them; the table names every phasor).
    /// </summary>
    internal static void Label(Svg svg, List<Box> taken, string text, double x0, double y0, double x1, double y1, string style)
    {
        if (taken.Count >= MaxLabels) return;
        var length = Math.Max(1, Math.Sqrt((x1 - x0) * (x1 - x0) + (y1 - y0) * (y1 - y0)));
        var (ux, uy) = ((x1 - x0) / length, (y1 - y0) / length);
        var anchor = ux > 0.35 ? Anchor.Start : ux < -0.35 ? Anchor.End : Anchor.Middle;
        for (var step = 0; step < 8; step++)
        {
            // Out along the arrow, then alternately above and below the tip.
            var d = 6 + step / 2 * 11;
            var side = step % 2 == 0 ? 0 : 12;
            var (x, y) = (x1 + ux * d, y1 + uy * d + (uy > 0.35 ? 8 : uy < -0.35 ? -2 : 3.5) + side);
            var box = Svg.TextBox(text, x, y, NameSize, anchor);
            if (taken.Any(b => b.Inflate(1).Overlaps(box))) continue;
            taken.Add(box);
            svg.Text(text, x, y, style, NameSize, anchor);
            return;
        }
    }

    internal const string Css = Symbols.Css + """
        .grid{stroke:#dde3e8;stroke-width:1;fill:none}
        .axis{stroke:#9aa5ae;stroke-width:1}
        .vgrid{font-size:9px;fill:#1f4e79}
        .igrid{font-size:9px;fill:#8a3b12}
        .voltage{stroke:#1f4e79;stroke-width:2}
        .voltage-head{fill:#1f4e79;stroke:none}
        .section{stroke:#6b7f3a;stroke-width:1.2}
        .section-head{fill:#6b7f3a;stroke:none}
        .current{stroke:#8a3b12;stroke-width:1.6;stroke-dasharray:5 3}
        .current-head{fill:#8a3b12;stroke:none}
        .vlabel{font-size:10px;fill:#1f4e79}
        .ilabel{font-size:10px;fill:#8a3b12}

        """;
}

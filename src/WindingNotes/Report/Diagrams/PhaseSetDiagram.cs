using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report.Diagrams;

/// <summary>
/// A phasor diagram a three-phase terminal set (each three-phase winding, supply and load) in one
/// case: the line-to-neutral voltages from the set's star point (from earth where it has none), the
/// line-to-line voltages as the triangle joining their tips, and the line currents on a scale of
/// their own; under each grid its values and its symmetrical components.
/// </summary>
public static class PhaseSetDiagram
{
    private const double Radius = 80, NameSize = 10, ValueSize = 9, Margin = 24;

    /// <summary>Sets drawn at most: a page of grids stays legible up to about this many.</summary>
    public const int MaxSets = 60;

    public static Drawing Draw(Evaluation evaluation, CaseResult c)
    {
        var svg = new Svg();
        var three = evaluation.Model.ThreePhase;
        var network = c.Solution.Network;
        var sets = c.ThreePhase.Sets;
        var name = evaluation.Path.Length == 0 ? "standard input" : evaluation.Path;
        var title = $"Three-phase sets of {name}, case {c.Case.Name}";
        svg.Text(title, Margin, 28, "title", 13);
        string[] legend =
        [
            "Solid, from the centre: line-to-neutral voltages (from the set's star point; where it has none, from the centroid of its line voltages).",
            "Thin, tip to tip: line-to-line voltages. Dashed: line currents into the element (out of a supply), on their own scale.",
        ];
        svg.Text(legend[0], Margin, 46, "note", ValueSize);
        svg.Text(legend[1], Margin, 59, "note", ValueSize);
        var x = Margin;
        var y = 82.0;
        var rowHeight = 0.0;
        var width = Math.Max(Svg.TextWidth(title, 13), legend.Max(l => Svg.TextWidth(l, ValueSize))) + 2 * Margin;
        var shown = 0;
        foreach (var set in sets.Take(MaxSets))
        {
            var terminals = Terminals(three, set);
            if (terminals is not { Length: 3 }) continue;
            // Line-to-neutral from the star point; a set without one (a delta) from the centroid of its line
            // voltages, its equivalent wye, so a floating delta is not drawn from whatever its part's reference is.
            var star = Star(three, set) is { } point && network.Node(point) >= 0 ? c.PointVoltage(point) : (Complex?)null;
            var lines = Table(set, terminals, star);
            var panelWidth = Math.Max(2 * Radius + 140, lines.Max(l => Svg.TextWidth(l, ValueSize)) + 8);
            if (x > Margin && x + panelWidth > 1000) (x, y, rowHeight) = (Margin, y + rowHeight + 24, 0);
            var height = Panel(svg, set, terminals, star, lines, x, y, panelWidth);
            x += panelWidth + 28;
            rowHeight = Math.Max(rowHeight, height);
            width = Math.Max(width, x - 28 + Margin);
            shown++;
        }
        if (shown == 0)
        {
            svg.Text("no three-phase set to draw: the file has no three-phase winding, supply or load, or it was not solved", Margin, y + 10, "note", ValueSize);
            rowHeight = 20;
            width = Math.Max(width, 560);
        }
        var more = sets.Length > MaxSets ? [$"The first {MaxSets} of {sets.Length} three-phase sets are drawn."] : Array.Empty<string>();
        var height2 = svg.Notes(Margin, y + rowHeight + 20, width - 2 * Margin, more) + 20;
        return new Drawing(svg.Document(width, height2, PhasorDiagram.Css), svg.TextBoxes, width, height2);
    }

    private static string[]? Terminals(ThreePhaseModel three, PhaseSetResult set) => set.Kind switch
    {
        "winding" => three.Windings.FirstOrDefault(w => w.Name == set.Name)?.LineTerminals.Select(t => t.Name).ToArray(),
        "supply" => three.Supplies.FirstOrDefault(s => s.Name == set.Name)?.LineTerminals.Select(t => t.Name).ToArray(),
        _ => three.Loads.FirstOrDefault(l => l.Name == set.Name)?.LineTerminals.Select(t => t.Name).ToArray(),
    };

    private static string? Star(ThreePhaseModel three, PhaseSetResult set) => set.Kind switch
    {
        "winding" => three.Windings.FirstOrDefault(w => w.Name == set.Name)?.StarPoint,
        "supply" => set.Name + "_n",
        _ => three.Loads.FirstOrDefault(l => l.Name == set.Name)?.StarPoint,
    };

    private static string Phasor(Complex value, string unit) =>
        $"{Numbers.Format(value.Magnitude, unit)} ∠{TextReport.Degrees(value):F1}°".Replace("∠-0.0°", "∠0.0°");

    /// <summary>The values under a grid: each line's voltage and current, each line-to-line voltage, the sequence components.</summary>
    private static List<string> Table(PhaseSetResult set, string[] terminals, Complex? star)
    {
        var lines = new List<string>();
        var to = star is null ? "to centroid" : "to neutral";
        var centre = star ?? (set.Voltages[0] + set.Voltages[1] + set.Voltages[2]) / 3;
        for (var k = 0; k < 3; k++)
            lines.Add($"{terminals[k]} {to}: {Phasor(set.Voltages[k] - centre, "V")}; {Phasor(set.LineCurrents[k], "A")}");
        for (var k = 0; k < 3; k++)
            lines.Add($"{terminals[k]}-{terminals[(k + 1) % 3]}: {Phasor(set.LineToLine[k], "V")}");
        var v = set.VoltageSequence;
        lines.Add($"V1 {Numbers.Format(v.Positive.Magnitude, "V")}, V2 {Numbers.Format(v.Negative.Magnitude, "V")}, V0 {Numbers.Format(v.Zero.Magnitude, "V")}");
        var i = set.CurrentSequence;
        lines.Add($"I1 {Numbers.Format(i.Positive.Magnitude, "A")}, I2 {Numbers.Format(i.Negative.Magnitude, "A")}, I0 {Numbers.Format(i.Zero.Magnitude, "A")}");
        if (set.NeutralCurrent is { } neutral) lines.Add($"neutral current {Numbers.Format(neutral.Magnitude, "A")}");
        return lines;
    }

    private static double Panel(Svg svg, PhaseSetResult set, string[] terminals, Complex? star, List<string> table, double left, double top, double width)
    {
        var cx = left + width / 2;
        var cy = top + 28 + Radius;
        svg.Text($"{set.Kind} {set.Name}", left, top + 8, "strong", NameSize);
        var tail = star ?? (set.Voltages[0] + set.Voltages[1] + set.Voltages[2]) / 3;
        var tips = set.Voltages.Select(v => v - tail).ToArray();
        var vMax = tips.Max(t => t.Magnitude);
        var iMax = set.LineCurrents.Max(i => i.Magnitude);
        var vStep = Scales.Step(vMax, 4);
        var iStep = Scales.Step(iMax, 4);
        var rings = Math.Max(1, (int)Math.Max(Math.Ceiling(vMax / vStep - 1e-9), iMax > 0 ? Math.Ceiling(iMax / iStep - 1e-9) : 0));
        for (var ring = 1; ring <= rings; ring++)
        {
            var r = Radius * ring / rings;
            svg.Circle(cx, cy, r, "grid");
        }
        svg.Line(cx - Radius - 6, cy, cx + Radius + 6, cy, "axis");
        svg.Line(cx, cy - Radius - 6, cx, cy + Radius + 6, "axis");
        // The outer ring's values, voltage above and current below the axis.
        var taken = new List<Box>(svg.TextBoxes);
        if (vMax > 0) taken.Add(svg.Text(Numbers.Format(vStep * rings, "V"), cx + Radius + 4, cy - 4, "vgrid", ValueSize));
        if (iMax > 0) taken.Add(svg.Text(Numbers.Format(iStep * rings, "A"), cx + Radius + 4, cy + 11, "igrid", ValueSize));
        taken.Add(new Box(cx - 6, cy - 6, 12, 12));
        (double X, double Y) V(Complex v) => vMax > 0 ? (cx + v.Real * Radius / (vStep * rings), cy - v.Imaginary * Radius / (vStep * rings)) : (cx, cy);
        (double X, double Y) I(Complex i) => iMax > 0 ? (cx + i.Real * Radius / (iStep * rings), cy - i.Imaginary * Radius / (iStep * rings)) : (cx, cy);
        // The line-to-line triangle: V_ab from b's tip to a's, and so on.
        for (var k = 0; k < 3; k++)
        {
            var (x0, y0) = V(tips[(k + 1) % 3]);
            var (x1, y1) = V(tips[k]);
            PhasorDiagram.ArrowLine(svg, x0, y0, x1, y1, "section");
        }
        for (var k = 0; k < 3; k++)
        {
            var (x1, y1) = V(tips[k]);
            PhasorDiagram.ArrowLine(svg, cx, cy, x1, y1, "voltage");
            PhasorDiagram.Label(svg, taken, terminals[k], cx, cy, x1, y1, "vlabel");
        }
        for (var k = 0; k < 3; k++)
        {
            if (set.LineCurrents[k].Magnitude <= 1e-9 * iMax) continue;
            var (x1, y1) = I(set.LineCurrents[k]);
            PhasorDiagram.ArrowLine(svg, cx, cy, x1, y1, "current");
            PhasorDiagram.Label(svg, taken, $"I {terminals[k]}", cx, cy, x1, y1, "ilabel");
        }
        var y = cy + Radius + 30;
        foreach (var line in table)
        {
            svg.Text(line, left, y, "name", ValueSize);
            y += 12;
        }
        return y - top;
    }
}

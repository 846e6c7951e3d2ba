using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report.Diagrams;

/// <summary>A drawing and the boxes of its labels (for tests of legibility).</summary>
public sealed record Drawing(string Svg, IReadOnlyList<Box> Labels, double Width, double Height)
{
    /// <summary>In a network drawing: where each terminal meets its element, so a test can follow the wires from it.</summary>
    public IReadOnlyList<(string Point, double X, double Y)> Terminals { get; init; } = [];

    /// <summary>In a network drawing: the top of each earth symbol, so a test can check that no other lead runs through one.</summary>
    public IReadOnlyList<(double X, double Y)> Earths { get; init; } = [];
}

/// <summary>
/// The network drawn from the model. Elements stand in one row, left to right: supplies, each core
/// with its windings (the winding on the supply side left of the core, the others stacked right of
/// it), loads, faults. Every terminal leaves its element by a short lead to a column of its own; each
/// node that joins two or more terminals is a horizontal rail above the row, and each column rises
/// straight to its rail. Earthed terminals end in an earth symbol at their column instead. A lead
/// that leaves lower on an element takes a column further out, so no two leads of an element cross,
/// and labels sit in lanes no lead runs through.
/// </summary>
public static class NetworkDiagram
{
    private const double NameSize = 10, ValueSize = 9, TitleSize = 13;
    private const double ColumnPitch = 14, RailPitch = 17, Margin = 24;
    private const int MinArcsPerSection = 4, ArcsPerWinding = 8;

    /// <summary>Elements drawn at most: one row of them is legible up to about this many, and the rails' layout grows with their square.</summary>
    public const int MaxElements = 200;

    private sealed record Pin(string Point, int Node, double X, double Y, int Outward)
    {
        public double Column { get; set; }

    }

    public static Drawing Draw(Evaluation evaluation)
    {
        var network = evaluation.Network ?? NetworkBuilder.Build(evaluation.Model);
        return new Run(evaluation, network).Draw();
    }

    private sealed class Run(Evaluation evaluation, Network network)
    {
        private readonly Svg svg = new();
        private readonly List<Pin> pins = [];
        private readonly List<(string, double, double)> terminals = [];
        private readonly List<(double, double)> earths = [];
        private readonly CaseResult? results = evaluation.Normal;
        private readonly HashSet<int> railNodes = RailNodes(network);
        private double elementsTop;

        // Looked up once: a file of a thousand units draws in time linear in its size.
        private readonly ILookup<int, WindingNet> windingsOn = network.Windings.ToLookup(w => w.Core);
        private readonly ILookup<int, Section> sectionsOf = network.Sections.ToLookup(s => s.Winding);
        private readonly HashSet<int> supplyNodes = [.. network.Supplies.SelectMany(s => new[] { s.NodeP, s.NodeQ })];
        private readonly Dictionary<string, TapModel> brushes = evaluation.Model.Taps.Where(t => t.IsBrush).DistinctBy(t => t.Name).ToDictionary(t => t.Name);
        private readonly Dictionary<int, SectionResult> sectionResults = evaluation.Normal?.Sections.DistinctBy(x => x.Section.Index).ToDictionary(x => x.Section.Index) ?? [];
        private readonly Dictionary<int, CoreResult> coreResults = evaluation.Normal?.Cores.DistinctBy(x => x.Core.Index).ToDictionary(x => x.Core.Index) ?? [];
        private readonly Dictionary<int, SupplyResult> supplyResults = evaluation.Normal?.Supplies.DistinctBy(x => x.Supply.Index).ToDictionary(x => x.Supply.Index) ?? [];
        private readonly Dictionary<int, LoadResult> loadResults = evaluation.Normal?.Loads.DistinctBy(x => x.Load.Index).ToDictionary(x => x.Load.Index) ?? [];
        // The largest current, voltage and power of the normal case: what is within 1e-9 of them is the
        // solve's rounding (as the result diff counts it) and is drawn as zero, never as "0.07358 pA".
        private readonly double currentScale = evaluation.Normal is { } n ? n.Sections.Select(x => x.Current.Magnitude).Concat(n.Supplies.Select(x => x.Current.Magnitude)).Concat(n.Loads.Select(x => x.Current.Magnitude)).DefaultIfEmpty(0).Max() : 0;
        private readonly double voltageScale = evaluation.Normal?.Points.Select(p => p.Voltage.Magnitude).DefaultIfEmpty(0).Max() ?? 0;
        private readonly double powerScale = evaluation.Normal is { } n ? n.Supplies.Select(x => x.Power.Magnitude).Concat(n.Loads.Select(x => x.Power.Magnitude)).DefaultIfEmpty(0).Max() : 0;
        private readonly Dictionary<string, CaseResult> faultCases = evaluation.Cases.Where(x => x.Case.Fault is not null).DistinctBy(x => x.Case.Fault!.Name).ToDictionary(x => x.Case.Fault!.Name);

        public Drawing Draw()
        {
            var rails = railNodes.Count;
            elementsTop = Margin + 24 + rails * RailPitch + 18;
            var x = Margin;
            var bottom = elementsTop;
            var faults = evaluation.Model.Faults.Where(f => network.NodeOfPoint.ContainsKey(f.A.Name) && network.NodeOfPoint.ContainsKey(f.B.Name)).ToList();
            var elements = network.Supplies.Length + network.Cores.Length + network.Loads.Length + faults.Count;
            var drawn = 0;
            bool Room() => drawn++ < MaxElements;
            foreach (var s in network.Supplies.TakeWhile(_ => Room()))
                (x, bottom) = Next(x, bottom, TwoTerminal(x, s.Source.Positive.Name, s.Source.Negative.Name, "supply", s.Name, SupplyValues(s), (g, cx, cy) => Symbols.Source(g, cx, cy)));
            foreach (var core in network.Cores.TakeWhile(_ => Room()))
                (x, bottom) = Next(x, bottom, Transformer(x, core));
            foreach (var l in network.Loads.TakeWhile(_ => Room()))
                (x, bottom) = Next(x, bottom, TwoTerminal(x, l.Source.A.Name, l.Source.B.Name, "load", l.Name, LoadValues(l), (g, cx, cy) => Symbols.Impedance(g, cx, cy)));
            foreach (var f in faults.TakeWhile(_ => Room()))
                (x, bottom) = Next(x, bottom, TwoTerminal(x, f.A.Name, f.B.Name, "fault", f.Name, FaultValues(f), (g, cx, cy) => Symbols.Fault(g, cx, cy)));
            if (pins.Count == 0)
            {
                svg.Text("nothing to draw: the file has no windings, supplies or loads", Margin, elementsTop, "note", ValueSize);
                x = Math.Max(x, Margin + 360);
                bottom = elementsTop + 10;
            }
            var title = Title();
            var width = Math.Max(Math.Max(x + Margin - 16, 420), Svg.TextWidth(title, TitleSize) + 2 * Margin);
            DrawRails(width);
            svg.Text(title, Margin, Margin + 4, "title", TitleSize);
            // The cautions that apply to this network travel with its drawing.
            var cautions = evaluation.Diagnostics.Where(d => d.Code.StartsWith("caution")).Select(d => "Caution: " + d.Shown).Distinct();
            var legend = elements > MaxElements
                ? $"{Legend()} The network has {elements} supplies, cores, loads and faults, too many to draw legibly: the first {MaxElements} are drawn."
                : Legend();
            var height = svg.Notes(Margin, bottom + 26, width - 2 * Margin, [legend, .. cautions]) + Margin - 8;
            return new Drawing(svg.Document(width, height, Symbols.Css), svg.TextBoxes, width, height) { Terminals = terminals, Earths = earths };
        }

        private static (double, double) Next(double x, double bottom, (double Right, double Bottom) element) =>
            (element.Right + 18, Math.Max(bottom, element.Bottom));

        private string Title()
        {
            var name = evaluation.Path.Length == 0 ? "standard input" : evaluation.Path;
            return results is null ? $"Network of {name} (not solved: no results shown)" : $"Network of {name}, with the results of the normal case";
        }

        private static string Legend() =>
            "Dot: polarity-marked end (from). Arrow on a winding: brush. Rails carry node voltages; section values are current and loading.";

        /// <summary>Nodes drawn as rails: not earth, and joining two or more terminals.</summary>
        private static HashSet<int> RailNodes(Network network)
        {
            var count = new int[network.Nodes.Length];
            void Add(string point)
            {
                if (network.NodeOfPoint.TryGetValue(point, out var n)) count[n]++;
            }
            foreach (var s in network.Sections.GroupBy(s => s.Winding))
            {
                Add(s.First().FromPoint);
                foreach (var section in s) Add(section.ToPoint);
            }
            foreach (var s in network.Supplies) { Add(s.Source.Positive.Name); Add(s.Source.Negative.Name); }
            foreach (var l in network.Loads) { Add(l.Source.A.Name); Add(l.Source.B.Name); }
            foreach (var f in network.Model.Faults) { Add(f.A.Name); Add(f.B.Name); }
            return [.. Enumerable.Range(0, count.Length).Where(n => count[n] >= 2 && !network.Nodes[n].IsEarth)];
        }

        private bool IsEarth(string point) => network.NodeOfPoint.TryGetValue(point, out var n) && network.Nodes[n].IsEarth;

        private int NodeOf(string point) => network.NodeOfPoint.TryGetValue(point, out var n) ? n : -1;

        // ---- upright two-terminal elements: supplies, loads, faults ----

        /// <summary>
        /// The first terminal at the top, its lead rising straight to its rail; the second at the
        /// bottom, its lead taken right under the labels to a column of its own. An earthed first
        /// terminal is drawn at the bottom instead, so earth symbols always hang downward.
        /// </summary>
        private (double Right, double Bottom) TwoTerminal(double left, string first, string second, string kind, string name,
            IReadOnlyList<string> values, Action<Svg, double, double> symbol)
        {
            var flipped = IsEarth(first) && !IsEarth(second);
            var (top, bottom) = flipped ? (second, first) : (first, second);
            var axis = left + 12;
            var yTop = elementsTop;
            var yMid = yTop + 40;
            var yBottom = yTop + 80;
            svg.Line(axis, yTop, axis, yMid - 14);
            svg.Line(axis, yMid + 14, axis, yBottom);
            symbol(svg, axis, yMid);
            if (kind == "supply") svg.Text("+", axis - 6, flipped ? yMid + 26 : yMid - 17, "name", NameSize, Anchor.End);

            var lines = new List<(string Text, string Style, double Size)> { ($"{kind} {name}", "strong", NameSize) };
            lines.AddRange(values.Select(v => (v, "value", ValueSize)));
            var textX = axis + 20;
            var y = yMid - (lines.Count - 1) * 6.5 + 3;
            var widest = 0.0;
            foreach (var (text, style, size) in lines)
            {
                svg.Text(text, textX, y, style, size);
                widest = Math.Max(widest, Svg.TextWidth(text, size));
                y += 13;
            }
            var column = textX + widest + 10;
            Terminal(top, axis, yTop, +1, direct: true);
            Terminal(bottom, axis, yBottom, +1, column: IsEarth(bottom) ? axis : column);
            return (Math.Max(column, axis + 20), yBottom + (IsEarth(bottom) ? Symbols.EarthDepth : 0) + 14);
        }

        /// <summary>
        /// A terminal at (x, y): earthed, it ends in an earth symbol; on a rail, it gets a column
        /// (its own x when it rises directly); alone, it ends in an open circle with its name.
        /// </summary>
        private void Terminal(string point, double x, double y, int outward, bool direct = false, double? column = null, bool named = true)
        {
            terminals.Add((point, x, y));
            var node = NodeOf(point);
            if (IsEarth(point))
            {
                var at = direct ? x : column ?? x;
                if (at != x) svg.Line(x, y, at, y);
                Symbols.Earth(svg, at, y);
                earths.Add((at, y));
                return;
            }
            if (node >= 0 && railNodes.Contains(node))
            {
                var at = direct ? x : column ?? x;
                if (at != x) svg.Line(x, y, at, y);
                pins.Add(new Pin(point, node, x, y, outward) { Column = at });
                return;
            }
            var end = direct ? x : column ?? x;
            if (end != x) svg.Line(x, y, end, y);
            Symbols.OpenTerminal(svg, end, y);
            if (named) svg.Text(point, end + (outward > 0 ? 5 : -5), y - 5, "name", NameSize, outward > 0 ? Anchor.Start : Anchor.End);
        }

        // ---- a core with its windings ----

        private sealed record Coil(WindingNet Winding, List<Section> Sections, List<int> Arcs)
        {
            public double Length => Arcs.Sum() * Symbols.ArcHeight;
        }

        private (double Right, double Bottom) Transformer(double left, CoreNet core)
        {
            var coils = windingsOn[core.Index]
                .Select(w => Arrange(w, [.. sectionsOf[w.Index]]))
                .Where(c => c.Sections.Count > 0).ToList();
            if (coils.Count == 0) return (left, elementsTop);
            var primary = coils.FirstOrDefault(c => c.Sections.Any(s => supplyNodes.Contains(s.NodeA) || supplyNodes.Contains(s.NodeB))) ?? coils[0];
            List<Coil> leftCoils = [primary];
            var rightCoils = coils.Where(c => c != primary).ToList();

            const double gap = 34;
            double Stack(List<Coil> side) => side.Sum(c => c.Length) + gap * Math.Max(0, side.Count - 1);
            var height = Math.Max(Stack(leftCoils), Stack(rightCoils));
            var top = elementsTop + 20;

            // x positions: left columns, left lane, left coil, core, right coil, right lane, right columns.
            var leftLabels = leftCoils.SelectMany(c => Labels(c)).DefaultIfEmpty(0).Max() + 10;
            var rightLabels = rightCoils.SelectMany(c => Labels(c)).DefaultIfEmpty(0).Max() + 10;
            var leftPins = leftCoils.Sum(c => Points(c).Count(p => railNodes.Contains(NodeOf(p)) || IsEarth(p)));
            var leftAxis = left + leftPins * ColumnPitch + leftLabels;
            var coreX = leftAxis + 14;
            var rightAxis = coreX + 19;

            var placed = new List<(Coil Coil, double Axis, double Top, int Outward)>();
            var y = top + (height - Stack(leftCoils)) / 2;
            foreach (var c in leftCoils)
            {
                placed.Add((c, leftAxis, y, -1));
                y += c.Length + gap;
            }
            y = top + (height - Stack(rightCoils)) / 2;
            foreach (var c in rightCoils)
            {
                placed.Add((c, rightAxis, y, +1));
                y += c.Length + gap;
            }

            svg.Line(coreX, top - 6, coreX, top + height + 6, "core");
            svg.Line(coreX + 5, top - 6, coreX + 5, top + height + 6, "core");
            svg.Text(core.Name, coreX + 2.5, top - 12, "strong", NameSize, Anchor.Middle);
            var coreResult = coreResults.GetValueOrDefault(core.Index);
            if (coreResult?.Flux is { } flux)
                svg.Text($"{Numbers.Format(flux, "T")} peak", coreX + 2.5, top + height + 32, "value", ValueSize, Anchor.Middle);

            var columnsLeft = 0;
            var columnsRight = 0;
            foreach (var (coil, axis, coilTop, outward) in placed)
            {
                var lane = outward > 0 ? rightLabels : leftLabels;
                if (outward > 0) DrawCoil(coil, axis, coilTop, outward, lane, ref columnsRight);
                else DrawCoil(coil, axis, coilTop, outward, lane, ref columnsLeft);
            }
            var right = rightAxis + rightLabels + Math.Max(1, columnsRight) * ColumnPitch;
            return (right, top + height + 36);
        }

        private static IEnumerable<string> Points(Coil c) => c.Sections.Select(s => s.ToPoint).Prepend(c.Sections[0].FromPoint);

        /// <summary>Arcs per section: in proportion to the turns, at least four so a value fits between the names of two taps.</summary>
        private static Coil Arrange(WindingNet winding, List<Section> sections)
        {
            var total = sections.Sum(s => s.Turns);
            var arcs = sections.Select(s => Math.Max(MinArcsPerSection, (int)Math.Round(total > 0 ? ArcsPerWinding * s.Turns / total : ArcsPerWinding / (double)sections.Count))).ToList();
            return new Coil(winding, sections, arcs);
        }

        /// <summary>The widths of the labels a coil puts in its lane.</summary>
        private IEnumerable<double> Labels(Coil c)
        {
            // The winding's name sits under its coil, clear of an earth symbol at the lane's edge.
            yield return Svg.TextWidth(WindingLabel(c.Winding), NameSize) + 10;
            yield return Svg.TextWidth(c.Sections[0].FromPoint, NameSize);
            foreach (var s in c.Sections)
            {
                yield return Svg.TextWidth(PointLabel(s.ToPoint), NameSize);
                yield return Svg.TextWidth(SectionValue(s), ValueSize) + 6;
            }
        }

        private static string WindingLabel(WindingNet w) => w.TurnsKnown ? $"{w.Name} {Numbers.Plain(w.Turns)} t" : w.Name;

        private string PointLabel(string point)
        {
            var brush = brushes.GetValueOrDefault(point);
            return brush?.Unit switch
            {
                null => point,
                TapUnit.Fraction => $"{point} at {Numbers.Plain(brush.Position * 100)} %",
                TapUnit.Turns => $"{point} at {Numbers.Plain(brush.Position)} t",
                _ => $"{point} at {Numbers.Format(brush.Position, "V")}",
            };
        }

        private string SectionValue(Section s)
        {
            var r = sectionResults.GetValueOrDefault(s.Index);
            if (r is null) return "";
            var current = Numbers.Clean(r.Current.Magnitude, currentScale);
            return r.Loading is { } loading ? $"{Numbers.Format(current, "A")}, {Numbers.Plain(current == 0 ? 0 : loading * 100, 3)} %" : Numbers.Format(current, "A");
        }

        private void DrawCoil(Coil coil, double axis, double top, int outward, double lane, ref int columns)
        {
            var inward = -outward;
            var anchor = outward > 0 ? Anchor.Start : Anchor.End;
            var text = axis + outward * 5;
            var y = top;
            Symbols.Polarity(svg, axis + inward * 7, top - 5);
            var points = new List<(string Point, double Y)> { (coil.Sections[0].FromPoint, top) };
            for (var k = 0; k < coil.Sections.Count; k++)
            {
                var s = coil.Sections[k];
                Symbols.Coil(svg, axis, y, coil.Arcs[k], inward);
                var mid = y + coil.Arcs[k] * Symbols.ArcHeight / 2;
                if (SectionValue(s) is { Length: > 0 } value) svg.Text(value, text + outward * 6, mid + 3, "value", ValueSize, anchor);
                y += coil.Arcs[k] * Symbols.ArcHeight;
                points.Add((s.ToPoint, y));
            }
            svg.Text(WindingLabel(coil.Winding), axis + inward * 1, y + 14, "strong", NameSize, anchor);
            foreach (var (point, py) in points)
            {
                if (brushes.ContainsKey(point)) Symbols.Brush(svg, axis, py, outward);
                svg.Text(PointLabel(point), text, py - 3.5, "name", NameSize, anchor);
                if (NodeOf(point) >= 0 && railNodes.Contains(NodeOf(point)))
                {
                    var column = axis + outward * (lane + ColumnPitch * (1 + columns++));
                    svg.Line(axis, py, column, py);
                    pins.Add(new Pin(point, NodeOf(point), axis, py, outward) { Column = column });
                    terminals.Add((point, axis, py));
                }
                // An earth takes a column of its own, as wide as the symbol, so the leads of the points
                // below it rise a column further out, clear of it; an open terminal ends at the lane's edge.
                else if (IsEarth(point)) Terminal(point, axis, py, outward, column: axis + outward * (lane + ColumnPitch * (1 + columns++)));
                else Terminal(point, axis, py, outward, column: axis + outward * (lane + 6), named: false);
            }
        }

        // ---- rails ----

        /// <summary>Rails in rows above the elements: the shortest nearest, so long rails cross the fewest leads.</summary>
        private void DrawRails(double width)
        {
            var rails = pins.GroupBy(p => p.Node)
                .Select(g => (Node: g.Key, Pins: g.ToList(), From: g.Min(p => p.Column), To: g.Max(p => p.Column)))
                .OrderBy(r => r.To - r.From).ThenBy(r => r.From).ToList();
            for (var rank = 0; rank < rails.Count; rank++)
            {
                var (node, railPins, from, to) = rails[rank];
                var y = elementsTop - 18 - rank * RailPitch;
                svg.Line(from, y, to, y);
                foreach (var p in railPins)
                {
                    svg.Line(p.Column, y, p.Column, p.Y);
                    if (p.Column > from + 0.1 && p.Column < to - 0.1) Symbols.Junction(svg, p.Column, y);
                }
                // The leads of the rails above rise through this row: the label goes in a gap between them.
                var crossing = rails.Skip(rank + 1).SelectMany(r => r.Pins.Select(p => p.Column)).ToList();
                var label = RailLabel(node);
                svg.Text(label, LabelX(from, to, Svg.TextWidth(label, ValueSize), crossing, width), y - 3.5, "value", ValueSize);
            }
        }

        /// <summary>Where a label of this width fits between the crossing columns, as near the rail's start as can be.</summary>
        private static double LabelX(double from, double to, double width, List<double> crossing, double pageWidth)
        {
            var edges = crossing.Append(Margin / 2).Append(pageWidth - Margin / 2).Distinct().Order().ToList();
            var best = from + 3;
            var bestCost = double.MaxValue;
            for (var i = 0; i + 1 < edges.Count; i++)
            {
                var (a, b) = (edges[i] + 4, edges[i + 1] - 4);
                if (b - a < width) continue;
                // Prefer a place over the rail itself, then the nearest to its start.
                var x = Math.Clamp(from + 3, a, b - width);
                var outside = Math.Max(0, from - x) + Math.Max(0, x + width - to);
                var cost = outside * 3 + Math.Abs(x - from);
                if (cost < bestCost) (best, bestCost) = (x, cost);
            }
            return best;
        }

        private string RailLabel(int node)
        {
            var name = network.Nodes[node].Name;
            var v = results?.PointVoltage(name);
            return v is { } phasor ? $"{name}: {TextReport.Phasor(Numbers.Clean(phasor, voltageScale), "V").Replace(" angle ", " ∠").Replace(" deg", "°")}" : name;
        }

        // ---- values ----

        private IReadOnlyList<string> SupplyValues(SupplyNet s)
        {
            var r = supplyResults.GetValueOrDefault(s.Index);
            return r is null ? [Numbers.Format(s.Voltage.Magnitude, "V")] : [Numbers.Format(Numbers.Clean(r.Voltage.Magnitude, voltageScale), "V"), Numbers.Format(Numbers.Clean(r.Current.Magnitude, currentScale), "A"), $"{Numbers.Format(Numbers.Clean(r.Power.Magnitude, powerScale), "VA")}, pf {Numbers.Fixed(r.PowerFactor, 3)}"];
        }

        private IReadOnlyList<string> LoadValues(LoadNet l)
        {
            var r = loadResults.GetValueOrDefault(l.Index);
            return r is null ? [] : [Numbers.Format(Numbers.Clean(r.Voltage.Magnitude, voltageScale), "V"), Numbers.Format(Numbers.Clean(r.Current.Magnitude, currentScale), "A"), $"{Numbers.Format(Numbers.Clean(r.Power.Real, powerScale), "W")}, pf {Numbers.Fixed(r.PowerFactor, 3)}"];
        }

        private IReadOnlyList<string> FaultValues(FaultModel f)
        {
            var c = faultCases.GetValueOrDefault(f.Name);
            return c is null ? [] : [$"{Numbers.Format(c.Solution.FaultCurrent.Magnitude, "A")} (fault case)"];
        }
    }
}

using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report.Diagrams;

/// <summary>
/// The three-phase part of a network drawn one-line: each set of three line terminals that joins
/// two or more three-phase elements is one bus (a heavy bar), each three-phase unit a circle a
/// winding with the symbol of its connection inside (wye, wye with its neutral earthed or brought
/// out, delta, zigzag, an autotransformer's series winding) and its letters and clock number beside
/// it, supplies above their bus and loads below. Buses stand in rows: those with a supply first,
/// then each row the buses one unit further away. Under the drawing, each unit's vector group as a
/// clock diagram (<see cref="ClockDiagram"/>). Single-phase elements are named in a note: the network
/// diagram draws them phase by phase.
/// </summary>
public static class OneLineDiagram
{
    private const double NameSize = 10, ValueSize = 9, TitleSize = 13, Margin = 24;
    private const double Radius = 16, RowPitch = 170, Gap = 30;

    /// <summary>Three-phase elements drawn at most, as the network diagram's limit.</summary>
    public const int MaxElements = 200;

    /// <summary>Units whose clock diagrams are drawn at most.</summary>
    public const int MaxClocks = 24;

    public static Drawing Draw(Evaluation evaluation)
    {
        var network = evaluation.Network ?? NetworkBuilder.Build(evaluation.Model);
        return new Run(evaluation, network).Draw();
    }

    private sealed class Bus(int index, int[] nodes, string label)
    {
        public int Index = index;
        public int[] Nodes = nodes;
        public string Label = label;
        public int Level = -1;
        public int Attached;
        public readonly List<double> Above = [], Below = [];
        public double Y;
        public bool Bar => Attached >= 2;
    }

    private sealed record Unit(ThreePhaseCoreModel Core, List<ThreePhaseWindingModel> Windings);

    private sealed class Run(Evaluation evaluation, Network network)
    {
        private readonly Svg svg = new();
        private readonly ThreePhaseModel three = network.Model.ThreePhase;
        private readonly CaseResult? results = evaluation.Normal;
        private readonly List<Bus> buses = [];
        private readonly Dictionary<string, Bus> busByNodes = [];
        private readonly Dictionary<object, Bus> busOf = new(ReferenceEqualityComparer.Instance);
        private readonly Dictionary<Bus, List<Unit>> unitsOn = [];
        private readonly Dictionary<Bus, List<ThreePhaseSupplyModel>> suppliesOn = [];
        private readonly Dictionary<Bus, List<ThreePhaseLoadModel>> loadsOn = [];

        private static void Add<T>(Dictionary<Bus, List<T>> on, Bus bus, T item)
        {
            if (!on.TryGetValue(bus, out var list)) on[bus] = list = [];
            list.Add(item);
            bus.Attached++;
        }

        private static List<T> On<T>(Dictionary<Bus, List<T>> on, Bus bus) => on.GetValueOrDefault(bus) ?? [];
        private readonly List<Unit> units = [];
        private readonly HashSet<Unit> placed = [];
        private readonly HashSet<Bus> visited = [];
        private readonly List<Action> draw = [];
        private double cursor = Margin;
        private readonly ILookup<string, SectionResult> sectionsOf = (evaluation.Normal?.Sections ?? []).ToLookup(s => s.Winding.Name, StringComparer.Ordinal);
        private readonly Dictionary<string, VectorGroup> groups = network.VectorGroups.DistinctBy(g => g.Core).ToDictionary(g => g.Core, StringComparer.Ordinal);

        private VectorGroup? GroupOf(string core) => groups.GetValueOrDefault(core);
        private double top;

        public Drawing Draw()
        {
            var windingsOn = three.Windings.ToLookup(w => w.Core, StringComparer.Ordinal);
            foreach (var core in three.Cores)
            {
                var windings = windingsOn[core.Name].ToList();
                var order = GroupOf(core.Name)?.Windings.Select(w => w.Winding).ToList() ?? [];
                windings = [.. windings.OrderBy(w => order.IndexOf(w.Name) is var i && i < 0 ? int.MaxValue : i)];
                if (windings.Count > 0) units.Add(new Unit(core, windings));
            }
            // Each element's bus found once, so a file of many units draws in time linear in its size.
            foreach (var s in three.Supplies) Add(suppliesOn, busOf[s] = BusFor(s.LineTerminals), s);
            foreach (var l in three.Loads) Add(loadsOn, busOf[l] = BusFor(l.LineTerminals), l);
            foreach (var u in units)
                foreach (var w in u.Windings)
                {
                    busOf[w] = BusFor(w.LineTerminals);
                    if (!unitsOn.TryGetValue(busOf[w], out var list)) unitsOn[busOf[w]] = list = [];
                    if (!list.Contains(u)) list.Add(u);
                    busOf[w].Attached++;
                }
            Levels();
            top = Margin + 40 + (three.Supplies.IsEmpty ? 0 : 90);
            foreach (var b in buses) b.Y = top + b.Level * RowPitch;

            // Left to right, depth first from each bus with a supply, so what hangs on a bus stands together.
            var drawn = 0;
            foreach (var bus in buses.OrderBy(b => b.Level).ThenBy(b => b.Index))
                if (drawn < MaxElements) Place(bus, ref drawn);
            foreach (var unit in units.Where(u => !placed.Contains(u)))
                if (drawn++ < MaxElements) PlaceUnit(unit, null);
            foreach (var action in draw) action();
            DrawBars();

            var bottom = top + (buses.Count == 0 ? 0 : buses.Max(b => b.Level)) * RowPitch + 130;
            var width = Math.Max(cursor + Margin, 480);
            if (units.Count == 0 && three.Supplies.IsEmpty && three.Loads.IsEmpty)
            {
                svg.Text("nothing to draw one-line: the file has no three-phase core, supply or load", Margin, Margin + 48, "note", ValueSize);
                bottom = Margin + 60;
            }
            // Each unit's clock diagram, in rows under the drawing.
            var x = Margin;
            var rowHeight = 0.0;
            var y = bottom;
            foreach (var group in network.VectorGroups.Take(MaxClocks))
            {
                if (x > Margin && x + group.Windings.Length * (ClockDiagram.FaceWidth + 8) > Math.Max(width, 900))
                {
                    (x, y, rowHeight) = (Margin, y + rowHeight + 20, 0);
                }
                var (w, h) = ClockDiagram.Draw(svg, network, group, x, y);
                x += w + 40;
                rowHeight = Math.Max(rowHeight, h);
                width = Math.Max(width, x - 40 + Margin);
            }
            bottom = y + rowHeight + 20;

            var name = evaluation.Path.Length == 0 ? "standard input" : evaluation.Path;
            var title = results is null ? $"One-line diagram of {name} (not solved: no results shown)" : $"One-line diagram of {name}, with the results of the normal case";
            width = Math.Max(width, Svg.TextWidth(title, TitleSize) + 2 * Margin);
            svg.Text(title, Margin, Margin + 4, "title", TitleSize);
            var notes = new List<string>
            {
                "Heavy bar: a bus of three line terminals, with its line-to-line voltage. Each circle is one three-phase winding, its connection inside: "
                + "a Y for wye (with a lead to earth, or to an open terminal, where its neutral is brought out), a triangle for delta, bent arms for zigzag, "
                + "arms crossed by tap marks for an autotransformer's series winding. Beside each unit its windings' letters and clock numbers as IEC 60076-1 gives them; "
                + "the clock diagrams below put each set's terminal 1 where its phasor points, the first set's at 12.",
            };
            if (Others() is { Length: > 0 } others) notes.Add($"Drawn phase by phase in the network diagram, not here: {others}.");
            if (network.VectorGroups.Length > MaxClocks) notes.Add($"The clock diagrams of the first {MaxClocks} of {network.VectorGroups.Length} units are drawn.");
            if (units.Count + three.Supplies.Length + three.Loads.Length > MaxElements) notes.Add($"The first {MaxElements} three-phase elements are drawn.");
            var cautions = evaluation.Diagnostics.Where(d => d.Code.StartsWith("caution")).Select(d => "Caution: " + d.Message).Distinct();
            var height = svg.Notes(Margin, bottom + 6, width - 2 * Margin, [.. notes, .. cautions]) + Margin - 8;
            return new Drawing(svg.Document(width, height, Symbols.Css + ClockDiagram.Css + Css), svg.TextBoxes, width, height);
        }

        /// <summary>The elements that are not three-phase statements: single-phase cores, supplies, loads and faults.</summary>
        private string Others()
        {
            var limbs = three.Cores.SelectMany(c => c.Limbs).ToHashSet(StringComparer.Ordinal);
            var phaseElements = three.Supplies.SelectMany(s => Phases.All(s.Name).Append(s.Name + "_zn")).Concat(three.Loads.SelectMany(l => l.PhaseLoads)).ToHashSet(StringComparer.Ordinal);
            var parts = new List<string>();
            void Add(string kind, IEnumerable<string> names)
            {
                var list = names.ToList();
                if (list.Count > 0) parts.Add($"{kind} {string.Join(", ", list.Take(12))}{(list.Count > 12 ? $" and {list.Count - 12} more" : "")}");
            }
            Add("cores", network.Model.Cores.Where(c => !limbs.Contains(c.Name)).Select(c => c.Name));
            Add("supplies", network.Model.Supplies.Where(s => !phaseElements.Contains(s.Name)).Select(s => s.Name));
            Add("loads", network.Model.Loads.Where(l => !phaseElements.Contains(l.Name)).Select(l => l.Name));
            Add("faults", network.Model.Faults.Select(f => f.Name));
            return string.Join("; ", parts);
        }

        private Bus BusFor(IEnumerable<NodeRef> terminals)
        {
            var names = terminals.Select(t => t.Name).ToList();
            var nodes = names.Select(network.Node).ToArray();
            var key = string.Join(",", nodes.Order());
            if (!busByNodes.TryGetValue(key, out var bus))
            {
                busByNodes[key] = bus = new Bus(buses.Count, nodes, string.Join(" ", names));
                buses.Add(bus);
            }
            return bus;
        }

        private Bus? Find(IEnumerable<NodeRef> terminals) => busByNodes.GetValueOrDefault(string.Join(",", terminals.Select(t => network.Node(t.Name)).Order()));

        private Bus BusOf(object element) => busOf[element];

        /// <summary>Rows: buses with a supply first, then each row one unit further away; a part with no supply starts a row of its own at the top.</summary>
        private void Levels()
        {
            var queue = new Queue<Bus>();
            void Start(Bus b)
            {
                if (b.Level >= 0) return;
                b.Level = 0;
                queue.Enqueue(b);
                while (queue.Count > 0)
                {
                    var bus = queue.Dequeue();
                    foreach (var unit in On(unitsOn, bus))
                        foreach (var other in unit.Windings.Select(BusOf))
                            if (other.Level < 0)
                            {
                                other.Level = bus.Level + 1;
                                queue.Enqueue(other);
                            }
                }
            }
            foreach (var s in three.Supplies) Start(BusOf(s));
            foreach (var b in buses) Start(b);
        }

        private void Place(Bus bus, ref int drawn)
        {
            if (!visited.Add(bus)) return;
            foreach (var s in On(suppliesOn, bus))
                if (drawn++ < MaxElements) PlaceSupply(s, bus);
            // Every unit that hangs from this bus side by side first (paralleled units stand together),
            // then what hangs from their other buses.
            var hanging = On(unitsOn, bus).Where(u => !placed.Contains(u)).ToList();
            foreach (var unit in hanging)
            {
                if (drawn++ >= MaxElements) return;
                PlaceUnit(unit, bus);
            }
            foreach (var unit in hanging)
                foreach (var w in unit.Windings)
                    if (BusOf(w) is var lower && lower != bus) Place(lower, ref drawn);
            foreach (var l in On(loadsOn, bus))
                if (drawn++ < MaxElements) PlaceLoad(l, bus);
        }

        // ---- supplies and loads ----

        private PhaseSetResult? SetOf(string name) => results?.ThreePhase.SetOf(name);

        private List<string> SetValues(PhaseSetResult? r)
        {
            if (r is null) return [];
            return [Numbers.Format(r.LineToLine[0].Magnitude, "V") + " line-to-line",
                Numbers.Format(r.LineCurrents.Max(i => i.Magnitude), "A") + " in the lines",
                $"{Numbers.Format(r.Power.Magnitude, "VA")}, pf {Numbers.Fixed(r.PowerFactor, 3)}"];
        }

        private void PlaceSupply(ThreePhaseSupplyModel s, Bus bus)
        {
            var x = cursor + 14;
            var lines = new List<(string, string, double)> { ($"supply {s.Name}", "strong", NameSize) };
            lines.AddRange(SetValues(SetOf(s.Name)).Select(v => (v, "value", ValueSize)));
            var width = lines.Max(l => Svg.TextWidth(l.Item1, l.Item3));
            cursor = x + 24 + width + Gap;
            Attach(bus, x, above: true);
            draw.Add(() =>
            {
                var cy = bus.Y - 62;
                Symbols.Source(svg, x, cy);
                svg.Line(x, cy + 13, x, bus.Y, "wire");
                if (!bus.Bar) OpenTerminals(s.LineTerminals, x, bus.Y, below: true);
                svg.Text("3~", x - 17, cy + 4, "name", NameSize, Anchor.End);
                Block(lines, x + 22, cy);
            });
        }

        private void PlaceLoad(ThreePhaseLoadModel l, Bus bus)
        {
            var x = cursor + 14;
            var lines = new List<(string, string, double)> { ($"load {l.Name}", "strong", NameSize), (l.Delta ? "delta" : l.StarPoint is { } n && network.Node(n) is var node && node >= 0 && network.Nodes[node].IsEarth ? "wye, neutral earthed" : "wye", "value", ValueSize) };
            lines.AddRange(SetValues(SetOf(l.Name)).Select(v => (v, "value", ValueSize)));
            var width = lines.Max(t => Svg.TextWidth(t.Item1, t.Item3));
            cursor = x + 22 + width + Gap;
            Attach(bus, x, above: false);
            draw.Add(() =>
            {
                var cy = bus.Y + 52;
                svg.Line(x, bus.Y, x, cy - 14, "wire");
                if (!bus.Bar) OpenTerminals(l.LineTerminals, x, bus.Y, below: false);
                Symbols.Impedance(svg, x, cy);
                Block(lines, x + 20, cy);
            });
        }

        private void Block(List<(string Text, string Style, double Size)> lines, double x, double cy)
        {
            var y = cy - (lines.Count - 1) * 6.5 + 3;
            foreach (var (text, style, size) in lines)
            {
                svg.Text(text, x, y, style, size);
                y += 13;
            }
        }

        private void Attach(Bus bus, double x, bool above)
        {
            if (!bus.Bar) return;
            (above ? bus.Above : bus.Below).Add(x);
        }

        // ---- units ----

        /// <summary>
        /// A unit: the winding on the bus it hangs from (or its first) in the top circle, the others
        /// side by side below it, each with its lead to its bus or to its open terminals.
        /// </summary>
        private void PlaceUnit(Unit unit, Bus? from)
        {
            placed.Add(unit);
            var topWinding = unit.Windings.FirstOrDefault(w => BusOf(w) == from) ?? unit.Windings[0];
            var lower = unit.Windings.Where(w => w != topWinding).ToList();
            var group = GroupOf(unit.Core.Name);
            var spread = Math.Max(0, lower.Count - 1) * (2 * Radius + 6);
            var cx = cursor + 14 + Math.Max(Radius + 16, spread / 2 + Radius + 16);
            var circles = new List<(ThreePhaseWindingModel W, double X, int Row)> { (topWinding, cx, 0) };
            for (var i = 0; i < lower.Count; i++) circles.Add((lower[i], cx - spread / 2 + i * (2 * Radius + 6), 1));
            var lines = new List<(string, string, double)>
            {
                ($"{unit.Core.Name} {group?.Symbol ?? ""}".Trim(), "strong", NameSize),
                (Construction(unit.Core), "value", ValueSize),
            };
            foreach (var (w, _, _) in circles) lines.Add((WindingLine(w, group), "value", ValueSize));
            var textX = cx + spread / 2 + Radius + 12;
            var width = lines.Max(t => Svg.TextWidth(t.Item1, t.Item3));
            cursor = textX + width + Gap;
            var topBus = BusOf(topWinding);
            // The top circle's lead rises to its bus from below; the others' come down to theirs from above.
            foreach (var (w, x, row) in circles) Attach(BusOf(w), x, above: row == 1);
            draw.Add(() =>
            {
                var y0 = (from ?? topBus).Y;
                var cyTop = y0 + 48;
                var cyLow = cyTop + Radius * 1.45;
                foreach (var (w, x, row) in circles)
                {
                    var cy = row == 0 ? cyTop : cyLow;
                    var bus = BusOf(w);
                    if (row == 0)
                    {
                        if (bus.Bar) svg.Line(x, cy - Radius, x, bus.Y, "wire");
                        else OpenEnd(w, x, cy - Radius, -1);
                    }
                    else if (bus.Bar) svg.Line(x, cy + Radius, x, bus.Y, "wire");
                    else OpenEnd(w, x, cy + Radius, +1);
                }
                foreach (var (w, x, row) in circles)
                {
                    var cy = row == 0 ? cyTop : cyLow;
                    svg.Circle(x, cy, Radius, "winding");
                    Glyph(w, group, x, cy);
                }
                Block(lines, textX, cyTop + 10);
            });
        }

        /// <summary>A supply's or load's terminals where no other three-phase element joins them: an open terminal and their names.</summary>
        private void OpenTerminals(IEnumerable<NodeRef> terminals, double x, double y, bool below)
        {
            Symbols.OpenTerminal(svg, x, y);
            svg.Text(string.Join(" ", terminals.Select(t => t.Name)), x + 6, below ? y + 13 : y - 6, "name", NameSize);
        }

        /// <summary>A set that joins nothing else: a short lead to its terminals' names.</summary>
        private void OpenEnd(ThreePhaseWindingModel w, double x, double y, int direction)
        {
            var end = y + direction * 16;
            svg.Line(x, y, x, end, "wire");
            Symbols.OpenTerminal(svg, x, end);
            svg.Text(string.Join(" ", w.LineTerminals.Select(t => t.Name)), x, end + (direction > 0 ? 14 : -6), "name", NameSize, Anchor.Middle);
        }

        private static string Construction(ThreePhaseCoreModel core)
        {
            var kind = core.Construction switch
            {
                CoreConstruction.Bank => "bank",
                CoreConstruction.ThreeLimb => "three-limb",
                CoreConstruction.FiveLimb => "five-limb",
                _ => "shell",
            };
            return core.Rating is { } rating ? $"{kind}, {Numbers.Format(rating, "VA")}" : kind;
        }

        /// <summary>"LV yn11: 1.747 kA, 96.8 %": the winding, its letters and clock number, its largest line current and phase loading.</summary>
        private string WindingLine(ThreePhaseWindingModel w, VectorGroup? group)
        {
            var symbol = group?.Windings.FirstOrDefault(s => s.Winding == w.Name);
            var letters = symbol is null ? ConnectionWord(w) : symbol.Letters + (symbol.Clock?.ToString(System.Globalization.CultureInfo.InvariantCulture) ?? "");
            var text = $"{w.Name} {letters}";
            if (SetOf(w.Name) is not { } r) return text;
            var phases = w.PhaseWindings.ToHashSet(StringComparer.Ordinal);
            var loading = phases.SelectMany(p => sectionsOf[p]).Where(s => s.Loading is not null).Select(s => s.Loading!.Value).DefaultIfEmpty(double.NaN).Max();
            var current = Numbers.Format(r.LineCurrents.Max(i => i.Magnitude), "A");
            return double.IsNaN(loading) ? $"{text}: {current}" : $"{text}: {current}, {Numbers.Plain(loading * 100, 3)} %";
        }

        private static string ConnectionWord(ThreePhaseWindingModel w) => w.Connection switch
        {
            PhaseConnection.Wye => w.NeutralTerminal ? "wye, neutral" : "wye",
            PhaseConnection.Delta => "delta",
            PhaseConnection.Zigzag => w.NeutralTerminal ? "zigzag, neutral" : "zigzag",
            PhaseConnection.Series => "series",
            _ => "phase windings",
        };

        /// <summary>The connection inside a winding's circle, from the letters the wiring gave it where it has them.</summary>
        private void Glyph(ThreePhaseWindingModel w, VectorGroup? group, double cx, double cy)
        {
            var letters = group?.Windings.FirstOrDefault(s => s.Winding == w.Name)?.Letters.ToLowerInvariant();
            const double r = 9;
            (double, double) Arm(double degrees, double length) => (cx + Math.Cos(degrees * Math.PI / 180) * length, cy - Math.Sin(degrees * Math.PI / 180) * length);
            void Star(bool tapped)
            {
                foreach (var angle in new[] { 90.0, 210, 330 })
                {
                    var (x, y) = Arm(angle, r);
                    svg.Line(cx, cy, x, y, "glyph");
                    if (!tapped) continue;
                    // A tap mark across each arm: the common winding's line terminal on the series winding's way out.
                    var (mx, my) = Arm(angle, r * 0.55);
                    var (px, py) = (Math.Cos((angle + 90) * Math.PI / 180) * 3, -Math.Sin((angle + 90) * Math.PI / 180) * 3);
                    svg.Line(mx - px, my - py, mx + px, my + py, "glyph");
                }
            }
            var connection = w.Connection;
            if (connection == PhaseConnection.Ends)
                connection = letters is "d" ? PhaseConnection.Delta : letters is "y" or "yn" ? PhaseConnection.Wye : PhaseConnection.Ends;
            switch (connection)
            {
                case PhaseConnection.Delta:
                    var (ax, ay) = Arm(90, r);
                    var (bx, by) = Arm(210, r);
                    var (ccx, ccy) = Arm(330, r);
                    svg.Polyline([(ax, ay), (bx, by), (ccx, ccy), (ax, ay)], "glyph");
                    return;
                case PhaseConnection.Zigzag:
                    foreach (var angle in new[] { 90.0, 210, 330 })
                    {
                        var (mx, my) = Arm(angle, r * 0.55);
                        var (ex, ey) = (mx + Math.Cos((angle - 60) * Math.PI / 180) * r * 0.55, my - Math.Sin((angle - 60) * Math.PI / 180) * r * 0.55);
                        svg.Polyline([(cx, cy), (mx, my), (ex, ey)], "glyph");
                    }
                    break;
                case PhaseConnection.Series:
                    Star(tapped: true);
                    return;
                case PhaseConnection.Wye:
                    Star(tapped: false);
                    break;
                default:
                    for (var k = -1; k <= 1; k++) svg.Line(cx + k * 5, cy - r * 0.8, cx + k * 5, cy + r * 0.8, "glyph");
                    return;
            }
            // The neutral: to earth, or to an open terminal, out of the circle's lower left.
            var neutral = w.NeutralTerminal || letters is "yn" or "zn" ? w.StarPoint : null;
            if (neutral is null) return;
            var node = network.Node(neutral);
            var (nx, ny) = (cx - Radius - 6, cy + 9);
            svg.Polyline([(cx, cy), (cx - Radius + 3, cy + 9), (nx, ny)], "glyph");
            if (node >= 0 && network.Nodes[node].IsEarth)
            {
                svg.Line(nx, ny, nx, ny + 4, "wire");
                svg.Line(nx - 5, ny + 4, nx + 5, ny + 4, "wire");
                svg.Line(nx - 3, ny + 6.5, nx + 3, ny + 6.5, "wire");
                svg.Line(nx - 1.2, ny + 9, nx + 1.2, ny + 9, "wire");
            }
            else Symbols.OpenTerminal(svg, nx, ny);
        }

        // ---- buses ----

        private void DrawBars()
        {
            foreach (var bus in buses.Where(b => b.Bar && b.Above.Count + b.Below.Count > 0))
            {
                var xs = bus.Above.Concat(bus.Below).ToList();
                var (from, to) = (xs.Min() - 14, xs.Max() + 14);
                svg.Line(from, bus.Y, to, bus.Y, "bus");
                var label = BusLabel(bus);
                // Above the bar, in the first gap between the leads from above wide enough for it.
                var edges = bus.Above.Order().Prepend(from - 8).Append(double.MaxValue).ToList();
                var width = Svg.TextWidth(label, ValueSize);
                var at = edges[^2] + 6;
                for (var i = 0; i + 1 < edges.Count; i++)
                    if (edges[i + 1] - edges[i] - 12 >= width)
                    {
                        at = edges[i] + 6;
                        break;
                    }
                svg.Text(label, at, bus.Y - 5, "value", ValueSize);
            }
        }

        private string BusLabel(Bus bus)
        {
            // The set of an element on the bus: a supply's, else a load's, else a winding's.
            var element = On(suppliesOn, bus).Select(x => x.Name).Concat(On(loadsOn, bus).Select(x => x.Name))
                .Concat(On(unitsOn, bus).SelectMany(u => u.Windings).Where(w => BusOf(w) == bus).Select(w => w.Name)).FirstOrDefault();
            var set = element is null ? null : results?.ThreePhase.SetOf(element);
            return set is null ? bus.Label : $"{bus.Label}: {Numbers.Format(set.LineToLine[0].Magnitude, "V")}";
        }
    }

    private const string Css = """
        .bus{stroke:#27313b;stroke-width:4;stroke-linecap:square}
        .winding{stroke:#9a4d12;stroke-width:1.8;fill:#ffffff}
        .glyph{stroke:#27313b;stroke-width:1.4;fill:none;stroke-linecap:round;stroke-linejoin:round}

        """;
}

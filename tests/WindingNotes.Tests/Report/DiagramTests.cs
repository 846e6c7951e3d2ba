using System.Xml.Linq;
using WindingNotes.Report.Diagrams;
using WindingNotes.Tests.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using WindingNotes.Text;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>
/// The diagrams of every example (and of a thirty-section network) are well-formed SVG, keep their
/// labels apart and inside the page, and render to PNG with a real renderer.
/// </summary>
public class DiagramTests
{
    private static readonly XNamespace SvgNs = "http://www.w3.org/2000/svg";

    private static string ThirtySections => Path.Combine(Snapshot.TestsRoot(), "Data", "diagrams", "thirty-sections.wn");

    private static IEnumerable<string> Files() =>
        Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").Order().Append(ThirtySections);

    public static TheoryData<string, string> Drawings()
    {
        var data = new TheoryData<string, string>();
        foreach (var file in Files())
        {
            foreach (var kind in new[] { "network", "phasors" }) data.Add(Path.GetFileName(file), kind);
            var text = File.ReadAllText(file);
            if (text.Contains("\nsweep ") || text.Contains("\nload-cycle")) data.Add(Path.GetFileName(file), "sweep");
            if (text.Contains(" construction ") || text.Contains("\nthree-phase-"))
                foreach (var kind in new[] { "one-line", "phase-sets" }) data.Add(Path.GetFileName(file), kind);
        }
        return data;
    }

    private static string PathOf(string name) => Files().Single(f => Path.GetFileName(f) == name);

    private static Drawing Draw(string name, string kind)
    {
        var evaluation = Evaluator.Evaluate(File.ReadAllText(PathOf(name)), name);
        return kind switch
        {
            "network" => NetworkDiagram.Draw(evaluation),
            "phasors" => PhasorDiagram.Draw(evaluation, evaluation.Normal!),
            "one-line" => OneLineDiagram.Draw(evaluation),
            "phase-sets" => PhaseSetDiagram.Draw(evaluation, evaluation.Normal!),
            _ => SweepPlot.Draw(evaluation, null, out _)!,
        };
    }

    private static void AssertLegible(Drawing drawing, string what)
    {
        var labels = drawing.Labels;
        for (var i = 0; i < labels.Count; i++)
        {
            Assert.True(labels[i].X >= 0 && labels[i].Y >= 0 && labels[i].Right <= drawing.Width && labels[i].Bottom <= drawing.Height,
                $"{what}: label {i} at {labels[i]} leaves the page ({drawing.Width} x {drawing.Height})");
            for (var j = i + 1; j < labels.Count; j++)
                Assert.False(labels[i].Overlaps(labels[j]), $"{what}: labels {i} {labels[i]} and {j} {labels[j]} overlap");
        }
    }

    private static XElement Parse(string svg)
    {
        var root = XDocument.Parse(svg).Root!;
        Assert.Equal(SvgNs + "svg", root.Name);
        Assert.True(double.Parse(root.Attribute("width")!.Value) > 0 && double.Parse(root.Attribute("height")!.Value) > 0);
        return root;
    }

    [Theory]
    [MemberData(nameof(Drawings))]
    public void Each_drawing_is_well_formed_svg_with_its_labels_apart_and_on_the_page(string name, string kind)
    {
        var drawing = Draw(name, kind);
        Parse(drawing.Svg);
        AssertLegible(drawing, $"{name} {kind}");
        Assert.Equal(drawing.Svg, Draw(name, kind).Svg);
    }

    [SkippableTheory]
    [MemberData(nameof(Drawings))]
    public void Each_drawing_renders_to_png(string name, string kind)
    {
        Renderer.Require();
        using var dir = new TemporaryDirectory();
        var drawing = Draw(name, kind);
        var (width, height, bytes) = Renderer.Render(drawing.Svg, dir.File($"{kind}.png"));
        Assert.Equal(((int)Math.Ceiling(drawing.Width), (int)Math.Ceiling(drawing.Height)), (width, height));
        Assert.True(bytes > 4000, $"{name} {kind}: a {bytes}-byte PNG is too small to hold the drawing");
    }

    [Fact]
    public void The_network_names_every_winding_terminal_tap_load_and_supply_and_marks_each_polarity()
    {
        var evaluation = Evaluator.Evaluate(File.ReadAllText(ThirtySections), "t.wn");
        var root = Parse(NetworkDiagram.Draw(evaluation).Svg);
        var texts = root.Descendants(SvgNs + "text").Select(t => t.Value).ToList();
        var words = texts.SelectMany(t => t.Split(' ', ':')).ToHashSet();
        Assert.Equal(30, evaluation.Network!.Sections.Length);
        foreach (var point in evaluation.Model.Points) Assert.Contains(point.Name, words);
        foreach (var w in evaluation.Model.Windings) Assert.Contains(w.Name, words);
        foreach (var l in evaluation.Model.Loads) Assert.Contains($"load {l.Name}", texts);
        Assert.Contains("supply grid", texts);
        Assert.Contains("fault short1", texts);
        Assert.Contains("C5 at 75 %", texts);
        // One polarity dot per winding: the dots are the circles of radius 2.6 filled as marks.
        var marks = root.Descendants(SvgNs + "circle").Count(c => c.Attribute("class")?.Value == "dot" && c.Attribute("r")?.Value == "2.6");
        Assert.Equal(evaluation.Model.Windings.Length, marks);
    }

    /// <summary>
    /// The wires of a network drawing connect exactly what the network connects: following the
    /// drawn lines (joined where one ends on another, not where two merely cross) from each terminal
    /// reaches every other terminal of its node and none of another node.
    /// </summary>
    private static void AssertWiredAsTheNetwork(Evaluation evaluation, string what)
    {
        var drawing = NetworkDiagram.Draw(evaluation);
        var network = evaluation.Network ?? WindingNotes.Model.NetworkBuilder.Build(evaluation.Model);
        var root = Parse(drawing.Svg);
        var segments = new List<(double X1, double Y1, double X2, double Y2)>();
        double D(XElement e, string a) => double.Parse(e.Attribute(a)!.Value, System.Globalization.CultureInfo.InvariantCulture);
        foreach (var e in root.Descendants().Where(e => e.Attribute("class")?.Value == "wire"))
        {
            if (e.Name == SvgNs + "line") segments.Add((D(e, "x1"), D(e, "y1"), D(e, "x2"), D(e, "y2")));
            else if (e.Name == SvgNs + "polyline")
            {
                var p = e.Attribute("points")!.Value.Split(' ').Select(xy => xy.Split(',').Select(v => double.Parse(v, System.Globalization.CultureInfo.InvariantCulture)).ToArray()).ToList();
                for (var i = 0; i + 1 < p.Count; i++) segments.Add((p[i][0], p[i][1], p[i + 1][0], p[i + 1][1]));
            }
        }
        static bool On((double X1, double Y1, double X2, double Y2) s, double x, double y)
        {
            var (dx, dy) = (s.X2 - s.X1, s.Y2 - s.Y1);
            var length = Math.Sqrt(dx * dx + dy * dy);
            if (length < 1e-9) return Math.Abs(x - s.X1) < 0.05 && Math.Abs(y - s.Y1) < 0.05;
            var t = ((x - s.X1) * dx + (y - s.Y1) * dy) / (length * length);
            if (t < -1e-6 || t > 1 + 1e-6) return false;
            return Math.Abs((x - s.X1) * dy - (y - s.Y1) * dx) / length < 0.05;
        }
        var parent = Enumerable.Range(0, segments.Count).ToArray();
        int Find(int i) => parent[i] == i ? i : parent[i] = Find(parent[i]);
        for (var i = 0; i < segments.Count; i++)
            for (var j = i + 1; j < segments.Count; j++)
            {
                var (a, b) = (segments[i], segments[j]);
                if (On(a, b.X1, b.Y1) || On(a, b.X2, b.Y2) || On(b, a.X1, a.Y1) || On(b, a.X2, a.Y2)) parent[Find(i)] = Find(j);
            }
        var groups = drawing.Terminals.Select(t =>
        {
            var touching = Enumerable.Range(0, segments.Count).Where(i => On(segments[i], t.X, t.Y)).Select(Find).Distinct().ToList();
            Assert.True(touching.Count == 1, $"{what}: terminal {t.Point} touches {touching.Count} groups of wires");
            return (t.Point, Node: network.NodeOfPoint[t.Point], Group: touching[0]);
        }).ToList();
        Assert.NotEmpty(groups);
        foreach (var a in groups)
            foreach (var b in groups)
            {
                if (network.Nodes[a.Node].IsEarth && network.Nodes[b.Node].IsEarth) continue;
                Assert.True(a.Node == b.Node == (a.Group == b.Group),
                    $"{what}: {a.Point} and {b.Point} are {(a.Node == b.Node ? "one node" : "two nodes")} but the drawing {(a.Group == b.Group ? "joins" : "separates")} them");
            }
    }

    [Theory]
    [MemberData(nameof(Drawings))]
    public void The_network_drawing_is_wired_as_the_network(string name, string kind)
    {
        if (kind != "network") return;
        var evaluation = Evaluator.Evaluate(File.ReadAllText(PathOf(name)), name);
        AssertWiredAsTheNetwork(evaluation, name);
        AssertEarthsClear(NetworkDiagram.Draw(evaluation), name);
    }

    /// <summary>The wire segments of a drawing: its lines and the legs of its polylines.</summary>
    private static List<(double X1, double Y1, double X2, double Y2)> Wires(string svg)
    {
        var segments = new List<(double, double, double, double)>();
        double D(string v) => double.Parse(v, System.Globalization.CultureInfo.InvariantCulture);
        foreach (var e in Parse(svg).Descendants().Where(e => e.Attribute("class")?.Value == "wire"))
        {
            if (e.Name == SvgNs + "line") segments.Add((D(e.Attribute("x1")!.Value), D(e.Attribute("y1")!.Value), D(e.Attribute("x2")!.Value), D(e.Attribute("y2")!.Value)));
            else if (e.Name == SvgNs + "polyline")
            {
                var p = e.Attribute("points")!.Value.Split(' ').Select(xy => xy.Split(',').Select(D).ToArray()).ToList();
                for (var i = 0; i + 1 < p.Count; i++) segments.Add((p[i][0], p[i][1], p[i + 1][0], p[i + 1][1]));
            }
        }
        return segments;
    }

    /// <summary>Whether a segment passes through a box (Liang and Barsky's clipping: the part of the segment inside each slab).</summary>
    private static bool Crosses((double X1, double Y1, double X2, double Y2) s, double left, double top, double right, double bottom)
    {
        double t0 = 0, t1 = 1;
        foreach (var (p, q) in new[] { (s.X1 - s.X2, s.X1 - left), (s.X2 - s.X1, right - s.X1), (s.Y1 - s.Y2, s.Y1 - top), (s.Y2 - s.Y1, bottom - s.Y1) })
        {
            if (p == 0)
            {
                if (q < 0) return false;
                continue;
            }
            var t = q / p;
            if (p < 0) t0 = Math.Max(t0, t);
            else t1 = Math.Min(t1, t);
        }
        return t0 <= t1;
    }

    /// <summary>
    /// No wire but an earth's own comes within 2 px of its bars (7 px either side of its lead, 7 to
    /// 13 px below its top): an earth drawn over another lead makes that lead look earthed.
    /// </summary>
    private static void AssertEarthsClear(Drawing drawing, string what)
    {
        var wires = Wires(drawing.Svg);
        foreach (var (x, y) in drawing.Earths)
        {
            bool Own(double px, double py) => Math.Abs(px - x) <= 7.01 && py >= y - 0.01 && py <= y + 13.01;
            foreach (var w in wires)
                if (!(Own(w.X1, w.Y1) && Own(w.X2, w.Y2)) && Crosses(w, x - 9, y + 5, x + 9, y + 15))
                    Assert.Fail($"{what}: the wire from ({w.X1}, {w.Y1}) to ({w.X2}, {w.Y2}) runs through the earth at ({x}, {y})");
        }
    }

    [Fact]
    public void Values_within_rounding_of_the_largest_of_their_kind_are_drawn_as_zero()
    {
        // A 1 TΩ leak beside the planer draws about 0.2 nA (240 V / 1e12 Ω), some 1e-11 of the planer's
        // 17 A: below what the solve resolves, so it is drawn as zero (the rule the result diff counts by),
        // never as "228.1 pA" or a loading of "1.3E-09 %".
        var text = File.ReadAllText(Command.Example("alder-creek-boost.wn")) + "load leak X1 H2 impedance 1e12 ohm\n";
        var evaluation = Wn.Solved(text);
        Assert.InRange(evaluation.Normal!.Load("leak").Current.Magnitude, 1e-10, 1e-9);
        var texts = Parse(NetworkDiagram.Draw(evaluation).Svg).Descendants(SvgNs + "text").Select(t => t.Value).ToList();
        var leak = texts.IndexOf("load leak");
        Assert.Equal(["228.1 V", "0.000 A", "0.000 W, pf 1.00"], texts.Skip(leak + 1).Take(3));
        Assert.DoesNotContain(texts, t => t.Contains("pA") || t.Contains("nA") || t.Contains("E-"));
    }

    [Fact]
    public void An_earth_at_the_end_of_a_variable_autotransformer_winding_keeps_clear_of_the_brush_output()
    {
        // Cedar Hollow: A, the winding's top end, is earthed; the brush's lead rises past it to the heater.
        // The earth used to hang over that lead, 8 px from it with bars 7 px wide, so the output looked earthed.
        var evaluation = Evaluator.Evaluate(File.ReadAllText(Command.Example("cedar-hollow-bench-sweep.wn")), "c.wn");
        var drawing = NetworkDiagram.Draw(evaluation);
        // The earths of the supply, the winding's end A and the heater.
        Assert.Equal(3, drawing.Earths.Count);
        AssertEarthsClear(drawing, "cedar-hollow-bench-sweep.wn");
    }

    [Fact]
    public void Random_networks_draw_with_their_labels_apart()
    {
        for (var seed = 0; seed < 25; seed++)
        {
            var evaluation = Wn.Eval(RandomNetworks.Write(seed));
            AssertLegible(NetworkDiagram.Draw(evaluation), $"network of random network {seed}");
            AssertWiredAsTheNetwork(evaluation, $"random network {seed}");
            AssertEarthsClear(NetworkDiagram.Draw(evaluation), $"random network {seed}");
            AssertLegible(PhasorDiagram.Draw(evaluation, evaluation.Normal!), $"phasors of random network {seed}");
        }
    }

    [Fact]
    public void A_file_that_does_not_solve_still_draws_its_network_without_results()
    {
        var text = File.ReadAllText(Command.Example("alder-creek-boost.wn")).Replace("supply mains H1 H2 208 V", "supply mains H1 H2 208 A");
        var evaluation = Wn.Eval(text);
        Assert.Null(evaluation.Normal);
        var drawing = NetworkDiagram.Draw(evaluation);
        Assert.Contains("not solved: no results shown", drawing.Svg);
        Parse(drawing.Svg);
        Parse(NetworkDiagram.Draw(Wn.Eval("")).Svg);
    }

    [Fact]
    public void A_step_down_unit_gets_a_phasor_grid_for_each_side()
    {
        var evaluation = Evaluator.Evaluate(File.ReadAllText(Command.Example("birchwood-service.wn")), "b.wn");
        var texts = Parse(PhasorDiagram.Draw(evaluation, evaluation.Normal!).Svg).Descendants(SvgNs + "text").Select(t => t.Value).ToList();
        Assert.Contains("nodes H1", texts);
        Assert.Contains("nodes X1, X3", texts);
        Assert.Contains("V LV:X2-X3", texts);
        Assert.Contains("I bench_a", texts);
    }

    /// <summary>The grids of a phasor drawing, by their captions, with the arrow labels and the largest current ring drawn on each.</summary>
    private static List<(string Caption, List<string> Labels, double OuterCurrent)> Grids(string svg)
    {
        var texts = Parse(svg).Descendants(SvgNs + "text")
            .Select(t => (Class: t.Attribute("class")!.Value, X: double.Parse(t.Attribute("x")!.Value, System.Globalization.CultureInfo.InvariantCulture), Text: t.Value)).ToList();
        var captions = texts.Where(t => t.Class == "note" && t.Text.StartsWith("nodes ")).ToList();
        int GridOf(double x) => captions.FindLastIndex(c => c.X <= x);
        static double Amperes(string ring) => double.Parse(ring.Split(' ')[0], System.Globalization.CultureInfo.InvariantCulture) * (ring.EndsWith(" kA") ? 1e3 : ring.EndsWith(" mA") ? 1e-3 : 1);
        return [.. captions.Select((c, i) => (c.Text,
            texts.Where(t => t.Class is "vlabel" or "ilabel" && GridOf(t.X) == i).Select(t => t.Text).ToList(),
            texts.Where(t => t.Class == "igrid" && GridOf(t.X) == i).Select(t => Amperes(t.Text)).DefaultIfEmpty(0).Max()))];
    }

    [Fact]
    public void A_bus_fault_draws_each_line_current_into_the_fault_on_the_grid_of_the_bus()
    {
        // Quarry Lane, a line-to-ground fault FE on the 415 V bus: the faulted line carries I″k into the
        // fault and the sound lines none (symmetrical components, R30); the currents belong to the 415 V
        // grid, not the 11 kV one, and the phasors are the study's own line currents.
        var quarry = Evaluator.Evaluate(File.ReadAllText(Command.Example("quarry-lane-fault-duty.wn")), "q.wn");
        var fe = quarry.Cases.Single(c => c.ShortCircuit is { Minimum: false } sc && sc.Fault.Name == "FE");
        var sc = fe.ShortCircuit!;
        var svg = PhasorDiagram.Draw(quarry, fe).Svg;
        var grids = Grids(svg);
        Assert.Equal(2, grids.Count);
        var lv = grids.Single(g => g.Caption.Contains("X1"));
        Assert.DoesNotContain("X1", grids.Single(g => g != lv).Caption);
        Assert.Contains("FE X1", lv.Labels);
        Assert.True(lv.OuterCurrent >= sc.Initial, $"{lv.OuterCurrent} A against I″k {sc.Initial} A");
        Assert.True(grids.Single(g => g != lv).OuterCurrent < sc.Initial / 10, "the 11 kV grid keeps its own scale");
        // The table lists the line current with the study's magnitude and angle.
        Assert.Contains("I FE X1", svg);
        Assert.Contains(Numbers.Format(sc.LineCurrents[0].Magnitude, "A"), svg);
        // A sound line carries no current into a line-to-ground fault: it is not drawn.
        Assert.True(sc.LineCurrents[1].Magnitude < 1e-6 * sc.Initial);
        Assert.DoesNotContain("I FE X2", svg);
    }

    [Fact]
    public void A_current_from_the_grounded_neutral_goes_on_the_grid_of_its_own_voltage_level()
    {
        // Pine Ridge, fault F_half from X1 to the grounded neutral X2: some 29 kA on the 120 V side. It
        // used to be drawn on the 7.2 kV grid (X1, shorted to the neutral, had no voltage to give it a level).
        var pine = Evaluator.Evaluate(File.ReadAllText(Command.Example("pine-ridge-fault-study.wn")), "p.wn");
        var half = pine.Cases.Single(c => c.Case.Name == "fault F_half");
        var amperes = half.Solution.FaultCurrent.Magnitude;
        Assert.InRange(amperes, 20e3, 40e3);
        var grids = Grids(PhasorDiagram.Draw(pine, half).Svg);
        Assert.Equal(["nodes H1", "nodes X1, X3"], grids.Select(g => g.Caption));
        Assert.Contains("utility", grids[0].Labels);
        Assert.Contains("F_half", grids[1].Labels);
        // Each grid's current rings reach its own largest current: kiloamperes on the secondary, hundreds of amperes on the primary.
        Assert.True(grids[1].OuterCurrent >= amperes, $"{grids[1].OuterCurrent} A");
        Assert.True(grids[0].OuterCurrent < amperes / 10, $"{grids[0].OuterCurrent} A");
        // The bolted fault across the two outer ends too: both are near zero under the fault, yet the current is on the secondary's grid.
        var bolted = Grids(PhasorDiagram.Draw(pine, pine.Cases.Single(c => c.Case.Name == "fault F_bolted")).Svg);
        Assert.Contains(bolted, g => g.Caption == "nodes X1, X3" && g.Labels.Contains("F_bolted"));

        // Birchwood: load bench_b runs from the grounded centre tap X2 to X3, a 120 V load.
        var birchwood = Evaluator.Evaluate(File.ReadAllText(Command.Example("birchwood-service.wn")), "b.wn");
        var normal = Grids(PhasorDiagram.Draw(birchwood, birchwood.Normal!).Svg);
        Assert.Equal(["nodes H1", "nodes X1, X3"], normal.Select(g => g.Caption));
        Assert.Contains("bench_b", normal[1].Labels);
        Assert.DoesNotContain("bench_b", normal[0].Labels);
    }

    [Fact]
    public void The_sweep_plot_draws_a_line_per_result_with_a_mark_per_point_and_a_gap_where_a_section_ends()
    {
        var evaluation = Evaluator.Evaluate(File.ReadAllText(Command.Example("cedar-hollow-bench-sweep.wn")), "c.wn");
        var root = Parse(SweepPlot.Draw(evaluation, ["loads.heater.v.rms", "sections.W:*-BR.loading"], out var problem)!.Svg);
        Assert.Null(problem);
        var texts = root.Descendants(SvgNs + "text").Select(t => t.Value).ToList();
        Assert.Contains("load heater voltage", texts);
        Assert.Contains("section W:A-BR loading", texts);
        Assert.Contains("section W:LINE-BR loading", texts);
        Assert.Contains("BR (%)", texts);
        // The heater's eleven points, then the sections ending at BR: W:A-BR for 0 to 80 %, W:LINE-BR for 90 and 100 %.
        var lines = root.Descendants(SvgNs + "polyline").Where(p => p.Attribute("class")?.Value == "series").ToList();
        Assert.Equal(3, lines.Count);
        var heater = lines[0].Attribute("points")!.Value.Split(' ').Select(p => double.Parse(p.Split(',')[1], System.Globalization.CultureInfo.InvariantCulture)).ToList();
        Assert.Equal(11, heater.Count);
        // The output voltage rises with the brush: each point higher on the page than the one before.
        Assert.All(heater.Zip(heater.Skip(1)), pair => Assert.True(pair.Second < pair.First));
        Assert.Equal(11 + 9 + 2, root.Descendants(SvgNs + "circle").Count(c => c.Attribute("r")?.Value == "2.3"));
    }

    [Fact]
    public void The_sweep_plot_says_why_when_there_is_nothing_to_plot()
    {
        var sweep = Evaluator.Evaluate(File.ReadAllText(Command.Example("cedar-hollow-bench-sweep.wn")), "c.wn");
        Assert.Null(SweepPlot.Draw(sweep, ["loads.*.nothing"], out var problem));
        Assert.StartsWith("no result of the sweep matches 'loads.*.nothing'", problem);
        Assert.Null(SweepPlot.Draw(Wn.Eval(File.ReadAllText(Command.Example("alder-creek-boost.wn"))), null, out problem));
        Assert.Equal("the file has no sweep", problem);
    }

    /// <summary>The built command in a process of its own, started in the repository's folder, so a relative path is relative to it.</summary>
    private static (int Code, string Out, string Err) InRepository(params string[] args)
    {
        var start = new System.Diagnostics.ProcessStartInfo("dotnet") { WorkingDirectory = Snapshot.RepositoryRoot, RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var a in args.Prepend(typeof(WindingNotes.Cli.Cli).Assembly.Location)) start.ArgumentList.Add(a);
        using var process = System.Diagnostics.Process.Start(start)!;
        var error = process.StandardError.ReadToEndAsync();
        var output = process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        return (process.ExitCode, output, error.Result);
    }

    [Theory]
    [InlineData("network", "Network of examples/cedar-hollow-bench-sweep.wn, with the results of the normal case")]
    [InlineData("phasors", "Phasors of examples/cedar-hollow-bench-sweep.wn, case normal")]
    [InlineData("sweep", "Sweep of BR in examples/cedar-hollow-bench-sweep.wn")]
    public void The_title_carries_the_path_as_given_on_the_command_line(string kind, string title)
    {
        var (code, svg, error) = InRepository("diagram", "examples/cedar-hollow-bench-sweep.wn", "--kind", kind);
        Assert.True(code == 0, error);
        Assert.Equal(title, Parse(svg).Descendants(SvgNs + "text").Single(t => t.Attribute("class")?.Value == "title").Value);
        Assert.DoesNotContain(Snapshot.RepositoryRoot, svg);
    }

    [Fact]
    public void The_diagram_command_writes_the_file_or_standard_output_and_says_when_a_case_is_missing()
    {
        using var dir = new TemporaryDirectory();
        var example = Command.Example("alder-creek-boost.wn");
        Assert.Equal(0, Command.Run("", "diagram", example, "--kind", "network", "-o", dir.File("n.svg")).Code);
        Parse(File.ReadAllText(dir.File("n.svg")));
        var (code, output, _) = Command.Run("", "diagram", example, "--kind", "phasors");
        Assert.Equal(0, code);
        Parse(output);
        (code, _, var error) = Command.Run("", "diagram", example, "--kind", "phasors", "--case", "fault F9");
        Assert.Equal(1, code);
        Assert.Contains("no case 'fault F9' to draw (cases: 'normal')", error);
        Assert.Equal(2, Command.Run("", "diagram", example, "--kind", "pie").Code);
        (code, _, error) = Command.Run("", "diagram", example, "--kind", "sweep");
        Assert.Equal(1, code);
        Assert.Contains("nothing to plot: the file has no sweep", error);
        (code, output, _) = Command.Run("", "diagram", Command.Example("cedar-hollow-bench-sweep.wn"), "--kind", "sweep", "--result", "supplies.*.i.rms", "-r", "loads.heater.p");
        Assert.Equal(0, code);
        Assert.Contains(">supply bench current</text>", output);
        Assert.Contains(">load heater P</text>", output);
        Assert.Equal(2, Command.Run("", "diagram", "/no/such.wn").Code);
    }

    [Fact]
    public void A_sweep_point_is_drawn_by_its_name_though_the_evaluation_keeps_it_only_in_columns()
    {
        var (code, svg, error) = InRepository("diagram", "examples/cedar-hollow-bench-sweep.wn", "--kind", "phasors", "--case", "sweep BR=20 %");
        Assert.True(code == 0, error);
        Assert.Equal("Phasors of examples/cedar-hollow-bench-sweep.wn, case sweep BR=20 %", Parse(svg).Descendants(SvgNs + "text").Single(t => t.Attribute("class")?.Value == "title").Value);
        (code, _, error) = InRepository("diagram", "examples/cedar-hollow-bench-sweep.wn", "--kind", "phasors", "--case", "sweep BR=21 %");
        Assert.Equal(1, code);
        Assert.Contains("no case 'sweep BR=21 %' to draw", error);
    }
}

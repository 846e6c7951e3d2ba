using System.Xml.Linq;
using WindingNotes.Report.Diagrams;
using WindingNotes.Tests.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
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
            foreach (var kind in new[] { "network", "phasors" })
                data.Add(Path.GetFileName(file), kind);
        return data;
    }

    private static string PathOf(string name) => Files().Single(f => Path.GetFileName(f) == name);

    private static Drawing Draw(string name, string kind)
    {
        var evaluation = Evaluator.Evaluate(File.ReadAllText(PathOf(name)), name);
        return kind == "network" ? NetworkDiagram.Draw(evaluation) : PhasorDiagram.Draw(evaluation, evaluation.Normal!);
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

    [Fact]
    public void Random_networks_draw_with_their_labels_apart()
    {
        for (var seed = 0; seed < 25; seed++)
        {
            var evaluation = Wn.Eval(RandomNetworks.Write(seed));
            AssertLegible(NetworkDiagram.Draw(evaluation), $"network of random network {seed}");
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
        Assert.Equal(2, Command.Run("", "diagram", "/no/such.wn").Code);
    }
}

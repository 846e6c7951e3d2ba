using System.Xml.Linq;
using WindingNotes.Report.Diagrams;
using WindingNotes.Tests.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Text;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>
/// The one-line drawing of three-phase units with their clock diagrams, and the phasor grids of
/// each three-phase set: the clock positions come from the wiring, the values from the solve.
/// </summary>
public class ThreePhaseDiagramTests
{
    private static readonly XNamespace SvgNs = "http://www.w3.org/2000/svg";

    private static string Unit(string hv, string lv) => ThreePhaseTests.Unit(hv, lv);

    private static List<string> Texts(string svg) =>
        [.. XDocument.Parse(svg).Root!.Descendants(SvgNs + "text").Select(t => t.Value)];

    // R31: IEC 60076-1, clause on connection symbols (from memory): the lower-voltage set's terminal 1
    // stands 30° times the clock number behind the first set's, clockwise on the clock face: Dyn11 at
    // 330°, Dyn1 and YNd1 at 30°, Yy0 and Dd0 at 0°, Yzn11 at 330°. Dz10 by hand (ThreePhaseTests): 300°.
    [Theory]
    [InlineData("delta H1 H2 H3", "wye X1 X2 X3 neutral X0", "Dyn11", 330)]
    [InlineData("ends H1 H3 H2 H1 H3 H2", "wye X1 X2 X3 neutral X0", "Dyn1", 30)]
    [InlineData("wye H1 H2 H3 neutral H0", "delta X1 X2 X3", "YNd1", 30)]
    [InlineData("wye H1 H2 H3 neutral H0", "ends X1 X3 X2 X1 X3 X2", "YNd11", 330)]
    [InlineData("wye H1 H2 H3", "wye X1 X2 X3", "Yy0", 0)]
    [InlineData("delta H1 H2 H3", "delta X1 X2 X3", "Dd0", 0)]
    [InlineData("wye H1 H2 H3", "zigzag X1 X2 X3 neutral X0", "Yzn11", 330)]
    [InlineData("delta H1 H2 H3", "zigzag X1 X2 X3", "Dz10", 300)]
    public void The_clock_diagram_puts_terminal_1_of_each_set_at_its_clock_number(string hv, string lv, string symbol, double degrees)
    {
        var e = Wn.Solved(Unit(hv, lv));
        var group = Assert.Single(e.Network!.VectorGroups);
        Assert.Equal(symbol, group.Symbol);
        var positions = ClockDiagram.Positions(e.Network, group)!;
        Assert.Equal(("HV", 0.0), (positions[0].Winding, positions[0].Degrees));
        Assert.Equal("LV", positions[1].Winding);
        Assert.Equal(degrees, positions[1].Degrees, 9);
        var texts = Texts(OneLineDiagram.Draw(e).Svg);
        Assert.Contains($"Vector group of T1: {symbol}, from the wiring", texts);
        Assert.Contains(degrees == 0 ? "in phase with HV" : $"{degrees}° behind HV", texts);
    }

    [Fact]
    public void An_autotransformer_bank_with_a_delta_tertiary_draws_YNa0d1()
    {
        // Oak Hill: R31, YNa0d1 (IEC 60076-1, from memory): the common winding's set in phase with the
        // series winding's line ends, the tertiary's terminal 1 at 1 o'clock, 30° behind.
        var e = Evaluator.Evaluate(File.ReadAllText(Command.Example("oak-hill-autotransformer-bank.wn")), "o.wn");
        var group = Assert.Single(e.Network!.VectorGroups);
        var positions = ClockDiagram.Positions(e.Network, group)!;
        Assert.Equal(["S", "C", "Y"], positions.Select(p => p.Winding));
        Assert.Equal([0.0, 0.0, 30.0], positions.Select(p => Math.Round(p.Degrees, 9)));
        var svg = OneLineDiagram.Draw(e).Svg;
        var texts = Texts(svg);
        Assert.Contains("T1 YNa0d1", texts);
        Assert.Contains(texts, t => t.StartsWith("S YN: "));
        Assert.Contains(texts, t => t.StartsWith("C a0: "));
        Assert.Contains(texts, t => t.StartsWith("Y d1: "));
        // The tertiary joins nothing else: its terminals end open, named.
        Assert.Contains("Y1 Y2 Y3", texts);
        // Three winding circles, one a winding.
        Assert.Equal(3, XDocument.Parse(svg).Root!.Descendants(SvgNs + "circle").Count(c => c.Attribute("class")?.Value == "winding"));
    }

    [Fact]
    public void The_one_line_diagram_gives_each_bus_its_solved_line_to_line_voltage_and_each_winding_its_current()
    {
        var e = Evaluator.Evaluate(File.ReadAllText(Command.Example("maple-ford-station-unit.wn")), "m.wn");
        var three = e.Normal!.ThreePhase;
        var svg = OneLineDiagram.Draw(e).Svg;
        var texts = Texts(svg);
        Assert.Contains($"H1 H2 H3: {Numbers.Format(three.SetOf("utility")!.LineToLine[0].Magnitude, "V")}", texts);
        Assert.Contains($"X1 X2 X3: {Numbers.Format(three.SetOf("pumps")!.LineToLine[0].Magnitude, "V")}", texts);
        Assert.Contains("T1 Dyn11", texts);
        var lv = three.SetOf("LV")!;
        Assert.Contains(texts, t => t.StartsWith($"LV yn11: {Numbers.Format(lv.LineCurrents.Max(i => i.Magnitude), "A")}, "));
        // The single-phase lighting load is not drawn one-line, and the drawing says so.
        Assert.Contains(texts, t => t.Contains("not here: loads lighting"));
        Snapshot.Match(svg, "Data/diagrams/maple-ford-station-unit.one-line.svg");
    }

    [Fact]
    public void Each_three_phase_set_gets_a_grid_with_its_solved_values()
    {
        var e = Evaluator.Evaluate(File.ReadAllText(Command.Example("maple-ford-station-unit.wn")), "m.wn");
        var svg = PhaseSetDiagram.Draw(e, e.Normal!).Svg;
        var texts = Texts(svg);
        foreach (var heading in new[] { "winding HV", "winding LV", "supply utility", "load pumps" }) Assert.Contains(heading, texts);
        var lv = e.Normal!.ThreePhase.SetOf("LV")!;
        var vn = e.Normal.PointVoltage("X0");
        // By hand: the pumps are balanced and the 45 kW lighting load on X1 alone is small beside them,
        // so each line-to-line voltage is close to sqrt(3) times the line-to-neutral one.
        Assert.InRange(lv.LineToLine[1].Magnitude / (lv.Voltages[1] - vn).Magnitude, Math.Sqrt(3) * 0.99, Math.Sqrt(3) * 1.01);
        Assert.Contains(texts, t => t.StartsWith($"X1 to neutral: {Numbers.Format((lv.Voltages[0] - vn).Magnitude, "V")} ∠"));
        Assert.Contains(texts, t => t.StartsWith($"X2-X3: {Numbers.Format(lv.LineToLine[1].Magnitude, "V")} ∠"));
        // A delta has no star point: its line voltages are drawn from their centroid.
        Assert.Contains(texts, t => t.StartsWith("H1 to centroid: "));
        Snapshot.Match(svg, "Data/diagrams/maple-ford-station-unit.phase-sets.svg");
    }

    [Fact]
    public void A_reversed_phase_winding_has_no_clock_diagram_and_the_drawing_says_why()
    {
        var e = Wn.Eval(Unit("delta H1 H2 H3", "ends X1 X0 X0 X2 X3 X0"));
        Assert.Null(Assert.Single(e.Network!.VectorGroups).Symbol);
        var texts = Texts(OneLineDiagram.Draw(e).Svg);
        Assert.Contains("Vector group of T1: no clock number", texts);
        Assert.Contains(texts, t => t.Contains("'LV_b' is reversed"));
    }

    [Fact]
    public void Paralleled_units_and_a_grounding_zigzag_stand_side_by_side_on_their_buses_each_drawn_once()
    {
        var text = ParallelUnitTests.Pair("492 V", "6 %") + """
            core TG construction three-limb rating 150 kVA zero-sequence 40 %
            winding Z on TG rated 480 V zigzag Z1 Z2 Z3 neutral N
            join Z1 X1
            join Z2 X2
            join Z3 X3
            load nr N X0 impedance 2 ohm

            """;
        var e = Wn.Solved(text);
        var drawing = OneLineDiagram.Draw(e);
        var texts = Texts(drawing.Svg);
        Assert.Single(texts, t => t == "TA Dyn11");
        Assert.Single(texts, t => t == "TB Dyn11");
        Assert.Single(texts, t => t == "TG");
        Assert.Contains(texts, t => t.StartsWith("Z zigzag, neutral"));
        // Two buses: the 13.8 kV one with the supply and both units' high-voltage leads, the 480 V one with the rest.
        var bars = XDocument.Parse(drawing.Svg).Root!.Descendants(SvgNs + "line").Where(l => l.Attribute("class")?.Value == "bus").ToList();
        Assert.Equal(2, bars.Count);
        var labels = drawing.Labels;
        for (var i = 0; i < labels.Count; i++)
            for (var j = i + 1; j < labels.Count; j++)
                Assert.False(labels[i].Overlaps(labels[j]), $"labels {labels[i]} and {labels[j]} overlap");
    }

    [Fact]
    public void A_file_without_three_phase_elements_says_there_is_nothing_to_draw()
    {
        var e = Evaluator.Evaluate(File.ReadAllText(Command.Example("alder-creek-boost.wn")), "a.wn");
        Assert.Contains("nothing to draw one-line: the file has no three-phase core, supply or load", OneLineDiagram.Draw(e).Svg);
        Assert.Contains("no three-phase set to draw", PhaseSetDiagram.Draw(e, e.Normal!).Svg);
    }

    [Fact]
    public void The_diagram_command_draws_one_line_and_phase_sets()
    {
        var example = Command.Example("maple-ford-station-unit.wn");
        var (code, output, _) = Command.Run("", "diagram", example, "--kind", "one-line");
        Assert.Equal(0, code);
        Assert.Contains("T1 Dyn11", Texts(output));
        (code, output, _) = Command.Run("", "diagram", example, "--kind", "phase-sets", "--case", "normal");
        Assert.Equal(0, code);
        Assert.Contains("load pumps", Texts(output));
    }
}

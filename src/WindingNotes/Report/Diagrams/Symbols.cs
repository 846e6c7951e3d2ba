namespace WindingNotes.Report.Diagrams;

/// <summary>
/// The graphic symbols, after the forms of IEC 60617 and IEEE 315 (winding as a row of half
/// circles, iron core as parallel lines, earth as three shortening bars, source as a circle with a
/// sine, impedance as a rectangle, variable contact as an arrow), drawn in a plain style of our own.
/// </summary>
public static class Symbols
{
    public const double ArcHeight = 10;

    public const string Css = """
        .wire{stroke:#27313b;stroke-width:1.3;fill:none;stroke-linecap:round}
        .coil{stroke:#9a4d12;stroke-width:1.8;fill:none}
        .core{stroke:#55606b;stroke-width:2.2}
        .sym{stroke:#27313b;stroke-width:1.4;fill:#ffffff}
        .thin{stroke:#27313b;stroke-width:1.1;fill:none}
        .dot{fill:#27313b;stroke:none}
        .open{stroke:#27313b;stroke-width:1.2;fill:#ffffff}
        .fault{stroke:#b3261e;stroke-width:1.6;fill:none}
        .name{font-size:10px;fill:#1b2733}
        .strong{font-size:10px;fill:#1b2733;font-weight:bold}
        .value{font-size:9px;fill:#2f6690}
        .title{font-size:13px;fill:#1b2733;font-weight:bold}
        .note{font-size:9px;fill:#5b6670}

        """;

    /// <summary>
    /// A winding along a vertical axis from <paramref name="y0"/> down, one half circle per
    /// <see cref="ArcHeight"/>, bulging toward <paramref name="inward"/> (+1 right, -1 left).
    /// </summary>
    public static void Coil(Svg svg, double x, double y0, int arcs, int inward)
    {
        var r = ArcHeight / 2;
        var sweep = inward > 0 ? 1 : 0;
        var d = $"M{Svg.N(x)} {Svg.N(y0)}" + string.Concat(Enumerable.Repeat($" a{Svg.N(r)} {Svg.N(r)} 0 0 {sweep} 0 {Svg.N(ArcHeight)}", arcs));
        svg.Path(d, "coil");
    }

    /// <summary>Earth: a lead down from the point, then three bars, each shorter.</summary>
    public static void Earth(Svg svg, double x, double y)
    {
        svg.Line(x, y, x, y + 7);
        svg.Line(x - 7, y + 7, x + 7, y + 7);
        svg.Line(x - 4.5, y + 10, x + 4.5, y + 10);
        svg.Line(x - 2, y + 13, x + 2, y + 13);
        svg.Occupy(new Box(x - 7, y + 4, 14, 10));
    }

    public const double EarthDepth = 14;

    /// <summary>An AC source centred on (x, y): a circle with one period of a sine.</summary>
    public static void Source(Svg svg, double x, double y, double r = 13)
    {
        svg.Circle(x, y, r, "sym");
        var w = r * 0.55;
        svg.Path($"M{Svg.N(x - w)} {Svg.N(y)} q{Svg.N(w / 2)} {Svg.N(-w)} {Svg.N(w)} 0 t{Svg.N(w)} 0", "thin");
    }

    /// <summary>An impedance (load) centred on (x, y): an upright rectangle.</summary>
    public static void Impedance(Svg svg, double x, double y, double w = 12, double h = 28) =>
        svg.Rect(x - w / 2, y - h / 2, w, h, "sym");

    /// <summary>A fault centred on (x, y): the broken arrow of a short circuit.</summary>
    public static void Fault(Svg svg, double x, double y, double h = 28)
    {
        svg.Polyline([(x, y - h / 2), (x + 6, y - 2), (x - 6, y + 2), (x, y + h / 2)], "fault");
        svg.Polyline([(x - 3.5, y + h / 2 - 6), (x, y + h / 2), (x + 3.5, y + h / 2 - 6)], "fault");
    }

    /// <summary>A sliding contact: an arrow along the lead whose head touches the winding at (x, y).</summary>
    public static void Brush(Svg svg, double x, double y, int outward)
    {
        svg.Path($"M{Svg.N(x)} {Svg.N(y)} l{Svg.N(outward * 7)} -3.5 v7 z", "dot");
    }

    public static void Junction(Svg svg, double x, double y) => svg.Circle(x, y, 2.4, "dot");

    public static void OpenTerminal(Svg svg, double x, double y) => svg.Circle(x, y, 2.6, "open");

    /// <summary>The polarity mark of a winding.</summary>
    public static void Polarity(Svg svg, double x, double y) => svg.Circle(x, y, 2.6, "dot");
}

using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Report.Diagrams;

/// <summary>
/// The clock diagram of a three-phase unit's vector group, as IEC 60076-1 draws connection
/// symbols: a clock face a terminal set, the set's phase windings drawn between the potentials of
/// their ends and its line terminals at their places on the face, the first set's terminal 1 at
/// twelve o'clock and each other set's terminal 1 at its clock number. The potentials are those the
/// vector group is computed from (<see cref="VectorGroups.Potentials"/>: balanced volts per turn on
/// the limbs, walked along the windings), so the figure is the wiring's, not a picture of its symbol.
/// </summary>
public static class ClockDiagram
{
    private const double Figure = 36, Face = 60, NameSize = 10, SmallSize = 8;

    /// <summary>Width and height of one face with its caption.</summary>
    public const double FaceWidth = 2 * (Face + 16), FaceHeight = 2 * (Face + 16) + 30;

    /// <summary>The faces of a unit in a row from (x, y), under a heading; returns the size drawn.</summary>
    public static (double Width, double Height) Draw(Svg svg, Network network, VectorGroup group, double x, double y)
    {
        var heading = group.Symbol is { } symbol ? $"Vector group of {group.Core}: {symbol}, from the wiring" : $"Vector group of {group.Core}: no clock number";
        svg.Text(heading, x, y + 10, "strong", NameSize);
        var potentials = VectorGroups.Potentials(network, group.Core);
        if (group.Symbol is null || potentials is null || group.Windings.IsEmpty)
        {
            var why = group.Problem ?? "the windings' loops do not close";
            var lines = Svg.Wrap(why, 4 * FaceWidth, SmallSize + 1).ToList();
            for (var i = 0; i < lines.Count; i++) svg.Text(lines[i], x, y + 26 + 13 * i, "note", 9);
            return (Math.Max(Svg.TextWidth(heading, NameSize), lines.Max(l => Svg.TextWidth(l, 9))), 26 + 13 * lines.Count);
        }
        var three = network.Model.ThreePhase;
        var sets = group.Windings.Select(w => Set(network, three, w, potentials)).ToList();
        if (sets.Any(s => s is null)) return (Svg.TextWidth(heading, NameSize), 16);
        // Terminal 1 of the first set at twelve o'clock: the turn that takes its positive-sequence phasor there.
        var turn = Complex.ImaginaryOne * Complex.Conjugate(sets[0]!.Positive) / sets[0]!.Positive.Magnitude;
        var left = x;
        for (var i = 0; i < sets.Count; i++)
        {
            DrawFace(svg, sets[i]!, group.Windings[i], group.Windings[0].Winding, turn, left + FaceWidth / 2, y + 22 + FaceWidth / 2);
            left += FaceWidth + 8;
        }
        return (Math.Max(left - x - 8, Svg.TextWidth(heading, NameSize)), 22 + FaceHeight);
    }

    /// <summary>
    /// Where each terminal set's terminal 1 stands on the clock face, in degrees clockwise from
    /// twelve o'clock with the first set's there: 30° times the clock number. Null where the wiring
    /// gives no clock diagram.
    /// </summary>
    public static IReadOnlyList<(string Winding, double Degrees)>? Positions(Network network, VectorGroup group)
    {
        if (VectorGroups.Potentials(network, group.Core) is not { } potentials || group.Windings.IsEmpty) return null;
        var sets = group.Windings.Select(w => Set(network, network.Model.ThreePhase, w, potentials)).ToList();
        if (sets.Any(s => s is null)) return null;
        var turn = Complex.ImaginaryOne * Complex.Conjugate(sets[0]!.Positive) / sets[0]!.Positive.Magnitude;
        return [.. sets.Select((s, i) => (group.Windings[i].Winding, Clockwise((s!.Potential[s.Lines[0]] - s.Centre) * turn)))];
    }

    /// <summary>A phasor's place on a clock face: degrees clockwise from twelve o'clock, in [0, 360).</summary>
    private static double Clockwise(Complex z)
    {
        var degrees = 90 - z.Phase * 180 / Math.PI;
        degrees = Math.Round(degrees, 9) % 360;
        return degrees < 0 ? degrees + 360 : degrees;
    }

    private sealed record FaceSet(string[] Names, int[] Lines, List<(int A, int B)> Windings, int Star, Complex Centre, Complex Positive, IReadOnlyDictionary<int, Complex> Potential);

    /// <summary>A terminal set's line terminals and the sections drawn with it: its own and, for an autotransformer's series winding, its common winding's.</summary>
    private static FaceSet? Set(Network network, ThreePhaseModel three, WindingSymbol symbol, IReadOnlyDictionary<int, Complex> potential)
    {
        if (three.Windings.FirstOrDefault(w => w.Name == symbol.Winding) is not { } winding) return null;
        var lines = winding.LineTerminals.Select(t => network.Node(t.Name)).ToArray();
        if (lines.Length != 3 || lines.Any(n => !potential.ContainsKey(n))) return null;
        var phases = winding.PhaseWindings.SelectMany(p => new[] { p, p + "n" }).ToHashSet(StringComparer.Ordinal);
        if (winding.Connection == PhaseConnection.Series)
        {
            var ends = winding.OtherEnds.Select(t => network.Node(t.Name)).ToArray();
            var common = three.Windings.FirstOrDefault(w => w.Core == winding.Core && w.Connection == PhaseConnection.Wye && w.LineTerminals.Select(t => network.Node(t.Name)).SequenceEqual(ends));
            if (common is not null) phases.UnionWith(common.PhaseWindings);
        }
        var sections = network.Sections.Where(s => phases.Contains(network.Windings[s.Winding].Name) && potential.ContainsKey(s.NodeA) && potential.ContainsKey(s.NodeB))
            .Select(s => (s.NodeA, s.NodeB)).ToList();
        var v = lines.Select(n => potential[n]).ToArray();
        var a = Phases.A;
        var positive = (v[0] + a * v[1] + a * a * v[2]) / 3;
        if (positive.Magnitude == 0) return null;
        var star = winding.StarPoint is { } point ? network.Node(point) : -1;
        return new FaceSet([.. winding.LineTerminals.Select(t => t.Name)], lines, sections, star, (v[0] + v[1] + v[2]) / 3, positive, potential);
    }

    private static void DrawFace(Svg svg, FaceSet set, WindingSymbol symbol, string first, Complex turn, double cx, double cy)
    {
        // The face: twelve hour marks, the hours outside them.
        svg.Circle(cx, cy, Face, "face");
        for (var hour = 0; hour < 12; hour++)
        {
            var angle = Math.PI / 2 - hour * Math.PI / 6;
            var (c, s) = (Math.Cos(angle), Math.Sin(angle));
            svg.Line(cx + c * (Face - 4), cy - s * (Face - 4), cx + c * Face, cy - s * Face, "tick");
            svg.Text(hour == 0 ? "12" : hour.ToString(System.Globalization.CultureInfo.InvariantCulture), cx + c * (Face + 9), cy - s * (Face + 9) + 3, "hour", SmallSize, Anchor.Middle);
        }
        var scale = Figure / set.Positive.Magnitude;
        (double X, double Y) At(Complex p)
        {
            var z = (p - set.Centre) * turn * scale;
            return (cx + z.Real, cy - z.Imaginary);
        }
        foreach (var (a, b) in set.Windings)
        {
            var (x0, y0) = At(set.Potential[a]);
            var (x1, y1) = At(set.Potential[b]);
            svg.Line(x0, y0, x1, y1, "phase");
        }
        // Where windings meet inside the figure (an autotransformer's common terminals, a zigzag's mid-points, taps): small marks.
        foreach (var node in set.Windings.SelectMany(w => new[] { w.A, w.B }).Distinct().Where(n => !set.Lines.Contains(n) && n != set.Star))
        {
            var (jx, jy) = At(set.Potential[node]);
            svg.Circle(jx, jy, 1.6, "dot");
        }
        if (set.Star >= 0 && set.Potential.TryGetValue(set.Star, out var star))
        {
            var (sx, sy) = At(star);
            svg.Circle(sx, sy, 2, "dot");
        }
        // The hand: terminal 1 from the centre, the hour it points to is the clock number.
        var (hx, hy) = At(set.Potential[set.Lines[0]]);
        Hand(svg, cx, cy, hx, hy);
        for (var k = 0; k < 3; k++)
        {
            var (tx, ty) = At(set.Potential[set.Lines[k]]);
            svg.Circle(tx, ty, 2.4, "dot");
            var (dx, dy) = (tx - cx, ty - cy);
            var d = Math.Max(1e-9, Math.Sqrt(dx * dx + dy * dy));
            svg.Text(set.Names[k], tx + dx / d * 11, ty + dy / d * 11 + 3.5, "name", NameSize, Anchor.Middle);
        }
        var letters = symbol.Letters + (symbol.Clock?.ToString(System.Globalization.CultureInfo.InvariantCulture) ?? "");
        svg.Text($"{symbol.Winding} {letters}", cx, cy + Face + 26, "strong", NameSize, Anchor.Middle);
        var note = symbol.Clock is { } clock ? (clock == 0 ? $"in phase with {first}" : $"{clock * 30}° behind {first}") : "reference: terminal 1 at 12";
        svg.Text(note, cx, cy + Face + 38, "note", 9, Anchor.Middle);
    }

    private static void Hand(Svg svg, double x0, double y0, double x1, double y1)
    {
        var length = Math.Sqrt((x1 - x0) * (x1 - x0) + (y1 - y0) * (y1 - y0));
        if (length < 1) return;
        var (ux, uy) = ((x1 - x0) / length, (y1 - y0) / length);
        const double head = 7;
        svg.Line(x0, y0, x1 - ux * head, y1 - uy * head, "hand");
        var (bx, by) = (x1 - ux * head, y1 - uy * head);
        svg.Path($"M{Svg.N(x1)} {Svg.N(y1)} L{Svg.N(bx - uy * 3)} {Svg.N(by + ux * 3)} L{Svg.N(bx + uy * 3)} {Svg.N(by - ux * 3)} Z", "hand-head");
    }

    public const string Css = """
        .face{stroke:#c9d2da;stroke-width:1;fill:none}
        .tick{stroke:#9aa5ae;stroke-width:1}
        .hour{font-size:8px;fill:#5b6670}
        .phase{stroke:#9a4d12;stroke-width:2;stroke-linecap:round}
        .hand{stroke:#1f4e79;stroke-width:1.4}
        .hand-head{fill:#1f4e79;stroke:none}

        """;
}

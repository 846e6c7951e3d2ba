using System.Numerics;
using System.Text;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Text;

namespace WindingNotes.Report;

/// <summary>
/// The three-phase part of a case in each format: every three-phase terminal set (line and
/// line-to-line voltages, phase, line and neutral currents, three-phase totals, sequence components
/// and the voltage unbalance factor |V2|/|V1|) and each unit's vector group.
/// </summary>
internal static class ThreePhaseReport
{
    private static readonly string[] LinePairs = ["ab", "bc", "ca"];

    public static void Text(StringBuilder o, CaseResult c)
    {
        var three = c.ThreePhase;
        if (three.Sets.IsEmpty && three.VectorGroups.IsEmpty) return;
        o.Append("  Three-phase\n");
        foreach (var g in three.VectorGroups)
            o.Append("    ").Append(g.Core).Append(" vector group ").Append(g.Symbol ?? $"none: {g.Problem}").Append('\n');
        foreach (var s in three.Sets)
        {
            o.Append("    ").Append(s.Kind).Append(' ').Append(s.Name).Append('\n');
            o.Append("      line-to-line ").Append(string.Join(", ", s.LineToLine.Select((v, k) => $"{LinePairs[k]} {TextReport.Phasor(v, "V")}"))).Append('\n');
            o.Append("      line currents ").Append(string.Join(", ", s.LineCurrents.Select(i => TextReport.Phasor(i, "A"))));
            if (s.NeutralCurrent is { } n) o.Append("; neutral ").Append(TextReport.Phasor(n, "A"));
            o.Append('\n');
            o.Append("      total ").Append(TextReport.Powers(s.Power)).Append('\n');
            var v = s.VoltageSequence;
            o.Append("      sequence V0 ").Append(Numbers.Format(v.Zero.Magnitude, "V")).Append(", V1 ").Append(Numbers.Format(v.Positive.Magnitude, "V"))
                .Append(", V2 ").Append(Numbers.Format(v.Negative.Magnitude, "V"));
            if (s.Unbalance is { } vuf) o.Append(", unbalance ").Append(TextReport.Percent(vuf));
            var i = s.CurrentSequence;
            o.Append("; I0 ").Append(Numbers.Format(i.Zero.Magnitude, "A")).Append(", I1 ").Append(Numbers.Format(i.Positive.Magnitude, "A"))
                .Append(", I2 ").Append(Numbers.Format(i.Negative.Magnitude, "A")).Append('\n');
        }
    }

    public static void Markdown(StringBuilder o, CaseResult c)
    {
        var three = c.ThreePhase;
        if (!three.VectorGroups.IsEmpty)
        {
            o.Append('\n');
            MarkdownReport.Table(o, 1, ["unit", "vector group"], three.VectorGroups.Select(g => new[] { MarkdownReport.Code(g.Core), g.Symbol ?? $"none: {g.Problem}" }));
        }
        if (three.Sets.IsEmpty) return;
        o.Append('\n');
        MarkdownReport.Table(o, 2, ["three-phase set", "kind", "V ab", "V bc", "V ca", "I a", "I b", "I c", "I neutral", "P", "Q", "V1", "V2", "V0", "unbalance V2/V1"],
            three.Sets.Select(s => (string[])
            [
                MarkdownReport.Code(s.Name), s.Kind,
                .. s.LineToLine.Select(v => Numbers.Format(v.Magnitude, "V")),
                .. s.LineCurrents.Select(i => Numbers.Format(i.Magnitude, "A")),
                s.NeutralCurrent is { } n ? Numbers.Format(n.Magnitude, "A") : "",
                Numbers.Format(s.Power.Real, "W"), Numbers.Format(s.Power.Imaginary, "var"),
                Numbers.Format(s.VoltageSequence.Positive.Magnitude, "V"), Numbers.Format(s.VoltageSequence.Negative.Magnitude, "V"),
                Numbers.Format(s.VoltageSequence.Zero.Magnitude, "V"),
                s.Unbalance is { } u ? TextReport.Percent(u) : "",
            ]));
    }

    private static string Test(SequenceTest t) =>
        $"{(t.Kind == SequenceKind.Positive ? "positive" : "zero")} sequence, {t.Energised} energised, " +
        (t.Shorted is { } x ? $"{x} short-circuited" : t.Magnetising ? "the others open (magnetising)" : "the others open");

    private static string Impedance(SequenceTest t) =>
        Numbers.Format(t.Impedance.Magnitude, "ohm") + (t.Impedance.Real > 0 ? $", X/R {Numbers.Fixed(t.Impedance.Imaginary / t.Impedance.Real)}" : "")
        + (t.PerUnit is { } pu ? $", {TextReport.Percent(pu)} at {Numbers.Format(t.BaseVoltage!.Value, "V")}" : "");

    private static string Base(UnitSequenceImpedances u) =>
        u.Tests.FirstOrDefault()?.BasePower is { } s ? $" (percent on {Numbers.Format(s, "VA")})" : "";

    /// <summary>The sequence impedances of each three-phase unit, from its test connections.</summary>
    public static void SequenceText(StringBuilder o, IReadOnlyList<UnitSequenceImpedances> units)
    {
        if (units.Count == 0) return;
        o.Append("\nSequence impedances (each unit alone, ohms per phase at the energised line terminals)\n");
        foreach (var u in units)
        {
            o.Append("  ").Append(u.Core).Append(Base(u)).Append('\n');
            foreach (var t in u.Tests) o.Append("    ").Append(Test(t)).Append(": ").Append(Impedance(t)).Append('\n');
        }
    }

    public static void SequenceMarkdown(StringBuilder o, IReadOnlyList<UnitSequenceImpedances> units)
    {
        if (units.Count == 0) return;
        o.Append("\n### Sequence impedances\n\nEach unit alone; ohms per phase at the energised line terminals, percent on the unit's rated power at their rated line-to-line voltage.\n\n");
        MarkdownReport.Table(o, 4, ["unit", "sequence", "energised", "short-circuited", "Z", "X/R", "Z %"], units.SelectMany(u => u.Tests.Select(t => new[]
        {
            MarkdownReport.Code(u.Core), t.Kind == SequenceKind.Positive ? "positive" : "zero", MarkdownReport.Code(t.Energised),
            t.Shorted is { } x ? MarkdownReport.Code(x) : t.Magnetising ? "none (magnetising)" : "none",
            Numbers.Format(t.Impedance.Magnitude, "ohm"),
            t.Impedance.Real > 0 ? Numbers.Fixed(t.Impedance.Imaginary / t.Impedance.Real) : "",
            t.PerUnit is { } pu ? TextReport.Percent(pu) : "",
        })));
    }

    private static string Circulating(CirculatingCurrent c) =>
        $"{c.Winding} {Numbers.Format(c.Current, "A")}" + (c.OfRated is { } r ? $" ({TextReport.Percent(r)} of rated)" : "");

    /// <summary>Paralleled units: each one's share of the load in the normal case and the current circulating with every load removed.</summary>
    public static void ParallelText(StringBuilder o, IReadOnlyList<ParallelGroup> groups)
    {
        foreach (var g in groups)
        {
            o.Append("\nParalleled units ").Append(string.Join(", ", g.Units.Select(u => u.Core)))
                .Append(" (load shares in the normal case; currents circulating with every load removed)\n");
            foreach (var u in g.Units)
                o.Append("  ").Append(u.Core).Append(" carries ").Append(Numbers.Format(u.Apparent, "VA")).Append(", ").Append(TextReport.Percent(u.Share)).Append(" of the group's")
                    .Append(u.Loading is { } l ? $", loading {TextReport.Percent(l)}" : "")
                    .Append("; circulating ").Append(string.Join(", ", u.Circulating.Select(Circulating))).Append('\n');
        }
    }

    public static void ParallelMarkdown(StringBuilder o, IReadOnlyList<ParallelGroup> groups)
    {
        if (groups.Count == 0) return;
        o.Append("\n### Paralleled units\n\nLoad shares in the normal case; currents circulating with every load removed.\n\n");
        MarkdownReport.Table(o, 2, ["unit", "circulating", "carries", "share", "loading"], groups.SelectMany(g => g.Units.Select(u => new[]
        {
            MarkdownReport.Code(u.Core), string.Join(", ", u.Circulating.Select(Circulating)),
            Numbers.Format(u.Apparent, "VA"), TextReport.Percent(u.Share), u.Loading is { } l ? TextReport.Percent(l) : "",
        })));
    }
}

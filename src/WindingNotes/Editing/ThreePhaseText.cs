using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Text;

namespace WindingNotes.Editing;

/// <summary>Three-phase results in words for inlay hints (line-to-line voltages, the vector group) and hovers (sequence components).</summary>
internal static class ThreePhaseText
{
    private static readonly string[] Pairs = ["ab", "bc", "ca"];

    /// <summary>At the end of a three-phase line: its line-to-line voltages and unbalance, or a core's vector group.</summary>
    public static string? Hint(CaseResult? normal, string name)
    {
        if (normal is null) return null;
        if (normal.ThreePhase.GroupOf(name) is { } group) return group.Symbol ?? "no clock number";
        if (normal.ThreePhase.SetOf(name) is not { } set) return null;
        var text = string.Join(", ", set.LineToLine.Select((v, k) => $"{Pairs[k]} {Numbers.Format(v.Magnitude, "V")}"));
        return set.Unbalance is { } u ? $"{text}; unbalance {TextReport.Percent(u)}" : text;
    }

    /// <summary>Hover lines: the set's line-to-line voltages, line currents, totals and sequence components, or the vector group.</summary>
    public static IEnumerable<string> HoverLines(CaseResult? normal, string name)
    {
        if (normal?.ThreePhase.GroupOf(name) is { } group)
        {
            yield return $"vector group {group.Symbol ?? "none"}" + (group.Problem is { } p ? $": {p}" : "");
            foreach (var w in group.Windings) yield return $"{w.Winding}: {w.Letters}{w.Clock}";
        }
        if (normal?.ThreePhase.SetOf(name) is not { } set) yield break;
        yield return "line-to-line " + string.Join(", ", set.LineToLine.Select((v, k) => $"{Pairs[k]} {TextReport.Phasor(v, "V")}"));
        yield return "line currents " + string.Join(", ", set.LineCurrents.Select(i => TextReport.Phasor(i, "A")))
            + (set.NeutralCurrent is { } n ? $"; neutral {TextReport.Phasor(n, "A")}" : "");
        yield return "three phases: " + TextReport.Powers(set.Power);
        var v = set.VoltageSequence;
        yield return $"voltage sequence: zero {TextReport.Phasor(v.Zero, "V")}, positive {TextReport.Phasor(v.Positive, "V")}, negative {TextReport.Phasor(v.Negative, "V")}";
        if (set.Unbalance is { } u) yield return $"voltage unbalance {(set.Acb ? "|V1|/|V2| (acb sequence)" : "|V2|/|V1|")} {TextReport.Percent(u)} (IEC 61000-2-12)";
        var i = set.CurrentSequence;
        yield return $"current sequence: zero {TextReport.Phasor(i.Zero, "A")}, positive {TextReport.Phasor(i.Positive, "A")}, negative {TextReport.Phasor(i.Negative, "A")}";
    }
}

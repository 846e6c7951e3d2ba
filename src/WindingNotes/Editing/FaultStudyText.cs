using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

/// <summary>The words hints and hovers give a bus fault's results: its currents by study, and each winding's duty.</summary>
public static class FaultStudyText
{
    private static IEnumerable<ShortCircuitResult> Of(Evaluation evaluation, string fault) =>
        evaluation.Cases.Select(c => c.ShortCircuit).OfType<ShortCircuitResult>().Where(s => s.Fault.Name == fault);

    /// <summary>"I″k 34.78 kA, ip 83.53 kA (maximum); I″k 28.46 kA (minimum)", or null before it is solved.</summary>
    public static string? Hint(Evaluation evaluation, string fault)
    {
        var studies = Of(evaluation, fault).ToList();
        if (studies.Count == 0) return null;
        return string.Join("; ", studies.Select(s =>
            $"I\"k {Numbers.Format(s.Initial, "A")}, ip {Numbers.Format(s.Peak, "A")}{(s.EarthFaultFactor is { } k ? $", earth-fault factor {Numbers.Fixed(k)}" : "")} ({s.Extreme})"));
    }

    public static IEnumerable<string> FaultLines(Evaluation evaluation, string fault)
    {
        foreach (var s in Of(evaluation, fault))
        {
            yield return $"{s.Extreme}: I\"k {Numbers.Format(s.Initial, "A")}, ip {Numbers.Format(s.Peak, "A")}, Ith {Numbers.Format(s.Thermal, "A")} over {Numbers.Plain(s.Study.Duration)} s";
            yield return $"{s.Extreme}: {FaultDutyReport.Method(s)}";
        }
    }

    /// <summary>A winding's duty in each bus fault, for its phase windings where it is three-phase.</summary>
    public static IEnumerable<string> DutyLines(Evaluation evaluation, string winding)
    {
        var names = evaluation.Model.ThreePhase.Windings.FirstOrDefault(w => w.Name == winding)?.PhaseWindings.ToHashSet() ?? [winding];
        foreach (var s in evaluation.Cases.Select(c => c.ShortCircuit).OfType<ShortCircuitResult>())
            foreach (var d in s.Duties.Where(d => names.Contains(d.Winding.Name)))
                yield return $"in bus fault {s.Fault.Name} ({s.Extreme}): {d.Winding.Name} {FaultDutyReport.Duty(s, d)}";
    }
}

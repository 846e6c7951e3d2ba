using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

/// <summary>The words hints and hovers give a bus fault's results: its currents by study, and each winding's duty (at the fault's line and the winding's).</summary>
public static class FaultStudyText
{
    private static IEnumerable<ShortCircuitResult> Of(Evaluation evaluation, string fault) =>
        evaluation.Cases.Select(c => c.ShortCircuit).OfType<ShortCircuitResult>().Where(s => s.Fault.Name == fault);

    /// <summary>
    /// "I″k 34.78 kA, ip 83.53 kA, peak duty LV_a 104.4 % (maximum); I″k 28.46 kA, … (minimum)", or null before
    /// it is solved; the peak duty is the worst winding's peak over its peak withstand, where any gives one.
    /// </summary>
    public static string? Hint(Evaluation evaluation, string fault)
    {
        var studies = Of(evaluation, fault).ToList();
        if (studies.Count == 0) return null;
        return string.Join("; ", studies.Select(s =>
            $"I\"k {Numbers.Format(s.Initial, "A")}, ip {Numbers.Format(s.Peak, "A")}{(s.EarthFaultFactor is { } k ? $", earth-fault factor {Numbers.Fixed(k)}" : "")}{WorstPeak(s)} ({s.Extreme})"));
    }

    /// <summary>The first winding within solver noise of the largest peak duty (phases that share it name the first).</summary>
    private static string WorstPeak(ShortCircuitResult s)
    {
        var rated = s.Duties.Where(d => d.PeakDuty is not null).ToList();
        if (rated.Count == 0) return "";
        var most = rated.Max(d => d.PeakDuty!.Value);
        var worst = rated.First(d => d.PeakDuty >= most * (1 - 1e-9));
        return $", peak duty {worst.Winding.Name} {Numbers.Format(most * 100, "%")}";
    }

    public static IEnumerable<string> FaultLines(Evaluation evaluation, string fault)
    {
        foreach (var s in Of(evaluation, fault))
        {
            yield return $"{s.Extreme}: I\"k {Numbers.Format(s.Initial, "A")}, ip {Numbers.Format(s.Peak, "A")}, Ith {Numbers.Format(s.Thermal, "A")} over {Numbers.Plain(s.Study.Duration)} s";
            yield return $"{s.Extreme}: {FaultDutyReport.Method(s)}";
            yield return $"{s.Extreme}: fault duty: {FaultDutyReport.SignOff(s)}";
            foreach (var d in s.Duties) yield return $"{s.Extreme}: {d.Winding.Name} {FaultDutyReport.Duty(s, d)}";
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

using System.Collections.Immutable;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// The checks evaluated in a fault case ('in F1', or a fault measure such as 'fault-current F2'):
/// each against the one case it names, merged with the others in the order of the file.
/// </summary>
public static class FaultChecks
{
    public static bool InFault(ExpectModel e) => e.InFault is not null;

    public static ImmutableArray<CheckResult> Merge(ImmutableArray<ExpectModel> expects, ImmutableArray<CheckResult> others, ImmutableArray<CaseResult> cases, DiagnosticBag diagnostics)
    {
        if (!expects.Any(InFault)) return others;
        var results = ImmutableArray.CreateBuilder<CheckResult>();
        // Each fault's case found once, not searched for per check: a file of many units has many of both.
        var byFault = new Dictionary<string, CaseResult>(StringComparer.Ordinal);
        foreach (var c in cases)
            if (c.Case.Fault is { } f) byFault.TryAdd(f.Name, c);
        var next = 0;
        foreach (var e in expects)
        {
            if (!InFault(e))
            {
                results.Add(others[next++]);
                continue;
            }
            var tally = new CheckTally([e]);
            var found = (e.InFault is { } name ? byFault.GetValueOrDefault(name) : null) ?? Case(e, cases);
            tally.BeginPoint(found?.Case.Name ?? $"fault {e.InFault}");
            if (found is null) tally.Unsolved(null);
            else tally.Observe(found, null);
            results.Add(tally.Finish(diagnostics)[0]);
        }
        return results.ToImmutable();
    }

    /// <summary>The case an expect names: a two-node fault's case, or a bus fault's maximum, minimum or as-loaded study.</summary>
    public static CaseResult? Case(ExpectModel e, ImmutableArray<CaseResult> cases) =>
        cases.FirstOrDefault(c => c.Case.Fault?.Name == e.InFault)
        ?? cases.FirstOrDefault(c => c.ShortCircuit is { } sc && sc.Fault.Name == e.InFault && sc.Minimum == e.Minimum);

    /// <summary>A fault measure in its case; null with the reason where it has none.</summary>
    public static double? Measure(ExpectModel e, CaseResult result, out string? problem)
    {
        problem = null;
        if (result.ShortCircuit is not { } sc)
        {
            problem = $"'{e.InFault}' is not a bus fault";
            return null;
        }
        switch (e.Measure)
        {
            case MeasureKind.FaultCurrent: return sc.Initial;
            case MeasureKind.PeakCurrent: return sc.Peak;
            case MeasureKind.ThermalCurrent: return sc.Thermal;
            case MeasureKind.PeakDuty:
                // A three-phase winding's phases (HV_a of HV): the largest duty among them.
                var name = e.Targets[1].Name;
                var phases = result.Solution.Network.Model.ThreePhase.Windings.FirstOrDefault(w => w.Name == name)?.PhaseWindings.ToHashSet() ?? [name];
                var duties = sc.Duties.Where(d => phases.Contains(d.Winding.Name) && d.PeakDuty is not null).ToList();
                if (duties.Count > 0) return duties.Max(d => d.PeakDuty!.Value);
                problem = $"winding '{name}' carries no current in bus fault '{sc.Fault.Name}' or gives no peak withstand";
                return null;
            default:
                if (sc.EarthFaultFactor is { } k) return k;
                problem = $"a {BusFaultModel.Word(sc.Fault.Kind)} fault does not go to earth: the earth-fault factor is of line-to-ground and double-line-to-ground faults";
                return null;
        }
    }
}

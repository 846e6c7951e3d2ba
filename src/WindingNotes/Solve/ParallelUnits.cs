using System.Collections.Immutable;
using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>One winding of a paralleled unit at no load: its line current (positive sequence) and that over its rated current.</summary>
public sealed record CirculatingCurrent(string Winding, double Current, double? OfRated);

/// <summary>
/// One unit of a paralleled group: the current circulating in its windings with every load removed,
/// and in the normal case the apparent power it carries (its winding that carries most), its share
/// of the group's and its highest loading.
/// </summary>
public sealed record ParallelShare(string Core, ImmutableArray<CirculatingCurrent> Circulating, double Apparent, double Share, double? Loading);

/// <summary>Three-phase units whose windings end on the same three nodes, winding for winding.</summary>
public sealed record ParallelGroup(ImmutableArray<ParallelShare> Units);

/// <summary>
/// Paralleled three-phase units. Units on unequal ratios (taps) drive a current round the loop they
/// make that no load draws: with every load removed it is all that flows in the windings (besides
/// the magnetising current of an energised winding), I = ΔE/(Z1 + Z2) for two units, ΔE the
/// difference of their open-circuit voltages and Z their short-circuit impedances, which the
/// solver gives from the network as it is. Under load it adds to each unit's share, so unequal
/// impedances or ratios share the load unequally; the normal case gives each unit's share.
/// </summary>
public static class ParallelUnits
{
    public static ImmutableArray<ParallelGroup> Find(Network network, CaseResult normal, CaseResult? noLoad)
    {
        var three = network.Model.ThreePhase;
        if (three.Cores.Length < 2 || noLoad is null) return [];
        var windingsOf = three.Windings.ToLookup(w => w.Core, StringComparer.Ordinal);
        var groups = ImmutableArray.CreateBuilder<ParallelGroup>();
        var units = three.Cores.Select(c => (Core: c.Name, Windings: windingsOf[c.Name].ToList()))
            .Where(u => u.Windings.Count >= 2)
            .GroupBy(u => Key(network, u.Windings), StringComparer.Ordinal)
            .Where(g => g.Count() > 1);
        foreach (var group in units)
        {
            var carried = group.Select(u => u.Windings.Select(w => normal.ThreePhase.SetOf(w.Name)?.Power.Magnitude ?? 0).Max()).ToList();
            var total = carried.Sum();
            groups.Add(new ParallelGroup([.. group.Select((u, k) => new ParallelShare(u.Core,
                [.. u.Windings.Select(w => Circulating(noLoad, w))],
                carried[k], total > 0 ? carried[k] / total : 0,
                normal.Sections.Where(s => u.Windings.Any(w => w.PhaseWindings.Contains(s.Winding.Name))).Max(s => s.Loading)))]));
        }
        return groups.ToImmutable();
    }

    /// <summary>The nodes each winding's line terminals are on, winding by winding: equal keys are units in parallel.</summary>
    private static string Key(Network network, List<ThreePhaseWindingModel> windings) =>
        string.Join("|", windings.Select(w => string.Join(",", w.LineTerminals.Select(t => network.Node(t.Name)).Order())).Order(StringComparer.Ordinal));

    private static CirculatingCurrent Circulating(CaseResult noLoad, ThreePhaseWindingModel w)
    {
        var current = noLoad.ThreePhase.SetOf(w.Name)?.CurrentSequence.Positive.Magnitude ?? 0;
        var loading = noLoad.Sections.Where(s => w.PhaseWindings.Contains(s.Winding.Name)).Max(s => s.Loading);
        return new CirculatingCurrent(w.Name, current, loading);
    }
}

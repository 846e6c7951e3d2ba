using System.Collections.Immutable;
using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>
/// A supply and a load joined by wire through windings (not through earth): an autotransformer
/// connection, with no galvanic isolation between input and output. <see cref="Common"/> holds the
/// nodes both sides share (the common terminal), <see cref="Cores"/> the cores of the windings involved.
/// </summary>
public sealed record Connection(SupplyNet Supply, LoadNet Load, ImmutableArray<int> Common, ImmutableArray<int> Cores);

public static class Connections
{
    /// <summary>
    /// Nodes are linked by sections only, never through earth: both sides of an isolating transformer
    /// may be grounded and still be isolated. A load is fed through windings when one of its
    /// terminals other than earth is linked to a supply terminal that is not that same node, or when
    /// it shares a terminal other than earth with the supply and is not simply across the supply.
    /// </summary>
    public static ImmutableArray<Connection> Find(Network network)
    {
        var earth = network.EarthNode;
        var sets = new DisjointSets(network.Nodes.Length);
        foreach (var s in network.Sections)
            if (s.NodeA != earth && s.NodeB != earth) sets.Union(s.NodeA, s.NodeB);
        var result = ImmutableArray.CreateBuilder<Connection>();
        foreach (var load in network.Loads)
        {
            foreach (var supply in network.Supplies)
            {
                int[] loadNodes = [load.NodeA, load.NodeB], supplyNodes = [supply.NodeP, supply.NodeQ];
                var fed = Array.FindIndex(loadNodes, a => a != earth && supplyNodes.Any(p => p != earth && p != a && sets.Find(p) == sets.Find(a)));
                var shared = loadNodes.Any(a => a != earth && supplyNodes.Contains(a)) && !loadNodes.All(supplyNodes.Contains);
                if (fed < 0 && !shared) continue;
                // A load between a supply terminal and earth has no terminal of its own off the supply.
                var own = loadNodes.FirstOrDefault(a => a != earth && !supplyNodes.Contains(a), loadNodes.First(a => a != earth));
                var island = sets.Find(fed >= 0 ? loadNodes[fed] : own);
                var cores = network.Sections
                    .Where(s => (s.NodeA != earth && sets.Find(s.NodeA) == island) || (s.NodeB != earth && sets.Find(s.NodeB) == island))
                    .Select(s => s.Core).Distinct().Order().ToImmutableArray();
                var common = loadNodes.Intersect(supplyNodes).ToImmutableArray();
                result.Add(new Connection(supply, load, common, cores));
            }
        }
        return result.ToImmutable();
    }
}

using System.Collections.Immutable;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// A supply and a load joined by wire through windings (not through earth): an autotransformer
/// connection, with no galvanic isolation between input and output. <see cref="Common"/> holds the
/// nodes both sides share (the common terminal), <see cref="Cores"/> the cores of the windings involved.
/// <see cref="Island"/> names the galvanic island (connections of one island share its windings),
/// <see cref="FedFrom"/> the two supply points the load's terminals are fed from: what the output is
/// compared with, whichever supplies they belong to (two legs of a split-phase supply, two lines);
/// <see cref="Series"/> the sections between them and the load's terminals, the series winding.
/// </summary>
public sealed record Connection(SupplyNet Supply, LoadNet Load, ImmutableArray<int> Common, ImmutableArray<int> Cores)
{
    public int Island { get; init; }

    public ImmutableArray<int> Series { get; init; } = [];

    public (int A, int B) FedFrom { get; init; }
    /// <summary>
    /// Whether the supply or the load is a phase of a three-phase statement: its common terminal is
    /// not cautioned by the phase element's ends (a line-to-line output from line-to-neutral phases
    /// shares no terminal of one phase element with another); the lack of isolation holds all the
    /// same, and so do the output against the voltage between the supply points it is fed from and
    /// the co-ratio and two-winding rating, taken from the series windings' own V·I.
    /// </summary>
    public bool IsPhaseElement(Model.Model model) =>
        model.ThreePhase.IsSupplyOrLoad(Supply.Source.Line) || model.ThreePhase.IsSupplyOrLoad(Load.Source.Line);

    /// <summary>The same connection, its lists compared by their elements (a record compares them by reference).</summary>
    public bool Equals(Connection? other) => other is not null && (ReferenceEquals(this, other) ||
        Supply == other.Supply && Load == other.Load && Island == other.Island && FedFrom == other.FedFrom
        && Sequences.Equal(Common, other.Common) && Sequences.Equal(Cores, other.Cores) && Sequences.Equal(Series, other.Series));

    public override int GetHashCode() => HashCode.Combine(Supply, Load, Island);
}

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
        // What a connection is follows from the wiring alone, which a moved brush or a sweep point
        // leaves as it was: every point of a sweep would otherwise search the windings again.
        var nodes = ImmutableCollectionsMarshal.AsArray(network.Nodes)!;
        if (Known.TryGetValue(nodes, out var known) && known.For(network) is { } same) return same;
        var found = Search(network);
        Known.AddOrUpdate(nodes, new Wiring(network, found));
        return found;
    }

    /// <summary>The connections last found for a network's nodes, with what they were found from.</summary>
    private static readonly ConditionalWeakTable<NetworkNode[], Wiring> Known = new();

    private sealed class Wiring(Network network, ImmutableArray<Connection> connections)
    {
        /// <summary>
        /// The connections of <paramref name="other"/> where it is wired as the network they were
        /// found in (its sections, supplies and loads between the same nodes), with its own supplies
        /// and loads (a load cycle scales them); else null.
        /// </summary>
        public ImmutableArray<Connection>? For(Network other)
        {
            if (other.Sections.Length != network.Sections.Length || other.Supplies.Length != network.Supplies.Length || other.Loads.Length != network.Loads.Length) return null;
            for (var k = 0; k < other.Sections.Length; k++)
            {
                var (a, b) = (other.Sections[k], network.Sections[k]);
                if (a.NodeA != b.NodeA || a.NodeB != b.NodeB || a.Core != b.Core) return null;
            }
            if (other.Supplies == network.Supplies && other.Loads == network.Loads) return connections;
            for (var i = 0; i < other.Supplies.Length; i++)
                if (other.Supplies[i].NodeP != network.Supplies[i].NodeP || other.Supplies[i].NodeQ != network.Supplies[i].NodeQ) return null;
            for (var i = 0; i < other.Loads.Length; i++)
                if (other.Loads[i].NodeA != network.Loads[i].NodeA || other.Loads[i].NodeB != network.Loads[i].NodeB) return null;
            return [.. connections.Select(c => c with { Supply = other.Supplies[c.Supply.Index], Load = other.Loads[c.Load.Index] })];
        }
    }

    private static ImmutableArray<Connection> Search(Network network)
    {
        var earth = network.EarthNode;
        var sets = new DisjointSets(network.Nodes.Length);
        foreach (var s in network.Sections)
            if (s.NodeA != earth && s.NodeB != earth) sets.Union(s.NodeA, s.NodeB);
        // By island, so that a file of many units pairs each load only with the supplies of its own unit.
        var suppliesIn = new Dictionary<int, SortedSet<int>>();
        // A neutral or neutral-grounding impedance is no source: a load beside it is not fed through it, nor is earth a supply point by it.
        foreach (var supply in network.Supplies.Where(s => s.Source.IsSource))
            foreach (var p in new[] { supply.NodeP, supply.NodeQ }.Where(p => p != earth))
            {
                if (!suppliesIn.TryGetValue(sets.Find(p), out var set)) suppliesIn[sets.Find(p)] = set = [];
                set.Add(supply.Index);
            }
        var coresIn = new Dictionary<int, SortedSet<int>>();
        foreach (var s in network.Sections)
            foreach (var n in new[] { s.NodeA, s.NodeB }.Where(n => n != earth))
            {
                if (!coresIn.TryGetValue(sets.Find(n), out var set)) coresIn[sets.Find(n)] = set = [];
                set.Add(s.Core);
            }
        var supplyPoints = network.Supplies.Where(s => s.Source.IsSource).SelectMany(s => new[] { s.NodeP, s.NodeQ }).ToHashSet();
        // The lines: supply points other than earth and a three-phase supply's star point. A load is fed
        // from a line wherever one reaches it, from the neutral only where none does, so the answer does
        // not hang on which end of a winding is written first.
        var neutrals = network.Supplies.Where(s => s.Source.IsSource && network.Model.ThreePhase.IsSupplyOrLoad(s.Source.Line)).Select(s => s.NodeQ).Append(earth).ToHashSet();
        var lines = supplyPoints.Where(p => !neutrals.Contains(p)).ToHashSet();
        var touching = network.Sections.SelectMany(s => new[] { (Node: s.NodeA, Section: s), (Node: s.NodeB, Section: s) }).ToLookup(x => x.Node, x => x.Section);
        var result = ImmutableArray.CreateBuilder<Connection>();
        foreach (var load in network.Loads)
        {
            int[] loadNodes = [load.NodeA, load.NodeB];
            var candidates = new SortedSet<int>(loadNodes.Where(a => a != earth).SelectMany(a => suppliesIn.GetValueOrDefault(sets.Find(a)) ?? []));
            if (candidates.Count == 0) continue;
            // The supply points the load's terminals are fed from, and the series winding between.
            var fedB = FedFrom(touching, earth, load.NodeB, load.NodeA, supplyPoints, lines);
            var fedA = FedFrom(touching, earth, load.NodeA, fedB.Point, supplyPoints, lines);
            // Where supplies stand across the two points the load is fed from (a phase and its star point),
            // they are what feeds it: another phase that shares no more than the star point with the load
            // makes no connection with it. Else each supply with a terminal in reach does (two lines, two legs).
            int[] fedPoints = [fedA.Point, fedB.Point];
            var across = fedA.Point != fedB.Point && candidates.Any(i => fedPoints.All(p => network.Supplies[i].NodeP == p || network.Supplies[i].NodeQ == p));
            foreach (var supply in candidates.Select(i => network.Supplies[i]))
            {
                int[] supplyNodes = [supply.NodeP, supply.NodeQ];
                var fed = Array.FindIndex(loadNodes, a => a != earth && supplyNodes.Any(p => p != earth && p != a && sets.Find(p) == sets.Find(a)));
                // A load between a supply terminal and earth has no terminal of its own off the supply.
                var own = loadNodes.FirstOrDefault(a => a != earth && !supplyNodes.Contains(a), loadNodes.First(a => a != earth));
                // Sharing a supply terminal counts when the load's own terminal is on a winding, not a dead end.
                var shared = loadNodes.Any(a => a != earth && supplyNodes.Contains(a)) && !loadNodes.All(supplyNodes.Contains) && coresIn.ContainsKey(sets.Find(own));
                if (fed < 0 && !shared) continue;
                if (across && !fedPoints.All(supplyNodes.Contains)) continue;
                var island = sets.Find(fed >= 0 ? loadNodes[fed] : own);
                var cores = (coresIn.GetValueOrDefault(island) ?? []).ToImmutableArray();
                var common = loadNodes.Intersect(supplyNodes).ToImmutableArray();
                bool InIsland(Section s) => sets.Find(s.NodeA != earth ? s.NodeA : s.NodeB) == island;
                result.Add(new Connection(supply, load, common, cores)
                {
                    Island = island,
                    // The series winding of this island only: a load across two islands (a delta load on
                    // single-phase units in grounded wye, each unit an island) is fed through the other's too.
                    Series = [.. fedA.Series.Concat(fedB.Series).Where(i => InIsland(network.Sections[i]))],
                    FedFrom = fedA.Point == fedB.Point ? (supply.NodeP, supply.NodeQ) : (fedA.Point, fedB.Point),
                });
            }
        }
        return result.ToImmutable();
    }

    /// <summary>
    /// The supply point a load terminal is fed from and the sections between them (the series
    /// winding): the terminal itself and none when a supply ends there, else the supply point fewest
    /// sections away along the windings (not through earth), other than <paramref name="other"/>
    /// (the point of the load's other terminal), so that a brush between two supply points is
    /// compared with the voltage between them. A line (<paramref name="lines"/>) is sought first: earth
    /// and a star point are the feed only where no line is reached.
    /// </summary>
    private static (int Point, ImmutableArray<int> Series) FedFrom(ILookup<int, Section> touching, int earth, int terminal, int other, HashSet<int> supplyPoints, HashSet<int> lines)
    {
        if (supplyPoints.Contains(terminal) || terminal == earth) return (terminal, []);
        return Nearest(touching, earth, terminal, other, lines, supplyPoints) ?? Nearest(touching, earth, terminal, other, supplyPoints, supplyPoints) ?? (other, []);
    }

    /// <summary>
    /// The one of <paramref name="points"/> fewest sections from the terminal, other than <paramref name="other"/>,
    /// and the sections between; null if none is reached. The way goes on past no supply point but <paramref name="other"/>.
    /// </summary>
    private static (int Point, ImmutableArray<int> Series)? Nearest(ILookup<int, Section> touching, int earth, int terminal, int other, HashSet<int> points, HashSet<int> supplyPoints)
    {
        var via = new Dictionary<int, Section?> { [terminal] = null };
        var frontier = new List<int> { terminal };
        while (frontier.Count > 0)
        {
            var next = new List<int>();
            foreach (var node in frontier)
                foreach (var s in touching[node])
                {
                    var far = s.NodeA == node ? s.NodeB : s.NodeA;
                    if (!via.TryAdd(far, s)) continue;
                    if (points.Contains(far) && far != other) return (far, Path(far));
                    if (far != earth && (far == other || !supplyPoints.Contains(far))) next.Add(far);
                }
            frontier = next;
        }
        return null;

        ImmutableArray<int> Path(int end)
        {
            var path = ImmutableArray.CreateBuilder<int>();
            for (var n = end; via[n] is { } s; n = s.NodeA == n ? s.NodeB : s.NodeA) path.Add(s.Index);
            return path.ToImmutable();
        }
    }
}

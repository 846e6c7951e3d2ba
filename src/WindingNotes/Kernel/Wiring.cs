using System.Collections.Immutable;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using WindingNotes.Model;

namespace WindingNotes.Kernel;

/// <summary>
/// What follows from a network's wiring alone, found once and kept: the reference node of each
/// galvanic island and the independent parts (with and without loads). A fault case needs only
/// its own part; finding every part again per fault made a file of n units with n faults cost n².
/// Kept by the sections' array, which the networks a point derives (loads as impedances, supplies
/// scaled) share, and used only while the supplies, loads and cores join the same nodes.
/// </summary>
internal sealed class Wiring
{
    private static readonly ConditionalWeakTable<Section[], Wiring> Known = new();

    private readonly Network network;
    private readonly int[] references;
    private Partition? withLoads, withoutLoads;

    private Wiring(Network network)
    {
        this.network = network;
        references = Islands.References(network, []);
    }

    public static Wiring Of(Network network)
    {
        var sections = ImmutableCollectionsMarshal.AsArray(network.Sections)!;
        if (Known.TryGetValue(sections, out var known) && known.Fits(network)) return known;
        var wiring = new Wiring(network);
        Known.AddOrUpdate(sections, wiring);
        return wiring;
    }

    /// <summary>Whether <paramref name="other"/> is wired as the network this was found from.</summary>
    private bool Fits(Network other)
    {
        if (other == network || other == fitted) return true;
        if (!FitsWiring(other)) return false;
        // The networks of one point (loads as impedances, supplies scaled) ask once per fault: compared once.
        fitted = other;
        return true;
    }

    private Network? fitted;

    private bool FitsWiring(Network other)
    {
        if (other.Nodes != network.Nodes || other.Cores != network.Cores || other.Couplings != network.Couplings) return false;
        if (other.Supplies.Length != network.Supplies.Length || other.Loads.Length != network.Loads.Length) return false;
        if (other.Supplies != network.Supplies)
            for (var i = 0; i < other.Supplies.Length; i++)
                if (other.Supplies[i].NodeP != network.Supplies[i].NodeP || other.Supplies[i].NodeQ != network.Supplies[i].NodeQ) return false;
        if (other.Loads != network.Loads)
            for (var i = 0; i < other.Loads.Length; i++)
                if (other.Loads[i].NodeA != network.Loads[i].NodeA || other.Loads[i].NodeB != network.Loads[i].NodeB) return false;
        return true;
    }

    /// <summary>
    /// Whether <paramref name="node"/> is the reference of its island once a fault joins
    /// <paramref name="a"/> and <paramref name="b"/> (−1: no fault): joined, two islands take earth
    /// where either has it, else the lower of their references, as <see cref="Islands.References"/> does.
    /// </summary>
    public bool IsReference(int node, int a = -1, int b = -1)
    {
        var r = references[node];
        if (a < 0 || b < 0) return r == node;
        var (ra, rb) = (references[a], references[b]);
        if (ra == rb || (r != ra && r != rb)) return r == node;
        var earth = network.EarthNode;
        return (ra == earth || rb == earth ? earth : Math.Min(ra, rb)) == node;
    }

    /// <summary>
    /// The part a fault between nodes <paramref name="a"/> and <paramref name="b"/> is in: the part
    /// of each end that is not earth, joined where the fault links two; null where neither end is a
    /// node other than earth.
    /// </summary>
    public SolveGroup? FaultedPart(int a, int b, bool loads)
    {
        var parts = loads ? withLoads ??= new Partition(network, true) : withoutLoads ??= new Partition(network, false);
        var earth = network.EarthNode;
        var pa = a != earth ? parts.Of(a) : null;
        var pb = b != earth ? parts.Of(b) : null;
        if (pa is null || pb is null || pa == pb) return (pa ?? pb) is { } one ? one with { HasFault = true } : null;
        return new SolveGroup(Merge(pa.Nodes, pb.Nodes), Merge(pa.Sections, pb.Sections), Merge(pa.Supplies, pb.Supplies),
            Merge(pa.Loads, pb.Loads), Merge(pa.Cores, pb.Cores), true);
    }

    /// <summary>Two ascending lists of distinct indices as one, ascending: the order the parts were gathered in.</summary>
    private static List<int> Merge(List<int> x, List<int> y)
    {
        var merged = new List<int>(x.Count + y.Count);
        int i = 0, j = 0;
        while (i < x.Count || j < y.Count)
            merged.Add(j >= y.Count || (i < x.Count && x[i] < y[j]) ? x[i++] : y[j++]);
        return merged;
    }

    /// <summary>The independent parts as <see cref="SolveGroup.Find"/> gathers them without a fault, by node.</summary>
    private sealed class Partition
    {
        private readonly DisjointSets sets;
        private readonly Dictionary<int, SolveGroup> groups;

        public Partition(Network network, bool loads)
        {
            sets = Islands.Parts(network, loads, []);
            groups = SolveGroup.Gather(network, sets, loads ? network.Loads.Where(l => l.NodeA != l.NodeB) : [], -1);
        }

        public SolveGroup? Of(int node) => groups.GetValueOrDefault(sets.Find(node));
    }
}

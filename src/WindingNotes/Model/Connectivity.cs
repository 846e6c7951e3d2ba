namespace WindingNotes.Model;

/// <summary>A union-find over integers: joins, galvanic islands and independent subsystems use it.</summary>
public sealed class DisjointSets
{
    private readonly int[] parent;

    public DisjointSets(int count)
    {
        parent = new int[count];
        for (var i = 0; i < count; i++) parent[i] = i;
    }

    public int Find(int x)
    {
        while (parent[x] != x) x = parent[x] = parent[parent[x]];
        return x;
    }

    public void Union(int a, int b)
    {
        a = Find(a);
        b = Find(b);
        // The smaller index stays the root, so the result does not depend on the order of unions.
        if (a != b) parent[Math.Max(a, b)] = Math.Min(a, b);
    }
}

/// <summary>Galvanic islands: nodes linked by sections, supplies, loads and any extra branches (a fault).</summary>
public static class Islands
{
    /// <summary>For each node, the node that is the reference of its island: earth where the island has it, else its first node.</summary>
    public static int[] References(Network network, IEnumerable<(int A, int B)> extra)
    {
        var sets = new DisjointSets(network.Nodes.Length);
        foreach (var s in network.Sections) sets.Union(s.NodeA, s.NodeB);
        foreach (var s in network.Supplies) sets.Union(s.NodeP, s.NodeQ);
        foreach (var l in network.Loads) sets.Union(l.NodeA, l.NodeB);
        foreach (var (a, b) in extra) sets.Union(a, b);
        var earth = network.EarthNode;
        var reference = new int[network.Nodes.Length];
        for (var i = 0; i < reference.Length; i++) reference[i] = sets.Find(i);
        if (earth >= 0)
        {
            var earthRoot = sets.Find(earth);
            for (var i = 0; i < reference.Length; i++)
                if (reference[i] == earthRoot) reference[i] = earth;
        }
        return reference;
    }

    /// <summary>
    /// Independent parts: nodes linked by supplies, loads and extra branches, and through a core by its
    /// sections (core c is vertex Nodes.Length + c). Earth is the reference of every grounded part but
    /// links nothing, so two grounded units stay two small parts instead of one large one.
    /// </summary>
    public static DisjointSets Parts(Network network, bool withLoads, IEnumerable<(int A, int B)> extra)
    {
        var nodeCount = network.Nodes.Length;
        var earth = network.EarthNode;
        var sets = new DisjointSets(nodeCount + network.Cores.Length);
        void Link(int a, int b)
        {
            if (a != earth && b != earth) sets.Union(a, b);
        }
        foreach (var s in network.Sections)
        {
            Link(s.NodeA, nodeCount + s.Core);
            Link(s.NodeB, nodeCount + s.Core);
        }
        foreach (var s in network.Supplies) Link(s.NodeP, s.NodeQ);
        foreach (var m in network.Couplings)
            foreach (var limb in m.Limbs) sets.Union(nodeCount + m.Limbs[0], nodeCount + limb);
        if (withLoads)
            foreach (var l in network.Loads) Link(l.NodeA, l.NodeB);
        foreach (var (a, b) in extra) Link(a, b);
        return sets;
    }

    /// <summary>The vertex of <see cref="Parts"/> a two-terminal element belongs to: its node that is not earth (−1 when both are).</summary>
    public static int Anchor(Network network, int a, int b) => a != network.EarthNode ? a : b != network.EarthNode ? b : -1;
}

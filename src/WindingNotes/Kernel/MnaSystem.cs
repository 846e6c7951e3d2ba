using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Kernel;

/// <summary>What an unknown and its equation belong to.</summary>
public enum ElementKind { Node, Section, Supply, Fault, Core }

/// <summary>An unknown or an equation of the system, named for diagnostics.</summary>
public readonly record struct Element(ElementKind Kind, string Name, TextSpan Span)
{
    /// <summary>The element as messages name it: "section 'P'".</summary>
    public override string ToString() => $"{Word} '{Name}'";

    public string Word => Kind switch
    {
        ElementKind.Node => "node",
        ElementKind.Section => "section",
        ElementKind.Supply => "supply",
        ElementKind.Fault => "fault",
        _ => "core",
    };
}

/// <summary>A constant-power or constant-current load, by the columns of its two nodes (−1 for a reference).</summary>
internal readonly record struct NonlinearLoad(int Load, int ColumnA, int ColumnB, Complex S0, double V0, int Exponent);

/// <summary>A constant-impedance load, stamped in the matrix, by the columns of its two nodes.</summary>
internal readonly record struct LinearLoad(int Load, int ColumnA, int ColumnB);

/// <summary>
/// The linear system of one independent part of the network (nodes linked galvanically or through
/// cores). Unknowns: node voltages (references left out), section currents, supply currents, the
/// fault current, and per core its volts per turn e. Rows, in the same order:
/// KCL at each node; for each section V_a − V_b − N·e − Σ Z·I = 0; for each supply
/// V_p − V_q + Z_s·I = E; for the fault V_a − V_b − Z_f·I = 0; for each core Σ N·I − Y·e = 0.
/// Constant-impedance loads are stamped as admittances; the others are left to Newton's method.
/// The matrix is kept sparse (<see cref="SystemMatrix"/>). Every element stamps entries (i, j) and
/// (j, i) together, so the pattern is symmetric, which the brush update relies on (a dangling load's
/// node held at its other end is the exception; the update's residual check refuses what it misses).
/// Once assembled it does not change: its matrix is frozen, and a system with a load dropped is a
/// new one (<see cref="Without"/>, <see cref="Holding"/>); a network of the same shape is stamped
/// into the caller's own matrix (<see cref="StampInto"/>).
/// </summary>
internal sealed class MnaSystem
{
    private readonly Complex[] b;
    private readonly Dictionary<int, int> nodeColumn;
    private readonly SolveGroup group;
    private readonly CaseSpec spec;

    private MnaSystem(SolveGroup group, CaseSpec spec, Dictionary<int, int> nodeColumn, IReadOnlyDictionary<int, int> sectionColumn,
        IReadOnlyDictionary<int, int> supplyColumn, IReadOnlyDictionary<int, int> coreColumn, int faultColumn, IReadOnlyList<Element> unknowns)
    {
        (this.group, this.spec, this.nodeColumn) = (group, spec, nodeColumn);
        (SectionColumn, SupplyColumn, CoreColumn, FaultColumn, Unknowns) = (sectionColumn, supplyColumn, coreColumn, faultColumn, unknowns);
        Size = unknowns.Count;
        A = new SystemMatrix(Size);
        b = new Complex[Size];
    }

    private MnaSystem(MnaSystem other, SystemMatrix a, ImmutableArray<NonlinearLoad> nonlinear, Complex[]? rhs = null)
    {
        (group, spec, nodeColumn, b) = (other.group, other.spec, other.nodeColumn, rhs ?? other.b);
        (SectionColumn, SupplyColumn, CoreColumn, FaultColumn, Unknowns, Size) = (other.SectionColumn, other.SupplyColumn, other.CoreColumn, other.FaultColumn, other.Unknowns, other.Size);
        (LinearLoads, HasSource) = (other.LinearLoads, other.HasSource);
        A = a;
        NonlinearLoads = nonlinear;
    }

    public int Size { get; }

    /// <summary>The matrix, frozen: stamp a <see cref="SystemMatrix.Clone"/>.</summary>
    public SystemMatrix A { get; }

    public ReadOnlySpan<Complex> B => b;

    /// <summary>The unknowns; each equation belongs to the element of the unknown of its index.</summary>
    public IReadOnlyList<Element> Unknowns { get; }

    public IReadOnlyList<Element> Equations => Unknowns;

    public IReadOnlyDictionary<int, int> NodeColumn => nodeColumn;

    public IReadOnlyDictionary<int, int> SectionColumn { get; }

    public IReadOnlyDictionary<int, int> SupplyColumn { get; }

    public IReadOnlyDictionary<int, int> CoreColumn { get; }

    public int FaultColumn { get; }

    public ImmutableArray<NonlinearLoad> NonlinearLoads { get; private init; } = [];

    public ImmutableArray<LinearLoad> LinearLoads { get; private init; } = [];

    public bool HasSource { get; private init; }

    public int Column(int node) => nodeColumn.TryGetValue(node, out var c) ? c : -1;

    public static MnaSystem Assemble(Network network, SolveGroup group, int[] reference, CaseSpec spec) =>
        Assemble(network, group, n => reference[n] == n, spec);

    /// <param name="isReference">Whether a node is its island's reference (no unknown of its own).</param>
    public static MnaSystem Assemble(Network network, SolveGroup group, Func<int, bool> isReference, CaseSpec spec)
    {
        // Sized once (a part is assembled per case and per fault): the tables keep the order they are filled in.
        var unknowns = new List<Element>(group.Nodes.Count + group.Sections.Count + group.Supplies.Count + group.Cores.Count + 1);
        var (nodes, sections, supplies, cores) = (new Dictionary<int, int>(group.Nodes.Count), new Dictionary<int, int>(group.Sections.Count), new Dictionary<int, int>(group.Supplies.Count), new Dictionary<int, int>(group.Cores.Count));
        foreach (var n in group.Nodes.Where(n => !isReference(n)))
        {
            nodes[n] = unknowns.Count;
            unknowns.Add(new Element(ElementKind.Node, network.Nodes[n].Name, PointSpan(network, group, n)));
        }
        foreach (var k in group.Sections)
        {
            sections[k] = unknowns.Count;
            unknowns.Add(new Element(ElementKind.Section, network.Sections[k].Name, network.Windings[network.Sections[k].Winding].Source.Line));
        }
        foreach (var s in group.Supplies)
        {
            supplies[s] = unknowns.Count;
            unknowns.Add(new Element(ElementKind.Supply, network.Supplies[s].Name, network.Supplies[s].Source.Line));
        }
        var fault = -1;
        if (group.HasFault)
        {
            fault = unknowns.Count;
            unknowns.Add(new Element(ElementKind.Fault, spec.Fault!.Name, spec.Fault.Line));
        }
        foreach (var c in group.Cores)
        {
            cores[c] = unknowns.Count;
            unknowns.Add(new Element(ElementKind.Core, network.Cores[c].Name, network.Cores[c].Source.Line));
        }
        var m = new MnaSystem(group, spec, nodes, sections, supplies, cores, fault, unknowns);
        var (nonlinear, linear, hasSource) = m.Stamp(network, m.A, m.b);
        m.A.Freeze();
        return new MnaSystem(m, m.A, nonlinear) { LinearLoads = linear, HasSource = hasSource };
    }

    /// <summary>The same system without <paramref name="load"/> (one that draws nothing).</summary>
    public MnaSystem Without(NonlinearLoad load) => new(this, A, NonlinearLoads.Remove(load));

    /// <summary>
    /// The same system without <paramref name="load"/>, its node <paramref name="end"/> held at the
    /// voltage of <paramref name="other"/> (−1: the reference), for a load alone at that node.
    /// </summary>
    public MnaSystem Holding(NonlinearLoad load, int end, int other)
    {
        var a = A.Clone();
        a[end, end] = 1;
        if (other >= 0) a[end, other] = -1;
        a.Freeze();
        return new(this, a, NonlinearLoads.Remove(load));
    }

    /// <summary>
    /// The numbers of a network of the same shape (a brush moved) stamped into <paramref name="a"/>
    /// and <paramref name="rhs"/>, cleared first (a matrix of this one's entries keeps its places):
    /// the unknowns, the equations and their names stay, so nothing but the numbers is made again.
    /// </summary>
    public void StampInto(Network network, SystemMatrix a, Complex[] rhs)
    {
        a.Clear();
        Array.Clear(rhs);
        Stamp(network, a, rhs, collect: false);
    }

    /// <summary>
    /// This system with the numbers of <paramref name="network"/>, a network restamped on the wiring of
    /// the one it was assembled for (<see cref="NetworkBuilder.Restamp"/>): the unknowns, their names,
    /// the parts and the matrix's pattern stay; the values are stamped afresh into a copy, in the order
    /// <see cref="Assemble"/> stamps them, so every entry is the number assembly would give.
    /// </summary>
    public MnaSystem Restamped(Network network)
    {
        var a = A.Clone();
        var restamped = RestampedInto(network, a, new Complex[Size]);
        a.Freeze();
        return restamped;
    }

    /// <summary>
    /// As <see cref="Restamped"/>, stamped into <paramref name="scratch"/> (a <see cref="SystemMatrix.Clone"/>
    /// of this system's matrix) and <paramref name="rhs"/> (of its size), both cleared first, instead of
    /// a copy made for it: the system returned holds them, so it stands only until the caller stamps
    /// them again. For a caller that solves each system before it restamps the next (tolerance samples,
    /// <c>Rebinding</c>): a sample then makes no matrix of its own, which was most of a restamp's time.
    /// </summary>
    public MnaSystem RestampedInto(Network network, SystemMatrix scratch, Complex[] rhs)
    {
        scratch.Clear();
        Array.Clear(rhs);
        var (nonlinear, linear, hasSource) = Stamp(network, scratch, rhs);
        return new MnaSystem(this, scratch, nonlinear, rhs) { LinearLoads = linear, HasSource = hasSource };
    }

    /// <param name="collect">Whether to list the loads (assembly does; a restamp keeps the first system's lists).</param>
    private (ImmutableArray<NonlinearLoad>, ImmutableArray<LinearLoad>, bool) Stamp(Network network, SystemMatrix A, Complex[] B, bool collect = true)
    {
        var nonlinear = collect ? ImmutableArray.CreateBuilder<NonlinearLoad>() : null;
        var linear = collect ? ImmutableArray.CreateBuilder<LinearLoad>() : null;
        var hasSource = false;
        // Branch current leaving node a and entering node b.
        void Branch(int column, int a, int b)
        {
            if (Column(a) is var ra and >= 0) A.Add(ra, column, 1);
            if (Column(b) is var rb and >= 0) A.Add(rb, column, -1);
        }
        // Row gets +V_a − V_b.
        void Across(int row, int a, int b)
        {
            if (Column(a) is var ca and >= 0) A.Add(row, ca, 1);
            if (Column(b) is var cb and >= 0) A.Add(row, cb, -1);
        }

        // The same entries as Branch, Across and the core's row for each section, in the same order.
        foreach (var (k, row, ca, cb, coreColumn, r, columns) in SectionPlaces(network))
        {
            var s = network.Sections[k];
            if (ca >= 0) A.Add(ca, row, 1);
            if (cb >= 0) A.Add(cb, row, -1);
            if (ca >= 0) A.Add(row, ca, 1);
            if (cb >= 0) A.Add(row, cb, -1);
            var core = network.Cores[s.Core];
            A.Add(row, coreColumn, -s.Turns);
            A.Add(coreColumn, row, s.Turns);
            for (var c = 0; c < columns.Length; c++)
                A.Add(row, columns[c], -core.Impedance[r, c]);
        }
        foreach (var c in group.Cores)
            A.Add(CoreColumn[c], CoreColumn[c], -network.Cores[c].Admittance);
        // Limbs of one three-phase core share the return path (MagneticCircuit): −Yr·(e_a + e_b + e_c) in each limb's row.
        foreach (var m in network.Couplings)
            if (CoreColumn.ContainsKey(m.Limbs[0]))
                foreach (var j in m.Limbs)
                    foreach (var k in m.Limbs) A.Add(CoreColumn[j], CoreColumn[k], -m.ReturnAdmittance);
        foreach (var i in group.Supplies)
        {
            var s = network.Supplies[i];
            var row = SupplyColumn[i];
            // The supply's current leaves its positive terminal into the network.
            Branch(row, s.NodeQ, s.NodeP);
            Across(row, s.NodeP, s.NodeQ);
            A.Add(row, row, s.Impedance);
            B[row] = s.Voltage;
            hasSource |= s.Voltage != Complex.Zero;
        }
        if (FaultColumn >= 0)
        {
            var (a, b) = (network.Node(spec.Fault!.A.Name), network.Node(spec.Fault.B.Name));
            Branch(FaultColumn, a, b);
            Across(FaultColumn, a, b);
            A.Add(FaultColumn, FaultColumn, -spec.Fault.Impedance);
        }
        if (spec.WithoutLoads) return ([], [], hasSource);
        foreach (var i in group.Loads)
        {
            var l = network.Loads[i];
            var (ca, cb) = (Column(l.NodeA), Column(l.NodeB));
            if (l.Source.Exponent == 2)
            {
                // Constant impedance: the S drawn at 1 V is |V|²·conj(Y), so Y = conj(S0)/V0².
                var y = Complex.Conjugate(l.Source.S0) / (l.Source.V0 * l.Source.V0);
                if (ca >= 0) { A.Add(ca, ca, y); if (cb >= 0) A.Add(ca, cb, -y); }
                if (cb >= 0) { A.Add(cb, cb, y); if (ca >= 0) A.Add(cb, ca, -y); }
                linear?.Add(new LinearLoad(i, ca, cb));
            }
            else nonlinear?.Add(new NonlinearLoad(i, ca, cb, l.Source.S0, l.Source.V0, l.Source.Exponent));
        }
        return (nonlinear?.ToImmutable() ?? [], linear?.ToImmutable() ?? [], hasSource);
    }

    /// <summary>Where each section of the part is stamped: its row, its nodes' columns, its core's column, its place among the core's sections and their columns.</summary>
    private readonly record struct SectionPlace(int Section, int Row, int ColumnA, int ColumnB, int CoreColumn, int Position, int[] CoreSections);

    private sealed record Places(ImmutableArray<Section> Sections, SectionPlace[] Found);

    private Places? places;

    /// <summary>
    /// The section places of this part, found once from the network's sections (a network of the
    /// same shape, a brush moved, has the same list when its turns are all that changed, or a list
    /// of the same wiring): every stamp of a sweep point would otherwise look each up by dictionary.
    /// </summary>
    private SectionPlace[] SectionPlaces(Network network)
    {
        if (places is { } p && (p.Sections == network.Sections || SameWiring(p.Sections, network.Sections))) return p.Found;
        var found = new SectionPlace[group.Sections.Count];
        for (var i = 0; i < found.Length; i++)
        {
            var k = group.Sections[i];
            var s = network.Sections[k];
            var core = network.Cores[s.Core];
            found[i] = new SectionPlace(k, SectionColumn[k], Column(s.NodeA), Column(s.NodeB), CoreColumn[s.Core], core.Sections.IndexOf(k),
                [.. core.Sections.Select(c => SectionColumn[c])]);
        }
        places = new Places(network.Sections, found);
        return found;

        static bool SameWiring(ImmutableArray<Section> a, ImmutableArray<Section> b)
        {
            if (a.Length != b.Length) return false;
            for (var i = 0; i < a.Length; i++)
                if (a[i].NodeA != b[i].NodeA || a[i].NodeB != b[i].NodeB || a[i].Core != b[i].Core) return false;
            return true;
        }
    }

    /// <summary>Where a node is named; a node the file does not name (a phase's, a test's) is where the first element on it is written.</summary>
    /// <remarks>
    /// Every section and supply on a node of the part is in the part (they link it), and its lists
    /// ascend, so the first of its own is the first of the network's: a three-phase file of many
    /// units does not search every element per node. A load links its node only with loads, so it
    /// is searched for in the network, and only for a node on no section or supply.
    /// </remarks>
    private static TextSpan PointSpan(Network network, SolveGroup group, int node)
    {
        if (network.Model.Symbols.Find(network.Nodes[node].Name) is { } named) return named.Span;
        foreach (var k in group.Sections)
            if (network.Sections[k] is var s && (s.NodeA == node || s.NodeB == node)) return network.Windings[s.Winding].Source.Line;
        foreach (var i in group.Supplies)
            if (network.Supplies[i] is var s && (s.NodeP == node || s.NodeQ == node)) return s.Source.Line;
        return network.Loads.Where(l => l.NodeA == node || l.NodeB == node).Select(l => (TextSpan?)l.Source.Line).FirstOrDefault() ?? default;
    }

}

/// <summary>An independent part of the network: what is linked by wires or by a core is solved together.</summary>
internal sealed record SolveGroup(List<int> Nodes, List<int> Sections, List<int> Supplies, List<int> Loads, List<int> Cores, bool HasFault)
{
    /// <summary>
    /// Earth is the reference of every grounded part but carries no unknown and no KCL row, so it
    /// links nothing: two grounded units stay two small systems instead of one large one.
    /// </summary>
    public static List<SolveGroup> Find(Network network, CaseSpec spec)
    {
        int faultA = -1, faultB = -1;
        if (spec.Fault is { } f) (faultA, faultB) = (network.Node(f.A.Name), network.Node(f.B.Name));
        // A fault's case is its part alone (NetworkSolver), so only that part is wanted: the parts of
        // the wiring are found once (Wiring), and a file of many units then costs each fault the size
        // of its unit, not the size of the whole file.
        if (faultA >= 0 && faultB >= 0 && Wiring.Of(network).FaultedPart(faultA, faultB, !spec.WithoutLoads) is { } part) return [part];
        var loads = spec.WithoutLoads ? [] : network.Loads.Where(l => l.NodeA != l.NodeB).ToList();
        var sets = Islands.Parts(network, !spec.WithoutLoads, faultA >= 0 ? [(faultA, faultB)] : []);
        var faulted = faultA >= 0 && Islands.Anchor(network, faultA, faultB) is var anchor and >= 0 ? sets.Find(anchor) : -1;
        var groups = Gather(network, sets, loads, faulted);
        if (faulted >= 0) return [groups[faulted] with { HasFault = true }];
        return groups.OrderBy(g => g.Key).Select(g => g.Value).ToList();
    }

    /// <summary>The parts of <paramref name="sets"/> by their root, each list ascending; only the part of root <paramref name="only"/> unless it is −1.</summary>
    internal static Dictionary<int, SolveGroup> Gather(Network network, DisjointSets sets, IEnumerable<LoadNet> loads, int only)
    {
        var nodeCount = network.Nodes.Length;
        var earth = network.EarthNode;
        var groups = new Dictionary<int, SolveGroup>();
        SolveGroup? Of(int vertex)
        {
            var root = sets.Find(vertex);
            if (only >= 0 && root != only) return null;
            if (!groups.TryGetValue(root, out var g)) groups[root] = g = new SolveGroup([], [], [], [], [], false);
            return g;
        }
        for (var n = 0; n < nodeCount; n++)
            if (n != earth) Of(n)?.Nodes.Add(n);
        foreach (var s in network.Sections) Of(nodeCount + s.Core)?.Sections.Add(s.Index);
        foreach (var s in network.Supplies) Of(Islands.Anchor(network, s.NodeP, s.NodeQ))?.Supplies.Add(s.Index);
        foreach (var l in loads) Of(Islands.Anchor(network, l.NodeA, l.NodeB))?.Loads.Add(l.Index);
        for (var c = 0; c < network.Cores.Length; c++)
            if (network.Cores[c].Sections.Length > 0) Of(nodeCount + c)?.Cores.Add(c);
        return groups;
    }
}

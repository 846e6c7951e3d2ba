using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>An unknown or an equation of the system, named for diagnostics.</summary>
internal readonly record struct Element(string Kind, string Name, TextSpan Span);

/// <summary>A constant-power or constant-current load, by the columns of its two nodes (−1 for a reference).</summary>
internal readonly record struct NonlinearLoad(int Load, int ColumnA, int ColumnB, Complex S0, double V0, int Exponent);

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
/// </summary>
internal sealed class MnaSystem
{
    public int Size;
    public SystemMatrix A = null!;
    public Complex[] B = null!;
    public readonly List<Element> Unknowns = [];
    public readonly List<Element> Equations = [];
    public readonly Dictionary<int, int> NodeColumn = [];
    public readonly Dictionary<int, int> SectionColumn = [];
    public readonly Dictionary<int, int> SupplyColumn = [];
    public readonly Dictionary<int, int> CoreColumn = [];
    public int FaultColumn = -1;
    public List<NonlinearLoad> NonlinearLoads { get; private set; } = [];
    public List<(int Load, int ColumnA, int ColumnB)> LinearLoads { get; private set; } = [];
    public bool HasSource;

    public int Column(int node) => NodeColumn.TryGetValue(node, out var c) ? c : -1;

    private SolveGroup group = null!;
    private CaseSpec spec = null!;

    public static MnaSystem Assemble(Network network, SolveGroup group, int[] reference, CaseSpec spec)
    {
        var m = new MnaSystem { group = group, spec = spec };
        var model = network.Model;
        foreach (var n in group.Nodes.Where(n => reference[n] != n))
        {
            m.NodeColumn[n] = m.Unknowns.Count;
            m.Unknowns.Add(new Element("node", network.Nodes[n].Name, PointSpan(model, network.Nodes[n].Name)));
            m.Equations.Add(new Element("node", network.Nodes[n].Name, PointSpan(model, network.Nodes[n].Name)));
        }
        foreach (var k in group.Sections)
        {
            var w = network.Windings[network.Sections[k].Winding].Source;
            m.SectionColumn[k] = m.Unknowns.Count;
            m.Unknowns.Add(new Element("section", network.Sections[k].Name, w.Line));
            m.Equations.Add(new Element("section", network.Sections[k].Name, w.Line));
        }
        foreach (var s in group.Supplies)
        {
            m.SupplyColumn[s] = m.Unknowns.Count;
            m.Unknowns.Add(new Element("supply", network.Supplies[s].Name, network.Supplies[s].Source.Line));
            m.Equations.Add(new Element("supply", network.Supplies[s].Name, network.Supplies[s].Source.Line));
        }
        if (group.HasFault)
        {
            m.FaultColumn = m.Unknowns.Count;
            m.Unknowns.Add(new Element("fault", spec.Fault!.Name, spec.Fault.Line));
            m.Equations.Add(new Element("fault", spec.Fault.Name, spec.Fault.Line));
        }
        foreach (var c in group.Cores)
        {
            m.CoreColumn[c] = m.Unknowns.Count;
            m.Unknowns.Add(new Element("core", network.Cores[c].Name, network.Cores[c].Source.Line));
            m.Equations.Add(new Element("core", network.Cores[c].Name, network.Cores[c].Source.Line));
        }
        m.Size = m.Unknowns.Count;
        m.A = new SystemMatrix(m.Size);
        m.B = new Complex[m.Size];
        m.Stamp(network, group, spec);
        return m;
    }

    /// <summary>A copy with matrices of its own, for <see cref="Restamp"/>.</summary>
    public MnaSystem Copy()
    {
        var m = (MnaSystem)MemberwiseClone();
        m.A = A.Clone();
        m.B = (Complex[])B.Clone();
        m.NonlinearLoads = [.. NonlinearLoads];
        m.LinearLoads = [.. LinearLoads];
        return m;
    }

    /// <summary>
    /// The numbers stamped again, in place, from a network of the same shape (a brush moved): the
    /// unknowns and equations and their names stay, so nothing but the numbers is made again.
    /// </summary>
    public void Restamp(Network network)
    {
        A.Clear();
        Array.Clear(B);
        NonlinearLoads.Clear();
        LinearLoads.Clear();
        HasSource = false;
        Stamp(network, group, spec);
    }

    private void Stamp(Network network, SolveGroup group, CaseSpec spec)
    {
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

        foreach (var k in group.Sections)
        {
            var s = network.Sections[k];
            var row = SectionColumn[k];
            Branch(row, s.NodeA, s.NodeB);
            Across(row, s.NodeA, s.NodeB);
            var core = network.Cores[s.Core];
            A.Add(row, CoreColumn[s.Core], -s.Turns);
            A.Add(CoreColumn[s.Core], row, s.Turns);
            var r = core.Sections.IndexOf(k);
            for (var c = 0; c < core.Sections.Length; c++)
                A.Add(row, SectionColumn[core.Sections[c]], -core.Impedance[r, c]);
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
            HasSource |= s.Voltage != Complex.Zero;
        }
        if (FaultColumn >= 0)
        {
            var (a, b) = (network.Node(spec.Fault!.A.Name), network.Node(spec.Fault.B.Name));
            Branch(FaultColumn, a, b);
            Across(FaultColumn, a, b);
            A.Add(FaultColumn, FaultColumn, -spec.Fault.Impedance);
        }
        if (spec.WithoutLoads) return;
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
                LinearLoads.Add((i, ca, cb));
            }
            else NonlinearLoads.Add(new NonlinearLoad(i, ca, cb, l.Source.S0, l.Source.V0, l.Source.Exponent));
        }
    }

    private static TextSpan PointSpan(Model.Model model, string point) =>
        model.Symbols.Find(point)?.Span ?? default;
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
        var nodeCount = network.Nodes.Length;
        var earth = network.EarthNode;
        var loads = spec.WithoutLoads ? [] : network.Loads.Where(l => l.NodeA != l.NodeB).ToList();
        int faultA = -1, faultB = -1;
        if (spec.Fault is { } f) (faultA, faultB) = (network.Node(f.A.Name), network.Node(f.B.Name));
        var sets = Islands.Parts(network, !spec.WithoutLoads, faultA >= 0 ? [(faultA, faultB)] : []);
        // A fault's case is its part alone (NetworkSolver), so only that part is gathered: a file of
        // many units then costs each fault lists the size of its unit, not lists of the whole file.
        var faulted = faultA >= 0 && Islands.Anchor(network, faultA, faultB) is var anchor and >= 0 ? sets.Find(anchor) : -1;
        var groups = new Dictionary<int, SolveGroup>();
        SolveGroup? Of(int vertex)
        {
            var root = sets.Find(vertex);
            if (faulted >= 0 && root != faulted) return null;
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
        if (faulted >= 0) return [groups[faulted] with { HasFault = true }];
        return groups.OrderBy(g => g.Key).Select(g => g.Value).ToList();
    }
}

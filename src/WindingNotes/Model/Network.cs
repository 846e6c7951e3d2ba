using System.Collections.Immutable;
using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>An electrical node: the connection points joined into it. Earth is the node of all grounded points.</summary>
public sealed record NetworkNode(int Index, ImmutableArray<string> Points, bool IsEarth)
{
    public string Name => Points.IsEmpty ? "earth" : Points[0];
}

/// <summary>A winding as the network sees it: turns (derived where the document gave only voltages) and ratings.</summary>
public sealed record WindingNet(int Index, WindingModel Source, int Core, double Turns, bool TurnsKnown, double? RatedVoltage, double? RatedCurrent, double Resistance)
{
    public string Name => Source.Name;
}

/// <summary>
/// A section: the part of a winding between two neighbouring points. Node A is the end nearer the
/// winding's polarity end; the section's current is the current entering it there. Its resistance
/// is on the diagonal of its core's impedance matrix.
/// </summary>
public sealed record Section(int Index, string Name, int Winding, int Core, int NodeA, int NodeB, string FromPoint, string ToPoint, double Turns);

/// <summary>
/// A core: its sections, the impedance matrix among them (ohms: resistances on the diagonal plus
/// the leakage matrix in per-turn form scaled by the turns), and its magnetising admittance
/// referred to one turn (zero for an ideal core).
/// </summary>
public sealed record CoreNet(int Index, CoreModel Source, ImmutableArray<int> Sections, Complex[,] Impedance, Complex Admittance, double? FluxLimit)
{
    public string Name => Source.Name;

    /// <summary>The winding of the open-circuit test the admittance comes from, or −1.</summary>
    public int NoLoadWinding { get; init; } = -1;

    /// <summary>How <see cref="Impedance"/> follows from the sections' turns; null on a core built by hand.</summary>
    public SectionCoupling? Coupling { get; init; }
}

/// <summary>
/// A core's impedance matrix as a function of its sections' turns: Z[p][q] = N_p·N_q·PerTurn[m(p)][m(q)]
/// + δ_pq·Series[m(p)]·N_p, with m(p) the leakage member of section p (its position in the core's list)
/// and Series the member's series resistance per turn squared times its turns. A brush that moves
/// inside one member leaves the members as they are and changes the turns only.
/// </summary>
public sealed record SectionCoupling(int[] MemberOf, Complex[,] PerTurn, double[] Series)
{
    public Complex[,] Matrix(IReadOnlyList<double> turns)
    {
        var n = turns.Count;
        var z = new Complex[n, n];
        // The turns once into an array: every sample and brush move builds this, and the list's reads were an interface call each.
        var t = new double[n];
        for (var p = 0; p < n; p++) t[p] = turns[p];
        for (var p = 0; p < n; p++)
            for (var q = 0; q < n; q++)
                z[p, q] = Entry(t[p], t[q], p, q);
        return z;
    }

    /// <summary>
    /// <see cref="Matrix"/> of <paramref name="turns"/>, from the matrix <paramref name="before"/> of turns that differ
    /// only where <paramref name="changed"/> says: each entry is a product of its two sections' turns,
    /// so only the rows and columns of those sections are computed again, each as <see cref="Matrix"/> computes it
    /// (the same numbers, bit for bit); a moved brush changes two sections of a core of many.
    /// </summary>
    public Complex[,] Matrix(IReadOnlyList<double> turns, Complex[,] before, bool[] changed)
    {
        var n = turns.Count;
        var z = (Complex[,])before.Clone();
        for (var p = 0; p < n; p++)
            for (var q = 0; q < n; q++)
                if (changed[p] || changed[q]) z[p, q] = Entry(turns[p], turns[q], p, q);
        return z;
    }

    /// <summary>The entry of sections p and q, of <paramref name="tp"/> and <paramref name="tq"/> turns: mutual by the turns' product, and on the diagonal the section's series part added.</summary>
    private Complex Entry(double tp, double tq, int p, int q)
    {
        var z = tp * tq * PerTurn[MemberOf[p], MemberOf[q]];
        return p == q ? z + Series[MemberOf[p]] * tp : z;
    }
}

public sealed record SupplyNet(int Index, SupplyModel Source, int NodeP, int NodeQ, Complex Voltage, Complex Impedance)
{
    public string Name => Source.Name;
}

public sealed record LoadNet(int Index, LoadModel Source, int NodeA, int NodeB)
{
    public string Name => Source.Name;
}

/// <summary>The network the solver works on, built from the model. Indices into its arrays are the solver's names.</summary>
public sealed record Network(
    Model Model,
    ImmutableArray<NetworkNode> Nodes,
    ImmutableDictionary<string, int> NodeOfPoint,
    ImmutableArray<WindingNet> Windings,
    ImmutableArray<Section> Sections,
    ImmutableArray<CoreNet> Cores,
    ImmutableArray<SupplyNet> Supplies,
    ImmutableArray<LoadNet> Loads,
    ImmutableArray<Diagnostic> Diagnostics)
{
    public int Node(string point) => NodeOfPoint.TryGetValue(point, out var n) ? n : -1;

    /// <summary>The earth node, or −1; found once per node array, as the solver asks for it per element.</summary>
    public int EarthNode
    {
        get
        {
            var nodes = ImmutableCollectionsMarshal.AsArray(Nodes);
            if (nodes is null) return -1;
            return Earths.GetValue(nodes, n => new StrongBox<int>(Array.FindIndex(n, x => x.IsEarth) is var i and >= 0 ? n[i].Index : -1)).Value;
        }
    }

    private static readonly ConditionalWeakTable<NetworkNode[], StrongBox<int>> Earths = new();

    /// <summary>The limbs of three-phase cores linked through their yokes.</summary>
    public ImmutableArray<MagneticCoupling> Couplings { get; init; } = [];

    /// <summary>How many of <see cref="Diagnostics"/>, first, come of the values (turns, leakage, supplies); the rest come of the wiring (<see cref="NetworkBuilder.Restamp"/> keeps those).</summary>
    internal int ValueDiagnostics { get; init; }

    /// <summary>The vector group of each three-phase core with two or more three-phase windings, from the wiring.</summary>
    public ImmutableArray<VectorGroup> VectorGroups { get; init; } = [];
}

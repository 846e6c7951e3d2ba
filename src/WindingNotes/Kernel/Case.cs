using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Kernel;

/// <summary>One swept value at a sweep point: the target's name, its value in SI (fractions for %), and as the report writes it.</summary>
public sealed record SweepValue(string Name, double Value, string Text)
{
    public override string ToString() => $"{Name}={Text}";
}

/// <summary>
/// What a case changes on the network: the loads taken off (the no-load case for regulation), a
/// fault put on, or the swept values it was bound with.
/// </summary>
public sealed record CaseSpec(string Name, bool WithoutLoads = false, FaultModel? Fault = null)
{
    public static readonly CaseSpec Normal = new("normal");

    public static readonly CaseSpec NoLoad = new("no-load", WithoutLoads: true);

    /// <summary>The swept values of a sweep point, in the order of the sweep lines; empty for other cases.</summary>
    public ImmutableArray<SweepValue> Sweep { get; init; } = [];

    public bool IsSweepPoint => !Sweep.IsEmpty;

    /// <summary>How messages name the case: "BR=25 %" for a sweep point, "as written" for the normal case.</summary>
    public string Where => IsSweepPoint ? SweepWords() : Fault is not null ? Name : "as written";

    /// <summary>A sweep point's values worded once (the checks, the ratings and the cautions each ask where it is), kept with the list they word, so a copy with other values words its own.</summary>
    private string SweepWords()
    {
        if (words is { } w && w.Of == Sweep) return w.Text;
        var text = string.Join(" ", Sweep);
        words = new Words(Sweep, text);
        return text;
    }

    private Words? words;

    private sealed record Words(ImmutableArray<SweepValue> Of, string Text);

    public static CaseSpec ForFault(FaultModel fault) => new($"fault {fault.Name}", Fault: fault);

    public static CaseSpec ForSweep(ImmutableArray<SweepValue> values) => new($"sweep {string.Join(" ", values)}") { Sweep = values };

    /// <summary>The no-load companion of a case (for regulation and excitation at no load), keeping its swept values.</summary>
    public CaseSpec WithoutLoad() => this == Normal ? NoLoad : new CaseSpec($"{Name} no-load", WithoutLoads: true) { Sweep = Sweep };

    /// <summary>The same case with the same swept values, in whatever list (a record compares its list by reference).</summary>
    public bool Equals(CaseSpec? other) => other is not null && (ReferenceEquals(this, other) ||
        Name == other.Name && WithoutLoads == other.WithoutLoads && Fault == other.Fault && Sequences.Equal(Sweep, other.Sweep));

    public override int GetHashCode() => HashCode.Combine(Name, WithoutLoads, Fault);
}

/// <summary>
/// The solved unknowns of one case, indexed like the network's arrays. Currents follow the
/// conventions of the notation: a section's current enters its from-side end, a supply's leaves its
/// positive terminal, a load's enters its first node, a fault's flows from its first node to its second.
/// </summary>
public sealed record Solution(
    Network Network,
    CaseSpec Case,
    Phasors NodeVoltages,
    Phasors SectionCurrents,
    Phasors CoreVoltsPerTurn,
    Phasors SupplyCurrents,
    Phasors LoadCurrents,
    Complex FaultCurrent,
    bool Solved,
    ImmutableArray<Diagnostic> Diagnostics)
{
    public Complex Voltage(int node) => node < 0 ? Complex.Zero : NodeVoltages[node];

    public Complex SectionVoltage(Section s) => Voltage(s.NodeA) - Voltage(s.NodeB);

    public Complex LoadVoltage(LoadNet l) => Voltage(l.NodeA) - Voltage(l.NodeB);

    public Complex SupplyVoltage(SupplyNet s) => Voltage(s.NodeP) - Voltage(s.NodeQ);

    /// <summary>The part of the network the case solved when it is not all of it; null when it is.</summary>
    public CaseScope? Scope { get; init; }

    /// <summary>False once <see cref="Compact"/> has let the vectors go.</summary>
    public bool HasVectors => NodeVoltages.Length == Network.Nodes.Length;

    /// <summary>
    /// The same solution without its vectors, once its case's results hold what they say: the study
    /// keeps fault cases and sweep points so, and a file of many units and faults, or a long sweep,
    /// then holds its results and not every unknown of every case besides.
    /// </summary>
    public Solution Compact() => this with { NodeVoltages = default, SectionCurrents = default, CoreVoltsPerTurn = default, SupplyCurrents = default, LoadCurrents = default };

    /// <summary>
    /// The same solution: of that network (the instance solved, not one of equal parts), the same case,
    /// unknowns and messages, compared by value (a record compares its arrays by reference).
    /// </summary>
    public bool Equals(Solution? other) => other is not null && (ReferenceEquals(this, other) ||
        ReferenceEquals(Network, other.Network) && Case == other.Case && FaultCurrent.Equals(other.FaultCurrent) && Solved == other.Solved && Scope == other.Scope
        && NodeVoltages.Equals(other.NodeVoltages) && SectionCurrents.Equals(other.SectionCurrents)
        && CoreVoltsPerTurn.Equals(other.CoreVoltsPerTurn) && SupplyCurrents.Equals(other.SupplyCurrents)
        && LoadCurrents.Equals(other.LoadCurrents) && Sequences.Equal(Diagnostics, other.Diagnostics));

    public override int GetHashCode() => HashCode.Combine(Case, NodeVoltages.Length, Solved);
}

/// <summary>
/// The solved values of one kind of unknown of a case (node voltages, section currents …), indexed
/// like the network's array of that element; zero where the case did not solve the element. A case
/// of the whole network holds them in one array; a fault's case (one part of many) holds only its
/// part's, so a file of n units and n faults does not allocate and clear n arrays of the whole file.
/// </summary>
public readonly struct Phasors : IEquatable<Phasors>
{
    private readonly Complex[]? values;
    // For a part: the place in values of each element's index.
    private readonly Dictionary<int, int>? place;

    private Phasors(Complex[] values, Dictionary<int, int>? place, int length) => (this.values, this.place, Length) = (values, place, length);

    /// <summary>How many elements the network has of this kind (0 once let go).</summary>
    public int Length { get; }

    public Complex this[int index]
    {
        get
        {
            if (place is null) return values![index];
            ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual((uint)index, (uint)Length, nameof(index));
            return place.TryGetValue(index, out var at) ? values![at] : Complex.Zero;
        }
    }

    /// <summary>Every element's value, as one array of the network's length.</summary>
    public Complex[] ToArray()
    {
        if (place is null) return values is null ? [] : (Complex[])values.Clone();
        var all = new Complex[Length];
        foreach (var (index, at) in place) all[index] = values![at];
        return all;
    }

    /// <summary>Equal when every element's value is, however each holds them (a part's values or the whole network's).</summary>
    public bool Equals(Phasors other) => Length == other.Length && ToArray().AsSpan().SequenceEqual(other.ToArray());

    public override bool Equals(object? obj) => obj is Phasors other && Equals(other);

    public override int GetHashCode() => Length;

    /// <summary>Values set one element at a time: into an array of the whole network, or of a part only.</summary>
    internal sealed class Builder(int length, bool partOnly)
    {
        private readonly Complex[]? all = partOnly ? null : new Complex[length];
        // The whole network's: the indices set. A part's: each index's place in values.
        private readonly List<int> set = [];
        private readonly Dictionary<int, int>? place = partOnly ? [] : null;
        private readonly List<Complex> values = [];

        public void Set(int index, Complex value)
        {
            if (all is not null)
            {
                all[index] = value;
                set.Add(index);
            }
            else if (place!.TryGetValue(index, out var at)) values[at] = value;
            else
            {
                place[index] = values.Count;
                values.Add(value);
            }
        }

        /// <summary>The largest magnitude set (NaN passed over).</summary>
        public double Largest()
        {
            var max = 0.0;
            if (all is not null)
                foreach (var i in set)
                    if (all[i].Magnitude > max) max = all[i].Magnitude;
            foreach (var v in values)
                if (v.Magnitude > max) max = v.Magnitude;
            return max;
        }

        /// <summary>Each part of a value set within <paramref name="limit"/> of zero made zero: rounding leaves 1e-17 where the answer is zero.</summary>
        public void Chop(double limit)
        {
            if (all is not null)
                foreach (var i in set) all[i] = Chopped(all[i], limit);
            var span = System.Runtime.InteropServices.CollectionsMarshal.AsSpan(values);
            for (var k = 0; k < span.Length; k++) span[k] = Chopped(span[k], limit);
        }

        private static Complex Chopped(Complex v, double limit) =>
            new(Math.Abs(v.Real) <= limit ? 0 : v.Real, Math.Abs(v.Imaginary) <= limit ? 0 : v.Imaginary);

        public Phasors Build() => all is not null ? new Phasors(all, null, length) : new Phasors([.. values], place, length);
    }
}

/// <summary>
/// The elements of the part of the network a case is about. A fault changes only the independent
/// part it is in, so its case solves and reports that part; every other part is as in the normal case.
/// </summary>
public sealed record CaseScope(IReadOnlySet<string> Points, IReadOnlySet<int> Sections, IReadOnlySet<int> Cores, IReadOnlySet<int> Supplies, IReadOnlySet<int> Loads)
{
    /// <summary>The same elements (a record compares its sets by reference).</summary>
    public bool Equals(CaseScope? other) => other is not null && (ReferenceEquals(this, other) ||
        Sequences.Equal(Points, other.Points) && Sequences.Equal(Sections, other.Sections) && Sequences.Equal(Cores, other.Cores)
        && Sequences.Equal(Supplies, other.Supplies) && Sequences.Equal(Loads, other.Loads));

    public override int GetHashCode() => HashCode.Combine(Points.Count, Sections.Count, Supplies.Count, Loads.Count);
}

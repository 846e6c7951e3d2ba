using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// Symmetrical components of a phase set (Fortescue's transformation, R29): X0 = (Xa + Xb + Xc)/3,
/// X1 = (Xa + a·Xb + a²·Xc)/3, X2 = (Xa + a²·Xb + a·Xc)/3 with a = 1∠120°. Derived from phase values,
/// never the other way round.
/// </summary>
public sealed record Sequence(Complex Zero, Complex Positive, Complex Negative)
{
    public static Sequence Of(Complex xa, Complex xb, Complex xc)
    {
        var a = Phases.A;
        return new Sequence((xa + xb + xc) / 3, (xa + a * xb + a * a * xc) / 3, (xa + a * a * xb + a * xc) / 3);
    }

    /// <summary>|X2|/|X1|: for voltages the voltage unbalance factor as IEC 61000-2-12 and IEC 61000-4-30 define it (R35); null without a positive sequence.</summary>
    public double? Unbalance => Positive.Magnitude > 0 ? Negative.Magnitude / Positive.Magnitude : null;

    /// <summary>
    /// The unbalance factor in the sequence the supplies run in: a source written 'sequence acb'
    /// runs in what the abc frame calls the negative sequence, so there the factor is |X1|/|X2|.
    /// </summary>
    public double? UnbalanceIn(bool acb) => !acb ? Unbalance : Negative.Magnitude > 0 ? Positive.Magnitude / Negative.Magnitude : null;
}

/// <summary>
/// A three-phase terminal set in a case: line voltages against the reference, line-to-line voltages
/// (ab, bc, ca), the currents of the phase elements and of the lines (into the element at each line
/// terminal), the neutral current (out at the star point, zero-sequence times three), the totals of
/// the three phases, and the sequence components of the line voltages and currents.
/// </summary>
public sealed record PhaseSetResult(string Name, string Kind, ImmutableArray<Complex> Voltages, ImmutableArray<Complex> LineToLine,
    ImmutableArray<Complex> PhaseCurrents, ImmutableArray<Complex> LineCurrents, Complex? NeutralCurrent, Complex Power, Sequence VoltageSequence, Sequence CurrentSequence)
{
    public double PowerFactor => Power.Magnitude == 0 ? 1 : Math.Abs(Power.Real) / Power.Magnitude;

    /// <summary>Whether the file's three-phase supplies all run in the acb sequence.</summary>
    public bool Acb { get; init; }

    /// <summary>The voltage unbalance factor, negative over positive sequence, in the sequence the supplies run in.</summary>
    public double? Unbalance => VoltageSequence.UnbalanceIn(Acb);

    /// <summary>The same set and values, its lists compared by their elements (a record compares them by reference).</summary>
    public bool Equals(PhaseSetResult? other) => other is not null && (ReferenceEquals(this, other) ||
        Name == other.Name && Kind == other.Kind && NeutralCurrent.Equals(other.NeutralCurrent) && Power.Equals(other.Power) && Acb == other.Acb
        && VoltageSequence == other.VoltageSequence && CurrentSequence == other.CurrentSequence
        && Sequences.Equal(Voltages, other.Voltages) && Sequences.Equal(LineToLine, other.LineToLine)
        && Sequences.Equal(PhaseCurrents, other.PhaseCurrents) && Sequences.Equal(LineCurrents, other.LineCurrents));

    public override int GetHashCode() => HashCode.Combine(Name, Kind, Power);
}

public sealed record ThreePhaseResult(ImmutableArray<PhaseSetResult> Sets, ImmutableArray<VectorGroup> VectorGroups)
{
    public static readonly ThreePhaseResult Empty = new([], []);

    // Indices built on first use: a file of many units looks up many sets and vector groups. Each is kept
    // with the list it indexes, so a copy made with another list ('with') indexes its own; one object, so a
    // reader on another thread sees a whole index or none.
    private sealed record Indexed<T>(ImmutableArray<T> Of, Dictionary<string, T> Index);

    private Indexed<VectorGroup>? byCore;
    private Indexed<PhaseSetResult>? byName;

    public VectorGroup? GroupOf(string core) =>
        (byCore is { } k && k.Of == VectorGroups ? k : byCore = new(VectorGroups, Index(VectorGroups, g => g.Core))).Index.GetValueOrDefault(core);

    /// <summary>The terminal set of a three-phase winding, supply or load by its name.</summary>
    public PhaseSetResult? SetOf(string name) =>
        (byName is { } k && k.Of == Sets ? k : byName = new(Sets, Index(Sets, s => s.Name))).Index.GetValueOrDefault(name);

    /// <summary>The same sets and vector groups, compared by their elements; the indices are no part of it.</summary>
    public bool Equals(ThreePhaseResult? other) => other is not null && (ReferenceEquals(this, other) ||
        Sequences.Equal(Sets, other.Sets) && Sequences.Equal(VectorGroups, other.VectorGroups));

    public override int GetHashCode() => HashCode.Combine(Sequences.Hash(Sets), Sequences.Hash(VectorGroups));

    private static Dictionary<string, T> Index<T>(IEnumerable<T> items, Func<T, string> key)
    {
        var index = new Dictionary<string, T>(StringComparer.Ordinal);
        foreach (var item in items) index.TryAdd(key(item), item);
        return index;
    }
}

public static class ThreePhaseResults
{
    public static ThreePhaseResult Of(Network network, CaseResult result)
    {
        var three = network.Model.ThreePhase;
        if (three.IsEmpty) return ThreePhaseResult.Empty;
        var sets = ImmutableArray.CreateBuilder<PhaseSetResult>();
        var sectionsOf = result.Sections.ToLookup(s => s.Winding.Name, StringComparer.Ordinal);
        foreach (var w in three.Windings)
        {
            var phases = w.PhaseWindings.Select(p => sectionsOf[p].ToList()).ToList();
            if (phases.Any(p => p.Count == 0)) continue;
            // Each phase winding as a branch from its from end (first section's current) to its to end (last section's).
            var branches = phases.Select(p => (p[0].Section.NodeA, p[^1].Section.NodeB, p[0].Current, p[^1].Current)).ToList();
            var power = phases.SelectMany(p => p).Aggregate(Complex.Zero, (s, x) => s + x.Voltage * Complex.Conjugate(x.Current));
            var star = w.StarPoint is { } point ? network.Node(point) : -1;
            sets.Add(Set(network, result, w.Name, "winding", w.LineTerminals.Select(t => t.Name), [.. branches.Select(b => b.Item3)], branches, star, power));
        }
        var supplies = result.Supplies.ToDictionary(s => s.Supply.Name, StringComparer.Ordinal);
        foreach (var s in three.Supplies)
        {
            var phases = Phases.All(s.Name).Select(p => supplies.GetValueOrDefault(p)).ToList();
            if (phases.Any(p => p is null)) continue;
            // A supply's current leaves its positive terminal into the network: into the set it is the reverse.
            var branches = phases.Select(p => (p!.Supply.NodeQ, p.Supply.NodeP, p.Current, p.Current)).ToList();
            var power = phases.Aggregate(Complex.Zero, (sum, p) => sum + p!.Power);
            var star = network.Node(s.Name + "_n");
            sets.Add(Set(network, result, s.Name, "supply", s.LineTerminals.Select(t => t.Name), [.. phases.Select(p => p!.Current)], branches, star, power, outward: true));
        }
        var loads = result.Loads.ToDictionary(l => l.Load.Name, StringComparer.Ordinal);
        foreach (var l in three.Loads)
        {
            var phases = l.PhaseLoads.Select(p => loads.GetValueOrDefault(p)).ToList();
            if (phases.Any(p => p is null)) continue;
            var branches = phases.Select(p => (p!.Load.NodeA, p.Load.NodeB, p.Current, p.Current)).ToList();
            var power = phases.Aggregate(Complex.Zero, (sum, p) => sum + p!.Power);
            var star = l.StarPoint is { } point ? network.Node(point) : -1;
            sets.Add(Set(network, result, l.Name, "load", l.LineTerminals.Select(t => t.Name), [.. phases.Select(p => p!.Current)], branches, star, power));
        }
        var acb = !three.Supplies.IsEmpty && three.Supplies.All(s => s.Acb);
        return new ThreePhaseResult([.. sets.Select(s => s with { Acb = acb })], network.VectorGroups);
    }

    /// <summary>
    /// Line currents by Kirchhoff at each line terminal: the currents of the set's branches that
    /// start there less those that end there (a delta's line current is the difference of two phase
    /// currents); the neutral current likewise at the star point, taken outward.
    /// </summary>
    private static PhaseSetResult Set(Network network, CaseResult result, string name, string kind, IEnumerable<string> terminals,
        Complex[] phaseCurrents, List<(int From, int To, Complex AtFrom, Complex AtTo)> branches, int star, Complex power, bool outward = false)
    {
        terminals = [.. terminals];
        var lines = terminals.Select(network.Node).ToArray();
        Complex Into(int node) => branches.Aggregate(Complex.Zero, (sum, b) => sum + (b.From == node ? b.AtFrom : 0) - (b.To == node ? b.AtTo : 0));
        var v = terminals.Select(result.PointVoltage).ToArray();
        var lineCurrents = lines.Select(n => outward ? -Into(n) : Into(n)).ToArray();
        var iScale = lineCurrents.Max(i => i.Magnitude);
        Complex? neutral = star >= 0 && !lines.Contains(star) ? Numbers.Clean(outward ? Into(star) : -Into(star), iScale) : null;
        // The total's parts likewise: the reactive powers of two phases that cancel leave rounding, not a figure.
        var pScale = v.Max(x => x.Magnitude) * Math.Max(iScale, phaseCurrents.Max(i => i.Magnitude));
        power = new Complex(Numbers.Clean(power.Real, pScale), Numbers.Clean(power.Imaginary, pScale));
        return new PhaseSetResult(name, kind, [.. v], [v[0] - v[1], v[1] - v[2], v[2] - v[0]], [.. phaseCurrents], [.. lineCurrents], neutral, power,
            Clean(Sequence.Of(v[0], v[1], v[2]), v.Max(x => x.Magnitude)), Clean(Sequence.Of(lineCurrents[0], lineCurrents[1], lineCurrents[2]), iScale));
    }

    /// <summary>Rounding left in a sum of phasors that cancel (a balanced set's zero sequence) is zero, so the same network gives the same bytes.</summary>
    private static Sequence Clean(Sequence s, double scale) => new(Numbers.Clean(s.Zero, scale), Numbers.Clean(s.Positive, scale), Numbers.Clean(s.Negative, scale));
}

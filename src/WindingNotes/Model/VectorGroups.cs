using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>One three-phase terminal set of a unit in its connection symbol: its letters and its clock number (null for the first, or where the wiring gives none).</summary>
public sealed record WindingSymbol(string Winding, string Letters, int? Clock);

/// <summary>
/// The vector group of a three-phase core, from its wiring: null <see cref="Symbol"/> with the
/// reason where the wiring gives no clock number.
/// </summary>
public sealed record VectorGroup(string Core, ImmutableArray<WindingSymbol> Windings, string? Symbol, string? Problem)
{
    /// <summary>The same group, its windings compared by their elements (a record compares its list by reference).</summary>
    public bool Equals(VectorGroup? other) => other is not null && (ReferenceEquals(this, other) ||
        Core == other.Core && Symbol == other.Symbol && Problem == other.Problem && Sequences.Equal(Windings, other.Windings));

    public override int GetHashCode() => HashCode.Combine(Core, Symbol);
}

/// <summary>
/// Vector groups from polarity marks and joins. The limbs of a core are given balanced
/// positive-sequence volts per turn, e_a = 1, e_b = a², e_c = a (a = 1∠120°); walking the network
/// along the sections on those limbs, each section gives V_A − V_B = N·e. The positive-sequence
/// component of each terminal set (Fortescue) then gives its phase displacement against the first
/// set; the clock number is that displacement in steps of 30°, the set lagging the first (IEC 60076-1).
/// A set whose voltages are not a balanced positive sequence, or a loop whose voltages do not close,
/// has no clock number: the phase whose reversal would give one is named.
/// </summary>
public static class VectorGroups
{
    public static ImmutableArray<VectorGroup> Find(Network network, DiagnosticBag diagnostics)
    {
        var result = ImmutableArray.CreateBuilder<VectorGroup>();
        var three = network.Model.ThreePhase;
        if (three.Cores.IsEmpty) return [];
        // Sorted out once, so that a file of many units stays linear in its length.
        var windingIndex = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var w in network.Windings) windingIndex.TryAdd(w.Name, w.Index);
        var windingsOn = three.Windings.ToLookup(w => w.Core, StringComparer.Ordinal);
        // A winding on a core the file does not declare has its sections on none (core -1).
        var sectionsOn = network.Sections.Where(s => s.Core >= 0).ToLookup(s => network.Cores[s.Core].Name, StringComparer.Ordinal);
        foreach (var core in three.Cores)
        {
            var onCore = windingsOn[core.Name].Where(w => w.PhaseWindings.All(windingIndex.ContainsKey)).ToList();
            if (onCore.Count < 2) continue;
            var sets = TerminalSets(network, onCore, windingIndex);
            var limbOf = core.Limbs.Select((l, k) => (l, k)).ToDictionary(x => x.l, x => x.k);
            var sections = core.Limbs.SelectMany(l => sectionsOn[l]).ToList();
            Complex Limb(Section s) => Complex.Pow(Phases.A, -limbOf[network.Cores[s.Core].Name]);
            var (potential, conflict) = Walk(network, sections, Limb, []);
            var symbols = ImmutableArray.CreateBuilder<WindingSymbol>();
            Complex? reference = null;
            string? problem = null;
            foreach (var set in sets)
            {
                var positive = Positive(set.Lines, potential, out var clean);
                if (conflict is null && clean && reference is null) reference = positive;
                int? clock = null;
                if (conflict is null && clean && reference is { } r && set != sets[0])
                {
                    var lag = -Complex.Divide(positive, r).Phase * 180 / Math.PI;
                    var steps = lag / 30;
                    if (Math.Abs(steps - Math.Round(steps)) < 1e-6) clock = (((int)Math.Round(steps) % 12) + 12) % 12;
                    else problem ??= $"'{set.Winding.Name}' is displaced {Numbers.Plain(-lag)}°, not a multiple of 30°";
                }
                if ((conflict is not null || !clean) && problem is null)
                {
                    var reversed = Reversed(network, sections, Limb, onCore, set, windingIndex);
                    problem = reversed is { } phase
                        ? $"phase winding '{phase}' is reversed: the wiring gives no clock number"
                        : $"the wiring of '{(conflict ?? set.Winding.Name)}' gives no balanced three-phase set and no clock number";
                    diagnostics.ReportNoClockNumber(set.Winding.Line, problem);
                }
                symbols.Add(new WindingSymbol(set.Winding.Name, set == sets[0] ? set.Letters.ToUpperInvariant() : set.Letters, set == sets[0] ? null : clock));
            }
            string? symbol = problem is null && symbols.Skip(1).All(s => s.Clock is not null)
                ? string.Concat(symbols.Select(s => s.Letters + s.Clock))
                : null;
            result.Add(new VectorGroup(core.Name, symbols.ToImmutable(), symbol, problem));
        }
        return result.ToImmutable();
    }

    /// <summary>
    /// The potentials a core's vector group is read from (balanced positive-sequence volts per turn
    /// on its limbs, walked along its sections), by node, for drawing its clock diagram; null where
    /// the core is not three-phase or a loop of its windings does not close.
    /// </summary>
    public static IReadOnlyDictionary<int, Complex>? Potentials(Network network, string core)
    {
        if (network.Model.ThreePhase.Cores.FirstOrDefault(c => c.Name == core) is not { } three) return null;
        var limbOf = three.Limbs.Select((l, k) => (l, k)).ToDictionary(x => x.l, x => x.k, StringComparer.Ordinal);
        var sections = network.Sections.Where(s => s.Core >= 0 && limbOf.ContainsKey(network.Cores[s.Core].Name)).ToList();
        var (potential, conflict) = Walk(network, sections, s => Complex.Pow(Phases.A, -limbOf[network.Cores[s.Core].Name]), []);
        return conflict is null ? potential : null;
    }

    private sealed record TerminalSet(ThreePhaseWindingModel Winding, int[] Lines, string Letters);

    /// <summary>
    /// The unit's terminal sets, highest voltage first: a series winding and the wye it ends on form
    /// an autotransformer, whose high-voltage set is the series winding's line ends and whose
    /// low-voltage set ("a") the wye's.
    /// </summary>
    private static List<TerminalSet> TerminalSets(Network network, List<ThreePhaseWindingModel> onCore, Dictionary<string, int> windingIndex)
    {
        WindingNet Phase(string name) => network.Windings[windingIndex[name]];
        int[] Nodes(IEnumerable<NodeRef> refs) => [.. refs.Select(r => network.Node(r.Name))];
        var sets = new List<(TerminalSet Set, double Voltage)>();
        var common = new HashSet<string>();
        foreach (var series in onCore.Where(w => w.Connection == PhaseConnection.Series))
        {
            var ends = Nodes(series.OtherEnds);
            var wye = onCore.FirstOrDefault(w => w.Connection == PhaseConnection.Wye && Nodes(w.LineTerminals).SequenceEqual(ends));
            if (wye is null) continue;
            common.Add(wye.Name);
            var star = wye.NeutralTerminal ? "yn" : "y";
            sets.Add((new TerminalSet(series, Nodes(series.LineTerminals), star), LineVoltage(Phase(series.PhaseWindings[0]), series) + LineVoltage(Phase(wye.PhaseWindings[0]), wye)));
            sets.Add((new TerminalSet(wye, ends, "a"), LineVoltage(Phase(wye.PhaseWindings[0]), wye)));
        }
        foreach (var w in onCore.Where(w => !common.Contains(w.Name) && !sets.Any(s => s.Set.Winding == w)))
            sets.Add((new TerminalSet(w, Nodes(w.LineTerminals), Letters(network, w, Phase)), LineVoltage(Phase(w.PhaseWindings[0]), w)));
        // Stable: equal voltages keep their source order.
        return [.. sets.Select((s, i) => (s, i)).OrderByDescending(x => x.s.Voltage).ThenBy(x => x.i).Select(x => x.s.Set)];
    }

    private static double LineVoltage(WindingNet first, ThreePhaseWindingModel w)
    {
        var phase = first.RatedVoltage ?? 0;
        return w.Connection switch
        {
            PhaseConnection.Wye or PhaseConnection.Series => phase * Math.Sqrt(3),
            PhaseConnection.Zigzag => phase * 3,
            _ => phase,
        };
    }

    /// <summary>IEC 60076-1 letters: y, d, z (n where the star point is a terminal), iii for independent phase windings.</summary>
    private static string Letters(Network network, ThreePhaseWindingModel w, Func<string, WindingNet> phaseNamed)
    {
        switch (w.Connection)
        {
            case PhaseConnection.Wye: return w.NeutralTerminal ? "yn" : "y";
            case PhaseConnection.Zigzag: return w.NeutralTerminal ? "zn" : "z";
            case PhaseConnection.Delta: return "d";
        }
        var phases = w.PhaseWindings.Select(p => phaseNamed(p).Source).ToList();
        var from = phases.Select(p => network.Node(p.From.Name)).ToList();
        var to = phases.Select(p => network.Node(p.To.Name)).ToList();
        if (to.Distinct().Count() == 1 || from.Distinct().Count() == 1) return "yn";
        if (Enumerable.Range(0, 3).All(k => from.Contains(to[k]))) return "d";
        return "iii";
    }

    /// <summary>Potentials along the sections from a first node of each part at zero; the first section whose loop does not close.</summary>
    private static (Dictionary<int, Complex> Potential, string? Conflict) Walk(Network network, List<Section> sections, Func<Section, Complex> limb, HashSet<int> flipped)
    {
        var potential = new Dictionary<int, Complex>();
        string? conflict = null;
        var byNode = sections.SelectMany(s => new[] { (Node: s.NodeA, S: s), (Node: s.NodeB, S: s) }).ToLookup(x => x.Node, x => x.S);
        foreach (var start in sections.Select(s => s.NodeA))
        {
            if (potential.ContainsKey(start)) continue;
            potential[start] = 0;
            var queue = new Queue<int>([start]);
            while (queue.Count > 0)
            {
                var n = queue.Dequeue();
                foreach (var s in byNode[n])
                {
                    var drop = s.Turns * limb(s) * (flipped.Contains(s.Winding) ? -1 : 1);
                    var (other, value) = s.NodeA == n ? (s.NodeB, potential[n] - drop) : (s.NodeA, potential[n] + drop);
                    if (!potential.TryGetValue(other, out var known))
                    {
                        potential[other] = value;
                        queue.Enqueue(other);
                    }
                    else if ((known - value).Magnitude > 1e-9 * Math.Max(1, value.Magnitude + s.Turns))
                        conflict ??= network.Windings[s.Winding].Name;
                }
            }
        }
        return (potential, conflict);
    }

    /// <summary>The positive-sequence component of a set (R29); clean when the negative-sequence component is negligible.</summary>
    private static Complex Positive(int[] lines, Dictionary<int, Complex> potential, out bool clean)
    {
        var v = lines.Select(n => potential.GetValueOrDefault(n)).ToArray();
        var a = Phases.A;
        var positive = (v[0] + a * v[1] + a * a * v[2]) / 3;
        var negative = (v[0] + a * a * v[1] + a * v[2]) / 3;
        clean = positive.Magnitude > 0 && negative.Magnitude < 1e-9 * positive.Magnitude && lines.All(potential.ContainsKey);
        return positive;
    }

    /// <summary>The phase winding whose reversal makes the wiring give a clock number, or null.</summary>
    private static string? Reversed(Network network, List<Section> sections, Func<Section, Complex> limb, List<ThreePhaseWindingModel> onCore, TerminalSet set, Dictionary<string, int> windingIndex)
    {
        foreach (var w in onCore.Prepend(set.Winding).Distinct())
            foreach (var phase in w.PhaseWindings)
            {
                var (potential, conflict) = Walk(network, sections, limb, [windingIndex[phase]]);
                if (conflict is not null) continue;
                var sets = TerminalSets(network, onCore, windingIndex);
                var clean = true;
                foreach (var s in sets)
                {
                    Positive(s.Lines, potential, out var c);
                    clean &= c;
                }
                if (clean) return phase;
            }
        return null;
    }
}

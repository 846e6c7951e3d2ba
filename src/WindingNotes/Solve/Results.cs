using System.Collections.Immutable;
using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

public sealed record SectionResult(Section Section, WindingNet Winding, Complex Current, Complex Voltage, double Apparent, double? Loading, double Loss)
{
    /// <summary>A/m², where the winding's conductor is given.</summary>
    public double? CurrentDensity { get; init; }
}

/// <summary>
/// The current a winding gives out at one of its taps or brushes, into what that point feeds: what
/// enters the point from the section ending there less what leaves into the section starting
/// there. At a centre tap it is the neutral (return) current; at a brush, the current the brush carries.
/// </summary>
public sealed record TapResult(string Point, WindingNet Winding, Complex Current);

/// <summary>Volts per turn and peak flux density, where the turns are known (not only derived from voltages).</summary>
public sealed record CoreResult(CoreNet Core, Complex? VoltsPerTurn, double? Flux, double Loss)
{
    /// <summary>Whether an open-circuit test gives the core's loss; without one <see cref="Loss"/> is unknown, not zero.</summary>
    public bool LossKnown => Core.NoLoadWinding >= 0;

    /// <summary>The magnetising current the open-circuit test winding draws at this volts per turn, and that winding.</summary>
    public Complex? NoLoadCurrent { get; init; }

    public WindingNet? NoLoadWinding { get; init; }
}

public sealed record SupplyResult(SupplyNet Supply, Complex Voltage, Complex Current, Complex Power)
{
    public double PowerFactor => Power.Magnitude == 0 ? 1 : Math.Abs(Power.Real) / Power.Magnitude;
}

public sealed record LoadResult(LoadNet Load, Complex Voltage, Complex Current, Complex Power, double? Regulation)
{
    public double PowerFactor => Power.Magnitude == 0 ? 1 : Math.Abs(Power.Real) / Power.Magnitude;
}

/// <summary>
/// Totals of a case. Beside the losses and the efficiency: the load at which efficiency is highest,
/// found from this operating point by taking copper loss as growing with the square of the load and
/// core loss as fixed (x²·P_cu = P0, R12), and the efficiency there at this case's power factor.
/// </summary>
public sealed record Totals(double CopperLoss, double CoreLoss, double? Efficiency, double Throughput, double Transformed)
{
    /// <summary>
    /// False where a core has no open-circuit test: its loss is unknown, so <see cref="CoreLoss"/>
    /// is a part only and the efficiency and maximum-efficiency load are not given.
    /// </summary>
    public bool CoreLossKnown { get; init; } = true;

    /// <summary>VA of load at maximum efficiency; null without both copper and core loss.</summary>
    public double? MaxEfficiencyLoad { get; init; }

    /// <summary>The maximum-efficiency load as a fraction of this case's load.</summary>
    public double? MaxEfficiencyFraction { get; init; }

    public double? MaxEfficiency { get; init; }
}

/// <summary>
/// An autotransformer connection in a case: the supply and the load galvanically linked through
/// windings, the two-winding (transformed) rating the connection needs, and the co-ratio, that rating
/// over the throughput. The rating is the series winding's voltage times its current, whatever the
/// wiring: |V|·|I| of the sections between the load's terminals and the supply points they are fed
/// from. For a step-up or step-down connection with the common winding across the lower voltage
/// that is S_load·(V_H − V_X)/V_H (R5); where the common winding is across the line of a buck, the
/// series winding opposes, or the load spans two legs of a supply, the formula in voltages misstates
/// it. Loads on one island share the rating of its series windings in proportion to their throughput;
/// a load fed from several islands (single-phase units in grounded wye under a delta load) counts a
/// like part of its throughput in each, and each island's series windings only. With no throughput (an output at 0 V) the co-ratio is 0/0: absent.
/// </summary>
public sealed record ConnectionResult(Connection Connection, double? CoRatio, double Throughput, double TwoWindingRating);

/// <summary>The range of one result over the tolerances, by its JSON path.</summary>
public sealed record Band(string Path, string Unit, double Min, double Max);

/// <summary>Everything one case yields, in source order, ready to present.</summary>
public sealed record CaseResult(
    CaseSpec Case,
    Solution Solution,
    ImmutableArray<(string Point, Complex Voltage)> Points,
    ImmutableArray<SectionResult> Sections,
    ImmutableArray<CoreResult> Cores,
    ImmutableArray<SupplyResult> Supplies,
    ImmutableArray<LoadResult> Loads,
    Totals Totals)
{
    public Complex PointVoltage(string point)
    {
        // A small case is searched; a large one gets an index, so a thousand look-ups stay cheap.
        if (Points.Length <= 32) return Points.FirstOrDefault(p => p.Point == point).Voltage;
        if (pointIndex is null)
        {
            var index = new Dictionary<string, Complex>(Points.Length, StringComparer.Ordinal);
            foreach (var (name, voltage) in Points) index.TryAdd(name, voltage);
            pointIndex = index;
        }
        return pointIndex.GetValueOrDefault(point);
    }

    private Dictionary<string, Complex>? pointIndex;

    /// <summary>The first supply of that name, or null.</summary>
    public SupplyResult? SupplyNamed(string name) =>
        Small ? Supplies.FirstOrDefault(s => s.Supply.Name == name) : Index().Supplies.GetValueOrDefault(name);

    /// <summary>The first load of that name, or null.</summary>
    public LoadResult? LoadNamed(string name) =>
        Small ? Loads.FirstOrDefault(l => l.Load.Name == name) : Index().Loads.GetValueOrDefault(name);

    /// <summary>The first core of that name, or null.</summary>
    public CoreResult? CoreNamed(string name) =>
        Small ? Cores.FirstOrDefault(c => c.Core.Name == name) : Index().Cores.GetValueOrDefault(name);

    /// <summary>The sections of the winding of that name, in order.</summary>
    public IReadOnlyList<SectionResult> SectionsOf(string winding) =>
        Small ? [.. Sections.Where(s => s.Winding.Name == winding)] : Index().Sections.GetValueOrDefault(winding) ?? [];

    /// <summary>A small case is searched (a sweep point of one unit makes no index); a large one gets an index.</summary>
    private bool Small => Sections.Length + Cores.Length + Supplies.Length + Loads.Length <= 32;

    /// <summary>
    /// The case's elements by name, made on first use: a check finds its element without a search
    /// of the case's lists, which a file of many units and checks would make n². Made again for a
    /// copy of this case whose lists differ.
    /// </summary>
    private ElementIndex Index()
    {
        if (elementIndex is { } kept && kept.Of(this)) return kept;
        return elementIndex = new ElementIndex(this);
    }

    private ElementIndex? elementIndex;

    private sealed class ElementIndex
    {
        private readonly ImmutableArray<SectionResult> sections;
        private readonly ImmutableArray<CoreResult> cores;
        private readonly ImmutableArray<SupplyResult> supplies;
        private readonly ImmutableArray<LoadResult> loads;
        public readonly Dictionary<string, SupplyResult> Supplies = new(StringComparer.Ordinal);
        public readonly Dictionary<string, LoadResult> Loads = new(StringComparer.Ordinal);
        public readonly Dictionary<string, CoreResult> Cores = new(StringComparer.Ordinal);
        public readonly Dictionary<string, List<SectionResult>> Sections = new(StringComparer.Ordinal);

        public ElementIndex(CaseResult c)
        {
            (sections, cores, supplies, loads) = (c.Sections, c.Cores, c.Supplies, c.Loads);
            foreach (var s in supplies) Supplies.TryAdd(s.Supply.Name, s);
            foreach (var l in loads) Loads.TryAdd(l.Load.Name, l);
            foreach (var k in cores) Cores.TryAdd(k.Core.Name, k);
            foreach (var s in sections)
            {
                if (!Sections.TryGetValue(s.Winding.Name, out var list)) Sections[s.Winding.Name] = list = [];
                list.Add(s);
            }
        }

        public bool Of(CaseResult c) => c.Sections == sections && c.Cores == cores && c.Supplies == supplies && c.Loads == loads;
    }

    /// <summary>For a fault case: the fault current, the loop's X/R and the asymmetrical peak.</summary>
    public FaultResult? Fault { get; init; }

    /// <summary>For a bus fault's case: the fault study's results (currents, sequence components, peak, Ith, winding duties).</summary>
    public ShortCircuitResult? ShortCircuit { get; init; }

    /// <summary>Taps and brushes in source order, with the current each gives out.</summary>
    public ImmutableArray<TapResult> Taps { get; init; } = [];

    /// <summary>Tap changers in source order, at the positions stated or settled on (TapControl.cs).</summary>
    public ImmutableArray<TapPosition> TapPositions { get; init; } = [];

    /// <summary>Autotransformer connections: each supply and load linked through windings.</summary>
    public ImmutableArray<ConnectionResult> Connections { get; init; } = [];

    /// <summary>Results that vary over the tolerances, with their range; empty without tolerances.</summary>
    public ImmutableArray<Band> Bands { get; init; } = [];

    /// <summary>Three-phase terminal sets and vector groups; empty without three-phase statements.</summary>
    public ThreePhaseResult ThreePhase { get; init; } = ThreePhaseResult.Empty;

    /// <summary>
    /// Equal results: the same case, solution and values, each list compared by its elements. The
    /// look-up caches (<see cref="pointIndex"/>, <see cref="elementIndex"/>) are no part of it: a
    /// record's own equality compared them, and its lists, by reference.
    /// </summary>
    public bool Equals(CaseResult? other) => other is not null && (ReferenceEquals(this, other) ||
        Case == other.Case && Solution == other.Solution && Totals == other.Totals
        && Sequences.Equal(Points, other.Points) && Sequences.Equal(Sections, other.Sections) && Sequences.Equal(Cores, other.Cores)
        && Sequences.Equal(Supplies, other.Supplies) && Sequences.Equal(Loads, other.Loads)
        && Fault == other.Fault && ShortCircuit == other.ShortCircuit
        && Sequences.Equal(Taps, other.Taps) && Sequences.Equal(TapPositions, other.TapPositions) && Sequences.Equal(Connections, other.Connections)
        && Sequences.Equal(Bands, other.Bands) && ThreePhase == other.ThreePhase);

    public override int GetHashCode() => HashCode.Combine(Case, Totals, Sequences.Hash(Points), Sequences.Hash(Loads));
}

/// <summary>Derives what engineers read from a solution: powers, loading, losses, flux density, totals.</summary>
public static class Results
{
    /// <summary>E_rms = (2π/√2)·f·N·Φ_peak: the exact factor behind the rounded 4.44.</summary>
    public static readonly double FormFactor = 2 * Math.PI / Math.Sqrt(2);

    /// <summary>
    /// The results of a solved case: of the whole network, or of the part its <see cref="Solution.Scope"/>
    /// names (a fault's). <paramref name="noLoad"/> (the same network without loads) gives the
    /// regulation. A two-node fault's own results are <see cref="Faults"/>'.
    /// </summary>
    public static CaseResult Compute(Solution solution, Solution? noLoad)
    {
        var network = solution.Network;
        var model = network.Model;
        var scope = solution.Scope;
        var points = scope is null ? AllPoints(network, solution) : PointsOf(model, scope)
            .Select(p => (p.Name, solution.Voltage(network.Node(p.Name)))).ToImmutableArray();

        var losses = SectionLosses(network, solution, scope);
        var inScope = InScope(network.Sections, scope?.Sections).ToList();
        var sections = inScope.Select(s =>
        {
            var w = network.Windings[s.Winding];
            // A section of no turns (a brush at an end) is no part of the winding: what the solver
            // passes through it goes from the brush's contact to the end terminal, not through turns.
            var i = s.Turns > 0 ? solution.SectionCurrents[s.Index] : Complex.Zero;
            var v = solution.SectionVoltage(s);
            var loading = w.RatedCurrent is { } rated ? i.Magnitude / rated : (double?)null;
            return new SectionResult(s, w, i, v, v.Magnitude * i.Magnitude, loading, losses(s.Index))
            {
                CurrentDensity = w.Source.Conductor is { } conductor ? i.Magnitude / conductor.Area : null,
            };
        }).ToImmutableArray();

        var cores = InScope(network.Cores, scope?.Cores).Select(c =>
        {
            var e = solution.CoreVoltsPerTurn[c.Index];
            var known = c.Sections.All(k => network.Windings[network.Sections[k].Winding].TurnsKnown) && c.Sections.Length > 0;
            double? flux = known && c.Source.Area is { } area ? e.Magnitude / (FormFactor * model.Frequency * area) : null;
            var loss = c.Admittance.Real * e.Magnitude * e.Magnitude;
            var tested = c.NoLoadWinding >= 0 ? network.Windings[c.NoLoadWinding] : null;
            return new CoreResult(c, known ? e : null, flux, loss)
            {
                NoLoadCurrent = tested is null ? null : c.Admittance * e / tested.Turns,
                NoLoadWinding = tested,
            };
        }).ToImmutableArray();

        var supplies = InScope(network.Supplies, scope?.Supplies).Select(s =>
        {
            var v = solution.SupplyVoltage(s);
            var i = solution.SupplyCurrents[s.Index];
            return new SupplyResult(s, v, i, Clean(v * Complex.Conjugate(i)));
        }).ToImmutableArray();

        var loads = InScope(network.Loads, scope?.Loads).Select(l =>
        {
            var v = solution.LoadVoltage(l);
            var i = solution.LoadCurrents[l.Index];
            double? regulation = noLoad is not null && v.Magnitude > 0 ? (noLoad.LoadVoltage(l).Magnitude - v.Magnitude) / v.Magnitude : null;
            return new LoadResult(l, v, i, Clean(v * Complex.Conjugate(i)), regulation);
        }).ToImmutableArray();

        // A neutral or neutral-grounding impedance's power is a loss of the network, not power supplied.
        var supplied = supplies.Where(s => s.Supply.Source.IsSource).Sum(s => s.Power.Real);
        var delivered = loads.Sum(l => l.Power.Real);
        // Without an open-circuit test a core's loss is unknown: an efficiency of copper loss alone would flatter.
        var coreLossKnown = cores.All(c => c.LossKnown);
        var totals = MaximumEfficiency(new Totals(
            sections.Sum(s => s.Loss),
            cores.Sum(c => c.Loss),
            coreLossKnown && supplied > 0 && loads.Length > 0 ? delivered / supplied : null,
            loads.Sum(l => l.Power.Magnitude),
            sections.Sum(s => s.Apparent) / 2) { CoreLossKnown = coreLossKnown }, delivered);
        var result = new CaseResult(solution.Case, solution, points, sections, cores, supplies, loads, totals)
        {
            Taps = TapsOf(network, solution, inScope),
            Connections = ConnectionsOf(network, solution, loads),
        };
        return model.ThreePhase.IsEmpty ? result : result with { ThreePhase = ThreePhaseResults.Of(network, result) };
    }

    /// <summary>
    /// The elements a scope names, in the network's order (the order of their indices); all of them
    /// without one. A fault's case visits its own part only, not every element of the file.
    /// </summary>
    internal static IEnumerable<T> InScope<T>(ImmutableArray<T> all, IReadOnlySet<int>? scope) =>
        scope is null ? all : scope.Order().Select(i => all[i]);

    /// <summary>Every point of the model with its voltage, its node found once per list of points and nodes (the same at every point of a sweep).</summary>
    private static ImmutableArray<(string Point, Complex Voltage)> AllPoints(Network network, Solution solution)
    {
        var points = network.Model.Points;
        var key = ImmutableCollectionsMarshal.AsArray(points)!;
        if (!PointNodes.TryGetValue(key, out var known) || known.Nodes != network.NodeOfPoint)
        {
            known = new NodesOfPoints(network.NodeOfPoint, [.. points.Select(p => network.Node(p.Name))]);
            PointNodes.AddOrUpdate(key, known);
        }
        var result = ImmutableArray.CreateBuilder<(string, Complex)>(points.Length);
        for (var i = 0; i < points.Length; i++) result.Add((points[i].Name, solution.Voltage(known.Of[i])));
        return result.MoveToImmutable();
    }

    private sealed record NodesOfPoints(ImmutableDictionary<string, int> Nodes, int[] Of);

    private static readonly ConditionalWeakTable<Symbol[], NodesOfPoints> PointNodes = new();

    /// <summary>The model's points a scope names, in the model's order; all of them without one.</summary>
    private static IEnumerable<Symbol> PointsOf(Model.Model model, CaseScope? scope)
    {
        if (scope is null) return model.Points;
        var order = Order.Of(model.Points, p => p.Name, firstOnly: false);
        return order is null ? model.Points.Where(p => scope.Points.Contains(p.Name)) : order.Pick(model.Points, scope.Points);
    }

    /// <summary>
    /// η = x·S·pf / (x·S·pf + P0 + x²·P_cu) is highest where x²·P_cu = P0, so at x = √(P0/P_cu) of
    /// this load, where η = x·S·pf / (x·S·pf + 2·P0) (R12).
    /// </summary>
    private static Totals MaximumEfficiency(Totals t, double delivered)
    {
        if (!t.CoreLossKnown || t.CopperLoss <= 0 || t.CoreLoss <= 0 || t.Throughput <= 0 || delivered <= 0) return t;
        var x = Math.Sqrt(t.CoreLoss / t.CopperLoss);
        var p = x * delivered;
        return t with { MaxEfficiencyLoad = x * t.Throughput, MaxEfficiencyFraction = x, MaxEfficiency = p / (p + 2 * t.CoreLoss) };
    }

    /// <summary>The current out of each tap and brush of the sections given, by Kirchhoff's current law at the point.</summary>
    private static ImmutableArray<TapResult> TapsOf(Network network, Solution solution, List<Section> sections)
    {
        // Sized once: a case of the whole file has thousands of points, and a growing table is made again at each doubling.
        var at = new Dictionary<string, (int Winding, Complex Current, double Scale)>(sections.Count + 1, StringComparer.Ordinal);
        foreach (var s in sections)
        {
            var i = solution.SectionCurrents[s.Index];
            var (to, from) = (at.GetValueOrDefault(s.ToPoint), at.GetValueOrDefault(s.FromPoint));
            at[s.ToPoint] = (s.Winding, to.Current + i, Math.Max(to.Scale, i.Magnitude));
            at[s.FromPoint] = (s.Winding, from.Current - i, Math.Max(from.Scale, i.Magnitude));
        }
        // The difference of two equal currents through a tap is zero, not the solver's rounding (picoamperes of kiloamperes).
        var taps = network.Model.Taps;
        // Found by the network's nodes, which a moved brush keeps, not by its list of taps, which it makes again.
        var order = Order.Of(taps, t => t.Name, firstOnly: true, ImmutableCollectionsMarshal.AsArray(network.Nodes)!);
        // A tap's first line names it: those of the sections' points, in the model's order.
        return [.. (order is null ? taps.DistinctBy(t => t.Name).Where(t => at.ContainsKey(t.Name)) : order.Pick(taps, at.Keys))
            .Select(t => new TapResult(t.Name, network.Windings[at[t.Name].Winding], Numbers.Clean(at[t.Name].Current, at[t.Name].Scale)))];
    }

    private static ImmutableArray<ConnectionResult> ConnectionsOf(Network network, Solution solution, ImmutableArray<LoadResult> loads)
    {
        if (solution.Case.WithoutLoads || solution.Case.Fault is not null) return [];
        // Phase elements too: the co-ratio and the rating needed are taken from the series windings' own
        // V·I, never from one phase element's voltage against another's, so a three-phase statement
        // gets the figures of the same network written phase by phase.
        var connections = Solve.Connections.Find(network);
        if (connections.IsEmpty) return [];
        var shape = ConnectionShape.Of(connections);
        var carried = new double[shape.Islands.Length];
        var throughput = new double[shape.Islands.Length];
        for (var g = 0; g < carried.Length; g++)
        {
            var (series, shared) = shape.Islands[g];
            carried[g] = series.Sum(s => solution.SectionVoltage(network.Sections[s]).Magnitude * solution.SectionCurrents[s].Magnitude);
            throughput[g] = shared.Sum(x => loads[x.Load].Power.Magnitude / x.Islands);
        }
        var results = ImmutableArray.CreateBuilder<ConnectionResult>(connections.Length);
        for (var i = 0; i < connections.Length; i++)
        {
            var (c, g) = (connections[i], shape.IslandOf[i]);
            double? coRatio = throughput[g] > 0 ? carried[g] / throughput[g] : null;
            var s = loads[c.Load.Index].Power.Magnitude;
            results.Add(new ConnectionResult(c, coRatio, s, s * coRatio ?? 0));
        }
        return results.MoveToImmutable();
    }

    /// <summary>
    /// What the co-ratios of a network's connections add up, which the wiring alone fixes: found once
    /// per list of connections (the same at every point of a sweep) instead of grouped at every case.
    /// Each island of a connection, in order of first use: its series sections, each once, and its
    /// loads, each once, with the number of islands each is fed from. A load fed from several islands
    /// shares its throughput among them equally, so the co-ratio of each is its series windings' V·I
    /// over its part (three units in grounded wye under a delta load).
    /// </summary>
    private sealed class ConnectionShape
    {
        private static readonly ConditionalWeakTable<Connection[], ConnectionShape> Known = new();

        public readonly (int[] Series, (int Load, int Islands)[] Loads)[] Islands;
        public readonly int[] IslandOf;

        private ConnectionShape(ImmutableArray<Connection> connections)
        {
            var islands = connections.GroupBy(c => c.Load.Index).ToDictionary(g => g.Key, g => g.Select(c => c.Island).Distinct().Count());
            var groups = connections.GroupBy(c => c.Island).ToList();
            Islands = [.. groups.Select(g => (
                g.SelectMany(c => c.Series).Distinct().ToArray(),
                g.DistinctBy(c => c.Load.Index).Select(c => (c.Load.Index, islands[c.Load.Index])).ToArray()))];
            IslandOf = [.. connections.Select(c => groups.FindIndex(g => g.Key == c.Island))];
        }

        public static ConnectionShape Of(ImmutableArray<Connection> connections) =>
            Known.GetValue(ImmutableCollectionsMarshal.AsArray(connections)!, static a => new ConnectionShape(ImmutableCollectionsMarshal.AsImmutableArray(a)));
    }

    /// <summary>A product of phasors carries rounding of 1e-16 of its size; a part that small is zero.</summary>
    private static Complex Clean(Complex s)
    {
        var limit = 1e-12 * s.Magnitude;
        return new Complex(Math.Abs(s.Real) <= limit ? 0 : s.Real, Math.Abs(s.Imaginary) <= limit ? 0 : s.Imaginary);
    }

    /// <summary>
    /// Copper loss by section. A core's copper loss is Re(Iᴴ·R·I) over its sections, R the real part
    /// of its impedance matrix: exact, whatever the matrix. Its split by section is not: where three
    /// or more windings' resistances come from pairwise tests and do not split into non-negative
    /// winding resistances, the leakage matrix carries resistance between sections that belongs to no
    /// one section, and the term-by-term split Re(conj(I_p)·Σ R_pq·I_q) can be negative. So the core's
    /// loss is shared in proportion to each section's I²R through its own series resistance
    /// (R_p·|I_p|², the loss in its own conductor). Where all the resistance is on the diagonal that
    /// is the core's loss term by term, so nothing changes; a section with no series resistance of
    /// its own gets a share of none, and no share is ever negative. On a core whose series
    /// resistances are all zero, the diagonal of R (zero where negative) stands in for them.
    /// </summary>
    /// <summary>
    /// What heats each section: its winding, current and loss, as <see cref="Compute"/> gives them,
    /// without the rest of a case's results (a load cycle solves the network at every point).
    /// </summary>
    public static SectionHeat[] Heat(Solution solution)
    {
        var network = solution.Network;
        var losses = SectionLosses(network, solution, solution.Scope);
        return [.. InScope(network.Sections, solution.Scope?.Sections)
            .Select(s => new SectionHeat(s.Winding, s.Turns > 0 ? solution.SectionCurrents[s.Index].Magnitude : 0, losses(s.Index)))];
    }

    public static SectionHeat[] Heat(CaseResult c) => [.. c.Sections.Select(s => new SectionHeat(s.Winding.Index, s.Current.Magnitude, s.Loss))];

    /// <remarks>By section index: of every section, or of a scope's only (a fault's case: not an array of the whole file per fault).</remarks>
    private static Func<int, double> SectionLosses(Network network, Solution solution, CaseScope? scope)
    {
        var all = scope is null ? new double[network.Sections.Length] : null;
        var part = scope is null ? null : new Dictionary<int, double>(scope.Sections.Count);
        Func<int, double> result = all is not null ? k => all[k] : k => part!.GetValueOrDefault(k);
        if (!solution.HasVectors) return result;
        foreach (var core in InScope(network.Cores, scope?.Cores))
        {
            var n = core.Sections.Length;
            var currents = core.Sections.Select(s => solution.SectionCurrents[s]).ToArray();
            var total = 0.0;
            for (var p = 0; p < n; p++)
            {
                var sum = Complex.Zero;
                for (var q = 0; q < n; q++) sum += core.Impedance[p, q].Real * currents[q];
                total += (Complex.Conjugate(currents[p]) * sum).Real;
            }
            var own = new double[n];
            for (var p = 0; p < n; p++)
            {
                var section = network.Sections[core.Sections[p]];
                var r = core.Coupling is { } c ? c.Series[c.MemberOf[p]] * section.Turns : 0;
                own[p] = r * currents[p].Magnitude * currents[p].Magnitude;
            }
            if (own.Sum() <= 0)
                for (var p = 0; p < n; p++) own[p] = Math.Max(core.Impedance[p, p].Real, 0) * currents[p].Magnitude * currents[p].Magnitude;
            var weight = own.Sum();
            if (weight <= 0) continue;
            for (var p = 0; p < n; p++)
            {
                var loss = total * own[p] / weight;
                if (all is not null) all[core.Sections[p]] = loss;
                else part![core.Sections[p]] = loss;
            }
        }
        return result;
    }
}

/// <summary>
/// Where each name stands in a list of the model (its points, its taps), found once per list and
/// kept with it, so the part of a case picks its own names in the model's order without going
/// through the whole list: a file of many units asks once per fault.
/// </summary>
internal sealed class Order
{
    private static readonly ConditionalWeakTable<object, Order?[]> Known = new();

    private readonly Dictionary<string, int> position;

    private Order(Dictionary<string, int> position) => this.position = position;

    /// <summary>
    /// The order of <paramref name="list"/> by name: each name at its first place with
    /// <paramref name="firstOnly"/>; without, null where a name stands twice (the caller filters the whole list).
    /// </summary>
    public static Order? Of<T>(ImmutableArray<T> list, Func<T, string> name, bool firstOnly)
    {
        var key = ImmutableCollectionsMarshal.AsArray(list);
        if (key is null) return null;
        var kept = Known.GetValue(key, _ => new Order?[2]);
        var slot = firstOnly ? 0 : 1;
        if (kept[slot] is { } known) return known;
        var position = new Dictionary<string, int>(list.Length, StringComparer.Ordinal);
        for (var i = 0; i < list.Length; i++)
            if (!position.TryAdd(name(list[i]), i) && !firstOnly) return null;
        return kept[slot] = new Order(position);
    }

    private static readonly ConditionalWeakTable<object, Named?[]> Owned = new();

    private sealed record Named(string[] Names, Order? Order);

    /// <summary>
    /// The same, kept with <paramref name="owner"/> for any list of the same names in the same order:
    /// a sweep point's network has a list of taps of its own (a brush moved), with the names of the
    /// one before, and its order is not found again nor kept for every point's list.
    /// </summary>
    public static Order? Of<T>(ImmutableArray<T> list, Func<T, string> name, bool firstOnly, object owner)
    {
        var kept = Owned.GetValue(owner, static _ => new Named?[2]);
        var slot = firstOnly ? 0 : 1;
        if (kept[slot] is { } known && known.Names.Length == list.Length)
        {
            var same = true;
            for (var i = 0; i < list.Length && same; i++) same = known.Names[i] == name(list[i]);
            if (same) return known.Order;
        }
        var order = Of(list, name, firstOnly);
        kept[slot] = new Named([.. list.Select(name)], order);
        return order;
    }

    /// <summary>The entries of <paramref name="list"/> (the list this order is of) that <paramref name="names"/> name, in the list's order.</summary>
    public IEnumerable<T> Pick<T>(ImmutableArray<T> list, IEnumerable<string> names)
    {
        var at = new List<int>();
        foreach (var n in names)
            if (position.TryGetValue(n, out var i)) at.Add(i);
        at.Sort();
        return at.Select(i => list[i]);
    }
}

/// <summary>A section's winding (its index in the network), current magnitude and loss: what heats it.</summary>
public readonly record struct SectionHeat(int Winding, double Current, double Loss);

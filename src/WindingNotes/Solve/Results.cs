using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;

namespace WindingNotes.Solve;

public sealed record SectionResult(Section Section, WindingNet Winding, Complex Current, Complex Voltage, double Apparent, double? Loading, double Loss)
{
    /// <summary>A/m², where the winding's conductor is given.</summary>
    public double? CurrentDensity { get; init; }
}

/// <summary>Volts per turn and peak flux density, where the turns are known (not only derived from voltages).</summary>
public sealed record CoreResult(CoreNet Core, Complex? VoltsPerTurn, double? Flux, double Loss)
{
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
    /// <summary>VA of load at maximum efficiency; null without both copper and core loss.</summary>
    public double? MaxEfficiencyLoad { get; init; }

    /// <summary>The maximum-efficiency load as a fraction of this case's load.</summary>
    public double? MaxEfficiencyFraction { get; init; }

    public double? MaxEfficiency { get; init; }
}

/// <summary>
/// An autotransformer connection in a case: the supply and the load galvanically linked through
/// windings, the co-ratio (V_H − V_X)/V_H, and the two-winding rating the connection needs,
/// S_load·(V_H − V_X)/V_H (R5).
/// </summary>
public sealed record ConnectionResult(Connection Connection, double CoRatio, double Throughput, double TwoWindingRating);

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

    /// <summary>For a fault case: the fault current, the loop's X/R and the asymmetrical peak.</summary>
    public FaultResult? Fault { get; init; }

    /// <summary>Autotransformer connections: each supply and load linked through windings.</summary>
    public ImmutableArray<ConnectionResult> Connections { get; init; } = [];

    /// <summary>Results that vary over the tolerances, with their range; empty without tolerances.</summary>
    public ImmutableArray<Band> Bands { get; init; } = [];

    /// <summary>Three-phase terminal sets and vector groups; empty without three-phase statements.</summary>
    public ThreePhaseResult ThreePhase { get; init; } = ThreePhaseResult.Empty;
}

/// <summary>Derives what engineers read from a solution: powers, loading, losses, flux density, totals.</summary>
public static class Results
{
    /// <summary>E_rms = (2π/√2)·f·N·Φ_peak: the exact factor behind the rounded 4.44.</summary>
    public static readonly double FormFactor = 2 * Math.PI / Math.Sqrt(2);

    /// <summary>
    /// The results of a solved case: of the whole network, or of the part its <see cref="Solution.Scope"/>
    /// names (a fault's). <paramref name="noLoad"/> (the same network without loads) gives the
    /// regulation; <paramref name="normal"/> (the case without the fault) gives a fault's X/R.
    /// </summary>
    public static CaseResult Compute(Solution solution, Solution? noLoad, Solution? normal = null)
    {
        var network = solution.Network;
        var model = network.Model;
        var scope = solution.Scope;
        var points = model.Points
            .Where(p => scope is null || scope.Points.Contains(p.Name))
            .Select(p => (p.Name, solution.Voltage(network.Node(p.Name)))).ToImmutableArray();

        var sections = network.Sections.Where(s => scope is null || scope.Sections.Contains(s.Index)).Select(s =>
        {
            var w = network.Windings[s.Winding];
            var i = solution.SectionCurrents[s.Index];
            var v = solution.SectionVoltage(s);
            var loading = w.RatedCurrent is { } rated ? i.Magnitude / rated : (double?)null;
            return new SectionResult(s, w, i, v, v.Magnitude * i.Magnitude, loading, SectionLoss(network, s, solution))
            {
                CurrentDensity = w.Source.Conductor is { } conductor ? i.Magnitude / conductor.Area : null,
            };
        }).ToImmutableArray();

        var cores = network.Cores.Where(c => scope is null || scope.Cores.Contains(c.Index)).Select(c =>
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

        var supplies = network.Supplies.Where(s => scope is null || scope.Supplies.Contains(s.Index)).Select(s =>
        {
            var v = solution.SupplyVoltage(s);
            var i = solution.SupplyCurrents[s.Index];
            return new SupplyResult(s, v, i, Clean(v * Complex.Conjugate(i)));
        }).ToImmutableArray();

        var loads = network.Loads.Where(l => scope is null || scope.Loads.Contains(l.Index)).Select(l =>
        {
            var v = solution.LoadVoltage(l);
            var i = solution.LoadCurrents[l.Index];
            double? regulation = noLoad is not null && v.Magnitude > 0 ? (noLoad.LoadVoltage(l).Magnitude - v.Magnitude) / v.Magnitude : null;
            return new LoadResult(l, v, i, Clean(v * Complex.Conjugate(i)), regulation);
        }).ToImmutableArray();

        var supplied = supplies.Sum(s => s.Power.Real);
        var delivered = loads.Sum(l => l.Power.Real);
        var totals = MaximumEfficiency(new Totals(
            sections.Sum(s => s.Loss),
            cores.Sum(c => c.Loss),
            supplied > 0 && loads.Length > 0 ? delivered / supplied : null,
            loads.Sum(l => l.Power.Magnitude),
            sections.Sum(s => s.Apparent) / 2), delivered);
        var result = new CaseResult(solution.Case, solution, points, sections, cores, supplies, loads, totals)
        {
            Connections = ConnectionsOf(network, solution, supplies, loads),
            Fault = solution.Case.Fault is not null && normal is not null ? Faults.Compute(solution, normal) : null,
        };
        return model.ThreePhase.IsEmpty ? result : result with { ThreePhase = ThreePhaseResults.Of(network, result) };
    }

    /// <summary>
    /// η = x·S·pf / (x·S·pf + P0 + x²·P_cu) is highest where x²·P_cu = P0, so at x = √(P0/P_cu) of
    /// this load, where η = x·S·pf / (x·S·pf + 2·P0) (R12).
    /// </summary>
    private static Totals MaximumEfficiency(Totals t, double delivered)
    {
        if (t.CopperLoss <= 0 || t.CoreLoss <= 0 || t.Throughput <= 0 || delivered <= 0) return t;
        var x = Math.Sqrt(t.CoreLoss / t.CopperLoss);
        var p = x * delivered;
        return t with { MaxEfficiencyLoad = x * t.Throughput, MaxEfficiencyFraction = x, MaxEfficiency = p / (p + 2 * t.CoreLoss) };
    }

    private static ImmutableArray<ConnectionResult> ConnectionsOf(Network network, Solution solution, ImmutableArray<SupplyResult> supplies, ImmutableArray<LoadResult> loads)
    {
        if (solution.Case.WithoutLoads || solution.Case.Fault is not null) return [];
        return [.. Solve.Connections.Find(network).Where(c => !c.IsPhaseElement(network.Model)).Select(c =>
        {
            var (vs, vl) = (supplies[c.Supply.Index].Voltage.Magnitude, loads[c.Load.Index].Voltage.Magnitude);
            var high = Math.Max(vs, vl);
            var coRatio = high > 0 ? (high - Math.Min(vs, vl)) / high : 0;
            var s = loads[c.Load.Index].Power.Magnitude;
            return new ConnectionResult(c, coRatio, s, s * coRatio);
        })];
    }

    /// <summary>A product of phasors carries rounding of 1e-16 of its size; a part that small is zero.</summary>
    private static Complex Clean(Complex s)
    {
        var limit = 1e-12 * s.Magnitude;
        return new Complex(Math.Abs(s.Real) <= limit ? 0 : s.Real, Math.Abs(s.Imaginary) <= limit ? 0 : s.Imaginary);
    }

    /// <summary>
    /// Copper loss of a section: Re(conj(I_k)·Σ_j R_kj·I_j) with R the real part of the core's
    /// impedance matrix. It is R_kk·|I_k|² where only the diagonal is real; where the leakage matrix
    /// carries resistance its series resistances could not, the sections' losses still add up to
    /// the total Re(Iᴴ·R·I).
    /// </summary>
    private static double SectionLoss(Network network, Section s, Solution solution)
    {
        var core = network.Cores[s.Core];
        var row = core.Sections.IndexOf(s.Index);
        var sum = Complex.Zero;
        for (var j = 0; j < core.Sections.Length; j++)
            sum += core.Impedance[row, j].Real * solution.SectionCurrents[core.Sections[j]];
        return (Complex.Conjugate(solution.SectionCurrents[s.Index]) * sum).Real;
    }
}

using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;

namespace WindingNotes.Solve;

public sealed record SectionResult(Section Section, WindingNet Winding, Complex Current, Complex Voltage, double Apparent, double? Loading, double Loss);

/// <summary>Volts per turn and peak flux density, where the turns are known (not only derived from voltages).</summary>
public sealed record CoreResult(CoreNet Core, Complex? VoltsPerTurn, double? Flux, double Loss);

public sealed record SupplyResult(SupplyNet Supply, Complex Voltage, Complex Current, Complex Power)
{
    public double PowerFactor => Power.Magnitude == 0 ? 1 : Math.Abs(Power.Real) / Power.Magnitude;
}

public sealed record LoadResult(LoadNet Load, Complex Voltage, Complex Current, Complex Power, double? Regulation)
{
    public double PowerFactor => Power.Magnitude == 0 ? 1 : Math.Abs(Power.Real) / Power.Magnitude;
}

public sealed record Totals(double CopperLoss, double CoreLoss, double? Efficiency, double Throughput, double Transformed);

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
    public Complex PointVoltage(string point) => Points.FirstOrDefault(p => p.Point == point).Voltage;
}

/// <summary>Derives what engineers read from a solution: powers, loading, losses, flux density, totals.</summary>
public static class Results
{
    /// <summary>E_rms = (2π/√2)·f·N·Φ_peak: the exact factor behind the rounded 4.44.</summary>
    public static readonly double FormFactor = 2 * Math.PI / Math.Sqrt(2);

    public static CaseResult Compute(Solution solution, Solution? noLoad)
    {
        var network = solution.Network;
        var model = network.Model;
        var points = model.Points.Select(p => (p.Name, solution.Voltage(network.Node(p.Name)))).ToImmutableArray();

        var sections = network.Sections.Select(s =>
        {
            var w = network.Windings[s.Winding];
            var i = solution.SectionCurrents[s.Index];
            var v = solution.SectionVoltage(s);
            var loading = w.RatedCurrent is { } rated ? i.Magnitude / rated : (double?)null;
            return new SectionResult(s, w, i, v, v.Magnitude * i.Magnitude, loading, SectionLoss(network, s, solution));
        }).ToImmutableArray();

        var cores = network.Cores.Select(c =>
        {
            var e = solution.CoreVoltsPerTurn[c.Index];
            var known = c.Sections.All(k => network.Windings[network.Sections[k].Winding].TurnsKnown) && c.Sections.Length > 0;
            double? flux = known && c.Source.Area is { } area ? e.Magnitude / (FormFactor * model.Frequency * area) : null;
            var loss = c.Admittance.Real * e.Magnitude * e.Magnitude;
            return new CoreResult(c, known ? e : null, flux, loss);
        }).ToImmutableArray();

        var supplies = network.Supplies.Select(s =>
        {
            var v = solution.SupplyVoltage(s);
            var i = solution.SupplyCurrents[s.Index];
            return new SupplyResult(s, v, i, Clean(v * Complex.Conjugate(i)));
        }).ToImmutableArray();

        var loads = network.Loads.Select(l =>
        {
            var v = solution.LoadVoltage(l);
            var i = solution.LoadCurrents[l.Index];
            double? regulation = noLoad is not null && v.Magnitude > 0 ? (noLoad.LoadVoltage(l).Magnitude - v.Magnitude) / v.Magnitude : null;
            return new LoadResult(l, v, i, Clean(v * Complex.Conjugate(i)), regulation);
        }).ToImmutableArray();

        var supplied = supplies.Sum(s => s.Power.Real);
        var delivered = loads.Sum(l => l.Power.Real);
        var totals = new Totals(
            sections.Sum(s => s.Loss),
            cores.Sum(c => c.Loss),
            supplied > 0 && loads.Length > 0 ? delivered / supplied : null,
            loads.Sum(l => l.Power.Magnitude),
            sections.Sum(s => s.Apparent) / 2);
        return new CaseResult(solution.Case, solution, points, sections, cores, supplies, loads, totals);
    }

    /// <summary>A product of phasors carries rounding of 1e-16 of its size; a part that small is zero.</summary>
    private static Complex Clean(Complex s)
    {
        var limit = 1e-12 * s.Magnitude;
        return new Complex(Math.Abs(s.Real) <= limit ? 0 : s.Real, Math.Abs(s.Imaginary) <= limit ? 0 : s.Imaginary);
    }

    /// <summary>Copper loss of a section: the real power into its resistance, Re(I*·R·I) with R the diagonal of its impedance.</summary>
    private static double SectionLoss(Network network, Section s, Solution solution)
    {
        var core = network.Cores[s.Core];
        var r = core.Impedance[core.Sections.IndexOf(s.Index), core.Sections.IndexOf(s.Index)].Real;
        var i = solution.SectionCurrents[s.Index].Magnitude;
        return r * i * i;
    }
}

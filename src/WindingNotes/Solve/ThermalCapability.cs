using System.Collections.Immutable;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// The 'capability' lines: the largest load held all day, or the largest multiple of the cycle's
/// loads, that keeps a unit within its limits. The cycle is run again as written but for its loads
/// (the same ambients, step and method; the network solved at each load), and the excess over the
/// limits, max(θh − limit, θo − limit, 6·log2(loss of life / limit)) in K (the last: the hot-spot
/// rise that would age the day's life that much faster, for paper that doubles its ageing every 6 K),
/// is brought to zero by the bracketing search of 'find' (<see cref="SolveFor.Bracket"/>) from zero
/// load up to four times the cycle's. The answer is the first crossing: every load up to it is
/// within the limits.
/// </summary>
public static class ThermalCapability
{
    /// <summary>The search runs from no load to this many times the cycle's largest load (or the cycle itself).</summary>
    public const double Reach = 4;

    private const int Intervals = 16;

    internal static ImmutableArray<CapabilityResult> Run(SyntaxTree syntax, Model.Model model, Network network, CaseResult normal, ThermalResult day, DiagnosticBag diagnostics, CancellationToken cancel)
    {
        var results = ImmutableArray.CreateBuilder<CapabilityResult>();
        foreach (var cap in model.Thermal.Capabilities)
        {
            cancel.ThrowIfCancellationRequested();
            var result = One(syntax, model, network, normal, day, cap, cancel);
            if (result.Value is { } value)
                diagnostics.ReportCapability(cap, Shown(day, cap, value), result.Beyond, Readable(result.Binding), Measured(result.Binding, result.AtBinding));
            else diagnostics.ReportCapabilityUnknown(cap, result.Problem ?? "");
            results.Add(result);
        }
        return results.ToImmutable();
    }

    private static CapabilityResult One(SyntaxTree syntax, Model.Model model, Network network, CaseResult normal, ThermalResult day, CapabilityModel cap, CancellationToken cancel)
    {
        CapabilityResult Fails(string problem) => new(cap, null, "", double.NaN, false, problem);
        if (day.Units.FirstOrDefault(u => u.Unit.Core == cap.Core) is not { } followed)
            return Fails(model.Thermal.Units.Any(u => u.Core == cap.Core) ? "the unit's load cycle was not evaluated" : $"core '{cap.Core}' has no 'thermal' line");
        var unit = followed.Unit;
        if (unit.Dry && cap.TopOil is not null) return Fails("a dry-type unit has no top oil to limit");
        var limits = ThermalStudy.LimitsOf(day.Cycle.Duty, unit);
        var hotSpot = cap.HotSpot ?? limits.HotSpot;
        var topOil = unit.Dry ? null : cap.TopOil ?? limits.TopOil;
        var life = cap.LossOfLife;
        var cycle = day.Cycle;
        var largest = cycle.Points.Max(p => Math.Abs(p.Load.Real));
        var hi = cap.Kind == CapabilityKind.CycleScale || cycle.Let is null ? Reach : Reach * largest;
        if (hi <= 0 || (cap.Kind == CapabilityKind.CycleScale && largest <= 0)) return Fails("the cycle's loads are all zero, so no multiple of them loads the unit");

        // The unit alone, with the cycle's loads set by s.
        ThermalUnitResult? At(double s)
        {
            var points = cycle.Points.Select(p => p with { Load = p.Load with { Value = cap.Kind == CapabilityKind.CycleScale ? p.Load.Value * s : s } }).ToImmutableArray();
            var alone = model with { Thermal = model.Thermal with { Units = [unit], Cycle = cycle with { Points = points }, Capabilities = [] } };
            return ThermalStudy.Cycle(syntax, alone, network, normal, new DiagnosticBag(), cancel)?.Units.FirstOrDefault();
        }
        (double Excess, string Binding, double Value) Excess(ThermalUnitResult u)
        {
            var terms = new List<(double, string, double)> { (u.PeakHotSpot - hotSpot, "hot-spot", u.PeakHotSpot) };
            if (topOil is { } o) terms.Add((u.PeakTopOil - o, "top-oil", u.PeakTopOil));
            if (life is { } l) terms.Add((6 * Math.Log2(Math.Max(u.LossOfLife, 1e-300) / l), "loss-of-life", u.LossOfLife));
            return terms.MaxBy(t => t.Item1);
        }
        double? Residual(double s) => At(s) is { } u ? Excess(u).Excess : null;

        var scan = SolveFor.Bracket(Residual, 0, hi, Intervals, 1e-7);
        if (scan.Values.Count == 0) return Fails("the network could not be solved at any load of the search");
        var atNoLoad = At(0);
        if (atNoLoad is not null && Excess(atNoLoad) is { Excess: > 0 } over)
            return Fails($"even at no load the {over.Binding} is beyond its limit ({Measured(over.Binding, over.Value)})");
        var found = scan.Zeros.Concat(scan.Crossings.Select(c => c.X)).DefaultIfEmpty(double.NaN).Min();
        var beyond = double.IsNaN(found);
        var value = beyond ? hi : found;
        if (At(value) is not { } there) return Fails("the network could not be solved at the load found");
        var binding = Excess(there);
        return new CapabilityResult(cap, value, binding.Binding, binding.Value, beyond, null) { HotSpotLimit = hotSpot, TopOilLimit = topOil, LossOfLifeLimit = life };
    }

    /// <summary>A capability as the file writes loads: per unit, or in the let's unit.</summary>
    public static string Shown(ThermalResult day, CapabilityModel cap, double value) =>
        cap.Kind == CapabilityKind.ConstantLoad && day.LoadUnit != "pu" ? Numbers.Format(value, day.LoadUnit) : Numbers.Fixed(value) + " pu";

    /// <summary>The limit that binds, as a report words it.</summary>
    public static string Readable(string binding) => binding == "hot-spot" ? binding : binding.Replace('-', ' ');

    public static string Measured(string binding, double value) => binding == "loss-of-life" ? ThermalResult.Hours(value) : Numbers.Format(value, "degC");
}

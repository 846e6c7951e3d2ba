using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// The load cycle: the network solved at each cycle point's load (every load scaled by its per-unit
/// value, or the let set to its value), each unit's windings loaded by what the solution gives them,
/// and each unit's top-oil and hot-spot followed through the day, from the day before repeated until
/// it repeats itself. Then the loading limits, the hot-spot caution and the thermal checks.
/// </summary>
public static class ThermalStudy
{
    public static bool IsThermal(ExpectModel e) => e.Measure is MeasureKind.HotSpot or MeasureKind.TopOil or MeasureKind.LossOfLife or MeasureKind.EquivalentAging or MeasureKind.Capability;

    /// <summary>Change of any rise over a day (K) below which the day is taken to repeat itself.</summary>
    private const double Settled = 1e-3;

    private const int MaxDays = 60;

    public static (ThermalResult? Result, ImmutableArray<CheckResult> Checks) Run(SyntaxTree syntax, Model.Model model, Network network, CaseResult normal, DiagnosticBag diagnostics, CancellationToken cancel)
    {
        var result = Cycle(syntax, model, network, normal, diagnostics, cancel);
        if (result is not null)
        {
            Limits(result, diagnostics);
            result = result with { Capabilities = ThermalCapability.Run(syntax, model, network, normal, result, diagnostics, cancel) };
        }
        else foreach (var cap in model.Thermal.Capabilities)
                diagnostics.ReportCapabilityUnknown(cap, model.Thermal.Cycle is null ? "there is no load cycle: give a 'load-cycle' line and its 'cycle-point' lines" : "the load cycle was not evaluated");
        return (result, Check(model, result, diagnostics));
    }

    internal static ThermalResult? Cycle(SyntaxTree syntax, Model.Model model, Network network, CaseResult normal, DiagnosticBag diagnostics, CancellationToken cancel)
    {
        var thermal = model.Thermal;
        if (thermal.Cycle is not { } cycle)
        {
            if (!thermal.Units.IsEmpty && !syntax.Statements.Any(s => s.Kind == StatementKind.LoadCycle)) diagnostics.ReportThermalWithoutCycle(thermal.Units[0].Line);
            return null;
        }
        if (thermal.Units.IsEmpty)
        {
            diagnostics.ReportCycleWithoutUnits(cycle.Line);
            return null;
        }
        var points = cycle.Points;
        if (points.IsEmpty || (cycle.Ambient is null && !points.Any(p => p.Ambient is not null))) return null;
        if (cycle.Method == ThermalMethod.DifferenceEquation)
            foreach (var u in thermal.Units)
            {
                // The explicit difference equations follow a time constant only with steps well inside it (IEC 60076-7 asks for at most half the smallest).
                var smallest = Math.Min(u.K22 * u.WindingTimeConstant, Math.Min(u.OilTimeConstant / u.K22, u.K11 * u.OilTimeConstant));
                if (cycle.Step > smallest / 2 + 1e-9)
                {
                    diagnostics.ReportStepTooLong(cycle.Line, u.Core, cycle.Step, smallest / 2);
                    return null;
                }
            }

        // The network at each cycle point's load.
        var solved = new SectionHeat[points.Length][];
        var byLoad = new Dictionary<double, SectionHeat[]>();
        var scaling = new LoadScaling(network);
        // Cycle points built in full (a let's, and no load) refactor on the first's pivots.
        var factors = new SymbolicFactors();
        for (var i = 0; i < points.Length; i++)
        {
            cancel.ThrowIfCancellationRequested();
            var value = points[i].Load.Real;
            if (!byLoad.TryGetValue(value, out var at))
            {
                at = SolveAt(syntax, model, scaling, factors, normal, cycle, points[i], out var problem, cancel);
                if (at is null)
                {
                    diagnostics.ReportCyclePointUnsolved(points[i].Line, problem ?? "");
                    return null;
                }
                byLoad[value] = at;
            }
            solved[i] = at;
        }

        // Each unit's windings, and its load factors at each point.
        var units = new List<Heating>();
        foreach (var u in thermal.Units)
            if (Heating.Of(u, model, network, solved, diagnostics) is { } h) units.Add(h);
        if (units.Count == 0) return null;

        var n = (int)Math.Round(86400 / cycle.Step);
        var dt = 86400.0 / n;
        // The cycle point in force over each step: the last at or before its start, round the day.
        var pointAt = new int[n];
        for (int step = 0, i = -1; step < n; step++)
        {
            while (i + 1 < points.Length && points[i + 1].Time <= step * dt + 1e-6) i++;
            pointAt[step] = i < 0 ? points.Length - 1 : i;
        }
        var ambient = Ambients(cycle);

        var days = 0;
        foreach (var h in units) h.Settle(pointAt[0]);
        var settled = false;
        while (!settled && days < MaxDays)
        {
            cancel.ThrowIfCancellationRequested();
            var before = units.Select(h => h.Snapshot()).ToList();
            var previous = pointAt[^1];
            for (var step = 0; step < n; step++)
            {
                var i = pointAt[step];
                foreach (var h in units) h.Advance(cycle.Method, dt, i, i != previous);
                previous = i;
            }
            days++;
            settled = units.Zip(before).All(p => p.First.Snapshot().Zip(p.Second).All(x => Math.Abs(x.First - x.Second) < Settled));
        }

        // The day given: the day after the one that repeated itself, sampled at every step.
        var times = new double[n + 1];
        var loads = new double[n + 1];
        var ambients = new double[n + 1];
        for (var k = 0; k <= n; k++)
        {
            times[k] = k * dt;
            // What held over the step that ends at the sample, as its temperatures are.
            var i = pointAt[(k + n - 1) % n];
            loads[k] = points[i].Load.Real;
            ambients[k] = ambient[i] - 273.15;
        }
        foreach (var h in units) h.Begin(n, ambient[pointAt[^1]] - 273.15);
        {
            var previous = pointAt[^1];
            for (var step = 0; step < n; step++)
            {
                var i = pointAt[step];
                foreach (var h in units)
                {
                    h.Advance(cycle.Method, dt, i, i != previous);
                    h.Record(step + 1, ambient[i] - 273.15, dt);
                }
                previous = i;
            }
        }
        var unit = cycle.Let is { } let && model.Lets.TryGetValue(let, out var q) ? q.Dimension.SiUnit() : "pu";
        return new ThermalResult(cycle, [.. times], [.. loads], [.. ambients], [.. units.Select(h => h.Result(times, points, pointAt, dt))])
        {
            Days = days + 1,
            LoadUnit = unit,
        };
    }

    /// <summary>The ambient (K) in force from each cycle point: its own, else the last one given before it (round the day), else the cycle's.</summary>
    private static double[] Ambients(LoadCycleModel cycle)
    {
        var points = cycle.Points;
        var result = new double[points.Length];
        for (var i = 0; i < points.Length; i++)
        {
            double? found = null;
            for (var back = 0; back < points.Length && found is null; back++)
                found = points[(i - back + points.Length) % points.Length].Ambient;
            result[i] = found ?? cycle.Ambient!.Value;
        }
        return result;
    }

    private static SectionHeat[]? SolveAt(SyntaxTree syntax, Model.Model model, LoadScaling scaling, SymbolicFactors factors, CaseResult normal, LoadCycleModel cycle, CyclePointModel point, out string? problem, CancellationToken cancel)
    {
        problem = null;
        Network at;
        var scaled = false;
        CaseSpec spec = CaseSpec.Normal;
        if (cycle.Let is { } let)
        {
            var overrides = new BindOverrides { Values = ImmutableDictionary<string, Quantity>.Empty.Add(let, point.Load), RatedFrequency = model.RatedFrequency };
            // The statements the let reaches bound again, as a sweep point's; in full where they cannot be alone (the full bind words any message).
            var bound = Binder.Rebind(model, overrides)?.Model ?? ZigzagImpedances.Bind(syntax, overrides, cancel);
            if (bound.Diagnostics.FirstOrDefault(d => d.IsError) is { } bindError)
            {
                problem = bindError.Message;
                return null;
            }
            bound = bound with { RatedFrequency = model.RatedFrequency };
            at = NetworkBuilder.Build(bound);
        }
        else
        {
            var k = point.Load.Real;
            if (k == 1) return Results.Heat(normal);
            if (k == 0)
            {
                at = scaling.Network;
                spec = spec.WithoutLoad();
            }
            else (at, scaled) = (scaling.At(k), true);
        }
        if (at.Diagnostics.FirstOrDefault(d => d.IsError) is { } buildError)
        {
            problem = buildError.Message;
            return null;
        }
        var solution = scaled ? scaling.Solve(at, cancel) : NetworkSolver.Solve(at, spec, factors, cancel);
        if (!solution.Solved)
        {
            problem = solution.Diagnostics.FirstOrDefault(d => d.IsError)?.Shown;
            return null;
        }
        return Results.Heat(solution);
    }

    /// <summary>Normal cyclic, long-time and short-time emergency limits (IEC 60076-7, its table of loading limits; from memory, REFERENCES R48): hot-spot and top oil (°C), current (pu) by class.</summary>
    internal static (double HotSpot, double TopOil, double Current) LimitsOf(LoadingDuty duty, string unitClass) => duty switch
    {
        LoadingDuty.NormalCyclic => (120, 105, unitClass == "large" ? 1.3 : 1.5),
        LoadingDuty.LongTimeEmergency => (140, 115, unitClass switch { "distribution" => 1.8, "medium" => 1.5, _ => 1.3 }),
        _ => (160, 115, unitClass switch { "distribution" => 2.0, "medium" => 1.8, _ => 1.5 }),
    };

    /// <summary>
    /// A unit's limits under a duty: an oil-immersed unit's by its class (<see cref="LimitsOf(LoadingDuty, string)"/>);
    /// a dry-type unit's hot-spot at its insulation system temperature, the temperature its class is
    /// rated for (IEC 60085), under every duty, no top oil, and 1.5 pu of current (IEC 60076-12, from memory).
    /// </summary>
    internal static (double HotSpot, double? TopOil, double Current) LimitsOf(LoadingDuty duty, ThermalUnitModel u)
    {
        if (u.Dry) return (u.InsulationClass ?? double.NaN, null, 1.5);
        var oil = LimitsOf(duty, u.Class);
        return (oil.HotSpot, oil.TopOil, oil.Current);
    }

    /// <summary>Above this hot-spot (°C) gas bubbles may form from the paper's moisture (IEC 60076-7, from memory).</summary>
    public const double BubbleRisk = 140;

    private static void Limits(ThermalResult r, DiagnosticBag diagnostics)
    {
        var duty = r.Cycle.Duty switch { LoadingDuty.NormalCyclic => "normal cyclic", LoadingDuty.LongTimeEmergency => "long-time emergency", _ => "short-time emergency" };
        foreach (var u in r.Units)
        {
            var limit = LimitsOf(r.Cycle.Duty, u.Unit);
            var span = u.Unit.NameSpan;
            if (u.PeakHotSpot > limit.HotSpot)
                diagnostics.ReportHotSpotHigh(span, u.Unit.Core, u.PeakHotSpot, r.Clock(u.PeakHotSpotTime), u.HottestWinding, limit.HotSpot, duty);
            if (limit.TopOil is { } topOilLimit && u.PeakTopOil > topOilLimit)
                diagnostics.ReportTopOilHigh(span, u.Unit.Core, u.PeakTopOil, r.Clock(u.PeakTopOilTime), topOilLimit, duty);
            var loaded = u.Windings.MaxBy(w => w.PeakLoad)!;
            if (loaded.PeakLoad > limit.Current + 1e-9)
                diagnostics.ReportCycleCurrentHigh(span, u.Unit.Core, loaded.Winding, loaded.PeakLoad, r.Clock(loaded.PeakLoadTime), limit.Current, duty, u.Unit.Dry ? "dry-type" : u.Unit.Class);
            if (!u.Unit.Dry && u.PeakHotSpot > BubbleRisk)
                diagnostics.ReportHotSpotCaution(span, u.Unit.Core, u.PeakHotSpot, r.Clock(u.PeakHotSpotTime));
        }
    }

    private static ImmutableArray<CheckResult> Check(Model.Model model, ThermalResult? r, DiagnosticBag diagnostics)
    {
        var results = ImmutableArray.CreateBuilder<CheckResult>();
        foreach (var e in model.Expects.Where(IsThermal))
        {
            var units = r?.Units.Where(u => e.Targets.IsEmpty || u.Unit.Core == e.Targets[0].Name).ToList() ?? [];
            string? problem = r is null
                ? model.Thermal.Cycle is null ? "there is no load cycle: give a 'load-cycle' line and its 'cycle-point' lines" : "the load cycle was not evaluated"
                : units.Count == 0 ? $"core '{e.Targets[0].Name}' has no 'thermal' line"
                : e.Measure == MeasureKind.EquivalentAging && units.Any(u => u.EquivalentAging is null) ? "the equivalent aging factor is defined for oil-immersed units only"
                : e.Measure == MeasureKind.TopOil && units.All(u => u.Unit.Dry) ? "a dry-type unit has no top oil"
                : null;
            CapabilityResult? capability = null;
            if (problem is null && e.Measure == MeasureKind.Capability)
            {
                var kind = e.Targets.Length > 1 && e.Targets[1].Name == "constant-load" ? CapabilityKind.ConstantLoad : CapabilityKind.CycleScale;
                capability = r!.Capabilities.FirstOrDefault(c => c.Capability.Core == e.Targets[0].Name && c.Capability.Kind == kind);
                problem = capability is null ? $"there is no 'capability {e.Targets[0].Name} {(kind == CapabilityKind.ConstantLoad ? "constant-load" : "cycle-scale")}' line"
                    : capability.Value is null ? $"the capability was not found: {capability.Problem}"
                    : capability.Beyond && !(double.IsPositiveInfinity(e.High) && capability.Value >= e.Low)
                        ? $"the capability is beyond the search, at least {ThermalCapability.Shown(r, capability.Capability, capability.Value.Value)}" : null;
            }
            if (problem is not null)
            {
                diagnostics.ReportCannotCheck(e, problem);
                results.Add(new CheckResult(e, false, null));
                continue;
            }
            var (value, time) = e.Measure switch
            {
                MeasureKind.HotSpot => units.Select(u => (u.PeakHotSpot, u.PeakHotSpotTime)).MaxBy(x => x.Item1),
                MeasureKind.TopOil => units.Where(u => !u.Unit.Dry).Select(u => (u.PeakTopOil, u.PeakTopOilTime)).MaxBy(x => x.Item1),
                MeasureKind.EquivalentAging => (units.Max(u => u.EquivalentAging!.Value), double.NaN),
                MeasureKind.Capability => (capability!.Value!.Value, double.NaN),
                _ => (units.Max(u => u.LossOfLife), double.NaN),
            };
            var slack = 1e-9 * Math.Max(Math.Abs(double.IsFinite(e.Low) ? e.Low : 0), Math.Abs(double.IsFinite(e.High) ? e.High : 0));
            var passed = value >= e.Low - slack && value <= e.High + slack;
            if (!passed) diagnostics.ReportCheckFailed(e, value, e.Measure == MeasureKind.Capability ? "" : double.IsNaN(time) ? "over the day" : $"at {r!.Clock(time)}", [], 1, 1);
            results.Add(new CheckResult(e, passed, value) { Min = value, Max = value, Failing = passed ? 0 : 1 });
        }
        return results.ToImmutable();
    }
}

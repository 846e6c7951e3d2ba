using System.Collections.Immutable;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

// The thermal statements: 'thermal' (a unit's data), 'load-cycle' and 'cycle-point' (the day of load),
// and the checks on what the cycle yields.
internal sealed partial class BindRun
{
    private readonly ImmutableArray<ThermalUnitModel>.Builder thermalUnits = ImmutableArray.CreateBuilder<ThermalUnitModel>();
    private readonly Dictionary<string, TextSpan> thermalCores = new(StringComparer.Ordinal);
    private readonly List<CyclePointModel> cyclePoints = [];
    private LoadCycleModel? loadCycle;

    /// <summary>A temperature rise is a difference: written in K, and well below what absolute temperatures in K read as.</summary>
    private const double LargestRise = 200;

    /// <summary>
    /// Typical constants by cooling mode, IEC 60076-7 (its table of thermal characteristics; from
    /// memory, REFERENCES R46): x, y, k11, k21, k22, τo (min), τw (min).
    /// </summary>
    internal static (double X, double Y, double K11, double K21, double K22, double OilMinutes, double WindingMinutes) Typical(CoolingMode cooling, bool distribution) => cooling switch
    {
        CoolingMode.ONAN when distribution => (0.8, 1.6, 1.0, 1.0, 2.0, 180, 4),
        CoolingMode.ONAN => (0.8, 1.3, 0.5, 2.0, 2.0, 210, 10),
        CoolingMode.ONAF => (0.8, 1.3, 0.5, 2.0, 2.0, 150, 7),
        CoolingMode.OF => (1.0, 1.3, 1.0, 1.3, 1.0, 90, 7),
        _ => (1.0, 2.0, 1.0, 1.0, 1.0, 90, 7),
    };

    /// <summary>Distribution transformers are those up to 2.5 MVA, medium power up to 100 MVA (IEC 60076-7, from memory).</summary>
    internal static string ClassOf(double? rating) => rating switch
    {
        <= 2.5e6 => "distribution",
        <= 100e6 => "medium",
        null => "medium",
        _ => "large",
    };

    /// <summary>
    /// Dry-type insulation classes by their insulation system temperature (°C): the average winding
    /// rise allowed at rated current (IEC 60076-11, its table of winding temperature-rise limits) and
    /// the hot-spot at rated load in a 20 °C ambient (IEC 60076-12, its table of rated hot-spot
    /// temperatures), so the hot-spot gradient over the winding's average is their difference. All
    /// from memory: verify against the standards before relying on a default.
    /// </summary>
    internal static readonly IReadOnlyDictionary<int, (double WindingRise, double RatedHotSpot)> DryClasses = new Dictionary<int, (double, double)>
    {
        [105] = (60, 95), [120] = (75, 110), [130] = (80, 120), [155] = (100, 145), [180] = (125, 170), [200] = (135, 190), [220] = (150, 210),
    };

    /// <summary>
    /// Typical constants of a dry-type unit (IEEE C57.96 and IEC 60076-12 give the winding exponent
    /// 0.8 for natural air, 0.9 forced; the rise follows the total loss, the gradient the load loss;
    /// one winding time constant, about an hour for natural air: from memory, verify). The oil's
    /// equation carries the average winding rise with this time constant, the gradient follows it
    /// with no overshoot (k21 1).
    /// </summary>
    internal static (double X, double Y, double Minutes) TypicalDry(CoolingMode cooling) =>
        cooling == CoolingMode.AF ? (0.9, 1.8, 40) : (0.8, 1.6, 60);

    private void BindThermal(StatementSyntax s)
    {
        var nameSyntax = s.Head.Name(0);
        var core = Resolve(nameSyntax, "a core", SymbolKind.Core);
        var coolingClause = s.Clause("cooling");
        var coolingName = coolingClause?.Name(0);
        CoolingMode? cooling = null;
        if (coolingName is not null)
        {
            if (Enum.TryParse<CoolingMode>(coolingName.Text, ignoreCase: false, out var c) && Enum.IsDefined(c)) cooling = c;
            else diagnostics.ReportUnknownCooling(coolingName.Name, Spelling.Nearest(coolingName.Text, Grammar.CoolingModes));
        }
        var dry = cooling is CoolingMode.AN or CoolingMode.AF;
        int? insulation = null;
        var classSyntax = coolingClause?.Value(0);
        if (classSyntax is not null && cooling is not null)
        {
            if (!dry)
            {
                diagnostics.ReportClassOfOil(classSyntax.Span);
                return;
            }
            if (Real(classSyntax, Dimension.TemperatureDim, "the insulation system temperature", positive: true) is { } kelvin)
            {
                var celsius = (int)Math.Round(kelvin - 273.15);
                if (Math.Abs(kelvin - 273.15 - celsius) < 1e-6 && DryClasses.ContainsKey(celsius)) insulation = celsius;
                else diagnostics.ReportOutOfBounds(classSyntax.Span, "the insulation system temperature", $"one of the classes {string.Join(", ", DryClasses.Keys)} degC");
            }
            if (dry && insulation is null) return;
        }
        else if (dry && coolingClause is not null)
        {
            diagnostics.ReportDryWithoutClass(coolingClause.Span);
            return;
        }
        var topOilSyntax = s.Value("top-oil-rise");
        var windingRiseSyntax = s.Value("winding-rise");
        if (cooling is not null && (dry ? topOilSyntax : windingRiseSyntax) is { } wrongRise)
        {
            diagnostics.ReportRiseOfOtherCooling(wrongRise.Span, dry);
            return;
        }
        if (cooling is not null && !dry && topOilSyntax is null)
        {
            diagnostics.ReportThermalClauseMissing(s.Keyword.Span.Cover(nameSyntax?.Name.Span ?? s.Keyword.Span), "'top-oil-rise'");
            return;
        }
        if (cooling is not null && !dry && s.Clause("hot-spot-gradient") is null && s.Clause("hot-spot-factor") is null)
        {
            diagnostics.ReportThermalClauseMissing(s.Keyword.Span.Cover(nameSyntax?.Name.Span ?? s.Keyword.Span), "'hot-spot-gradient' or 'hot-spot-factor'");
            return;
        }
        double? topOil = null;
        if (topOilSyntax is not null) topOil = Rise(topOilSyntax, "the rated top-oil rise");
        else if (windingRiseSyntax is not null) topOil = Rise(windingRiseSyntax, "the rated average winding rise");
        double? gradient = null;
        var gradientGiven = true;
        if (s.Clause("hot-spot-gradient") is { } g) gradient = Rise(g.Value(), "the hot-spot gradient");
        else if (s.Clause("hot-spot-factor") is { } f)
        {
            var factor = Real(f.Value(0), Dimension.None, "the hot-spot factor", positive: true);
            var average = Rise(f.Value(1), "the average winding gradient");
            if (factor is { } h && average is { } gr) gradient = h * gr;
        }
        else gradientGiven = false;
        var ratio = s.Clause("loss-ratio") is { } r ? Real(r.Value(), Dimension.None, "the loss ratio", positive: true) : null;
        var exponents = s.Clause("exponents");
        var x = exponents is null ? null : Real(exponents.Value(0), Dimension.None, "the oil exponent", positive: true);
        var y = exponents is null ? null : Real(exponents.Value(1), Dimension.None, "the winding exponent", positive: true);
        var times = s.Clause("time-constants");
        var oil = times is null ? null : Real(times.Value(0), Dimension.TimeDim, "the oil time constant", positive: true);
        var winding = times is null ? null : Real(times.Value(1), Dimension.TimeDim, "the winding time constant", positive: true);
        var k = new[] { "k11", "k21", "k22" }.Select(n => s.Clause(n) is { } c ? Real(c.Value(), Dimension.None, $"the constant {n}", positive: true) : null).ToArray();
        var kGiven = new[] { "k11", "k21", "k22" }.Select(n => s.Clause(n) is not null).ToArray();
        var paper = s.Clause("paper")?.Word(_ => true)?.Text;
        if (dry && paper is not null)
        {
            diagnostics.ReportPaperOfDry(s.Clause("paper")!.Span);
            return;
        }
        var riseGiven = topOilSyntax is not null || windingRiseSyntax is not null;
        if (core is null || cooling is not { } mode || (riseGiven && topOil is null) || (gradientGiven && gradient is null)) return;
        if ((exponents is not null && (x is null || y is null)) || (times is not null && (oil is null || winding is null)) || k.Where((v, i) => kGiven[i] && v is null).Any()) return;
        if (thermalCores.TryGetValue(core.Name, out var first))
        {
            diagnostics.ReportDuplicateThermal(nameSyntax!.Name, first);
            return;
        }
        thermalCores[core.Name] = nameSyntax!.Name.Span;
        var rating = cores.FirstOrDefault(c => c.Name == core.Name)?.Rating ?? ThreePhaseRating(core.Name);
        var unitClass = dry ? "dry-type" : ClassOf(rating);
        var defaulted = new List<string>();
        (double X, double Y, double K11, double K21, double K22, double OilMinutes, double WindingMinutes) typical;
        if (dry)
        {
            var (dx, dy, minutes) = TypicalDry(mode);
            typical = (dx, dy, 1, 1, 1, minutes, minutes);
            var (classRise, ratedHotSpot) = DryClasses[insulation!.Value];
            if (topOil is null) defaulted.Add($"average winding rise {Numbers.Plain(classRise)} K");
            topOil ??= classRise;
            if (gradient is null) defaulted.Add($"hot-spot gradient {Numbers.Plain(ratedHotSpot - 20 - classRise)} K");
            gradient ??= ratedHotSpot - 20 - classRise;
        }
        else typical = Typical(mode, unitClass == "distribution");
        if (exponents is null) defaulted.Add($"exponents x {Numbers.Plain(typical.X)}, y {Numbers.Plain(typical.Y)}");
        if (times is null)
            defaulted.Add(dry ? $"time constants {Numbers.Plain(typical.OilMinutes)} min winding average, {Numbers.Plain(typical.WindingMinutes)} min hot-spot"
                : $"time constants {Numbers.Plain(typical.OilMinutes)} min oil, {Numbers.Plain(typical.WindingMinutes)} min winding");
        var typicalK = new[] { typical.K11, typical.K21, typical.K22 };
        var missingK = new[] { "k11", "k21", "k22" }.Select((n, i) => kGiven[i] ? null : $"{n} {Numbers.Plain(typicalK[i])}").OfType<string>().ToList();
        if (missingK.Count > 0) defaulted.Add($"model constants {string.Join(", ", missingK)}");
        if (paper is null && !dry) defaulted.Add("paper non-upgraded");
        var unit = new ThermalUnitModel(core.Name, nameSyntax.Name.Span, s.Span, mode, topOil!.Value, gradient!.Value)
        {
            LossRatio = ratio,
            X = x ?? typical.X,
            Y = y ?? typical.Y,
            OilTimeConstant = oil ?? typical.OilMinutes * 60,
            WindingTimeConstant = winding ?? typical.WindingMinutes * 60,
            K11 = k[0] ?? typical.K11,
            K21 = k[1] ?? typical.K21,
            K22 = k[2] ?? typical.K22,
            Upgraded = paper == "upgraded",
            Class = unitClass,
            InsulationClass = insulation,
            Defaulted = [.. defaulted],
        };
        if (defaulted.Count > 0)
            diagnostics.ReportThermalDefaults(s.Keyword.Span.Cover(nameSyntax.Name.Span), mode, dry ? $"class {insulation} degC dry-type" : unitClass, defaulted);
        thermalUnits.Add(unit);
    }

    private readonly ImmutableArray<CapabilityModel>.Builder capabilities = ImmutableArray.CreateBuilder<CapabilityModel>();

    private void BindCapability(StatementSyntax s)
    {
        var nameSyntax = s.Head.Name(0);
        var core = Resolve(nameSyntax, "a core", SymbolKind.Core);
        var kind = s.Head.Word(w => w is "constant-load" or "cycle-scale")?.Text == "constant-load" ? CapabilityKind.ConstantLoad : CapabilityKind.CycleScale;
        double? Limit(string clause, Dimension dimension)
        {
            if (s.Clause(clause) is not { } c) return null;
            return Real(c.Value(), dimension, $"the {clause} limit", positive: true);
        }
        var hotSpot = Limit("hot-spot", Dimension.TemperatureDim);
        var topOil = Limit("top-oil", Dimension.TemperatureDim);
        var life = Limit("loss-of-life", Dimension.TimeDim);
        if (core is null || (s.Clause("hot-spot") is not null && hotSpot is null) || (s.Clause("top-oil") is not null && topOil is null) || (s.Clause("loss-of-life") is not null && life is null)) return;
        if (capabilities.FirstOrDefault(c => c.Core == core.Name && c.Kind == kind) is { } same)
        {
            diagnostics.ReportDuplicateCapability(nameSyntax!.Name, same.Line);
            return;
        }
        capabilities.Add(new CapabilityModel(s.Span, core.Name, nameSyntax!.Name.Span, kind, hotSpot - 273.15, topOil - 273.15, life / 3600));
    }

    /// <summary>The rating of a three-phase core, whose phase cores are in the list by their phase names.</summary>
    private double? ThreePhaseRating(string core) =>
        cores.Where(c => c.Name.StartsWith(core + "_", StringComparison.Ordinal)).Select(c => c.Rating).ToList() is { Count: 3 } phases && phases.All(r => r is not null)
            ? phases.Sum() : null;

    private double? Rise(ValueSyntax? value, string description)
    {
        if (Real(value, Dimension.TemperatureDim, description) is not { } rise) return null;
        if (rise > 0 && rise <= LargestRise) return rise;
        diagnostics.ReportOutOfBounds(value!.Span, description, $"a rise above 0 K and at most {LargestRise:0} K, written in K");
        return null;
    }

    private void BindLoadCycle(StatementSyntax s)
    {
        if (!Once(s)) return;
        var let = s.Clause("of")?.Name(0) is { } name ? Resolve(name, "a let", SymbolKind.Let)?.Name : null;
        var ambient = s.Clause("ambient") is { } a ? Ambient(a.Value()) : null;
        var stepSyntax = s.Value("step");
        var step = stepSyntax is null ? 60 : Real(stepSyntax, Dimension.TimeDim, "the time step", positive: true);
        if (step is { } dt && (dt < 1 - 1e-9 || dt > 3600 + 1e-9 || Math.Abs(86400 / dt - Math.Round(86400 / dt)) > 1e-6))
        {
            diagnostics.ReportOutOfBounds(stepSyntax!.Span, "the time step", "from 1 s to 1 h and a whole part of a day");
            step = null;
        }
        var method = s.Clause("method")?.Word(_ => true)?.Text == "exponential" ? ThermalMethod.Exponential : ThermalMethod.DifferenceEquation;
        var duty = s.Clause("duty")?.Word(_ => true)?.Text switch
        {
            "long-time-emergency" => LoadingDuty.LongTimeEmergency,
            "short-time-emergency" => LoadingDuty.ShortTimeEmergency,
            _ => LoadingDuty.NormalCyclic,
        };
        if ((s.Clause("of") is not null && let is null) || (s.Clause("ambient") is not null && ambient is null) || step is not { } okStep) return;
        loadCycle = new LoadCycleModel(s.Span, let, ambient, okStep, method, duty, []);
    }

    private double? Ambient(ValueSyntax? value)
    {
        if (Real(value, Dimension.TemperatureDim, "the ambient temperature", positive: true) is not { } t) return null;
        // −60 °C to 60 °C: outside it the thermal constants of the standard say nothing.
        if (t >= 213.15 && t <= 333.15) return t;
        diagnostics.ReportOutOfBounds(value!.Span, "the ambient temperature", "from -60 degC to 60 degC");
        return null;
    }

    private void BindCyclePoint(StatementSyntax s)
    {
        var timeSyntax = s.Head.Value();
        var time = Real(timeSyntax, Dimension.TimeDim, "the time of day");
        if (time is { } t && (t < 0 || t >= 86400 - 1e-9))
        {
            diagnostics.ReportOutOfBounds(timeSyntax!.Span, "the time of day", "from 0 h to before 24 h");
            time = null;
        }
        var load = Value(s.Value("load"), "the load");
        var ambient = s.Clause("ambient") is { } a ? Ambient(a.Value()) : null;
        if (time is not { } at || load is not { } q || (s.Clause("ambient") is not null && ambient is null)) return;
        if (cyclePoints.FirstOrDefault(p => Math.Abs(p.Time - at) < 1e-6) is { } same)
        {
            diagnostics.ReportDuplicateCyclePoint(timeSyntax!.Span, same.Line);
            return;
        }
        cyclePoints.Add(new CyclePointModel(s.Span, at, q, ambient) { LoadSpan = s.Value("load")!.Span });
    }

    /// <summary>The thermal part of the model once every line is read: the cycle's points checked against its let, in time order.</summary>
    private ThermalModel ThermalResult()
    {
        var lineOfCycle = tree.Statements.FirstOrDefault(s => s.Kind == StatementKind.LoadCycle);
        if (lineOfCycle is null)
        {
            if (cyclePoints.Count > 0) diagnostics.ReportCyclePointWithoutCycle(cyclePoints[0].Line);
            return new ThermalModel(thermalUnits.ToImmutable(), null) { Capabilities = capabilities.ToImmutable() };
        }
        if (loadCycle is not { } cycle) return new ThermalModel(thermalUnits.ToImmutable(), null) { Capabilities = capabilities.ToImmutable() };
        var points = ImmutableArray.CreateBuilder<CyclePointModel>();
        Quantity? letValue = cycle.Let is { } let && lets.TryGetValue(let, out var lv0) ? lv0 : null;
        foreach (var p in cyclePoints.OrderBy(p => p.Time))
        {
            var q = p.Load;
            if (cycle.Let is not null)
            {
                if (letValue is not { } lv) continue;
                if (!q.Dimension.Fits(lv.Dimension) || q.IsBare != lv.IsBare)
                {
                    diagnostics.ReportWrongDimension(p.LoadSpan, $"a value of '{cycle.Let}' ({lv.Dimension.Describe()})", q.Dimension);
                    continue;
                }
            }
            else if (q.IsBare || !q.Dimension.IsNone || !q.IsReal || q.Real < 0)
            {
                if (q.IsBare) diagnostics.ReportMissingUnit(p.LoadSpan, "the per-unit load", tree.Text[p.LoadSpan], ["pu", "%"], fixable: false);
                else diagnostics.ReportOutOfBounds(p.LoadSpan, "the load of a cycle without 'of'", "a per-unit multiple (pu or %) of the loads as written, zero or more");
                continue;
            }
            points.Add(p);
        }
        if (cyclePoints.Count == 0) diagnostics.ReportCycleWithoutPoints(cycle.Line);
        else if (cycle.Ambient is null && !cyclePoints.Any(p => p.Ambient is not null)) diagnostics.ReportCycleWithoutAmbient(cycle.Line);
        // A capability with a let is a value of the let; without, a per-unit multiple: its checks' bounds must be one.
        foreach (var (expect, bound) in capabilityBounds)
        {
            var constantOfLet = cycle.Let is not null && expect.Targets.Length > 1 && expect.Targets[1].Name == "constant-load";
            if (constantOfLet && letValue is { } lv && !(bound.Dimension.Fits(lv.Dimension) && !bound.IsBare))
                diagnostics.ReportWrongDimension(bound.Span, $"a value of '{cycle.Let}' ({lv.Dimension.Describe()})", bound.Dimension);
            else if (!constantOfLet && (bound.IsBare || !bound.Dimension.IsNone))
                diagnostics.ReportOutOfBounds(bound.Span, "a bound on a capability", "a per-unit multiple (pu or %)");
            else
            {
                if (constantOfLet && letValue is { } ofLet && expects.IndexOf(expect) is var at and >= 0) expects[at] = expect with { Unit = ofLet.Dimension.SiUnit() };
                continue;
            }
            expects.Remove(expect);
        }
        return new ThermalModel(thermalUnits.ToImmutable(), cycle with { Points = points.ToImmutable() }) { Capabilities = capabilities.ToImmutable() };
    }

    /// <summary>The bounds of capability checks, checked against the cycle once it is bound: (the check, each bound's dimension, bareness and span).</summary>
    private readonly List<(ExpectModel Expect, (Dimension Dimension, bool IsBare, TextSpan Span) Bound)> capabilityBounds = [];

    private void BindThermalExpect(StatementSyntax s, ClauseSyntax measureClause, ClauseSyntax conditionClause)
    {
        var measure = measureClause.Keyword!.Text switch
        {
            "hot-spot" => MeasureKind.HotSpot,
            "top-oil" => MeasureKind.TopOil,
            "equivalent-aging" => MeasureKind.EquivalentAging,
            "capability" => MeasureKind.Capability,
            _ => MeasureKind.LossOfLife,
        };
        if (measure is MeasureKind.EquivalentAging or MeasureKind.Capability)
        {
            BindRatioExpect(s, measureClause, conditionClause, measure);
            return;
        }
        var targets = ImmutableArray.CreateBuilder<NodeRef>();
        if (measureClause.Name(0) is { } name)
        {
            if (Resolve(name, "a core", SymbolKind.Core) is not { } core) return;
            targets.Add(new NodeRef(core.Name, name.Name.Span));
        }
        var life = measure == MeasureKind.LossOfLife;
        var dimension = life ? Dimension.TimeDim : Dimension.TemperatureDim;
        var what = $"a bound on {measureClause.Keyword.Text}";
        // Bounds as the report shows them: temperatures in degC, loss of life in hours.
        double Shown(double si) => life ? si / 3600 : si - 273.15;
        double low = double.NegativeInfinity, high = double.PositiveInfinity, target = double.NaN;
        switch (conditionClause.Keyword!.Text)
        {
            case "between":
                if (Real(conditionClause.Value(0), dimension, what) is not { } lo || Real(conditionClause.Value(1), dimension, what) is not { } hi) return;
                (low, high) = (Shown(Math.Min(lo, hi)), Shown(Math.Max(lo, hi)));
                break;
            case "below":
                if (Real(conditionClause.Value(0), dimension, what) is not { } below) return;
                high = Shown(below);
                break;
            case "above":
                if (Real(conditionClause.Value(0), dimension, what) is not { } above) return;
                low = Shown(above);
                break;
            case "near":
                if (Real(conditionClause.Value(0), dimension, what) is not { } near) return;
                var withinSyntax = conditionClause.Value(1);
                if (Value(withinSyntax, "the tolerance of the check") is not { } within) return;
                double band;
                if (within.IsPercent && within.Dimension.IsNone) band = Math.Abs(Shown(near)) * within.Real;
                // A tolerance on a temperature is a difference: K, or degC read as a difference.
                else if (within.Dimension.Fits(dimension) && within.IsReal) band = life ? within.Real / 3600 : Math.Abs(UnitWord(withinSyntax) == "degC" ? within.Real - 273.15 : within.Real);
                else
                {
                    diagnostics.ReportToleranceDimension(withinSyntax!.Span, dimension, within.Dimension);
                    return;
                }
                (low, high, target) = (Shown(near) - band, Shown(near) + band, Shown(near));
                break;
            default:
                diagnostics.ReportOutOfBounds(conditionClause.Span, $"a check on {measureClause.Keyword.Text}", "'below', 'above', 'between' or 'near'");
                return;
        }
        expects.Add(new ExpectModel(s.Span, tree.Text[s.Span], measure, targets.ToImmutable(), Enum.Parse<ConditionKind>(conditionClause.Keyword.Text, true), low, high, life ? "h" : "degC")
        {
            Target = target,
            MeasureText = tree.Text[measureClause.Span],
            ConditionText = tree.Text[conditionClause.Span],
        });
    }

    /// <summary>
    /// A check on a plain number: the equivalent aging factor (a ratio), or a capability (a per-unit
    /// multiple, or a value of the cycle's let for a constant load with 'of'). Bounds as the file
    /// writes them, in SI; a capability's are checked against the cycle at the end.
    /// </summary>
    private void BindRatioExpect(StatementSyntax s, ClauseSyntax measureClause, ClauseSyntax conditionClause, MeasureKind measure)
    {
        var targets = ImmutableArray.CreateBuilder<NodeRef>();
        if (measureClause.Name(0) is { } name)
        {
            if (Resolve(name, "a core", SymbolKind.Core) is not { } core) return;
            targets.Add(new NodeRef(core.Name, name.Name.Span));
        }
        if (measure == MeasureKind.Capability && measureClause.Word(w => w is "constant-load" or "cycle-scale") is { } kindWord)
            targets.Add(new NodeRef(kindWord.Text, kindWord.Span));
        var bounds = new List<(Quantity Value, TextSpan Span)>();
        foreach (var v in conditionClause.Values)
        {
            if (Value(v, "a bound of the check") is not { } q) return;
            bounds.Add((q, v.Span));
        }
        if (bounds.Count == 0)
        {
            diagnostics.ReportOutOfBounds(conditionClause.Span, $"a check on {measureClause.Keyword!.Text}", "'below', 'above', 'between' or 'near'");
            return;
        }
        if (measure == MeasureKind.EquivalentAging)
            foreach (var (q, span) in bounds.Where(b => !b.Value.Dimension.IsNone || !b.Value.IsReal))
            {
                diagnostics.ReportWrongDimension(span, "a plain number (the equivalent aging factor)", q.Dimension);
                return;
            }
        double low = double.NegativeInfinity, high = double.PositiveInfinity, target = double.NaN;
        var first = bounds[0].Value.Real;
        switch (conditionClause.Keyword!.Text)
        {
            case "between" when bounds.Count == 2:
                (low, high) = (Math.Min(first, bounds[1].Value.Real), Math.Max(first, bounds[1].Value.Real));
                break;
            case "below":
                high = first;
                break;
            case "above":
                low = first;
                break;
            case "near" when bounds.Count == 2:
                var within = bounds[1].Value;
                var band = within.IsPercent && within.Dimension.IsNone && !bounds[0].Value.IsPercent ? Math.Abs(first) * within.Real : Math.Abs(within.Real);
                (low, high, target) = (first - band, first + band, first);
                break;
            default:
                diagnostics.ReportOutOfBounds(conditionClause.Span, $"a check on {measureClause.Keyword!.Text}", "'below', 'above', 'between' or 'near'");
                return;
        }
        var expect = new ExpectModel(s.Span, tree.Text[s.Span], measure, targets.ToImmutable(), Enum.Parse<ConditionKind>(conditionClause.Keyword.Text, true), low, high, measure == MeasureKind.Capability ? "pu" : "")
        {
            Target = target,
            MeasureText = tree.Text[measureClause.Span],
            ConditionText = tree.Text[conditionClause.Span],
        };
        expects.Add(expect);
        if (measure == MeasureKind.Capability) capabilityBounds.Add((expect, (bounds[0].Value.Dimension, bounds[0].Value.IsBare, bounds[0].Span)));
    }
}

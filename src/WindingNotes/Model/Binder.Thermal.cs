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

    private void BindThermal(StatementSyntax s)
    {
        var nameSyntax = s.Head.Name(0);
        var core = Resolve(nameSyntax, "a core", SymbolKind.Core);
        var coolingName = s.Clause("cooling")?.Name(0);
        CoolingMode? cooling = null;
        if (coolingName is not null)
        {
            if (Enum.TryParse<CoolingMode>(coolingName.Text, ignoreCase: false, out var c) && Enum.IsDefined(c)) cooling = c;
            else diagnostics.ReportUnknownCooling(coolingName.Name, Spelling.Nearest(coolingName.Text, Enum.GetNames<CoolingMode>()));
        }
        var topOil = Rise(s.Value("top-oil-rise"), "the rated top-oil rise");
        double? gradient = null;
        if (s.Clause("hot-spot-gradient") is { } g) gradient = Rise(g.Value(), "the hot-spot gradient");
        else if (s.Clause("hot-spot-factor") is { } f)
        {
            var factor = Real(f.Value(0), Dimension.None, "the hot-spot factor", positive: true);
            var average = Rise(f.Value(1), "the average winding gradient");
            if (factor is { } h && average is { } gr) gradient = h * gr;
        }
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
        if (core is null || cooling is not { } mode || topOil is not { } rise || gradient is not { } hr) return;
        if ((exponents is not null && (x is null || y is null)) || (times is not null && (oil is null || winding is null)) || k.Where((v, i) => kGiven[i] && v is null).Any()) return;
        if (thermalCores.TryGetValue(core.Name, out var first))
        {
            diagnostics.ReportDuplicateThermal(nameSyntax!.Name, first);
            return;
        }
        thermalCores[core.Name] = nameSyntax!.Name.Span;
        var rating = cores.FirstOrDefault(c => c.Name == core.Name)?.Rating ?? ThreePhaseRating(core.Name);
        var unitClass = ClassOf(rating);
        var typical = Typical(mode, unitClass == "distribution");
        var defaulted = new List<string>();
        if (exponents is null) defaulted.Add($"exponents x {Numbers.Plain(typical.X)}, y {Numbers.Plain(typical.Y)}");
        if (times is null) defaulted.Add($"time constants {Numbers.Plain(typical.OilMinutes)} min oil, {Numbers.Plain(typical.WindingMinutes)} min winding");
        var typicalK = new[] { typical.K11, typical.K21, typical.K22 };
        var missingK = new[] { "k11", "k21", "k22" }.Select((n, i) => kGiven[i] ? null : $"{n} {Numbers.Plain(typicalK[i])}").OfType<string>().ToList();
        if (missingK.Count > 0) defaulted.Add($"model constants {string.Join(", ", missingK)}");
        if (paper is null) defaulted.Add("paper non-upgraded");
        var unit = new ThermalUnitModel(core.Name, nameSyntax.Name.Span, s.Span, mode, rise, hr)
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
            Defaulted = [.. defaulted],
        };
        if (defaulted.Count > 0) diagnostics.ReportThermalDefaults(s.Keyword.Span.Cover(nameSyntax.Name.Span), mode, unitClass, defaulted);
        thermalUnits.Add(unit);
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
            return new ThermalModel(thermalUnits.ToImmutable(), null);
        }
        if (loadCycle is not { } cycle) return new ThermalModel(thermalUnits.ToImmutable(), null);
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
        return new ThermalModel(thermalUnits.ToImmutable(), cycle with { Points = points.ToImmutable() });
    }

    private void BindThermalExpect(StatementSyntax s, ClauseSyntax measureClause, ClauseSyntax conditionClause)
    {
        var measure = measureClause.Keyword!.Text switch { "hot-spot" => MeasureKind.HotSpot, "top-oil" => MeasureKind.TopOil, _ => MeasureKind.LossOfLife };
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
}

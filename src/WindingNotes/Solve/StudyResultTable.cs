using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>
/// The results <see cref="ResultTable"/> does not hold as groups of elements, in the same records:
/// the parts of a case written after its groups (a bus fault's study, the three-phase sets and vector
/// groups) and the sections of the study that are not per case (the load cycle, the units' sequence
/// impedances, paralleled units). The JSON report and grammar/results.schema.json are written from
/// them, as from the results table; a test keeps the schema equal to them.
/// </summary>
public static class StudyResultTable
{
    private static ResultField Field<T>(string key, ResultKind kind, string unit, Func<T, object?> read, string description = "", bool required = false) =>
        new(key, kind, unit, description, x => read((T)x)) { Required = required };

    private static ResultField Number<T>(string key, string unit, Func<T, double?> read, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Number, unit, x => read(x), description, required) with { ReadNumber = x => read((T)x) };

    private static ResultField Phasor<T>(string key, string unit, Func<T, Complex?> read, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Phasor, unit, x => read(x), description, required) with { ReadPhasor = x => read((T)x) };

    private static ResultField Word<T>(string key, Func<T, string?> read, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Word, "", read, description, required);

    private static ResultField Choice<T>(string key, Func<T, string?> read, ImmutableArray<string> choices, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Choice, "", read, description, required) with { Choices = choices };

    private static ResultField Boolean<T>(string key, Func<T, bool?> read, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Boolean, "", x => read(x), description, required);

    private static ResultField Integer<T>(string key, Func<T, int?> read, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Integer, "", x => read(x), description, required);

    private static ResultField Sequence<T>(string key, string unit, Func<T, Sequence> read, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Sequence, unit, read, description, required);

    private static ResultField Object<T>(string key, Func<T, object?> read, string description, params ResultField[] fields) =>
        Field<T>(key, ResultKind.Object, "", read, description) with { Nested = [.. fields] };

    /// <summary>Elements by name, each as <paramref name="item"/> says; absent where <paramref name="read"/> gives null.</summary>
    private static ResultField Map<T>(string key, Func<T, IEnumerable<(string, object)>?> read, ResultField item, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.Map, "", read, description, required) with { Item = item };

    private static ResultField List<T>(string key, Func<T, IEnumerable<object>?> read, ResultField item, string description = "", bool required = false) =>
        Field<T>(key, ResultKind.List, "", read, description, required) with { Item = item };

    /// <summary>An element that is an object of these fields.</summary>
    private static ResultField Of(params ResultField[] fields) => new("", ResultKind.Object, "", "", x => x) { Nested = [.. fields] };

    /// <summary>An element written as it is, of this kind.</summary>
    private static ResultField Each(ResultKind kind, string unit = "") => new("", kind, unit, "", x => x);

    /// <summary>Three phasors by the phases' letters (or the line pairs').</summary>
    private static ResultField ThreePhasors<T>(string key, string unit, Func<T, ImmutableArray<Complex>> read, IReadOnlyList<string> names, string description) =>
        Object<T>(key, x => read(x), description, [.. names.Select((name, k) => Phasor<ImmutableArray<Complex>>(name, unit, v => v[k], required: true))]);

    private static readonly string[] LinePairs = ["ab", "bc", "ca"];

    private static double? Finite(double x) => double.IsFinite(x) ? x : null;

    private static double? Celsius(double? kelvin) => kelvin - 273.15;

    public sealed record FaultLine(Complex Current, Complex Voltage);

    public sealed record Duty(ShortCircuitResult Study, WindingDuty Winding);

    public sealed record ThermalUnit(ThermalResult Cycle, ThermalUnitResult Unit);

    public sealed record Hour(ThermalResult Cycle, int Sample);

    public sealed record HourOfUnit(ThermalUnitResult Unit, int Sample);

    /// <summary>The parts of a case after its groups, in the report's order, each where the case has it.</summary>
    public static readonly ImmutableArray<ResultGroup> CaseParts =
    [
        new ResultGroup("busFault", "in a bus fault's case: the fault study (every section's current is then the fault duty it carries)",
        [
            Word<ShortCircuitResult>("fault", sc => sc.Fault.Name, required: true),
            Choice<ShortCircuitResult>("kind", sc => BusFaultModel.Word(sc.Fault.Kind), [.. Enum.GetValues<BusFaultKind>().Select(BusFaultModel.Word)], required: true),
            Choice<ShortCircuitResult>("study", sc => sc.Extreme, ["maximum", "minimum", "as loaded"], required: true),
            Choice<ShortCircuitResult>("method", sc => sc.Study.Method == FaultMethod.AsLoaded ? "as-loaded" : "equivalent-source", ["equivalent-source", "as-loaded"], required: true),
            Number<ShortCircuitResult>("c", "", sc => sc.VoltageFactor, "the voltage factor of the equivalent source (IEC 60909-0); 1 as loaded", required: true),
            Number<ShortCircuitResult>("nominal", "V", sc => sc.Nominal, "the nominal line-to-line voltage at the bus, V", required: true),
            Map<ShortCircuitResult>("lines", sc => sc.Fault.Lines.Select((line, p) => (line.Name, (object)new FaultLine(sc.LineCurrents[p], sc.LineVoltages[p]))),
                Of(Phasor<FaultLine>("i", "A", l => l.Current, "from the line into the fault", required: true),
                   Phasor<FaultLine>("v", "V", l => l.Voltage, "the line's voltage to earth during the fault", required: true)), required: true),
            Phasor<ShortCircuitResult>("earth", "A", sc => sc.EarthCurrent, "the current from the fault into earth", required: true),
            Sequence<ShortCircuitResult>("iSequence", "A", sc => sc.Currents, required: true),
            Sequence<ShortCircuitResult>("vSequence", "V", sc => sc.Voltages, required: true),
            Number<ShortCircuitResult>("ik", "A", sc => sc.Initial, "initial symmetrical short-circuit current: the largest faulted line's, A", required: true),
            Number<ShortCircuitResult>("kappa", "", sc => sc.Kappa, "κ = 1.02 + 0.98·e^(−3R/X), R/X of the positive-sequence short-circuit impedance at the fault; for a meshed network 1.15 times that, at most 1.8 (up to 1 kV) or 2.0", required: true),
            Choice<ShortCircuitResult>("kappaMethod", sc => sc.EquivalentRX is not null ? "equivalent-frequency" : sc.KappaExempt ? "meshed-exempt" : sc.Study.Meshed ? "meshed" : "at-fault",
                ["at-fault", "meshed", "meshed-exempt", "equivalent-frequency"], "IEC 60909-0 method B: the ratio R/X at the fault, or with the factor 1.15 of a meshed network, or without it where R/X is below 0.3 in every branch; method C: the equivalent frequency"),
            Number<ShortCircuitResult>("rxEquivalent", "", sc => sc.EquivalentRX, "method C: (Rc/Xc)·(fc/f) of the short-circuit impedance at the equivalent frequency fc"),
            Map<ShortCircuitResult>("transformerCorrection", sc => sc.TransformerCorrections.IsEmpty ? null : sc.TransformerCorrections.Select(k => (k.Line, (object)k.Factor)),
                Each(ResultKind.Number), "K_T = 0.95·cmax/(1 + 0.6·xT) of each impedance line between two windings ('transformer-correction'), by the windings' names"),
            Number<ShortCircuitResult>("endTemperature", "degC", sc => Celsius(sc.EndTemperature), "minimum currents: the conductors' temperature at the end of the fault to which resistances given with a temperature are corrected, °C"),
            Number<ShortCircuitResult>("rx", "", sc => Finite(sc.RX)),
            Number<ShortCircuitResult>("ip", "A", sc => sc.Peak, "peak short-circuit current κ·√2·I″k, A", required: true),
            Number<ShortCircuitResult>("ith", "A", sc => sc.Thermal, "thermal equivalent short-circuit current over the duration, A", required: true),
            Number<ShortCircuitResult>("duration", "s", sc => sc.Study.Duration, "s", required: true),
            Number<ShortCircuitResult>("dcTimeConstant", "s", sc => Finite(sc.DcTimeConstant), "X/(ωR) of the fault loop, s"),
            Number<ShortCircuitResult>("earthFaultFactor", "", sc => sc.EarthFaultFactor, "faults to earth: the highest sound line's voltage to earth over its voltage before the fault"),
            Map<ShortCircuitResult>("duties", sc => sc.Duties.Select(d => (d.Winding.Name, (object)new Duty(sc, d))), Of(
                Number<Duty>("i", "A", d => d.Winding.Current, "the winding's largest section current, A", required: true),
                Number<Duty>("multiple", "", d => d.Winding.Multiple, "over its rated current"),
                Number<Duty>("peak", "A", d => d.Winding.Peak, "k·√2 times the current (IEC 60076-5, 2.55 above X/R 14)", required: true),
                Number<Duty>("peakWithstand", "A", d => d.Winding.PeakWithstand, "the peak the winding withstands as its line gives it ('peak-withstand'), A"),
                Number<Duty>("temperature", "degC", d => d.Winding.Temperature is { } t ? Celsius(Finite(t)) : null, "average winding temperature after the duration, degC"),
                Number<Duty>("temperatureLimit", "degC", d => Celsius(d.Winding.TemperatureLimit), "degC"),
                Choice<Duty>("category", d => d.Winding.Category, ["I", "II", "III", "IV"]),
                Number<Duty>("allowed", "s", d => d.Winding.AllowedSeconds, "seconds the through-fault category allows at this multiple; absent below 2 times rated current, where the curves start"),
                Number<Duty>("allowedFrequent", "s", d => d.Winding.FrequentSeconds, "seconds the category's frequent-fault curve allows at this multiple (IEEE C57.109)"),
                Number<Duty>("largestMultiple", "", d => d.Winding.LargestMultiple, "categories II and III: the largest through-fault multiple the frequent-fault curve is drawn from (1/Zt, or 1/(Zt + Zs) for III)"),
                Boolean<Duty>("withstands", d => !d.Study.Exceeds(d.Winding), required: true)), required: true),
            Map<ShortCircuitResult>("groundings", sc => sc.Groundings.IsEmpty ? null : sc.Groundings.Select(g => (g.Grounding.Element, (object)g)), Of(
                Phasor<GroundingDuty>("i", "A", g => g.Current, "the current from the node to earth through it, A", required: true),
                Phasor<GroundingDuty>("v", "V", g => g.Voltage, "the voltage across it: the node's voltage to earth, V", required: true),
                Number<GroundingDuty>("i2t", "A²s", g => g.I2t, "the current squared times the fault's duration, A²s", required: true),
                Number<GroundingDuty>("ratedCurrent", "A", g => g.Grounding.RatedCurrent, "its rated current as its line gives it, A"),
                Number<GroundingDuty>("ratedI2t", "A²s", g => g.RatedI2t, "its rated current squared times its time rating, A²s"),
                Boolean<GroundingDuty>("withstands", g => g.Judged ? !g.Exceeded : null, "with a rated current given: neither its current nor its I²t above its rating")),
                "each neutral-grounding impedance ('ground N impedance …') by its element's name"),
        ])
        { When = c => c.ShortCircuit is not null, Single = c => c.ShortCircuit! },

        new ResultGroup("threePhase", "where the file has three-phase statements: each unit's vector group from the wiring, and each three-phase terminal set (winding, supply, load) in source order",
        [
            Map<ThreePhaseResult>("vectorGroups", t => t.VectorGroups.Select(g => (g.Core, (object)g)), Of(
                Word<VectorGroup>("symbol", g => g.Symbol, "e.g. 'Dyn11', 'YNa0d1'; absent where the wiring gives no clock number"),
                Word<VectorGroup>("problem", g => g.Problem, "why there is no symbol, naming the phase winding whose reversal would give one"),
                Map<VectorGroup>("windings", g => g.Windings.Select(x => (x.Winding, (object)x)), Of(
                    Word<WindingSymbol>("letters", x => x.Letters, "'D', 'Y', 'YN', 'Z', 'ZN', 'III' for the first set, lower case for the others; 'a' for an autotransformer's low-voltage set", required: true),
                    Integer<WindingSymbol>("clock", x => x.Clock, "the phase displacement against the first set in steps of 30 degrees, lagging; absent for the first") with { Minimum = 0, Maximum = 11 }), required: true)),
                "by three-phase core: the IEC 60076-1 connection symbol, highest-voltage terminal set first, clock numbers in steps of 30 degrees lagging it", required: true),
            Map<ThreePhaseResult>("sets", t => t.Sets.Select(s => (s.Name, (object)s)), Of(
                Choice<PhaseSetResult>("kind", s => s.Kind, ["winding", "supply", "load"], required: true),
                ThreePhasors<PhaseSetResult>("v", "V", s => s.Voltages, Phases.Letters, "each line terminal's voltage against the reference"),
                ThreePhasors<PhaseSetResult>("vLineToLine", "V", s => s.LineToLine, LinePairs, "line-to-line voltages"),
                ThreePhasors<PhaseSetResult>("iPhase", "A", s => s.PhaseCurrents, Phases.Letters, "the current of each phase element: a phase winding's entering its from end, a supply's leaving it, a load's from its first node (a delta load's phases ab, bc, ca)"),
                ThreePhasors<PhaseSetResult>("iLine", "A", s => s.LineCurrents, Phases.Letters, "the current in each line into the element (out of a supply)"),
                Phasor<PhaseSetResult>("iNeutral", "A", s => s.NeutralCurrent, "the current out at the star point, where it has one"),
                Number<PhaseSetResult>("p", "W", s => s.Power.Real, "three-phase active power, W: drawn by a winding or a load, delivered by a supply", required: true),
                Number<PhaseSetResult>("q", "var", s => s.Power.Imaginary, "three-phase reactive power, var", required: true),
                Number<PhaseSetResult>("s", "VA", s => s.Power.Magnitude, "three-phase apparent power, VA", required: true),
                Number<PhaseSetResult>("pf", "", s => s.PowerFactor, required: true),
                Sequence<PhaseSetResult>("vSequence", "V", s => s.VoltageSequence, "symmetrical components of the line voltages (Fortescue): zero, positive, negative", required: true),
                Sequence<PhaseSetResult>("iSequence", "A", s => s.CurrentSequence, "symmetrical components of the line currents", required: true),
                Number<PhaseSetResult>("unbalance", "%", s => s.Unbalance, "voltage unbalance factor |V2|/|V1| (the IEC 61000-2-12 definition, not the NEMA MG 1 deviation from the average) in the sequence the supplies run in: |V1|/|V2| of the abc frame where every three-phase supply is 'sequence acb'; a fraction")),
                "by the three-phase element's name", required: true),
        ])
        {
            When = c => c.Fault is null && c.ShortCircuit is null && !(c.ThreePhase.Sets.IsEmpty && c.ThreePhase.VectorGroups.IsEmpty),
            Single = c => c.ThreePhase,
        },
    ];

    /// <summary>The sections of the study written after its cases, read from the <see cref="StudyResult"/>, each where the study has it.</summary>
    public static readonly ImmutableArray<ResultField> Study =
    [
        Object<StudyResult>("thermal", r => r.Thermal, "the load cycle through each unit's thermal data ('thermal', 'load-cycle', 'cycle-point'), where the file gives both and the cycle was solved: temperatures in degrees Celsius, times in s from midnight, loss of life in hours",
            Choice<ThermalResult>("method", r => r.Cycle.Method == ThermalMethod.DifferenceEquation ? "difference-equation" : "exponential", ["difference-equation", "exponential"], required: true),
            Number<ThermalResult>("step", "s", r => r.Cycle.Step, "the time step, s", required: true),
            Integer<ThermalResult>("days", r => r.Days, "days of the cycle run, the last being the one given: the first from the steady state of midnight's load, until the day repeats itself", required: true) with { Minimum = 1 },
            Word<ThermalResult>("loadUnit", r => r.LoadUnit, "'pu' where each cycle point scales every load as written, else the SI unit of the let the cycle points give values of", required: true),
            Map<ThermalResult>("units", r => r.Units.Select(u => (u.Unit.Core, (object)new ThermalUnit(r, u))), Of(
                Choice<ThermalUnit>("cooling", u => u.Unit.Unit.Cooling.ToString(), [.. Enum.GetNames<CoolingMode>()], required: true),
                Number<ThermalUnit>("insulationClass", "degC", u => u.Unit.Unit.InsulationClass, "a dry-type unit (cooling AN or AF): its insulation system temperature, degC"),
                Boolean<ThermalUnit>("upgradedPaper", u => u.Unit.Unit.InsulationClass is null ? u.Unit.Unit.Upgraded : null, "an oil-immersed unit: whether its paper is thermally upgraded"),
                Number<ThermalUnit>("ageingReference", "degC", u => ThermalEquations.AgeingReference(u.Unit.Unit), "the hot-spot at which the relative ageing rate is 1, degC: 98 (non-upgraded paper), 110 (upgraded paper), or a dry-type class's rated hot-spot (its rate doubling every 10 K)", required: true),
                Number<ThermalUnit>("lossRatio", "", u => u.Unit.LossRatio, "load loss at rated current over no-load loss, as given or from the windings' resistances and the no-load test", required: true),
                Number<ThermalUnit>("peakHotSpot", "degC", u => u.Unit.PeakHotSpot, "the highest hot-spot temperature of the day, degC", required: true),
                Number<ThermalUnit>("peakHotSpotTime", "s", u => u.Unit.PeakHotSpotTime, "when it is first reached, s from midnight", required: true),
                Word<ThermalUnit>("hottestWinding", u => u.Unit.HottestWinding, "the winding whose hot-spot is highest", required: true),
                Number<ThermalUnit>("peakTopOil", "degC", u => u.Unit.Unit.Dry ? null : u.Unit.PeakTopOil, "the highest top-oil temperature of the day, degC"),
                Number<ThermalUnit>("peakTopOilTime", "s", u => u.Unit.Unit.Dry ? null : u.Unit.PeakTopOilTime, "when it is first reached, s from midnight"),
                Number<ThermalUnit>("peakWindingAverage", "degC", u => u.Unit.Unit.Dry ? u.Unit.PeakTopOil : null, "a dry-type unit, in place of peakTopOil: the highest average winding temperature of the day, degC"),
                Number<ThermalUnit>("peakWindingAverageTime", "s", u => u.Unit.Unit.Dry ? u.Unit.PeakTopOilTime : null, "when it is first reached, s from midnight"),
                Number<ThermalUnit>("lossOfLife", "h", u => u.Unit.LossOfLife, "insulation life used over the day, in hours at the reference ageing rate", required: true),
                Number<ThermalUnit>("meanAgeing", "", u => u.Unit.MeanAgeing, "the relative ageing rate averaged over the day", required: true),
                Number<ThermalUnit>("peakAgeing", "", u => u.Unit.PeakAgeing, "the highest relative ageing rate of the day", required: true),
                Number<ThermalUnit>("equivalentAging", "", u => u.Unit.EquivalentAging, "an oil-immersed unit: the equivalent aging factor F_EQA of IEEE C57.91 over the day, the mean of F_AA = exp(15000/383 - 15000/(hot-spot + 273))"),
                Number<ThermalUnit>("peakAgingFactor", "", u => u.Unit.PeakAgingFactor, "an oil-immersed unit: the highest aging acceleration factor F_AA of the day"),
                Map<ThermalUnit>("capability", u => Capabilities(u) is { Count: > 0 } found ? found : null, Of(
                    Number<CapabilityResult>("value", "", c => c.Value),
                    Boolean<CapabilityResult>("atLeast", c => c.Value is null ? null : c.Beyond, "still within every limit at the end of the search: the capability is at least value"),
                    Choice<CapabilityResult>("binding", c => c.Value is null ? null : c.Binding, ["hot-spot", "top-oil", "loss-of-life"], "the limit reached at value"),
                    Number<CapabilityResult>("atBinding", "", c => c.Value is null ? null : c.AtBinding, "that measure at value: degC, or hours of life for loss-of-life"),
                    Number<CapabilityResult>("hotSpotLimit", "degC", c => c.Value is null ? null : c.HotSpotLimit, "degC"),
                    Number<CapabilityResult>("topOilLimit", "degC", c => c.Value is null ? null : c.TopOilLimit, "degC; absent for a dry-type unit"),
                    Number<CapabilityResult>("lossOfLifeLimit", "h", c => c.Value is null ? null : c.LossOfLifeLimit, "hours over the day; absent where none is set"),
                    Word<CapabilityResult>("problem", c => c.Value is null ? c.Problem : null)),
                    "what the unit's 'capability' lines found, by kind: the largest load held all day (constant-load: per unit of the loads as written, or in the cycle's let's SI unit) or multiple of the cycle (cycle-scale, per unit) within the unit's limits, or the problem that left it unknown")
                    with { Choices = ["constant-load", "cycle-scale"] },
                Map<ThermalUnit>("windings", u => u.Unit.Windings.Select(h => (h.Winding, (object)h)), Of(
                    Number<WindingHeat>("peakLoad", "", h => h.PeakLoad, "the highest current over rated current, of its most loaded section", required: true),
                    Number<WindingHeat>("peakLoadTime", "s", h => h.PeakLoadTime, "the time of the cycle point it is carried from, s", required: true),
                    Number<WindingHeat>("peakHotSpot", "degC", h => h.PeakHotSpot, "degC", required: true),
                    Number<WindingHeat>("peakHotSpotTime", "s", h => h.PeakHotSpotTime, "s from midnight", required: true)),
                    "each winding of the unit: its highest load (current over rated current) and hot-spot", required: true)),
                "each unit with a 'thermal' line, by its core's name", required: true),
            List<ThermalResult>("hourly", r => r.Hourly().Select(k => (object)new Hour(r, k)), Of(
                Number<Hour>("time", "s", h => h.Cycle.Times[h.Sample], "s from midnight", required: true),
                Number<Hour>("load", "", h => h.Cycle.Load[h.Sample], "the cycle point's load, in loadUnit", required: true),
                Number<Hour>("ambient", "degC", h => h.Cycle.Ambient[h.Sample], "degC", required: true),
                Map<Hour>("units", h => h.Cycle.Units.Select(u => (u.Unit.Core, (object)new HourOfUnit(u, h.Sample))), Of(
                    Number<HourOfUnit>("topOil", "degC", u => u.Unit.Unit.Dry ? null : u.Unit.TopOil[u.Sample], "degC"),
                    Number<HourOfUnit>("windingAverage", "degC", u => u.Unit.Unit.Dry ? u.Unit.TopOil[u.Sample] : null, "a dry-type unit, in place of topOil: degC"),
                    Number<HourOfUnit>("hotSpot", "degC", u => u.Unit.HotSpot[u.Sample], "degC, the hottest winding's", required: true)), required: true)),
                "the day on the hour, 0 h to 24 h: the load and ambient over the step ending there, each unit's temperatures there", required: true)),

        Map<StudyResult>("sequenceImpedances", r => r.SequenceImpedances.IsEmpty ? null : r.SequenceImpedances.Select(u => (u.Core, (object)u.Tests)),
            new ResultField("", ResultKind.List, "", "", x => ((ImmutableArray<SequenceTest>)x).Cast<object>())
            {
                Item = Of(
                    Choice<SequenceTest>("sequence", t => t.Kind == SequenceKind.Positive ? "positive" : "zero", ["positive", "zero"], required: true),
                    Word<SequenceTest>("energised", t => t.Energised, "the three-phase winding energised at its line terminals (zero sequence: lines joined, voltage to its neutral)", required: true),
                    Word<SequenceTest>("shortCircuited", t => t.Shorted, "the winding short-circuited (lines joined, and to its neutral in zero sequence); absent: every other winding open, the zero-sequence magnetising impedance"),
                    Number<SequenceTest>("r", "ohm", t => t.Impedance.Real, "resistance, ohm per phase", required: true),
                    Number<SequenceTest>("x", "ohm", t => t.Impedance.Imaginary, "reactance, ohm per phase", required: true),
                    Number<SequenceTest>("z", "ohm", t => t.Impedance.Magnitude, "|Z|, ohm per phase", required: true),
                    Number<SequenceTest>("perUnit", "", t => t.PerUnit, "|Z| over the base impedance, a fraction"),
                    Number<SequenceTest>("baseVoltage", "V", t => t.PerUnit is null ? null : t.BaseVoltage, "V, line-to-line"),
                    Number<SequenceTest>("basePower", "VA", t => t.PerUnit is null ? null : t.BasePower, "VA, three-phase")),
            },
            "per three-phase unit (by core name), the sequence impedances its test connections give, solved on the unit alone: ohms per phase at the energised line terminals, and as a fraction of the base impedance (the unit's rated power, an autotransformer's throughput, at the energised terminals' rated line-to-line voltage) where both are known"),

        List<StudyResult>("parallel", r => r.Parallel.IsEmpty ? null : r.Parallel.Cast<object>(),
            new ResultField("", ResultKind.Map, "", "", x => ((ParallelGroup)x).Units.Select(u => (u.Core, (object)u)))
            {
                Item = Of(
                    Number<ParallelShare>("s", "VA", u => u.Apparent, "VA the unit carries in the normal case (its winding that carries most)", required: true),
                    Number<ParallelShare>("share", "%", u => u.Share, "its share of the group's, a fraction", required: true),
                    Number<ParallelShare>("loading", "%", u => u.Loading, "its highest winding loading in the normal case, a fraction"),
                    Map<ParallelShare>("circulating", u => u.Circulating.Select(c => (c.Winding, (object)c)), Of(
                        Number<CirculatingCurrent>("i", "A", c => c.Current, required: true),
                        Number<CirculatingCurrent>("ofRated", "%", c => c.OfRated)),
                        "per three-phase winding, the line current (positive sequence, A) with every load removed, and that over its rated current", required: true)),
            },
            "groups of paralleled three-phase units (every winding of each on the same three nodes), each unit by its core name"),
    ];

    private static List<(string, object)> Capabilities(ThermalUnit u) =>
        [.. u.Cycle.Capabilities.Where(c => c.Capability.Core == u.Unit.Unit.Core).Select(c => (c.Capability.KindWord, (object)c))];
}

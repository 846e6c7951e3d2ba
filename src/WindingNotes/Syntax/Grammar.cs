
namespace WindingNotes.Syntax;

public enum StatementKind { Frequency, Temperature, Let, Core, Winding, Tap, Brush, Impedance, NoLoad, Join, Ground, Supply, Load, Fault, Sweep, Expect, FailOn, Acknowledge, ThreePhaseSupply, ThreePhaseLoad, Thermal, LoadCycle, CyclePoint, TapChanger, Find, FaultStudy, BusFault, Capability, Pair }

/// <summary>What a name stands for. One namespace holds them all.</summary>
public enum SymbolKind { Let, Core, Winding, Terminal, Tap, Brush, Node, Supply, Load, Fault, TapChanger }

/// <summary>How a name in a statement is used: it defines a symbol or refers to one of some kinds.</summary>
public sealed record NameRole(bool Defines, SymbolKind[] Kinds, string Label, bool AllowsSection = false)
{
    /// <summary>Words of the trade completion offers where no symbol stands (cooling modes, say).</summary>
    public string[] Suggestions { get; init; } = [];
}

/// <summary>One element of a statement's form.</summary>
public abstract record Part;

public sealed record NamePart(NameRole Role) : Part;

/// <summary>One or more names.</summary>
public sealed record NameListPart(NameRole Role) : Part;

public sealed record ValuePart(string Label) : Part;

public sealed record WordPart(string Word) : Part;

public sealed record ChoicePart(string Label, params string[] Words) : Part;

/// <summary>Parts that may be left out; the first one decides, so no backtracking is needed.</summary>
public sealed record OptionalPart(params Part[] Parts) : Part;

/// <summary>A clause: a keyword and its parts. Clauses of one group exclude each other.</summary>
public sealed record ClauseForm(string Keyword, Part[] Parts, bool Required = false, string? Group = null, string Summary = "");

/// <summary>A statement: its keyword, its head (parts before any clause), its clauses in canonical order.</summary>
public sealed record StatementForm(
    StatementKind Kind,
    string Keyword,
    Part[] Head,
    ClauseForm[] Clauses,
    string Example,
    string Summary,
    string[]? RequiredGroups = null)
{
    public ClauseForm? FindClause(string keyword)
    {
        // A loop, not Array.Find: a closure per call, and the reader asks for every clause keyword.
        foreach (var c in Clauses)
            if (c.Keyword == keyword) return c;
        return null;
    }
}

/// <summary>
/// The notation's statements as data. The parser, the EBNF in grammar/, completion, formatting
/// and semantic colouring all read this one table, so they cannot drift apart.
/// </summary>
public static class Grammar
{
    private static NameRole Def(SymbolKind kind, string label) => new(true, [kind], label);

    private static NameRole Use(string label, params SymbolKind[] kinds) => new(false, kinds, label);

    private static readonly NameRole NodeRef = Use("a terminal or node", SymbolKind.Terminal, SymbolKind.Node);
    private static readonly NameRole CoreRef = Use("a core name", SymbolKind.Core);
    private static readonly NameRole WindingRef = Use("a winding name", SymbolKind.Winding);
    private static readonly NameRole WindingOrSection = new(false, [SymbolKind.Winding], "a winding or section", AllowsSection: true);
    private static readonly ValuePart Value = new("a value");
    private static readonly NameRole FaultRef = Use("a fault name", SymbolKind.Fault);

    /// <summary>Which study of a bus fault: its maximum currents (cmax) unless said.</summary>
    private static readonly OptionalPart Extreme = new(new ChoicePart("'maximum' or 'minimum'", "maximum", "minimum"));

    private static readonly NameRole Terminal = Def(SymbolKind.Terminal, "a terminal name");

    /// <summary>The three line terminals of a three-phase winding.</summary>
    private static readonly Part[] Lines = [new NamePart(Terminal), new NamePart(Terminal), new NamePart(Terminal)];

    private static readonly ChoicePart Construction = new("a core construction", "bank", "three-limb", "five-limb", "shell");

    /// <summary>One value for all three phases, or one a phase.</summary>
    private static readonly Part[] PerPhase = [new ValuePart("a value"), new OptionalPart(new ValuePart("a value"), new ValuePart("a value"))];

    private static ClauseForm Clause(string keyword, string summary, params Part[] parts) => new(keyword, parts, Summary: summary);

    /// <summary>The rating warnings a file may make errors of with 'fail-on' (their wording is in Solve/Messages.cs).</summary>
    public static readonly string[] RatingWarnings = ["loading-high", "flux-high", "overexcited", "brush-current-high", "connection-rating", "current-density-high", "hot-spot-high", "top-oil-high", "cycle-current-high", "fault-duty-high", "regulator-current-high"];

    /// <summary>The cautions a file may acknowledge (their wording is in Solve/Messages.cs).</summary>
    public static readonly string[] Cautions = ["caution-no-isolation", "caution-common-terminal", "caution-fuse-output", "caution-above-supply", "caution-fault-duty", "caution-hot-spot"];

    /// <summary>
    /// Cooling modes by their codes (IEC 60076-2 for oil-immersed units: oil natural or forced (directed),
    /// air natural or forced; IEC 60076-11 for dry-type units: air natural, air forced).
    /// </summary>
    public static readonly string[] CoolingModes = ["ONAN", "ONAF", "OF", "OD", "AN", "AF"];

    /// <summary>What a thermal capability is the largest of: one load held all day, or a multiple of the cycle's loads.</summary>
    private static readonly ChoicePart CapabilityKind = new("'constant-load' or 'cycle-scale'", "constant-load", "cycle-scale");

    /// <summary>What an 'expect' or a 'find' measures (one of them).</summary>
    private static readonly ClauseForm[] Measures =
    [
        new("voltage", [new NamePart(NodeRef), new NamePart(NodeRef)], Group: "measure", Summary: "the voltage between two nodes"),
        new("current", [new NamePart(Use("a winding, supply or load", SymbolKind.Winding, SymbolKind.Supply, SymbolKind.Load)), new OptionalPart(new NamePart(NodeRef), new NamePart(NodeRef))],
            Group: "measure", Summary: "the current of a winding, a section, a supply or a load"),
        new("loading", [new NamePart(WindingRef), new OptionalPart(new NamePart(NodeRef), new NamePart(NodeRef))], Group: "measure", Summary: "a winding's or section's current over its rated current"),
        new("flux", [new NamePart(CoreRef)], Group: "measure", Summary: "the peak flux density of a core"),
        new("power", [new NamePart(Use("a supply or load", SymbolKind.Supply, SymbolKind.Load))], Group: "measure", Summary: "the active power of a supply or load"),
        new("efficiency", [], Group: "measure", Summary: "load power over supply power"),
        new("regulation", [new NamePart(Use("a load name", SymbolKind.Load))], Group: "measure", Summary: "the rise of a load's voltage when all loads are removed"),
        new("vector-group", [new NamePart(CoreRef)], Group: "measure", Summary: "the connection symbol and clock numbers of a three-phase unit, from its wiring"),
    ];

    public static readonly StatementForm[] Statements =
    [
        new(StatementKind.Frequency, "frequency", [new ValuePart("a frequency")], [],
            "frequency 60 Hz", "the system frequency"),
        new(StatementKind.Temperature, "temperature", [new ValuePart("a temperature")], [],
            "temperature 75 degC", "the reference temperature to which winding resistances are corrected"),
        new(StatementKind.Let, "let", [new NamePart(Def(SymbolKind.Let, "a new name")), new WordPart("="), Value], [],
            "let vin = 208 V", "a named value; sweeps and tolerances act on these"),
        new(StatementKind.Core, "core", [new NamePart(Def(SymbolKind.Core, "a new core name"))],
            [
                Clause("construction", "a three-phase core: three single-phase cores (bank), or limbs on one core", Construction),
                Clause("rating", "the core's kVA rating", Value),
                Clause("area", "the net cross-section of the core", Value),
                Clause("flux-limit", "the highest peak flux density allowed", Value),
                Clause("zero-sequence", "the zero-sequence magnetising impedance of a three-phase core, in % on its rating", Value),
                Clause("frequency", "the core's rated frequency, where it is not the file's", Value),
            ],
            "core K1 rating 0.5 kVA area 26 cm2 flux-limit 1.6 T", "a magnetic core: all windings on it link the same flux"),
        new(StatementKind.Winding, "winding", [new NamePart(Def(SymbolKind.Winding, "a new winding name"))],
            [
                new("on", [new NamePart(CoreRef)], Required: true, Summary: "the core the winding is on"),
                Clause("turns", "the number of turns", Value),
                Clause("rated", "the rated voltage", Value),
                Clause("rating", "the winding's own kVA rating", Value),
                Clause("rated-current", "the winding's own rated current", Value),
                new("from", [new NamePart(Def(SymbolKind.Terminal, "a terminal name")), new WordPart("to"), new NamePart(Def(SymbolKind.Terminal, "a terminal name"))],
                    Group: "ends", Summary: "the polarity-marked end, then the other end"),
                Clause("resistance", "the winding's resistance, optionally as measured at a temperature", Value, new OptionalPart(new WordPart("at"), new ValuePart("a temperature"))),
                Clause("conductor", "resistance from the conductor: material, size, length or mean turn",
                    new ChoicePart("a conductor material", "copper", "aluminium"),
                    new OptionalPart(new WordPart("AWG")), new ValuePart("a conductor size"),
                    new ChoicePart("'length' or 'mean-turn'", "length", "mean-turn"), new ValuePart("a length")),
                new("wye", [.. Lines, new OptionalPart(new WordPart("neutral"), new NamePart(Terminal))], Group: "ends",
                    Summary: "three phase windings, one a limb, from each line terminal to the star point (a neutral terminal when named)"),
                new("delta", Lines, Group: "ends", Summary: "three phase windings in a ring: phase a from the first line terminal to the second, b from the second to the third, c from the third to the first"),
                new("zigzag", [.. Lines, new OptionalPart(new WordPart("neutral"), new NamePart(Terminal))], Group: "ends",
                    Summary: "each phase from its line terminal through a half on its limb, then reversed through a half on the next limb, to the star point"),
                new("series", [.. Lines, new WordPart("to"), new NamePart(NodeRef), new NamePart(NodeRef), new NamePart(NodeRef)], Group: "ends",
                    Summary: "the series winding of an autotransformer: each phase from its line terminal to the common winding's line terminal"),
                new("ends", [.. Enumerable.Repeat<Part>(new NamePart(NodeRef), 6)], Group: "ends",
                    Summary: "three phase windings by their ends: phase a from, to, phase b from, to, phase c from, to"),
                Clause("peak-withstand", "the peak through-fault current the winding withstands (its dynamic ability, IEC 60076-5), compared with its peak in each bus fault", Value),
            ],
            "winding HV on K1 turns 240 rated 240 V from H1 to H2 resistance 1.4 ohm", "a winding between two terminals, or three phase windings on a three-phase core", ["ends"]),
        new(StatementKind.Tap, "tap", [new NamePart(Def(SymbolKind.Tap, "a new tap name"))],
            [
                new("on", [new NamePart(WindingRef)], Required: true, Summary: "the winding the tap is on"),
                new("at", [new ValuePart("a position")], Required: true, Summary: "turns, percent or volts from the winding's from end"),
            ],
            "tap T60 on HV at 60 turns", "a fixed tap, counted from the winding's from end"),
        new(StatementKind.Brush, "brush", [new NamePart(Def(SymbolKind.Brush, "a new brush name"))],
            [
                new("on", [new NamePart(WindingRef)], Required: true, Summary: "the winding the brush slides on"),
                new("at", [new ValuePart("a position")], Required: true, Summary: "the brush position from the from end"),
                Clause("range", "the travel of the brush", Value, new WordPart("to"), Value),
                Clause("current-limit", "the current the brush may carry", Value),
            ],
            "brush B on W at 75 % range 0 % to 100 % current-limit 4 A", "a sliding contact on a winding"),
        new(StatementKind.Impedance, "impedance", [new NamePart(WindingOrSection), new NamePart(WindingOrSection), new ValuePart("an impedance")],
            [
                Clause("xr", "the X/R ratio of the impedance", Value),
                Clause("base", "the power a percentage is on, where the test report does not use the core's rating", Value),
            ],
            "impedance HV LV 3.6 % xr 1.1", "short-circuit impedance between two windings or sections"),
        new(StatementKind.NoLoad, "no-load", [new NamePart(CoreRef)],
            [
                new("current", [Value], Required: true, Summary: "the no-load current, in percent of rated or in amperes"),
                new("loss", [Value], Required: true, Summary: "the no-load loss"),
                new("at", [new NamePart(WindingRef), new ValuePart("a voltage")], Required: true, Summary: "the winding and voltage of the test"),
            ],
            "no-load K1 current 1.8 % loss 11 W at HV 240 V", "the magnetising branch from an open-circuit test"),
        new(StatementKind.Join, "join", [new NameListPart(NodeRef)], [],
            "join H2 X1", "connect terminals into one node"),
        new(StatementKind.Ground, "ground", [new NamePart(NodeRef)],
            [
                // A neutral-grounding resistor or reactor: part of the network in every case, never a load.
                Clause("impedance", "earthed through a neutral-grounding resistor or reactor of this impedance, which stays in every case (no-load, faults)", Value),
                Clause("rated-current", "the current the grounding impedance is rated to carry for its time rating", Value),
                Clause("time-rating", "how long the grounding impedance may carry its rated current", Value),
            ],
            "ground N", "the reference node, or a node earthed through a grounding impedance"),
        new(StatementKind.Supply, "supply", [new NamePart(Def(SymbolKind.Supply, "a new supply name")), new NamePart(NodeRef), new NamePart(NodeRef), new ValuePart("a voltage")],
            [
                Clause("fault-level", "the prospective fault current or fault power at the supply", Value),
                Clause("xr", "the X/R ratio of the supply's internal impedance", Value),
                Clause("impedance", "the supply's internal impedance", Value),
                Clause("minimum-fault-level", "the prospective fault current or fault power at the supply when the source is weakest, for minimum short-circuit currents", Value),
            ],
            "supply mains H1 N 208 V angle 0 deg fault-level 10 kA", "an AC source between two nodes, the first positive"),
        new(StatementKind.Load, "load", [new NamePart(Def(SymbolKind.Load, "a new load name")), new NamePart(NodeRef), new NamePart(NodeRef)],
            [
                new("power", [Value], Group: "demand", Summary: "active power drawn (constant power)"),
                new("apparent", [Value], Group: "demand", Summary: "apparent power drawn (constant power)"),
                new("impedance", [Value], Group: "demand", Summary: "a constant impedance"),
                new("current", [Value], Group: "demand", Summary: "a constant current"),
                Clause("pf", "the power factor, lagging unless said", Value, new OptionalPart(new ChoicePart("'lagging' or 'leading'", "lagging", "leading"))),
                Clause("model", "how the load responds to its voltage",
                    new ChoicePart("a load model", "constant-impedance", "constant-current", "constant-power"),
                    new OptionalPart(new WordPart("at"), new ValuePart("a voltage"))),
            ],
            "load planer X1 N power 3.2 kW pf 0.82 lagging", "a load between two nodes", ["demand"]),
        new(StatementKind.Fault, "fault", [new NamePart(Def(SymbolKind.Fault, "a new fault name")), new NamePart(NodeRef), new NamePart(NodeRef)],
            [Clause("impedance", "the fault impedance (0 ohm when left out)", Value)],
            "fault F1 X1 N impedance 0 ohm", "a short-circuit case, solved apart from the normal case"),
        new(StatementKind.Sweep, "sweep", [new NamePart(Use("a let or brush name", SymbolKind.Let, SymbolKind.Brush))],
            [
                new("from", [Value, new WordPart("to"), Value], Required: true, Summary: "the range of the sweep"),
                new("step", [Value], Group: "spacing", Summary: "the step between points"),
                new("points", [Value], Group: "spacing", Summary: "the number of points"),
            ],
            "sweep B from 0 % to 100 % step 5 %", "vary a brush position or a let value", ["spacing"]),
        new(StatementKind.Expect, "expect", [],
            [
                .. Measures,
                new("hot-spot", [new OptionalPart(new NamePart(CoreRef))], Group: "measure", Summary: "the highest hot-spot temperature over the load cycle, of one unit or of every unit with thermal data"),
                new("top-oil", [new OptionalPart(new NamePart(CoreRef))], Group: "measure", Summary: "the highest top-oil temperature over the load cycle"),
                new("loss-of-life", [new OptionalPart(new NamePart(CoreRef))], Group: "measure", Summary: "the insulation life used over the day of the load cycle, in hours at the reference ageing rate"),
                new("equivalent-aging", [new OptionalPart(new NamePart(CoreRef))], Group: "measure", Summary: "the equivalent aging factor FEQA over the day of the load cycle (IEEE C57.91): the mean of the aging acceleration factor"),
                new("capability", [new NamePart(CoreRef), CapabilityKind], Group: "measure", Summary: "the thermal capability a 'capability' line finds: the largest constant load or multiple of the cycle"),
                new("position", [new NamePart(Use("a tap changer name", SymbolKind.TapChanger))], Group: "measure", Summary: "the position a tap changer is set to or settles on"),
                new("positive-sequence", [new NamePart(WindingRef), new NamePart(WindingRef)], Group: "measure",
                    Summary: "the positive-sequence short-circuit impedance of a three-phase unit: the first winding energised, the second short-circuited, the others open"),
                new("zero-sequence", [new NamePart(WindingRef), new OptionalPart(new NamePart(WindingRef))], Group: "measure",
                    Summary: "the zero-sequence impedance from the first winding's neutral: with a second winding short-circuited, or alone (the others open) the zero-sequence magnetising impedance"),
                new("fault-current", [new NamePart(FaultRef), Extreme], Group: "measure", Summary: "the initial symmetrical short-circuit current of a bus fault (the largest faulted line's)"),
                new("peak-current", [new NamePart(FaultRef), Extreme], Group: "measure", Summary: "the peak short-circuit current of a bus fault"),
                new("thermal-current", [new NamePart(FaultRef), Extreme], Group: "measure", Summary: "the thermal equivalent short-circuit current of a bus fault over the study's duration"),
                new("earth-fault-factor", [new NamePart(FaultRef), Extreme], Group: "measure", Summary: "the highest line-to-earth voltage of a sound line during a bus fault over the line-to-earth voltage before it"),
                new("peak-duty", [new NamePart(WindingRef), new NamePart(FaultRef), Extreme], Group: "measure", Summary: "a winding's peak current in a bus fault (k·√2 times its current) over its 'peak-withstand'"),
                new("in", [new NamePart(FaultRef), Extreme], Summary: "evaluate the measure in a fault case (a bus fault's maximum study unless said)"),
                new("between", [Value, new WordPart("and"), Value], Group: "condition", Summary: "both bounds included"),
                new("below", [Value], Group: "condition", Summary: "an upper bound"),
                new("above", [Value], Group: "condition", Summary: "a lower bound"),
                new("near", [Value, new WordPart("within"), Value], Group: "condition", Summary: "a target with a tolerance"),
                new("is", [new NamePart(new NameRole(false, [], "a connection symbol such as Dyn11"))], Group: "condition", Summary: "a connection symbol (IEC 60076-1), for 'vector-group'"),
                new("clear-of-limits", [], Group: "condition", Summary: "for 'position': at neither end of the tap changer's range"),
            ],
            "expect voltage X1 N between 225 V and 235 V", "a check that must hold", ["measure", "condition"]),
        new(StatementKind.FailOn, "fail-on", [new ChoicePart("a rating warning", RatingWarnings)], [],
            "fail-on loading-high", "a rating warning that is an error in this file, so check fails on it"),
        new(StatementKind.Acknowledge, "acknowledge", [new ChoicePart("a caution", Cautions)], [],
            "acknowledge caution-no-isolation", "a caution read and accepted: check stops printing it, reports keep it"),
        new(StatementKind.ThreePhaseSupply, "three-phase-supply",
            [new NamePart(Def(SymbolKind.Supply, "a new supply name")), new NamePart(NodeRef), new NamePart(NodeRef), new NamePart(NodeRef), new ValuePart("a line-to-line voltage")],
            [
                Clause("sequence", "the phase sequence (abc unless said)", new ChoicePart("a phase sequence", "abc", "acb")),
                Clause("fault-level", "the three-phase fault current or fault power at the supply", Value),
                Clause("xr", "the X/R ratio of the supply's internal impedance", Value),
                Clause("impedance", "the supply's positive-sequence impedance per phase", Value),
                Clause("zero-sequence", "the line-to-ground fault current, or the zero-sequence impedance per phase", Value),
                Clause("minimum-fault-level", "the three-phase fault current or fault power when the source is weakest, for minimum short-circuit currents", Value),
            ],
            "three-phase-supply grid H1 H2 H3 13.8 kV fault-level 250 MVA xr 12 zero-sequence 9 kA",
            "a three-phase source, wye with its neutral earthed, by its line-to-line voltage"),
        new(StatementKind.ThreePhaseLoad, "three-phase-load",
            [new NamePart(Def(SymbolKind.Load, "a new load name")), new NamePart(NodeRef), new NamePart(NodeRef), new NamePart(NodeRef)],
            [
                new("wye", [new OptionalPart(new NamePart(NodeRef))], Group: "connection", Summary: "one load a phase from each line to the star point (a neutral when named)"),
                new("delta", [], Group: "connection", Summary: "one load a phase between each pair of lines"),
                new("power", PerPhase, Group: "demand", Summary: "active power: the three-phase total, or one value a phase"),
                new("apparent", PerPhase, Group: "demand", Summary: "apparent power: the three-phase total, or one value a phase"),
                new("impedance", PerPhase, Group: "demand", Summary: "the impedance of each phase, or one value a phase"),
                new("current", PerPhase, Group: "demand", Summary: "the current of each phase, or one value a phase"),
                Clause("pf", "the power factor, lagging unless said", Value, new OptionalPart(new ChoicePart("'lagging' or 'leading'", "lagging", "leading"))),
                Clause("model", "how the load responds to its voltage",
                    new ChoicePart("a load model", "constant-impedance", "constant-current", "constant-power"),
                    new OptionalPart(new WordPart("at"), new ValuePart("a voltage"))),
            ],
            "three-phase-load mill X1 X2 X3 wye X0 power 300 kW pf 0.85", "a three-phase load, wye or delta", ["connection", "demand"]),
        new(StatementKind.Thermal, "thermal", [new NamePart(CoreRef)],
            [
                new("cooling", [new NamePart(new NameRole(false, [], "a cooling mode: ONAN, ONAF, OF, OD, or AN, AF for a dry-type unit") { Suggestions = CoolingModes }),
                    new OptionalPart(new WordPart("class"), new ValuePart("an insulation system temperature"))],
                    Required: true, Summary: "the cooling mode; a dry-type unit (AN, AF) also its insulation system temperature, such as class 155 degC"),
                new("top-oil-rise", [Value], Group: "rise", Summary: "the top-oil rise over ambient at rated load (an oil-immersed unit)"),
                new("winding-rise", [Value], Group: "rise", Summary: "the average winding rise over ambient at rated load (a dry-type unit; its class's limit when left out)"),
                new("hot-spot-gradient", [Value], Group: "gradient", Summary: "the hot-spot to top-oil gradient at rated current"),
                new("hot-spot-factor", [Value, new WordPart("winding-gradient"), Value], Group: "gradient", Summary: "the hot-spot factor and the average winding to average oil gradient at rated current"),
                Clause("loss-ratio", "load loss at rated current over no-load loss (from the windings' resistances and the no-load test when left out)", Value),
                Clause("exponents", "the oil exponent x and the winding exponent y", Value, new WordPart("and"), Value),
                Clause("time-constants", "the oil and winding time constants", Value, new WordPart("and"), Value),
                Clause("k11", "the thermal model's oil constant", Value),
                Clause("k21", "the thermal model's first winding constant (the hot-spot overshoot)", Value),
                Clause("k22", "the thermal model's second winding constant", Value),
                Clause("paper", "whether the winding paper is thermally upgraded", new ChoicePart("'upgraded' or 'non-upgraded'", "upgraded", "non-upgraded")),
            ],
            "thermal T1 cooling ONAN top-oil-rise 52 K hot-spot-gradient 26 K loss-ratio 6 paper upgraded",
            "a unit's thermal data: its hot-spot and ageing are followed over the load cycle"),
        new(StatementKind.LoadCycle, "load-cycle", [],
            [
                Clause("of", "the let whose values the cycle points give (every load scaled by a per-unit value when left out)", new NamePart(Use("a let name", SymbolKind.Let))),
                Clause("ambient", "the ambient temperature, where the cycle points give none", Value),
                Clause("step", "the time step of the thermal model (1 min when left out)", Value),
                Clause("method", "how temperatures follow the load (difference-equation unless said)", new ChoicePart("a thermal method", "difference-equation", "exponential")),
                Clause("duty", "the loading the limits are those of (normal-cyclic unless said)", new ChoicePart("a loading duty", "normal-cyclic", "long-time-emergency", "short-time-emergency")),
            ],
            "load-cycle ambient 30 degC step 1 min", "a day of load: the network is solved at each cycle point and the thermal data followed through the day"),
        new(StatementKind.CyclePoint, "cycle-point", [new ValuePart("a time of day")],
            [
                new("load", [Value], Required: true, Summary: "the load from this time until the next cycle point: per-unit of the loads as written, or a value of the load-cycle's let"),
                Clause("ambient", "the ambient temperature from this time on", Value),
            ],
            "cycle-point 18 h load 1.2 pu ambient 35 degC", "the load of the cycle from a time of day until the next cycle point"),
        new(StatementKind.Capability, "capability", [new NamePart(CoreRef), CapabilityKind],
            [
                Clause("hot-spot", "the highest hot-spot temperature allowed (the load cycle's duty limit when left out)", Value),
                Clause("top-oil", "the highest top-oil temperature allowed (the duty limit when left out; none for a dry-type unit)", Value),
                Clause("loss-of-life", "the most insulation life the day may use, in hours at the reference ageing rate (no limit when left out)", Value),
            ],
            "capability T1 cycle-scale hot-spot 120 degC loss-of-life 24 h",
            "the largest load held all day, or the largest multiple of the load cycle, that keeps a unit within its hot-spot, top-oil and ageing limits"),
        new(StatementKind.TapChanger, "tap-changer", [new NamePart(Def(SymbolKind.TapChanger, "a new tap changer name"))],
            [
                new("on", [new NamePart(WindingRef)], Required: true, Summary: "the tapped winding (the one a reversing switch reverses)"),
                new("sets", [new NamePart(Use("a let name", SymbolKind.Let))], Required: true, Summary: "the let that carries the position: its value as written at position 0, one step more a position"),
                new("positions", [Value, new WordPart("to"), Value], Required: true, Summary: "the lowest and the highest position, whole numbers"),
                new("step", [Value], Required: true, Summary: "what one position adds to the let"),
                new("on-load", [], Group: "duty", Summary: "changes position under load, so a control may set it (the default)"),
                new("off-circuit", [], Group: "duty", Summary: "changed only de-energised: its position is stated, never chosen"),
                Clause("reversing", "a reversing switch: at negative positions the winding is connected reversed and the let takes the step count without its sign"),
                Clause("at", "the position stated, or where the control starts (0 when left out)", Value),
                Clause("follows", "paralleled units: takes the position of another tap changer (master and follower)", new NamePart(Use("a tap changer name", SymbolKind.TapChanger))),
                Clause("regulate", "the voltage the control holds, between two nodes", new NamePart(NodeRef), new NamePart(NodeRef)),
                Clause("target", "the voltage the control holds, at the relay (node voltage over the pt-ratio)", Value),
                Clause("bandwidth", "the width of the band around the target, at the relay", Value),
                Clause("pt-ratio", "node voltage over relay voltage (1 when left out)", Value),
                Clause("compensation", "line-drop compensation: R and X settings in volts at the relay, at rated ct current", Value, Value),
                Clause("line-current", "the current the compensation sees: a load, supply or winding", new NamePart(Use("a load, supply or winding", SymbolKind.Load, SymbolKind.Supply, SymbolKind.Winding))),
                Clause("ct", "the rated primary current of the current transformer", Value),
            ],
            "tap-changer REG on SER sets sel positions -16 to 16 step 6.25 % on-load reversing regulate X1 N target 120 V bandwidth 2 V pt-ratio 60",
            "a tap changer on a tapped winding: a range of positions, stated or chosen by an automatic voltage control"),
        new(StatementKind.Find, "find", [new NamePart(Use("a let name", SymbolKind.Let))],
            [
                .. Measures,
                new("equals", [Value], Required: true, Summary: "the target the measure must equal"),
                new("from", [Value, new WordPart("to"), Value], Required: true, Summary: "the range searched for the let's value"),
            ],
            "find nser voltage X1 N equals 120 V from 10 turns to 40 turns",
            "the value of a let that makes a measure equal a target: every result is then at that value", ["measure"]),
        new(StatementKind.FaultStudy, "fault-study", [new ChoicePart("a fault method", "equivalent-source", "as-loaded")],
            [
                Clause("currents", "the currents studied: maximum (cmax), minimum (cmin) or both",
                    new ChoicePart("'maximum', 'minimum' or 'maximum-and-minimum'", "maximum", "minimum", "maximum-and-minimum")),
                Clause("voltage-tolerance", "the tolerance of a low-voltage system, 6 % or 10 % (10 % unless said); it sets the voltage factor c", Value),
                Clause("duration", "how long the fault lasts for the thermal duty (2 s unless said)", Value),
                Clause("initial-temperature", "the windings' average temperature before the fault (105 degC unless said)", Value),
                Clause("peak-method", "how κ of the peak is found: the ratio R/X at the fault (unless said), that times 1.15 for a meshed network, or the ratio of the loop solved at an equivalent frequency",
                    new ChoicePart("'at-fault', 'meshed' or 'equivalent-frequency'", "at-fault", "meshed", "equivalent-frequency")),
                Clause("end-temperature", "for minimum currents: the conductors' temperature at the end of the fault, to which resistances given with a temperature are corrected", Value),
                Clause("transformer-correction", "with the equivalent source: each impedance line between two windings times K_T = 0.95·cmax/(1 + 0.6·xT) (IEC 60909-0 network transformers)"),
            ],
            "fault-study equivalent-source currents maximum-and-minimum duration 2 s",
            "how bus faults are studied: the equivalent voltage source at the fault (IEC 60909-0) or the network as loaded"),
        new(StatementKind.BusFault, "bus-fault",
            [new NamePart(Def(SymbolKind.Fault, "a new fault name")), new NamePart(NodeRef), new NamePart(NodeRef), new NamePart(NodeRef),
             new ChoicePart("a fault kind", "three-phase", "line-to-ground", "line-to-line", "double-line-to-ground")],
            [
                Clause("impedance", "the fault impedance in each faulted line, or between the two lines of a line-to-line fault (0 ohm when left out)", Value),
                Clause("earth-impedance", "the impedance from the fault to earth (0 ohm when left out)", Value),
                Clause("nominal", "the system's nominal line-to-line voltage at the bus, where it is not the rated voltage there", Value),
            ],
            "bus-fault F2 X1 X2 X3 line-to-ground impedance 0 ohm",
            "a short circuit on a three-phase bus: line-to-ground on the first line, line-to-line and double-line-to-ground on the second and third"),
        // Two like single-phase units on a three-phase supply, declared once and placed by a connection word.
        new(StatementKind.Pair, "unit-pair", [new NamePart(Def(SymbolKind.Core, "a new pair name")), .. Lines],
            [
                new("open-delta", [], Group: "connection",
                    Summary: "two units in open delta: the first from the first line terminal to the second, the other from the third to the second, the line they share"),
                new("scott-t", [], Group: "connection",
                    Summary: "a Scott-T: the main from the first line terminal to the second, centre-tapped; the teaser from the third to the main's centre tap on its 86.6 % tap"),
                new("delta-output", [new NamePart(Terminal), new NamePart(Terminal), new NamePart(Terminal)], Group: "output",
                    Summary: "open delta: the secondaries in open delta too, the first from the first output terminal to the second, the other from the third to the second"),
                new("series", [new NamePart(Terminal), new NamePart(Terminal)], Group: "output",
                    Summary: "open delta: each secondary in series with its unit's outer line, from its output terminal to the line, adding to the supply (boost)"),
                new("series-bucking", [new NamePart(Terminal), new NamePart(Terminal)], Group: "output",
                    Summary: "open delta: each secondary in series with its unit's outer line, from the line to its output terminal, taking from the supply (buck)"),
                new("main-output", [new NamePart(Terminal), new NamePart(Terminal), new WordPart("teaser-output"), new NamePart(Terminal), new NamePart(Terminal)], Group: "output",
                    Summary: "Scott-T: the main's secondary from, to, then the teaser's from, to: two single-phase outputs in quadrature"),
                new("rating", [Value], Required: true, Summary: "each unit's kVA rating"),
                new("primary-winding", [new NamePart(Def(SymbolKind.Winding, "a new winding name")), new ValuePart("a rated voltage")], Required: true,
                    Summary: "the winding on the three-phase lines and its rated voltage: phase windings NAME_a, NAME_b (open delta) or NAME_m, NAME_t (main, teaser)"),
                new("secondary-winding", [new NamePart(Def(SymbolKind.Winding, "a new winding name")), new ValuePart("a rated voltage")], Required: true,
                    Summary: "the other winding of each unit and its rated voltage"),
                Clause("impedance", "each unit's short-circuit impedance between its primary and secondary, in % on its rating or ohms referred to the primary", Value),
                Clause("xr", "the X/R ratio of the impedance", Value),
                Clause("teaser-tap", "Scott-T: where on the teaser winding, from its line end, the tap joined to the main's centre tap is (86.6 %, √3/2, when left out)", Value),
            ],
            "unit-pair B H1 H2 H3 open-delta series Y1 Y3 rating 3 kVA primary-winding P 480 V secondary-winding S 48 V impedance 2.5 % xr 1.2",
            "two like single-phase two-winding units on three lines: open delta, or Scott-T (main and teaser)", ["connection", "output"]),
    ];

    // Plain hashed sets and maps, not frozen ones: a frozen collection studies its keys to choose a hashing
    // scheme when made, about a millisecond of the native command's start for a few hundred words that
    // a ten-line file looks up a few dozen times.
    public static readonly IReadOnlyDictionary<string, StatementForm> ByKeyword = Statements.ToDictionary(s => s.Keyword, StringComparer.Ordinal);

    /// <summary>Words with a fixed meaning; they cannot be used as names.</summary>
    public static readonly IReadOnlySet<string> Keywords = CollectKeywords().ToHashSet(StringComparer.Ordinal);

    /// <summary>Keywords written with a hyphen; the lexer reads them as one word.</summary>
    public static readonly IReadOnlySet<string> HyphenatedKeywords = Keywords.Where(k => k.Contains('-')).ToHashSet(StringComparer.Ordinal);

    /// <summary>The beginnings of hyphenated keywords up to a hyphen ("caution-no" of caution-no-isolation), so the lexer reads on.</summary>
    public static readonly IReadOnlySet<string> HyphenatedPrefixes =
        HyphenatedKeywords.SelectMany(k => k.Select((c, i) => c == '-' ? k[..i] : null).OfType<string>()).ToHashSet(StringComparer.Ordinal);

    /// <summary>Words with a fixed meaning inside values.</summary>
    public static readonly IReadOnlySet<string> ValueWords = new HashSet<string>(["angle", "sqrt"], StringComparer.Ordinal);

    private static IEnumerable<string> CollectKeywords()
    {
        foreach (var statement in Statements)
        {
            yield return statement.Keyword;
            foreach (var word in statement.Head.SelectMany(Words)) yield return word;
            foreach (var clause in statement.Clauses)
            {
                yield return clause.Keyword;
                foreach (var word in clause.Parts.SelectMany(Words)) yield return word;
            }
        }
        yield return "angle";
        yield return "sqrt";
    }

    private static IEnumerable<string> Words(Part part) => part switch
    {
        WordPart w when char.IsLetter(w.Word[0]) => [w.Word],
        ChoicePart c => c.Words,
        OptionalPart o => o.Parts.SelectMany(Words),
        _ => [],
    };
}

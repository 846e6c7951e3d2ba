using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>A connection point named in the document, where it was named.</summary>
public sealed record NodeRef(string Name, TextSpan Span);

public sealed record CoreModel(string Name, TextSpan NameSpan, TextSpan Line)
{
    /// <summary>VA.</summary>
    public double? Rating { get; init; }

    /// <summary>m².</summary>
    public double? Area { get; init; }

    /// <summary>Peak tesla.</summary>
    public double? FluxLimit { get; init; }

    /// <summary>The core's rated frequency, Hz, where the file states one for it.</summary>
    public double? Frequency { get; init; }
}

/// <summary>An open-circuit test: no-load current (a fraction of rated, or amperes) and loss, at a winding's voltage.</summary>
public sealed record NoLoadModel(string Core, TextSpan Line, double Current, bool CurrentIsFraction, double Loss, NodeRef Winding, double Voltage);

public enum ConductorMaterial { Copper, Aluminium }

/// <summary>A winding's conductor: cross-section in m², and its length or the length of a mean turn.</summary>
public sealed record ConductorModel(ConductorMaterial Material, double Area, double Length, bool PerTurn, TextSpan Span);

public sealed record WindingModel(string Name, TextSpan NameSpan, TextSpan Line, string Core, NodeRef From, NodeRef To)
{
    public double? Turns { get; init; }

    /// <summary>Rated voltage, V.</summary>
    public double? Rated { get; init; }

    /// <summary>The winding's own rating, VA.</summary>
    public double? Rating { get; init; }

    public double? RatedCurrent { get; init; }

    /// <summary>Resistance in ohms as stated, and the temperature (K) it was measured at when stated.</summary>
    public double? Resistance { get; init; }

    public double? ResistanceTemperature { get; init; }

    public ConductorModel? Conductor { get; init; }

    /// <summary>The peak through-fault current the winding withstands, A (its dynamic ability).</summary>
    public double? PeakWithstand { get; init; }
}

public enum TapUnit { Turns, Fraction, Volts }

/// <summary>A fixed tap or a brush: a connection point on a winding at a position from its from end.</summary>
/// <summary>A brush's travel; each end in its own unit.</summary>
public sealed record TapRange(double From, TapUnit FromUnit, double To, TapUnit ToUnit, TextSpan Span);

public sealed record TapModel(string Name, TextSpan NameSpan, TextSpan Line, string Winding, double Position, TapUnit Unit, bool IsBrush)
{
    public TapRange? Range { get; init; }

    public double? CurrentLimit { get; init; }

    public TextSpan PositionSpan { get; init; }
}

/// <summary>A winding, or the part of it between two of its points (<c>HV:H1-T60</c>).</summary>
public sealed record WindingPart(string Winding, string? From, string? To, TextSpan Span)
{
    public override string ToString() => From is null ? Winding : $"{Winding}:{From}-{To}";
}

/// <summary>A short-circuit impedance between two windings or parts of them: per unit on the core rating (or a base), or ohms referred to the first.</summary>
public sealed record ImpedanceModel(WindingPart First, WindingPart Second, Complex Value, bool PerUnit, double? XR, TextSpan Line, TextSpan ValueSpan)
{
    /// <summary>The power (VA) a per-unit value is on, where it is not the core's rating.</summary>
    public double? Base { get; init; }
}

public sealed record SupplyModel(string Name, TextSpan NameSpan, TextSpan Line, NodeRef Positive, NodeRef Negative, Complex Voltage)
{
    public Complex? Impedance { get; init; }

    /// <summary>Prospective fault current (A) or fault power (VA) at the supply terminals.</summary>
    public double? FaultCurrent { get; init; }

    public double? FaultPower { get; init; }

    public double? XR { get; init; }

    /// <summary>A neutral-grounding impedance ('ground N impedance …'): a branch of no EMF to earth, never a source.</summary>
    public bool Grounding { get; init; }

    /// <summary>A three-phase supply's neutral impedance ('NAME_zn', Zn = (Z0 − Z1)/3 from its star point to earth): a branch of no EMF, never a source.</summary>
    public bool Neutral { get; init; }

    /// <summary>
    /// Whether it drives the network: the one test of "is this a source" (autotransformer connections and
    /// their supply points, the power supplied for efficiency, the branches of κ's meshed exemption, a part
    /// fed or not). A branch of no EMF to earth (<see cref="Grounding"/>, <see cref="Neutral"/>) carries
    /// current and has a loss, but supplies nothing.
    /// </summary>
    public bool IsSource => !Grounding && !Neutral;

    /// <summary>The internal impedance at the minimum fault level ('minimum-fault-level'), at the frequency as written; for minimum short-circuit currents.</summary>
    public Complex? MinimumImpedance { get; init; }
}

public enum LoadBehaviour { ConstantPower, ConstantCurrent, ConstantImpedance }

/// <summary>
/// A load as S0 drawn at V0 and an exponent: S(V) = S0·(|V|/V0)^n with n = 0 for constant power,
/// 1 for constant current and 2 for constant impedance. Every way of writing a load becomes this.
/// </summary>
public sealed record LoadModel(string Name, TextSpan NameSpan, TextSpan Line, NodeRef A, NodeRef B, LoadBehaviour Behaviour, Complex S0, double V0)
{
    public int Exponent => Behaviour switch { LoadBehaviour.ConstantPower => 0, LoadBehaviour.ConstantCurrent => 1, _ => 2 };
}

public sealed record FaultModel(string Name, TextSpan NameSpan, TextSpan Line, NodeRef A, NodeRef B, Complex Impedance);

public sealed record SweepModel(Symbol Target, TextSpan Line, Quantity From, Quantity To, Quantity? Step, int? Points);

public enum MeasureKind { Voltage, Current, Loading, Flux, Power, Efficiency, Regulation, VectorGroup, HotSpot, TopOil, LossOfLife, Position, EquivalentAging, Capability, FaultCurrent, PeakCurrent, ThermalCurrent, EarthFaultFactor, PositiveSequence, ZeroSequence, PeakDuty }

public enum ConditionKind { Between, Below, Above, Near }

/// <summary>A check: what is measured, on what, and the bounds in SI (or as fractions).</summary>
public sealed record ExpectModel(TextSpan Line, string Text, MeasureKind Measure, ImmutableArray<NodeRef> Targets, ConditionKind Condition, double Low, double High, string Unit)
{
    /// <summary>The measure and the condition as written, for messages.</summary>
    public string MeasureText { get; init; } = "";

    public string ConditionText { get; init; } = "";

    /// <summary>For 'near': the target, and the tolerance as a fraction when it was given in %.</summary>
    public double Target { get; init; }

    /// <summary>For 'vector-group … is': the connection symbol expected, as written.</summary>
    public string? Symbol { get; init; }

    /// <summary>The unit of a tap changer's position: a whole step count, shown with its sign.</summary>
    public const string PositionUnit = "position";

    /// <summary>The fault case the check is evaluated in ('in F2', or the fault a fault measure names); null for the normal case and sweep points.</summary>
    public string? InFault { get; init; }

    /// <summary>For a bus fault: its minimum study rather than its maximum.</summary>
    public bool Minimum { get; init; }

    /// <summary>For a check of a whole three-phase element: its phase elements, each checked; empty otherwise.</summary>
    public ImmutableArray<string> Phases { get; init; } = [];
}

/// <summary>
/// The bound model: every statement resolved, every value in SI, every name in the symbol table.
/// It is what the document says; the network the solver needs is built from it.
/// </summary>
public sealed record Model(SyntaxTree Syntax, SymbolTable Symbols, ImmutableArray<Diagnostic> Diagnostics)
{
    public double Frequency { get; init; } = 50;

    /// <summary>
    /// The frequency the document's impedances, tests and ratings are given at: the frequency as
    /// written, where a core states no rated frequency of its own. A sweep point or tolerance sample
    /// that changes the frequency keeps it, so reactances follow (X ∝ f) and excitation is judged in
    /// volts per hertz.
    /// </summary>
    public double RatedFrequency { get => ratedFrequency ?? Frequency; init => ratedFrequency = value; }

    private readonly double? ratedFrequency;

    /// <summary>
    /// The frequency a core's impedances, open-circuit test and volts per hertz are given at: its own
    /// rated frequency where stated, else the frequency as written.
    /// </summary>
    public double RatedFrequencyOf(CoreModel core) => core.Frequency ?? RatedFrequency;

    /// <summary>Kelvin.</summary>
    public double Temperature { get; init; } = 348.15;

    public ImmutableArray<CoreModel> Cores { get; init; } = [];
    public ImmutableArray<NoLoadModel> NoLoads { get; init; } = [];
    public ImmutableArray<WindingModel> Windings { get; init; } = [];
    public ImmutableArray<TapModel> Taps { get; init; } = [];
    public ImmutableArray<ImpedanceModel> Impedances { get; init; } = [];
    public ImmutableArray<ImmutableArray<NodeRef>> Joins { get; init; } = [];
    public ImmutableArray<NodeRef> Grounds { get; init; } = [];

    /// <summary>Nodes earthed through an impedance; each is also a supply of no EMF in <see cref="Supplies"/> (Grounding.cs).</summary>
    public ImmutableArray<GroundingModel> Groundings { get; init; } = [];
    public ImmutableArray<SupplyModel> Supplies { get; init; } = [];
    public ImmutableArray<LoadModel> Loads { get; init; } = [];
    public ImmutableArray<FaultModel> Faults { get; init; } = [];
    public ImmutableArray<BusFaultModel> BusFaults { get; init; } = [];

    /// <summary>How bus faults are studied; the defaults where the file has no 'fault-study' line.</summary>
    public FaultStudyModel FaultStudy { get; init; } = FaultStudyModel.Default;
    public ImmutableArray<SweepModel> Sweeps { get; init; } = [];
    public ImmutableArray<ExpectModel> Expects { get; init; } = [];
    public ImmutableArray<ToleranceSite> Tolerances { get; init; } = [];

    /// <summary>Tap changers in source order (TapChangers.cs).</summary>
    public ImmutableArray<TapChangerModel> TapChangers { get; init; } = [];

    /// <summary>The 'find' line, where the file has one.</summary>
    public FindModel? Find { get; init; }

    /// <summary>Rating warnings this file makes errors ('fail-on'), each with the line that says so.</summary>
    public ImmutableDictionary<string, TextSpan> FailOn { get; init; } = ImmutableDictionary<string, TextSpan>.Empty;

    /// <summary>Cautions this file acknowledges ('acknowledge'), each with the line that says so.</summary>
    public ImmutableDictionary<string, TextSpan> Acknowledged { get; init; } = ImmutableDictionary<string, TextSpan>.Empty;
    /// <summary>The three-phase statements; their phase elements are in the lists above.</summary>
    public ThreePhaseModel ThreePhase { get; init; } = ThreePhaseModel.Empty;

    /// <summary>The thermal statements: each unit's thermal data and the load cycle.</summary>
    public ThermalModel Thermal { get; init; } = ThermalModel.Empty;

    /// <summary>The value of every let that evaluated.</summary>
    public ImmutableDictionary<string, Quantity> Lets { get; init; } = ImmutableDictionary<string, Quantity>.Empty;

    /// <summary>Every connection point in the order the document first names it.</summary>
    public ImmutableArray<Symbol> Points { get; init; } = [];

    public bool HasErrors => Diagnostics.Any(d => d.IsError);

    /// <summary>Impedance lines between a zigzag and another winding of its unit, still to be fitted to the unit's short-circuit test (<c>Solve.ZigzagImpedances</c>).</summary>
    public ImmutableArray<ZigzagImpedance> ZigzagImpedances { get; init; } = [];

    /// <summary>What each let, toleranced value and tap position reaches, for the document as written; null where points are bound in full.</summary>
    internal Reach? Reach { get; init; }
}

/// <summary>Values that replace what the document says: a sweep point, a tolerance corner.</summary>
public sealed record BindOverrides
{
    public static readonly BindOverrides None = new();

    /// <summary>Let values and brush positions by name.</summary>
    public ImmutableDictionary<string, Quantity> Values { get; init; } = ImmutableDictionary<string, Quantity>.Empty;

    /// <summary>Deviation in [-1, 1] of each toleranced value, by the value's start offset.</summary>
    public ImmutableDictionary<int, double> Deviations { get; init; } = ImmutableDictionary<int, double>.Empty;

    /// <summary>The frequency as written, where the values above may change the frequency.</summary>
    public double? RatedFrequency { get; init; }
}

/// <summary>An impedance line between the zigzag <paramref name="Zigzag"/> and <paramref name="Other"/> on one three-phase unit, as written.</summary>
public sealed record ZigzagImpedance(ImpedanceModel Line, string Other, string Zigzag);

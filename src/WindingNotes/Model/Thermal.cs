using System.Collections.Immutable;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>
/// Cooling modes by their letters: oil-immersed (IEC 60076-2: oil natural or forced (directed), air
/// natural or forced) and dry-type (IEC 60076-11: air natural, air forced). The words are
/// <see cref="Syntax.Grammar.CoolingModes"/>.
/// </summary>
public enum CoolingMode { ONAN, ONAF, OF, OD, AN, AF }

/// <summary>How temperatures follow the load: the difference equations, or the exponential response to each step.</summary>
public enum ThermalMethod { DifferenceEquation, Exponential }

/// <summary>The loading whose limits apply.</summary>
public enum LoadingDuty { NormalCyclic, LongTimeEmergency, ShortTimeEmergency }

/// <summary>
/// A unit's thermal data ('thermal' line), rises in K, time constants in s. <see cref="Defaulted"/>
/// names what the line left to the typical values of its cooling mode. For a dry-type unit
/// (<see cref="Dry"/>) there is no oil: <see cref="TopOilRise"/> is the average winding rise, which the
/// oil's equation and time constant then carry, and the hot-spot gradient is over the winding's average.
/// </summary>
public sealed record ThermalUnitModel(string Core, TextSpan NameSpan, TextSpan Line, CoolingMode Cooling, double TopOilRise, double HotSpotGradient)
{
    /// <summary>Load loss at rated current over no-load loss; null: from the windings' resistances and the no-load test.</summary>
    public double? LossRatio { get; init; }

    public double X { get; init; }
    public double Y { get; init; }
    public double OilTimeConstant { get; init; }
    public double WindingTimeConstant { get; init; }
    public double K11 { get; init; }
    public double K21 { get; init; }
    public double K22 { get; init; }
    public bool Upgraded { get; init; }

    /// <summary>Distribution (up to 2.5 MVA), medium or large: the class the typical constants and the current limits are those of.</summary>
    public string Class { get; init; } = "";

    public ImmutableArray<string> Defaulted { get; init; } = [];

    /// <summary>A dry-type unit (air cooled, no oil).</summary>
    public bool Dry => Cooling is CoolingMode.AN or CoolingMode.AF;

    /// <summary>A dry-type unit's insulation system temperature (°C): its thermal class.</summary>
    public int? InsulationClass { get; init; }
}

public enum CapabilityKind { ConstantLoad, CycleScale }

/// <summary>
/// A 'capability' line: the largest load held all day (a per-unit multiple of the loads as written,
/// or a value of the cycle's let), or the largest multiple of the cycle's loads, that keeps the unit
/// on <see cref="Core"/> within the limits: hot-spot and top oil in °C (null: the duty's), loss of
/// life in hours over the day (null: none).
/// </summary>
public sealed record CapabilityModel(TextSpan Line, string Core, TextSpan NameSpan, CapabilityKind Kind, double? HotSpot, double? TopOil, double? LossOfLife)
{
    public string KindWord => Kind == CapabilityKind.ConstantLoad ? "constant-load" : "cycle-scale";
}

/// <summary>One cycle point: the load from its time (s from midnight) to the next point's, and the ambient (K) it sets.</summary>
public sealed record CyclePointModel(TextSpan Line, double Time, Quantity Load, double? Ambient)
{
    public TextSpan LoadSpan { get; init; }
}

/// <summary>
/// The day of load ('load-cycle' and its 'cycle-point' lines, in time order). With <see cref="Let"/>
/// each load is the let's value; without, a per-unit multiplier of every load as written.
/// The cycle repeats: before the first point the last one's load holds.
/// </summary>
public sealed record LoadCycleModel(TextSpan Line, string? Let, double? Ambient, double Step, ThermalMethod Method, LoadingDuty Duty, ImmutableArray<CyclePointModel> Points);

public sealed record ThermalModel(ImmutableArray<ThermalUnitModel> Units, LoadCycleModel? Cycle)
{
    public static readonly ThermalModel Empty = new([], null);

    public ImmutableArray<CapabilityModel> Capabilities { get; init; } = [];

    public bool IsEmpty => Units.IsEmpty && Cycle is null && Capabilities.IsEmpty;
}

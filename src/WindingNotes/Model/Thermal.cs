using System.Collections.Immutable;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>Cooling modes by their IEC 60076-2 letters: oil natural or forced (directed), air natural or forced.</summary>
public enum CoolingMode { ONAN, ONAF, OF, OD }

/// <summary>How temperatures follow the load: the difference equations, or the exponential response to each step.</summary>
public enum ThermalMethod { DifferenceEquation, Exponential }

/// <summary>The loading whose limits apply.</summary>
public enum LoadingDuty { NormalCyclic, LongTimeEmergency, ShortTimeEmergency }

/// <summary>
/// A unit's thermal data ('thermal' line), rises in K, time constants in s. <see cref="Defaulted"/>
/// names what the line left to the typical values of its cooling mode.
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

    public bool IsEmpty => Units.IsEmpty && Cycle is null;
}

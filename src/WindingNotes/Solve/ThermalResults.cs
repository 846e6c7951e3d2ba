using System.Collections.Immutable;
using System.Globalization;
using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>One winding of a unit over the cycle: its highest load (its current over its rated current) and hot-spot, and when.</summary>
public sealed record WindingHeat(string Winding, double PeakLoad, double PeakLoadTime, double PeakHotSpot, double PeakHotSpotTime);

/// <summary>
/// One unit over the day of the load cycle. Temperatures in °C, times in s from midnight, one sample
/// a step from 0 h to 24 h; <see cref="HotSpot"/> is the hottest winding's at each sample. Loss of
/// life in hours: the hours of life used at the reference ageing rate (1 at 98 °C, or 110 °C for
/// thermally upgraded paper).
/// </summary>
public sealed record ThermalUnitResult(ThermalUnitModel Unit, double LossRatio, ImmutableArray<WindingHeat> Windings)
{
    public ImmutableArray<double> TopOil { get; init; } = [];
    public ImmutableArray<double> HotSpot { get; init; } = [];
    public double PeakTopOil { get; init; }
    public double PeakTopOilTime { get; init; }
    public double PeakHotSpot { get; init; }
    public double PeakHotSpotTime { get; init; }
    public string HottestWinding { get; init; } = "";
    public double LossOfLife { get; init; }
    public double MeanAgeing { get; init; }
    public double PeakAgeing { get; init; }

    /// <summary>IEEE C57.91's equivalent aging factor F_EQA over the day (the mean of F_AA); null for a dry-type unit, for which F_AA is not defined.</summary>
    public double? EquivalentAging { get; init; }

    /// <summary>The highest aging acceleration factor F_AA of the day; null for a dry-type unit.</summary>
    public double? PeakAgingFactor { get; init; }
}

/// <summary>
/// What a 'capability' line found: the largest value (a per-unit multiple, or the let's value for a
/// constant load of a let's cycle) that keeps the unit within its limits, the limit that binds there
/// (hot-spot, top oil or loss of life) and that measure's value there. <see cref="Beyond"/>: still
/// within every limit at the end of the search, so the capability is at least <see cref="Value"/>.
/// Null <see cref="Value"/>: not found (<see cref="Problem"/> says why).
/// </summary>
public sealed record CapabilityResult(CapabilityModel Capability, double? Value, string Binding, double AtBinding, bool Beyond, string? Problem)
{
    /// <summary>The limits applied: hot-spot and top oil in °C (top oil null for a dry-type unit), loss of life in h (null: none).</summary>
    public double HotSpotLimit { get; init; }
    public double? TopOilLimit { get; init; }
    public double? LossOfLifeLimit { get; init; }
}

/// <summary>The load cycle as solved: its samples (time; the load and ambient over the step ending there) and each unit over them.</summary>
public sealed record ThermalResult(LoadCycleModel Cycle, ImmutableArray<double> Times, ImmutableArray<double> Load, ImmutableArray<double> Ambient, ImmutableArray<ThermalUnitResult> Units)
{
    /// <summary>Days run from the steady state of midnight's load until the day repeated itself; the last is the one given.</summary>
    public int Days { get; init; } = 1;

    /// <summary>The 'capability' lines' results, in file order.</summary>
    public ImmutableArray<CapabilityResult> Capabilities { get; init; } = [];

    /// <summary>"18:30", or "18:30:15" where the step is not a whole minute.</summary>
    public string Clock(double seconds) => ClockText(seconds, Cycle.Step % 60 != 0);

    public static string ClockText(double seconds, bool withSeconds)
    {
        var s = (long)Math.Round(seconds);
        var text = $"{s / 3600:00}:{s / 60 % 60:00}";
        return withSeconds ? text + $":{s % 60:00}" : text;
    }

    /// <summary>The unit of the cycle's load: pu without 'of', else the let's SI unit.</summary>
    public string LoadUnit { get; init; } = "pu";

    /// <summary>The samples on the hour, 0 h to 24 h.</summary>
    public IEnumerable<int> Hourly()
    {
        var dt = Times.Length > 1 ? Times[1] : 86400;
        return Enumerable.Range(0, 25).Select(h => (int)Math.Round(h * 3600 / dt)).Where(k => k < Times.Length).Distinct();
    }

    public static string Hours(double h) => Text.Numbers.Fixed(h) + " h";

    internal static string Invariant(double x) => x.ToString(CultureInfo.InvariantCulture);
}

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
}

/// <summary>The load cycle as solved: its samples (time; the load and ambient over the step ending there) and each unit over them.</summary>
public sealed record ThermalResult(LoadCycleModel Cycle, ImmutableArray<double> Times, ImmutableArray<double> Load, ImmutableArray<double> Ambient, ImmutableArray<ThermalUnitResult> Units)
{
    /// <summary>Days run from the steady state of midnight's load until the day repeated itself; the last is the one given.</summary>
    public int Days { get; init; } = 1;

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

    public static string Hours(double h) => Text.Numbers.Fixed(h) + " h";

    internal static string Invariant(double x) => x.ToString(CultureInfo.InvariantCulture);
}

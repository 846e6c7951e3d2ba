using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>
/// A step-voltage regulator's range of regulation and the current its series winding may carry.
/// <see cref="Range"/> is the most the reachable positions put in circuit, as a fraction of the shunt
/// winding's voltage (the regulated voltage): max|position| × the turns a step moves over the shunt
/// winding's turns. <see cref="Multiplier"/> is the current rating at that range over the rating at ±10 %.
/// </summary>
public sealed record RegulatorRating(string Series, string Shunt, double Range, double Multiplier, double? RatedCurrent, double Current)
{
    /// <summary>The current the series winding may carry at this range; null where its rated current is not known.</summary>
    public double? CurrentRating => RatedCurrent * Multiplier;
}

public static class Regulators
{
    /// <summary>
    /// The current rating of a step-voltage regulator against its range of regulation, as a multiple of
    /// its rated current (at ±10 %): IEEE C57.15 (from memory; REFERENCES.md R43). Widest range first.
    /// </summary>
    public static readonly (double Range, double Multiplier)[] RatingByRange =
        [(0.10, 1.00), (0.0875, 1.10), (0.075, 1.20), (0.0625, 1.35), (0.05, 1.60)];

    /// <summary>
    /// The multiplier for a range: the row of the range itself or of the next wider one (so ±8 % takes
    /// the ±8.75 % row, 110 %); at or beyond ±10 % the rated current; below ±5 % the ±5 % row, not more.
    /// </summary>
    public static double Multiplier(double range)
    {
        var multiplier = RatingByRange[0].Multiplier;
        foreach (var (r, m) in RatingByRange)
            if (range <= r * (1 + 1e-9)) multiplier = m;
        return multiplier;
    }

    /// <summary>
    /// A tap changer is a step-voltage regulator's when it has a reversing switch and its winding (the
    /// series winding) shares its core with exactly one other winding (the shunt winding); its rating in
    /// this case, or null where it is not one or the range cannot be told (a step in volts on a winding
    /// with no rated voltage).
    /// </summary>
    public static RegulatorRating? Rating(TapChangerModel t, CaseResult c)
    {
        if (!t.Reversing) return null;
        var network = c.Solution.Network;
        var series = network.Windings.FirstOrDefault(w => w.Name == t.Winding);
        if (series is null) return null;
        var others = network.Windings.Where(w => w.Core == series.Core && w.Index != series.Index).ToList();
        if (others.Count != 1 || others[0].Turns <= 0) return null;
        var shunt = others[0];
        var turnsPerStep = t.Step.IsPercent ? t.Step.Real * series.Turns
            : t.Step.Flags.HasFlag(QuantityFlags.Turns) || t.Step.Dimension.IsNone ? t.Step.Real
            : series.RatedVoltage is { } v && v > 0 ? t.Step.Real / v * series.Turns : double.NaN;
        if (!double.IsFinite(turnsPerStep)) return null;
        var range = Math.Max(Math.Abs(t.Low), Math.Abs(t.High)) * Math.Abs(turnsPerStep) / shunt.Turns;
        var current = c.Sections.Where(s => s.Winding.Name == series.Name).Select(s => s.Current.Magnitude).DefaultIfEmpty(0).Max();
        return new RegulatorRating(series.Name, shunt.Name, range, Multiplier(range), series.RatedCurrent, current);
    }
}

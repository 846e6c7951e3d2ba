using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>
/// A neutral-grounding impedance in a bus fault: the current through it, the voltage across it (the
/// node's voltage to earth) and I²t over the fault's duration, against its rated current and the I²t
/// of its rated current for its time rating (a grounding resistor is rated by both, IEEE 32, from memory).
/// </summary>
public sealed record GroundingDuty(GroundingModel Grounding, Complex Current, Complex Voltage, double Duration)
{
    /// <summary>A²s.</summary>
    public double I2t => Current.Magnitude * Current.Magnitude * Duration;

    /// <summary>The I²t of its rated current for its time rating, A²s; null unless both are given.</summary>
    public double? RatedI2t => Grounding.RatedCurrent is { } r && Grounding.TimeRating is { } t ? r * r * t : null;

    public bool CurrentExceeded => Grounding.RatedCurrent is { } r && Current.Magnitude > r * (1 + 1e-9);

    public bool I2tExceeded => RatedI2t is { } k && I2t > k * (1 + 1e-9);

    public bool Exceeded => CurrentExceeded || I2tExceeded;

    /// <summary>Whether anything is judged: a rated current given.</summary>
    public bool Judged => Grounding.RatedCurrent is not null;

    /// <summary>
    /// Each grounding impedance's duty, from its element's current and voltage in the fault's case: the
    /// element's current leaves the node into the network, so the current from the node to earth is
    /// minus it, and the voltage over it is then that current times the impedance.
    /// </summary>
    public static ImmutableArray<GroundingDuty> Of(Model.Model model, CaseResult result, double duration) =>
        [.. model.Groundings.Select(g => result.Supplies.FirstOrDefault(s => s.Supply.Name == g.Element) is { } s
            ? new GroundingDuty(g, -s.Current, s.Voltage, duration) : null).OfType<GroundingDuty>()];
}

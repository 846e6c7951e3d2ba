using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>
/// A tap changer: whole-numbered positions from <see cref="Low"/> to <see cref="High"/> on a tapped
/// winding. Its position acts through a let (<see cref="Let"/>): at position k the let is its value
/// as written plus k steps (|k| steps with a reversing switch, which connects the winding reversed
/// at negative positions). So whatever the let sets (turns, a tap, a brush) follows the position.
/// </summary>
public sealed record TapChangerModel(string Name, TextSpan NameSpan, TextSpan Line, string Winding, string Let, int Low, int High, Quantity Step, bool OnLoad, bool Reversing, int Start)
{
    /// <summary>The master whose position a follower takes (paralleled units).</summary>
    public string? Follows { get; init; }

    /// <summary>The automatic voltage control; null where the position is stated.</summary>
    public TapControlModel? Control { get; init; }
}

/// <summary>
/// An automatic voltage control as practice sets one: the relay sees the regulated voltage over the
/// pt-ratio, less the line-drop compensation (R + jX volts at rated ct current, times the line
/// current over the ct rating), and holds it within the band target ± bandwidth/2.
/// </summary>
public sealed record TapControlModel(NodeRef A, NodeRef B, double Target, double Bandwidth, double PtRatio, Complex Compensation, NodeRef? Line, double? CtRating)
{
    public double BandLow => Target - Bandwidth / 2;

    public double BandHigh => Target + Bandwidth / 2;
}

/// <summary>
/// A 'find' line: the value of a let, between two bounds, that makes a measure (read as an expect
/// reads it) equal a target.
/// </summary>
public sealed record FindModel(TextSpan Line, string Let, ExpectModel Measure, double Target, Quantity Low, Quantity High);

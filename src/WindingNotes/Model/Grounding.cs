using System.Numerics;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>
/// A node earthed through a neutral-grounding resistor or reactor ('ground N impedance 8 ohm'). The
/// network holds it as <see cref="Element"/>, a supply of no EMF from the node to the earth point
/// <see cref="Earth"/> with the impedance as its internal impedance: a branch, so it stays in the
/// no-load case and under the equivalent source of IEC 60909-0, which leave loads out, and its current
/// and voltage are reported as a supply's. A grounding resistor is rated by its current and the time
/// it may carry it (IEEE 32, from memory): its duty in a bus fault is its current and I²t.
/// </summary>
public sealed record GroundingModel(NodeRef Node, string Element, string Earth, TextSpan Line, Complex Impedance)
{
    /// <summary>A.</summary>
    public double? RatedCurrent { get; init; }

    /// <summary>s.</summary>
    public double? TimeRating { get; init; }

    /// <summary>The names the expansion gives the element and its earth point: a node's own name, then a word.</summary>
    public static (string Element, string Earth) Names(string node) => (node + "_ground", node + "_earth");
}

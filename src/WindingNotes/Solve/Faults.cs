using System.Numerics;
using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>
/// A fault case's own results: the fault current, the X/R of the loop that feeds it, the
/// asymmetrical peak, and the winding that carries the most times its rated current.
/// </summary>
public sealed record FaultResult(FaultModel Fault, Complex Current, double XR, double PeakFactor, double Peak)
{
    /// <summary>The highest section current over its winding's rated current, and that winding; null when no winding has a rating.</summary>
    public double? WorstMultiple { get; init; }

    public string? WorstWinding { get; init; }
}

public static class Faults
{
    /// <summary>How long a winding must carry its short-circuit current: the fault study's default duration.</summary>
    public static double ThermalDuration => FaultStudyModel.Default.Duration;

    /// <summary>
    /// The asymmetrical peak factor κ√2 with κ = 1 + e^(−(φ+π/2)/(X/R))·sin φ and φ = atan(X/R)
    /// (IEC 60076-5, formula from memory): √2 for a resistive loop, 2√2 for a purely reactive one.
    /// </summary>
    public static double PeakFactor(double xr)
    {
        if (double.IsPositiveInfinity(xr)) return 2 * Math.Sqrt(2);
        if (!(xr > 0)) return Math.Sqrt(2);
        var phi = Math.Atan(xr);
        return Math.Sqrt(2) * (1 + Math.Exp(-(phi + Math.PI / 2) / xr) * Math.Sin(phi));
    }

    /// <summary>
    /// By Thévenin, the loop impedance (the network seen from the fault plus the fault's own) is the
    /// voltage across the fault before it, from the normal case, over the fault current. Exact for a
    /// linear network; with constant-power loads it is the usual approximation.
    /// </summary>
    public static FaultResult Compute(Solution fault, Solution normal)
    {
        var f = fault.Case.Fault!;
        var network = fault.Network;
        var i = fault.FaultCurrent;
        var before = normal.Voltage(network.Node(f.A.Name)) - normal.Voltage(network.Node(f.B.Name));
        var loop = i == Complex.Zero ? Complex.Zero : before / i;
        var xr = loop.Imaginary <= 0 ? 0 : loop.Real <= 1e-12 * loop.Magnitude ? double.PositiveInfinity : loop.Imaginary / loop.Real;
        var factor = PeakFactor(xr);
        double? worst = null;
        string? worstWinding = null;
        var worstTouches = false;
        var (a, b) = (network.Node(f.A.Name), network.Node(f.B.Name));
        foreach (var s in network.Sections.Where(s => fault.Scope?.Sections.Contains(s.Index) ?? true))
        {
            if (network.Windings[s.Winding].RatedCurrent is not { } rated || rated <= 0) continue;
            var multiple = fault.SectionCurrents[s.Index].Magnitude / rated;
            // Windings of one core carry the same multiple; of equals, name the one the fault is on.
            var touches = new[] { s.NodeA, s.NodeB }.Any(n => n != network.EarthNode && (n == a || n == b));
            var tie = worst is { } w && Math.Abs(multiple - w) <= 1e-9 * w;
            if (worst is null || (multiple > worst && !tie) || (tie && touches && !worstTouches))
                (worst, worstWinding, worstTouches) = (multiple, network.Windings[s.Winding].Name, touches);
        }
        return new FaultResult(f, i, xr, factor, factor * i.Magnitude) { WorstMultiple = worst, WorstWinding = worstWinding };
    }
}

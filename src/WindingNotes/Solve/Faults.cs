using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Text;

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

    /// <summary>How the case was solved: the equivalent source (loads left out) or the network as loaded.</summary>
    public FaultMethod Method { get; init; } = FaultMethod.AsLoaded;

    /// <summary>The voltage factor c of the equivalent source; null as loaded.</summary>
    public double? VoltageFactor { get; init; }

    /// <summary>The equivalent source: the voltage across the fault at no load that c is applied to, V.</summary>
    public double? Nominal { get; init; }

    /// <summary>As loaded: the constant-power and constant-current loads of the fault's part, taken as the impedance drawing their pre-fault power.</summary>
    public ImmutableArray<LoadModel> LoadsAsImpedance { get; init; } = [];
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
    /// How a two-node fault is studied: as the file's 'fault-study' line says (the equivalent source
    /// unless it says 'as-loaded'); without one, as loaded, as files written before the line meant.
    /// </summary>
    public static FaultMethod MethodOf(Model.Model model) => model.FaultStudy.Stated ? model.FaultStudy.Method : FaultMethod.AsLoaded;

    /// <summary>
    /// A two-node fault's case. With the equivalent source (IEC 60909-0) loads are left out and every
    /// supply's EMF is scaled by the voltage factor c, taken on the voltage across the fault at no
    /// load (the nominal voltage there); c is cmax unless the study asks for minimum currents only.
    /// As loaded, the supplies are as written and constant-power and constant-current loads become
    /// the impedance that draws their pre-fault power at their pre-fault voltage (common practice),
    /// so the faulted network is linear and its loop impedance exact. Null when it does not solve.
    /// </summary>
    /// <param name="loaded">The network with its loads as their pre-fault impedance (<see cref="AsLoaded"/>), made once for all the faults of a point; made here when null.</param>
    internal static CaseResult? Solve(Network network, FaultModel fault, Solution main, Solution? noLoad, ImmutableArray<Diagnostic>.Builder diagnostics, CancellationToken cancel, Network? loaded = null,
        SymbolicFactors? kept = null)
    {
        var (a, b) = (network.Node(fault.A.Name), network.Node(fault.B.Name));
        var spec = CaseSpec.ForFault(fault);
        if (MethodOf(network.Model) == FaultMethod.AsLoaded)
        {
            // The case keeps the network as written: its loads are what the file says, their stand-ins the solver's business.
            var solved = NetworkSolver.Solve(loaded ?? AsLoaded(network, main), spec, kept, cancel) with { Network = network };
            // A load the fault shorts has no voltage: that is the fault, not something to warn about.
            diagnostics.AddRange(solved.Diagnostics.Where(d => d.Code != "load-without-voltage"));
            if (!solved.Solved) return null;
            var converted = Results.InScope(network.Loads, solved.Scope?.Loads).Where(l => l.Source.Exponent != 2).Select(l => l.Source);
            var result = Results.Compute(solved, null);
            return result with { Fault = Compute(solved, main.Voltage(a) - main.Voltage(b)) with { LoadsAsImpedance = [.. converted] } };
        }
        var pre = network.Loads.IsEmpty ? main : noLoad;
        if (pre is null) return null;
        var before = pre.Voltage(a) - pre.Voltage(b);
        var study = network.Model.FaultStudy;
        var c = FaultStudy.VoltageFactor(before.Magnitude, minimum: !study.Maximum, study.LowVoltageTolerance);
        // Every supply's EMF scaled; only the fault's part is solved, so only its supplies need new records (a file of many units and faults made every supply again per fault).
        var supplies = network.Supplies.ToBuilder();
        var part = a >= 0 && b >= 0 ? Wiring.Of(network).FaultedPart(a, b, loads: false) : null;
        foreach (var i in part?.Supplies ?? Enumerable.Range(0, supplies.Count))
            supplies[i] = supplies[i] with { Voltage = supplies[i].Voltage * c };
        var scaled = network with { Supplies = supplies.ToImmutable() };
        var source = NetworkSolver.Solve(scaled, spec with { WithoutLoads = true }, kept, cancel) with { Network = network };
        diagnostics.AddRange(source.Diagnostics.Where(d => d.Code != "load-without-voltage"));
        if (!source.Solved) return null;
        return Results.Compute(source, null) with
        {
            Fault = Compute(source, c * before) with { Method = FaultMethod.EquivalentSource, VoltageFactor = c, Nominal = before.Magnitude },
        };
    }

    /// <summary>The network with its constant-power and constant-current loads as the impedance that draws their power in <paramref name="main"/>.</summary>
    internal static Network AsLoaded(Network network, Solution main) =>
        network with { Loads = [.. network.Loads.Select(l => FaultStudy.AsImpedance(l, main))] };

    /// <summary>
    /// By Thévenin, the loop impedance (the network seen from the fault plus the fault's own) is the
    /// voltage across the fault before it over the fault current: exact, as the faulted network is
    /// linear. Loads left out of the case are left out of the loop. The peak factor is the IEC 60076-5
    /// asymmetry factor k·√2 (2.55 above X/R 14).
    /// </summary>
    public static FaultResult Compute(Solution fault, Complex before)
    {
        var f = fault.Case.Fault!;
        var network = fault.Network;
        var i = fault.FaultCurrent;
        var loop = i == Complex.Zero ? Complex.Zero : before / i;
        var xr = loop.Imaginary <= 0 ? 0 : loop.Real <= 1e-12 * loop.Magnitude ? double.PositiveInfinity : loop.Imaginary / loop.Real;
        var factor = FaultStudy.AsymmetryFactor(xr);
        double? worst = null;
        string? worstWinding = null;
        var worstTouches = false;
        var (a, b) = (network.Node(f.A.Name), network.Node(f.B.Name));
        var earth = network.EarthNode;
        foreach (var s in Results.InScope(network.Sections, fault.Scope?.Sections))
        {
            if (network.Windings[s.Winding].RatedCurrent is not { } rated || rated <= 0) continue;
            var multiple = fault.SectionCurrents[s.Index].Magnitude / rated;
            // Windings of one core carry the same multiple; of equals, name the one the fault is on.
            var touches = (s.NodeA != earth && (s.NodeA == a || s.NodeA == b)) || (s.NodeB != earth && (s.NodeB == a || s.NodeB == b));
            var tie = worst is { } w && Math.Abs(multiple - w) <= 1e-9 * w;
            if (worst is null || (multiple > worst && !tie) || (tie && touches && !worstTouches))
                (worst, worstWinding, worstTouches) = (multiple, network.Windings[s.Winding].Name, touches);
        }
        return new FaultResult(f, i, xr, factor, factor * i.Magnitude) { WorstMultiple = worst, WorstWinding = worstWinding };
    }
}

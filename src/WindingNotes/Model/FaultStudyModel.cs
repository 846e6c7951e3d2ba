using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>The short circuits a three-phase bus can suffer, in the trade's words.</summary>
public enum BusFaultKind { ThreePhase, LineToGround, LineToLine, DoubleLineToGround }

/// <summary>
/// How a bus fault is studied: the equivalent voltage source at the fault location with the voltage
/// factor c and non-motor loads left out (IEC 60909-0), or the network as loaded.
/// </summary>
public enum FaultMethod { EquivalentSource, AsLoaded }

/// <summary>
/// A short circuit on three line terminals. Line-to-ground faults the first line; line-to-line and
/// double-line-to-ground the second and third (so the symmetrical components are those of the first
/// line, as the textbooks write them). The fault impedance is in each faulted line (between the two
/// lines for line-to-line); the earth impedance runs from the fault to earth.
/// </summary>
public sealed record BusFaultModel(string Name, TextSpan NameSpan, TextSpan Line, ImmutableArray<NodeRef> Lines, BusFaultKind Kind, Complex Impedance, Complex EarthImpedance)
{
    /// <summary>The system's nominal line-to-line voltage at the bus, V, where the file states it.</summary>
    public double? Nominal { get; init; }

    public bool ToEarth => Kind is BusFaultKind.LineToGround or BusFaultKind.DoubleLineToGround;

    public static string Word(BusFaultKind kind) => kind switch
    {
        BusFaultKind.ThreePhase => "three-phase",
        BusFaultKind.LineToGround => "line-to-ground",
        BusFaultKind.LineToLine => "line-to-line",
        _ => "double-line-to-ground",
    };
}

/// <summary>The 'fault-study' line: method, which currents (cmax, cmin), the low-voltage tolerance, the duration, the starting temperature (K).</summary>
public sealed record FaultStudyModel(FaultMethod Method, bool Maximum, bool Minimum, double LowVoltageTolerance, double Duration, double InitialTemperature, TextSpan Line)
{
    /// <summary>
    /// Without a 'fault-study' line: the equivalent source, maximum currents, a +10 % low-voltage
    /// system, 2 s (IEC 60076-5's duration for the thermal ability, from memory), and 105 °C, the
    /// standard's starting temperature for oil-immersed windings (40 °C ambient plus a 65 K average
    /// winding rise; from memory).
    /// </summary>
    /// <summary>κ by the ratio R/X at the fault times 1.15, as IEC 60909-0 asks for a meshed network.</summary>
    public bool Meshed { get; init; }

    /// <summary>κ by the equivalent frequency (IEC 60909-0 method C): R/X of the loop solved at 20 Hz (50 Hz systems) or 24 Hz (60 Hz).</summary>
    public bool EquivalentFrequency { get; init; }

    /// <summary>Network transformers' impedances times K_T (IEC 60909-0) in the equivalent-source study.</summary>
    public bool TransformerCorrection { get; init; }

    /// <summary>For minimum currents: the conductors' temperature at the end of the fault, K (IEC 60909-0); null keeps the reference temperature.</summary>
    public double? EndTemperature { get; init; }

    /// <summary>Whether the file has a 'fault-study' line (two-node faults then follow its method).</summary>
    public bool Stated => Line != default;

    public static readonly FaultStudyModel Default = new(FaultMethod.EquivalentSource, true, false, 0.10, 2, 378.15, default);
}

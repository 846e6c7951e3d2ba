using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>
/// How the three limbs of a three-phase core share their flux. A bank is three separate cores;
/// the others are one magnetic circuit whose limbs meet at the yokes.
/// </summary>
public enum CoreConstruction { Bank, ThreeLimb, FiveLimb, Shell }

/// <summary>How a three-phase winding's phase windings are connected, in the trade's words.</summary>
public enum PhaseConnection { Wye, Delta, Zigzag, Series, Ends }

/// <summary>The three phases, in the order the notation writes them; phase elements are named NAME_a, NAME_b, NAME_c.</summary>
public static class Phases
{
    public static readonly string[] Letters = ["a", "b", "c"];

    public static string Of(string name, int phase) => $"{name}_{Letters[phase]}";

    public static string[] All(string name) => [Of(name, 0), Of(name, 1), Of(name, 2)];

    /// <summary>The operator a = 1∠120° of symmetrical components.</summary>
    public static readonly Complex A = Complex.FromPolarCoordinates(1, 2 * Math.PI / 3);
}

/// <summary>
/// A three-phase core: three limbs (cores NAME_a, NAME_b, NAME_c in the model) and, for cores
/// whose limbs share yokes, the admittance per turn of the path the zero-sequence flux returns by
/// (tank and air for a three-limb core, the outer limbs or the shell otherwise), null where unknown.
/// </summary>
public sealed record ThreePhaseCoreModel(string Name, TextSpan NameSpan, TextSpan Line, CoreConstruction Construction, ImmutableArray<string> Limbs)
{
    /// <summary>The zero-sequence magnetising impedance per phase, per unit on the core's rating.</summary>
    public Complex? ZeroSequence { get; init; }

    /// <summary>Three-phase VA.</summary>
    public double? Rating { get; init; }
}

/// <summary>
/// A winding declared once on a three-phase core: its phase windings (in the model's windings),
/// the limb each is on, its line terminals and its star point where it has one.
/// </summary>
public sealed record ThreePhaseWindingModel(string Name, TextSpan NameSpan, TextSpan Line, string Core, PhaseConnection Connection,
    ImmutableArray<NodeRef> LineTerminals, ImmutableArray<string> PhaseWindings)
{
    /// <summary>The star point (wye, zigzag), named by the author as a neutral terminal or made; null for others.</summary>
    public string? StarPoint { get; init; }

    /// <summary>Whether the star point is a terminal the author named (YN, ZN).</summary>
    public bool NeutralTerminal { get; init; }

    /// <summary>For a series winding: the common winding's line terminals it ends at.</summary>
    public ImmutableArray<NodeRef> OtherEnds { get; init; } = [];
}

/// <summary>A three-phase source: three phase supplies NAME_a.. from a star point NAME_n, earthed directly or through NAME_zn.</summary>
public sealed record ThreePhaseSupplyModel(string Name, TextSpan NameSpan, TextSpan Line, ImmutableArray<NodeRef> LineTerminals, double LineVoltage, bool Acb, Complex Z1, Complex Z0);

/// <summary>A three-phase load: three phase loads NAME_a.. (wye) or NAME_ab.. (delta).</summary>
public sealed record ThreePhaseLoadModel(string Name, TextSpan NameSpan, TextSpan Line, ImmutableArray<NodeRef> LineTerminals, bool Delta, ImmutableArray<string> PhaseLoads)
{
    public string? StarPoint { get; init; }
}

/// <summary>What the three-phase statements of a document say, beside the phase elements they expand to.</summary>
public sealed record ThreePhaseModel
{
    public static readonly ThreePhaseModel Empty = new();

    public ImmutableArray<ThreePhaseCoreModel> Cores { get; init; } = [];
    public ImmutableArray<ThreePhaseWindingModel> Windings { get; init; } = [];
    public ImmutableArray<ThreePhaseSupplyModel> Supplies { get; init; } = [];
    public ImmutableArray<ThreePhaseLoadModel> Loads { get; init; } = [];

    public bool IsEmpty => Cores.IsEmpty && Supplies.IsEmpty && Loads.IsEmpty;

    private HashSet<int>? phaseLines;

    /// <summary>Whether a statement (by its span) is a three-phase supply or load; a set built once, so a file of many units stays linear.</summary>
    public bool IsSupplyOrLoad(TextSpan line) =>
        (phaseLines ??= [.. Supplies.Select(s => s.Line.Start), .. Loads.Select(l => l.Line.Start)]).Contains(line.Start);
}

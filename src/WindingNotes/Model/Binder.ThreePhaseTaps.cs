using System.Collections.Immutable;
using WindingNotes.Syntax;

namespace WindingNotes.Model;

// A tap on a three-phase winding and a check of a whole three-phase element, as the single-phase
// notation writes them: one line, all three phases.
internal sealed partial class BindRun
{
    /// <summary>Taps written on a three-phase winding: each stands for its phase taps NAME_a, NAME_b, NAME_c, and is no point itself.</summary>
    private readonly HashSet<string> threePhaseTaps = new(StringComparer.Ordinal);

    /// <summary>
    /// After every line has declared its names, a tap on a three-phase winding declares its phase
    /// taps, one on each phase winding, so a later or earlier line may join to one of them. A
    /// zigzag's phase is two halves on two limbs: a tap there names the half it is on.
    /// </summary>
    private void DeclareTapPhases(StatementSyntax s)
    {
        if (s.Kind is not (StatementKind.Tap or StatementKind.Brush) || rejected.Contains(s) || s.Head.Name(0) is not { } head || s.Clause("on")?.Name(0) is not { } on) return;
        if (symbols.Find(on.Text) is not { Kind: SymbolKind.Winding } winding || !declaredThreePhase.Contains(winding.Name) || IsZigzag(winding.Name)) return;
        threePhaseTaps.Add(head.Text);
        foreach (var phase in Phases.All(head.Text)) Derive(phase, s.Kind == StatementKind.Brush ? SymbolKind.Brush : SymbolKind.Tap, head, s);
    }

    private bool IsZigzag(string winding) => symbols.Find(Phases.Of(winding, 0) + "n") is { Derived: true } half && half.Owner == winding;

    /// <summary>
    /// A tap or brush on a three-phase winding: a phase tap (brush) at the same position on each phase
    /// winding (in turns or % of the phase winding, or in volts along it). Brushes B_a, B_b, B_c move
    /// together, ganged as one spindle: a sweep or override of B moves all three. False where the
    /// winding is not three-phase; true once handled, with a diagnostic where it cannot be.
    /// </summary>
    private bool BindThreePhaseTap(StatementSyntax s, Symbol winding, NameSyntax name, bool isBrush, Func<(double Position, TapUnit Unit)?> place, Func<TapRange?> range)
    {
        if (!declaredThreePhase.Contains(winding.Name)) return false;
        if (!threePhaseTaps.Contains(name.Text))
        {
            diagnostics.ReportNamePhase(s.Clause("on")!.Name(0)!.Name, winding.Name);
            return true;
        }
        if (place() is not { } at) return true;
        var travel = isBrush ? range() : null;
        var limit = isBrush ? Real(s.Value("current-limit"), Dimension.CurrentDim, $"the current limit of {name.Text}", positive: true) : null;
        for (var k = 0; k < 3; k++)
        {
            taps.Add(new TapModel(Phases.Of(name.Text, k), name.Name.Span, s.Span, Phases.Of(winding.Name, k), at.Position, at.Unit, isBrush)
            {
                PositionSpan = s.Value("at")!.Span,
                Range = travel,
                CurrentLimit = limit,
            });
            if (symbols.Find(Phases.Of(name.Text, k)) is { Derived: true } point && !derivedPoints.Contains(point)) derivedPoints.Add(point);
        }
        return true;
    }

    /// <summary>A point written as a three-phase tap's own name: it stands for three points, so one must be named.</summary>
    private bool IsThreePhaseTap(Symbol symbol, NameSyntax name)
    {
        if (!threePhaseTaps.Contains(symbol.Name)) return false;
        diagnostics.ReportNamePhase(name.Name, symbol.Name);
        return true;
    }

    /// <summary>
    /// A section of a whole three-phase winding between two of its three-phase taps ('expect current
    /// HV T1 T2'): checked on each phase between that phase's taps (T1_a and T2_a on HV_a …).
    /// </summary>
    private bool ThreePhaseSection(Symbol winding, List<NameSyntax> names) =>
        winding.Kind == SymbolKind.Winding && names.Count == 3
        && names.Skip(1).All(n => threePhaseTaps.Contains(n.Text) && symbols.Find(n.Text) is { Owner: var owner } && owner == winding.Name);

    /// <summary>
    /// The phase elements a current or loading check of a whole three-phase winding, supply or load
    /// measures, each on its own; empty where the check cannot name the element whole (another
    /// measure, a zigzag's second halves being the same current as the first).
    /// </summary>
    private ImmutableArray<string> PhasesChecked(Symbol symbol, MeasureKind measure)
    {
        if (measure is not (MeasureKind.Current or MeasureKind.Loading)) return [];
        if (measure == MeasureKind.Loading && symbol.Kind != SymbolKind.Winding) return [];
        if (symbol.Kind is not (SymbolKind.Winding or SymbolKind.Supply or SymbolKind.Load)) return [];
        if (PairPhases(symbol) is { } units) return units;
        // A delta load's phases are named by the lines they join.
        var names = symbol.Kind == SymbolKind.Load && symbols.Find(Phases.Of(symbol.Name, 0)) is null ? DeltaNames(symbol.Name) : Phases.All(symbol.Name);
        return names.All(n => symbols.Find(n) is { Derived: true }) ? [.. names] : [];
    }
}

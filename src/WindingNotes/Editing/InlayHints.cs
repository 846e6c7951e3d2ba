using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

/// <summary>A result shown at the end of the line it belongs to.</summary>
public sealed record InlayHint(Position Position, string Label, string? Tooltip = null);

/// <summary>
/// Results at line ends: supply and load lines show voltage, current, P and pf; winding and tap
/// lines their sections' currents and loading; core lines volts per turn and flux density against
/// the limit; expect lines pass or fail with the value; fault lines the fault current; sweep lines
/// the range over the sweep; let lines the value of an expression. Always from the normal case but
/// for faults and sweeps, which have cases of their own.
/// </summary>
public static class InlayHints
{
    /// <remarks>
    /// A version that was not solved shows the results of the last version that was, on the lines
    /// that read the same in both, each marked with that version: never a mix with a partial network.
    /// </remarks>
    public static IReadOnlyList<InlayHint> For(Evaluation evaluation, TextRange? range = null)
    {
        Func<StatementSyntax, string?> label = Labels(evaluation);
        if (!evaluation.Solved && evaluation.LastSolved is { } last)
        {
            var before = Labels(last.Evaluation);
            var kept = last.Evaluation.Syntax.Statements
                .Select(s => (Text: last.Evaluation.Text[s.Span], Label: before(s)))
                .Where(x => x.Label is not null)
                .GroupBy(x => x.Text, x => x.Label!)
                .ToDictionary(g => g.Key, g => new Queue<string>(g));
            label = s => kept.TryGetValue(evaluation.Text[s.Span], out var labels) && labels.TryDequeue(out var l) ? $"{l} (version {last.Version})" : null;
        }
        var hints = new List<InlayHint>();
        var text = evaluation.Text;
        foreach (var line in evaluation.Syntax.Lines)
        {
            if (line.Statement is not { } statement) continue;
            var end = text.GetPosition(line.Span.End);
            if (range is { } r && (end.Line < r.Start.Line || text.GetPosition(line.Span.Start).Line > r.End.Line)) continue;
            if (label(statement) is { } shown) hints.Add(new InlayHint(end, shown));
        }
        return hints;
    }

    /// <summary>The hint of each statement, or null where it has no result to show.</summary>
    internal static Func<StatementSyntax, string?> Labels(Evaluation evaluation)
    {
        var index = new ResultIndex(evaluation);
        return s => Label(evaluation, s, index);
    }

    private static string? Label(Evaluation evaluation, StatementSyntax s, ResultIndex index)
    {
        var name = s.Head.Name(0)?.Text ?? "";
        var label = s.Kind switch
        {
            StatementKind.Expect => index.Checks.GetValueOrDefault(s.Span.Start) is { } check ? ResultText.Check(check) : null,
            StatementKind.Fault => index.Faults.GetValueOrDefault(name) is { } fault ? $"{ResultText.Magnitude(fault.Solution.FaultCurrent, "A")} fault current" : null,
            StatementKind.BusFault => FaultStudyText.Hint(evaluation, name),
            StatementKind.Sweep => SweepRange(evaluation, name),
            StatementKind.Let => LetValue(evaluation, s, name),
            StatementKind.Supply => index.Supplies.GetValueOrDefault(name) is { } x ? ResultText.Terminal(x.Voltage, x.Current, x.Power) : null,
            StatementKind.Load => index.Loads.GetValueOrDefault(name) is { } l ? ResultText.Terminal(l.Voltage, l.Current, l.Power) : null,
            StatementKind.Core => index.Cores.GetValueOrDefault(name) is { } k ? ResultText.Core(k) : null,
            StatementKind.Winding => Sections(index.OfWinding[name].ToList()),
            StatementKind.Tap or StatementKind.Brush => Tap(evaluation.Normal, index.AtPoint[name].ToList(), name) ?? PhaseTaps(evaluation, name),
            StatementKind.Thermal => ThermalHint(evaluation.Thermal, name),
            StatementKind.Capability => CapabilityHint(evaluation.Thermal, s),
            StatementKind.TapChanger => evaluation.Normal?.TapPositions.FirstOrDefault(t => t.Changer.Name == name) is { } tap ? ResultTable.TapText(tap) : null,
            StatementKind.Find => evaluation.Normal is not null && evaluation.Model.Find is { } find && evaluation.Model.Lets.TryGetValue(find.Let, out var found)
                ? $"{find.Let} = {SolveFor.Text(found)}" : null,
            _ => null,
        };
        // A three-phase core, winding, supply or load: its vector group or line-to-line voltages.
        return label ?? (s.Kind is StatementKind.Core or StatementKind.Winding or StatementKind.ThreePhaseSupply or StatementKind.ThreePhaseLoad
            ? ThreePhaseText.Hint(evaluation.Normal, name) : null);
    }

    /// <summary>The normal case's results by name, so that a thousand lines cost a thousand look-ups.</summary>
    private sealed class ResultIndex(Evaluation evaluation)
    {
        private readonly CaseResult? normal = evaluation.Normal;
        // One check an expect line, each at its statement's start (a bare 'expect' spans its own word: Data/fuzz/input-5007049.wn).
        public Dictionary<int, CheckResult> Checks { get; } = evaluation.Checks.ToDictionary(c => c.Expect.Line.Start);
        public Dictionary<string, CaseResult> Faults { get; } = evaluation.Cases.Where(c => c.Case.Fault is not null).DistinctBy(c => c.Case.Fault!.Name).ToDictionary(c => c.Case.Fault!.Name);
        public Dictionary<string, SupplyResult> Supplies => field ??= normal?.Supplies.ToDictionary(x => x.Supply.Name) ?? [];
        public Dictionary<string, LoadResult> Loads => field ??= normal?.Loads.ToDictionary(x => x.Load.Name) ?? [];
        public Dictionary<string, CoreResult> Cores => field ??= normal?.Cores.ToDictionary(x => x.Core.Name) ?? [];
        public ILookup<string, SectionResult> OfWinding => field ??= (normal?.Sections ?? []).ToLookup(x => x.Winding.Name);
        public ILookup<string, SectionResult> AtPoint => field ??= (normal?.Sections ?? []).SelectMany(x => new[] { (x.Section.FromPoint, x), (x.Section.ToPoint, x) }).ToLookup(p => p.Item1, p => p.x);
    }

    /// <summary>A unit's day of load: its peak hot-spot, when and where, and the life the day costs.</summary>
    private static string? ThermalHint(ThermalResult? thermal, string core) =>
        thermal?.Units.FirstOrDefault(u => u.Unit.Core == core) is { } u
            ? $"hot-spot up to {Numbers.Format(u.PeakHotSpot, "degC")} at {thermal.Clock(u.PeakHotSpotTime)} in '{u.HottestWinding}', loss of life {ThermalResult.Hours(u.LossOfLife)} a day"
            : null;

    /// <summary>A capability line: what it found and the limit that binds.</summary>
    private static string? CapabilityHint(ThermalResult? thermal, StatementSyntax s) =>
        thermal?.Capabilities.FirstOrDefault(c => c.Capability.Line == s.Span) is { Value: { } v } c
            ? (c.Beyond ? "at least " : "") + ThermalCapability.Shown(thermal, c.Capability, v) + (c.Beyond ? ", the end of the search" : $", {ThermalCapability.Readable(c.Binding)} {ThermalCapability.Measured(c.Binding, c.AtBinding)}")
            : null;

    private static string? Sections(IReadOnlyList<SectionResult> sections) => sections.Count switch
    {
        0 => null,
        1 => ResultText.Section(sections[0]),
        _ => string.Join("; ", sections.Select(ResultText.NamedSection)),
    };

    /// <summary>The tap's voltage, and the sections that meet at it.</summary>
    private static string? Tap(CaseResult? normal, IReadOnlyList<SectionResult> sections, string name)
    {
        if (normal is null || sections.Count == 0) return null;
        return $"{ResultText.Magnitude(normal.PointVoltage(name), "V")}; {string.Join("; ", sections.Select(ResultText.NamedSection))}";
    }

    /// <summary>A tap on a three-phase winding: the voltage of each of its phase taps.</summary>
    private static string? PhaseTaps(Evaluation evaluation, string name) =>
        evaluation.Normal is { } normal && evaluation.Model.Taps.Any(t => t.Name == Phases.Of(name, 0))
            ? string.Join("; ", Phases.All(name).Select(p => $"{p} {ResultText.Magnitude(normal.PointVoltage(p), "V")}"))
            : null;

    /// <summary>
    /// Over every point of the sweep (the study's reductions, not the points kept of a long sweep):
    /// each load's voltage, or each supply's current where there is no load.
    /// </summary>
    private static string? SweepRange(Evaluation evaluation, string name)
    {
        if (evaluation.SweepColumns is not { Points.Length: > 0 } sweep || !sweep.Points[0].Any(v => v.Name == name) || evaluation.Normal is not { } normal) return null;
        var ranges = normal.Loads.Length > 0
            ? normal.Loads.Select(l => Over(l.Load.Name, sweep[$"loads.{l.Load.Name}.v.rms"], "V"))
            : normal.Supplies.Select(s => Over(s.Supply.Name, sweep[$"supplies.{s.Supply.Name}.i.rms"], "A"));
        return $"{sweep.Solved} points: {string.Join("; ", ranges)}";
    }

    private static string Over(string name, SweepColumn? column, string unit) =>
        column is null || double.IsNaN(column.Min) ? $"{name} unknown" : $"{name} {ResultText.Range(column.Min, column.Max, unit)}";

    /// <summary>A let's value where it is computed; a plain literal says its value already.</summary>
    private static string? LetValue(Evaluation evaluation, StatementSyntax s, string name)
    {
        if (s.Head.Value() is not { } value || value.Expression is NumberSyntax && value.Angle is null) return null;
        return evaluation.Model.Lets.TryGetValue(name, out var q) ? "= " + QuantityText.Show(q) : null;
    }
}

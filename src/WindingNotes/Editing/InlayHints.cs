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
    public static IReadOnlyList<InlayHint> For(Evaluation evaluation, TextRange? range = null)
    {
        var hints = new List<InlayHint>();
        var text = evaluation.Text;
        foreach (var line in evaluation.Syntax.Lines)
        {
            if (line.Statement is not { } statement) continue;
            var end = text.GetPosition(line.Span.End);
            var start = text.GetPosition(line.Span.Start);
            if (range is { } r && (end.Line < r.Start.Line || start.Line > r.End.Line)) continue;
            if (Label(evaluation, statement) is { } label) hints.Add(new InlayHint(end, label));
        }
        return hints;
    }

    /// <summary>The hint of one statement, or null where it has no result to show.</summary>
    internal static string? Label(Evaluation evaluation, StatementSyntax s)
    {
        var name = s.Head.Name(0)?.Text;
        return s.Kind switch
        {
            StatementKind.Expect => evaluation.Checks.FirstOrDefault(c => c.Expect.Line == s.Span) is { } check ? ResultText.Check(check) : null,
            StatementKind.Fault => FaultCurrent(evaluation, name),
            StatementKind.Sweep => SweepRange(evaluation, name),
            StatementKind.Let => LetValue(evaluation, s, name),
            _ when evaluation.Normal is { } normal => Normal(normal, s.Kind, name),
            _ => null,
        };
    }

    private static string? Normal(CaseResult normal, StatementKind kind, string? name) => kind switch
    {
        StatementKind.Supply => normal.Supplies.FirstOrDefault(x => x.Supply.Name == name) is { } s ? ResultText.Terminal(s.Voltage, s.Current, s.Power) : null,
        StatementKind.Load => normal.Loads.FirstOrDefault(x => x.Load.Name == name) is { } l ? ResultText.Terminal(l.Voltage, l.Current, l.Power) : null,
        StatementKind.Core => normal.Cores.FirstOrDefault(x => x.Core.Name == name) is { } k ? ResultText.Core(k) : null,
        StatementKind.Winding => Sections(normal.Sections.Where(x => x.Winding.Name == name).ToList()),
        StatementKind.Tap or StatementKind.Brush => Tap(normal, name),
        _ => null,
    };

    private static string? Sections(IReadOnlyList<SectionResult> sections) => sections.Count switch
    {
        0 => null,
        1 => ResultText.Section(sections[0]),
        _ => string.Join("; ", sections.Select(ResultText.NamedSection)),
    };

    /// <summary>The tap's voltage, and the sections that meet at it.</summary>
    private static string? Tap(CaseResult normal, string? name)
    {
        var sections = normal.Sections.Where(x => x.Section.FromPoint == name || x.Section.ToPoint == name).ToList();
        if (sections.Count == 0) return null;
        return $"{ResultText.Magnitude(normal.PointVoltage(name!), "V")}; {string.Join("; ", sections.Select(ResultText.NamedSection))}";
    }

    private static string? FaultCurrent(Evaluation evaluation, string? name) =>
        evaluation.Cases.FirstOrDefault(c => c.Case.Fault?.Name == name) is { } fault
            ? $"{ResultText.Magnitude(fault.Solution.FaultCurrent, "A")} fault current"
            : null;

    /// <summary>
    /// Over the sweep's points (the cases named "sweep NAME=…", as the JSON names them): each load's
    /// voltage, or each supply's current where there is no load.
    /// </summary>
    private static string? SweepRange(Evaluation evaluation, string? name)
    {
        var points = evaluation.Cases.Where(c => c.Case.Name.StartsWith("sweep ", StringComparison.Ordinal) && c.Case.Name.Contains($"{name}=")).ToList();
        if (points.Count == 0) return null;
        var first = points[0];
        var ranges = first.Loads.Length > 0
            ? first.Loads.Select(l => Over(l.Load.Name, points.Select(p => p.Loads.FirstOrDefault(x => x.Load.Name == l.Load.Name)?.Voltage.Magnitude), "V"))
            : first.Supplies.Select(s => Over(s.Supply.Name, points.Select(p => p.Supplies.FirstOrDefault(x => x.Supply.Name == s.Supply.Name)?.Current.Magnitude), "A"));
        return $"{points.Count} points: {string.Join("; ", ranges)}";
    }

    private static string Over(string name, IEnumerable<double?> values, string unit)
    {
        var known = values.OfType<double>().ToList();
        return known.Count == 0 ? $"{name} unknown" : $"{name} {ResultText.Range(known.Min(), known.Max(), unit)}";
    }

    /// <summary>A let's value where it is computed; a plain literal says its value already.</summary>
    private static string? LetValue(Evaluation evaluation, StatementSyntax s, string? name)
    {
        if (s.Head.Value() is not { } value || value.Expression is NumberSyntax && value.Angle is null) return null;
        return name is not null && evaluation.Model.Lets.TryGetValue(name, out var q) ? "= " + QuantityText.Show(q) : null;
    }
}

using System.Collections.Immutable;
using WindingNotes.Model;
using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

/// <summary>What a hover shows: Markdown, and the range of the word it is about.</summary>
public sealed record HoverInfo(TextRange Range, string Markdown);

/// <summary>
/// Hover on a name shows its full result (a winding's sections, a core's flux, a node's voltage, a
/// supply's or load's powers, a fault's current); on a value, the value in other units; on a
/// keyword, what the statement or clause means. While a version is not solved, a name shows its
/// result in the last version that was, marked as that version's.
/// </summary>
public static class Hovers
{
    public static HoverInfo? At(Evaluation evaluation, Position position)
    {
        var text = evaluation.Text;
        var offset = text.GetOffset(position);
        if (evaluation.Model.Symbols.At(offset) is { } reference)
        {
            var range = text.GetRange(reference.Span);
            if (!evaluation.Solved && evaluation.LastSolved is { } last && last.Evaluation.Model.Symbols.Find(reference.Symbol.Name) is { } before)
                return new HoverInfo(range, $"{Symbol(last.Evaluation, before)}\n\n*results of version {last.Version}: this version has errors and is not solved*");
            return new HoverInfo(range, Symbol(evaluation, reference.Symbol));
        }
        var line = evaluation.Syntax.Lines.FirstOrDefault(l => l.Span.Touches(offset));
        if (line?.Statement is not { } statement) return null;
        if (Keyword(statement, offset) is { } keyword) return new HoverInfo(text.GetRange(keyword.Span), KeywordText(statement, keyword));
        var value = statement.Head.Values.Concat(statement.Clauses.SelectMany(c => c.Values)).FirstOrDefault(v => v.Span.Touches(offset));
        return value is null ? null : ValueText(evaluation, value) is { } markdown ? new HoverInfo(text.GetRange(value.Span), markdown) : null;
    }

    private static Token? Keyword(StatementSyntax s, int offset) =>
        new[] { s.Keyword }.Concat(s.Clauses.Select(c => c.Keyword).OfType<Token>()).FirstOrDefault(k => k.Span.Touches(offset));

    private static string KeywordText(StatementSyntax s, Token keyword)
    {
        if (keyword == s.Keyword) return $"**{s.Form.Keyword}**: {s.Form.Summary}\n\n`{s.Form.Example}`";
        var clause = s.Form.FindClause(keyword.Text);
        return $"**{keyword.Text}** ({s.Form.Keyword}): {clause?.Summary}";
    }

    private static string? ValueText(Evaluation evaluation, ValueSyntax value)
    {
        var lets = evaluation.Model.Lets;
        var evaluator = new ValueEvaluator(new DiagnosticBag(), t => lets.TryGetValue(t.Text, out var q) ? q : null, lets.ContainsKey, ImmutableDictionary<int, double>.Empty);
        if (evaluator.Evaluate(value, "") is not { } quantity) return null;
        var lines = new List<string> { $"`{evaluation.Text[value.Span]}` = {QuantityText.Show(quantity)}" };
        if (evaluator.Tolerances.FirstOrDefault() is { } tolerance)
            lines.Add($"± {TextReport.Percent(tolerance.Spread)}: {QuantityText.Show(quantity with { Value = quantity.Value * (1 - tolerance.Spread) })} to {QuantityText.Show(quantity with { Value = quantity.Value * (1 + tolerance.Spread) })}");
        if (QuantityText.InOtherUnits(quantity) is { Count: > 0 } others) lines.Add(string.Join(" · ", others));
        return string.Join("\n\n", lines);
    }

    private static string Symbol(Evaluation evaluation, Symbol symbol)
    {
        var lines = new List<string>();
        var network = evaluation.Network;
        var normal = evaluation.Normal;
        var model = evaluation.Model;
        switch (symbol.Kind)
        {
            case SymbolKind.Let:
                if (model.Lets.TryGetValue(symbol.Name, out var q))
                {
                    lines.Add(QuantityText.Show(q));
                    if (QuantityText.InOtherUnits(q) is { Count: > 0 } others) lines.Add(string.Join(" · ", others));
                }
                break;
            case SymbolKind.Core:
                if (model.Cores.FirstOrDefault(c => c.Name == symbol.Name) is { } core) lines.Add(CoreData(core));
                if (normal?.Cores.FirstOrDefault(c => c.Core.Name == symbol.Name) is { } k)
                {
                    lines.Add(ResultText.Core(k) + (k.Loss > 0 ? $", core loss {Numbers.Format(k.Loss, "W")}" : ""));
                }
                var windings = model.Windings.Where(w => w.Core == symbol.Name).Select(w => w.Name).ToList();
                if (windings.Count > 0) lines.Add("windings: " + string.Join(", ", windings));
                lines.AddRange(ThermalLines(evaluation.Thermal, symbol.Name));
                break;
            case SymbolKind.Winding:
                if (network?.Windings.FirstOrDefault(w => w.Name == symbol.Name) is { } wn) lines.Add(WindingData(wn));
                foreach (var s in normal?.Sections.Where(s => s.Winding.Name == symbol.Name) ?? []) lines.Add(SectionLine(s));
                foreach (var fault in evaluation.Cases.Where(c => c.Case.Fault is not null))
                    foreach (var s in fault.Sections.Where(s => s.Winding.Name == symbol.Name))
                        lines.Add($"in {fault.Case.Name}: {s.Section.FromPoint} to {s.Section.ToPoint} {TextReport.Phasor(s.Current, "A")}");
                lines.AddRange(FaultStudyText.DutyLines(evaluation, symbol.Name));
                break;
            case SymbolKind.Terminal or SymbolKind.Tap or SymbolKind.Brush or SymbolKind.Node:
                if (model.Taps.FirstOrDefault(t => t.Name == symbol.Name) is { } tap)
                    lines.Add($"on {tap.Winding} at {TapPosition(tap)}");
                if (normal is not null) lines.Add(TextReport.Phasor(normal.PointVoltage(symbol.Name), "V"));
                if (network is not null && network.Node(symbol.Name) is var n and >= 0)
                {
                    var node = network.Nodes[n];
                    var joined = node.Points.Where(p => p != symbol.Name).ToList();
                    if (joined.Count > 0) lines.Add("joined with " + string.Join(", ", joined));
                    if (node.IsEarth) lines.Add("grounded: the reference of the voltages");
                }
                break;
            case SymbolKind.Supply:
                if (normal?.Supplies.FirstOrDefault(s => s.Supply.Name == symbol.Name) is { } supply)
                {
                    lines.Add($"{TextReport.Phasor(supply.Voltage, "V")}, {TextReport.Phasor(supply.Current, "A")}");
                    lines.Add(TextReport.Powers(supply.Power));
                }
                break;
            case SymbolKind.Load:
                if (normal?.Loads.FirstOrDefault(l => l.Load.Name == symbol.Name) is { } load)
                {
                    lines.Add($"{TextReport.Phasor(load.Voltage, "V")}, {TextReport.Phasor(load.Current, "A")}");
                    lines.Add(TextReport.Powers(load.Power));
                    if (load.Regulation is { } r) lines.Add($"regulation {TextReport.Percent(r)}");
                }
                break;
            case SymbolKind.TapChanger:
                if (normal?.TapPositions.FirstOrDefault(t => t.Changer.Name == symbol.Name) is { } changer)
                {
                    lines.Add(ResultTable.TapText(changer));
                    if (changer.Regulation is { } r) lines.Add(ResultTable.RegulationText(r));
                }
                break;
            case SymbolKind.Fault:
                if (evaluation.Cases.FirstOrDefault(c => c.Case.Fault?.Name == symbol.Name) is { } faultCase)
                    lines.Add($"fault current {TextReport.Phasor(faultCase.Solution.FaultCurrent, "A")}");
                lines.AddRange(FaultStudyText.FaultLines(evaluation, symbol.Name));
                break;
        }
        lines.AddRange(ThreePhaseText.HoverLines(normal, symbol.Name));
        if (lines.Count == 0 && symbol.Kind != SymbolKind.Let) lines.Add("no results: the network was not solved");
        return $"**{symbol.Name}**: {symbol.Describe()}\n\n" + string.Join("\n", lines.Select(l => "- " + l));
    }

    /// <summary>A unit's day of load: its peaks, ageing and capabilities (the thermal line's hover, and its core's anywhere).</summary>
    private static IEnumerable<string> ThermalLines(ThermalResult? thermal, string core)
    {
        if (thermal?.Units.FirstOrDefault(u => u.Unit.Core == core) is not { } u) yield break;
        yield return $"load cycle: hot-spot up to {Numbers.Format(u.PeakHotSpot, "degC")} at {thermal.Clock(u.PeakHotSpotTime)} in '{u.HottestWinding}', "
            + $"{(u.Unit.Dry ? "winding average" : "top oil")} up to {Numbers.Format(u.PeakTopOil, "degC")} at {thermal.Clock(u.PeakTopOilTime)}";
        yield return $"loss of life {ThermalResult.Hours(u.LossOfLife)} a day (mean ageing {Numbers.Fixed(u.MeanAgeing)}, 1 at {Numbers.Format(ThermalEquations.AgeingReference(u.Unit), "degC")})"
            + (u.EquivalentAging is { } feqa ? $", FEQA {Numbers.Fixed(feqa)}, FAA up to {Numbers.Fixed(u.PeakAgingFactor!.Value)}" : "");
        foreach (var c in thermal.Capabilities.Where(c => c.Capability.Core == core))
            yield return $"capability ({c.Capability.KindWord}): " + (c.Value is { } v
                ? (c.Beyond ? "at least " : "") + ThermalCapability.Shown(thermal, c.Capability, v) + (c.Beyond ? "" : $", where the {ThermalCapability.Readable(c.Binding)} reaches {ThermalCapability.Measured(c.Binding, c.AtBinding)}")
                : $"unknown, {c.Problem}");
    }

    private static string CoreData(CoreModel core)
    {
        var parts = new List<string>();
        if (core.Rating is { } rating) parts.Add($"rating {Numbers.Format(rating, "VA")}");
        if (core.Area is { } area) parts.Add($"area {Numbers.Format(area * 1e4, "cm2")}");
        if (core.FluxLimit is { } limit) parts.Add($"flux limit {Numbers.Format(limit, "T")}");
        if (core.Frequency is { } hertz) parts.Add($"rated frequency {Numbers.Format(hertz, "Hz")}");
        return parts.Count == 0 ? "no rating, area or flux limit given" : string.Join(", ", parts);
    }

    private static string WindingData(WindingNet w)
    {
        var parts = new List<string> { $"{Numbers.Plain(w.Turns)} turns{(w.TurnsKnown ? "" : " (from the rated voltages)")}" };
        if (w.RatedVoltage is { } v) parts.Add($"rated {Numbers.Format(v, "V")}");
        if (w.RatedCurrent is { } i) parts.Add($"rated current {Numbers.Format(i, "A")}");
        if (w.Resistance > 0) parts.Add($"resistance {Numbers.Format(w.Resistance, "ohm")}");
        return string.Join(", ", parts);
    }

    private static string SectionLine(SectionResult s)
    {
        var text = $"{s.Section.FromPoint} to {s.Section.ToPoint}, {Numbers.Plain(s.Section.Turns)} turns: {TextReport.Phasor(s.Current, "A")}, {Numbers.Format(s.Apparent, "VA")}";
        if (s.Loading is { } loading) text += $", loading {TextReport.Percent(loading)}";
        if (s.Loss > 0) text += $", loss {Numbers.Format(s.Loss, "W")}";
        return text;
    }

    private static string TapPosition(TapModel tap) => tap.Unit switch
    {
        TapUnit.Turns => $"{Numbers.Plain(tap.Position)} turns",
        TapUnit.Fraction => TextReport.Percent(tap.Position),
        _ => Numbers.Format(tap.Position, "V"),
    };
}

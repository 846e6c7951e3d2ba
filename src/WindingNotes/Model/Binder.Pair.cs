using System.Collections.Immutable;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

// 'unit-pair': two like single-phase two-winding units declared once and placed on three lines by a
// connection word (open delta, Scott-T). It expands to the cores, windings, taps, joins and
// impedance lines the single-phase notation would have written, so the solver, the ratings and the
// cautions (open delta, no isolation, output above supply) see the units as written by hand.
internal sealed partial class BindRun
{
    /// <summary>The suffixes of a pair's two units: open delta's first and second unit, or a Scott-T's main and teaser.</summary>
    private static string[] PairUnits(StatementSyntax s) => s.Clause("scott-t") is null ? ["a", "b"] : ["m", "t"];

    /// <summary>The teaser's tap where 'teaser-tap' does not place it, as the trade gives it: 86.6 % of its winding (√3/2 to three figures).</summary>
    internal const double TeaserTap = 0.866;

    /// <summary>
    /// The names a pair gives, defined with the statement so any line may use them: a core and a
    /// primary and secondary winding for each unit (NAME_a, NAME_b or NAME_m, NAME_t), and for a
    /// Scott-T the main's centre tap P_mc, the teaser's tap P_tt and the teaser's far end P_t2.
    /// </summary>
    private void DeclarePair(StatementSyntax s)
    {
        if (s.Kind != StatementKind.Pair || rejected.Contains(s) || s.Head.Name(0) is not { } head) return;
        var units = PairUnits(s);
        declaredPairs[head.Text] = units;
        foreach (var unit in units) Derive($"{head.Text}_{unit}", SymbolKind.Core, head, s);
        foreach (var clause in new[] { s.Clause("primary-winding"), s.Clause("secondary-winding") })
        {
            if (clause?.Name(0) is not { } winding) continue;
            declaredPairs[winding.Text] = units;
            foreach (var unit in units) Derive($"{winding.Text}_{unit}", SymbolKind.Winding, winding, s);
        }
        if (s.Clause("scott-t") is null || s.Clause("primary-winding")?.Name(0) is not { } primary) return;
        foreach (var point in new[] { (primary.Text + "_mc", SymbolKind.Tap), (primary.Text + "_tt", SymbolKind.Tap), (primary.Text + "_t2", SymbolKind.Terminal) })
            if (Derive(point.Item1, point.Item2, primary, s) is { } symbol && !derivedPoints.Contains(symbol)) derivedPoints.Add(symbol);
    }

    /// <summary>A pair's name and its primary and secondary names, each with its units' suffixes: each stands for its two units' cores or windings.</summary>
    private readonly Dictionary<string, string[]> declaredPairs = new(StringComparer.Ordinal);

    /// <summary>
    /// A point a section of a pair's unit winding may end at: one the pair names (a line or output
    /// terminal, the Scott-T's taps and the teaser's far end), whose owner is the pair or its primary;
    /// that it is on this unit's winding the network builder checks.
    /// </summary>
    private bool IsPairPoint(Symbol point, Symbol winding) =>
        winding is { Derived: true, Owner: { } owner } && declaredPairs.ContainsKey(owner) && point.Owner is { } at
        && (at == owner || symbols.Find(at) is { Kind: SymbolKind.Core } pair && pair.StatementSpan == winding.StatementSpan);

    /// <summary>
    /// Whether a name is a pair's own or its primary's or secondary's, which stands for its two units'
    /// cores or windings; written where one is meant (given <paramref name="use"/>), an error that names them.
    /// </summary>
    private bool IsPairWhole(Symbol symbol, NameSyntax? use)
    {
        if (symbol.Kind is not (SymbolKind.Winding or SymbolKind.Core) || symbol.Derived || !declaredPairs.TryGetValue(symbol.Name, out var units)) return false;
        if (use is not null) diagnostics.ReportNameUnit(use.Name, symbol.Name, units);
        return true;
    }

    /// <summary>The units' windings a current or loading check of a pair's whole primary or secondary measures.</summary>
    private ImmutableArray<string>? PairPhases(Symbol symbol) =>
        symbol.Kind == SymbolKind.Winding && !symbol.Derived && declaredPairs.TryGetValue(symbol.Name, out var units)
            ? [.. units.Select(u => $"{symbol.Name}_{u}")]
            : null;

    private void BindPair(StatementSyntax s)
    {
        var head = s.Head.Name(0)!;
        var scott = s.Clause("scott-t");
        var connection = scott ?? s.Clause("open-delta");
        var output = s.Clause("delta-output") ?? s.Clause("series") ?? s.Clause("series-bucking") ?? s.Clause("main-output");
        var teaserSyntax = s.Value("teaser-tap");
        var teaser = Real(teaserSyntax, Dimension.None, "the teaser's tap", positive: true, ratio: true);
        var rating = Real(s.Value("rating"), Dimension.ApparentPower, $"the rating of {head.Text}", positive: true);
        var primary = s.Clause("primary-winding");
        var secondary = s.Clause("secondary-winding");
        var vp = Real(primary?.Value(0), Dimension.Voltage, $"the rated voltage of {primary?.Name(0)?.Text}", positive: true);
        var vs = Real(secondary?.Value(0), Dimension.Voltage, $"the rated voltage of {secondary?.Name(0)?.Text}", positive: true);
        var zSyntax = s.Value("impedance");
        var z = Value(zSyntax, $"the impedance of {head.Text}");
        var xr = Real(s.Value("xr"), Dimension.None, "the X/R ratio", positive: true);
        if (connection is null || output is null || primary?.Name(0) is not { } p || secondary?.Name(0) is not { } q) return;
        if ((scott is null) != (output.Keyword!.Text != "main-output"))
        {
            diagnostics.ReportPairOutput(output.Keyword!, scott is not null);
            return;
        }
        if (s.Clause("teaser-tap") is { } teaserClause && scott is null)
        {
            diagnostics.ReportOutOfBounds(teaserClause.Span, "'teaser-tap'", "left out of an open delta, which has no teaser: it places a Scott-T's teaser tap");
            return;
        }
        if (teaser is >= 1)
        {
            diagnostics.ReportOutOfBounds(teaserSyntax!.Span, "the teaser's tap", "below 100 % of the teaser winding: the tap joined to the main's centre lies between its ends");
            return;
        }
        if (z is { } zv && !(zv.Dimension == Dimension.Impedance || (zv.Dimension.IsNone && zv.IsPercent)))
        {
            diagnostics.ReportWrongDimension(zSyntax!.Span, "an impedance in %, pu or ohm", zv.Dimension);
            return;
        }
        if (z is { IsReal: false } && xr is not null)
        {
            diagnostics.ReportOutOfBounds(s.Clause("xr")!.Span, "'xr'", "left out when the impedance is complex");
            return;
        }
        if (rating is null || vp is null || vs is null) return;
        NodeRef At(NameSyntax n) => new(n.Text, n.Name.Span);
        var lines = Enumerable.Range(1, 3).Select(i => s.Head.Name(i)).OfType<NameSyntax>().Select(At).ToArray();
        var outs = output.Names.Select(At).ToArray();
        if (lines.Length < 3) return;
        var units = PairUnits(s);
        // Each unit's primary (from, to) and secondary (from, to).
        (NodeRef, NodeRef)[] primaries, secondaries;
        if (scott is null)
        {
            primaries = [(lines[0], lines[1]), (lines[2], lines[1])];
            // In series: from the output terminal to the line adds the unit's secondary voltage to the
            // line's (a boost); from the line to the output terminal takes it away (a buck).
            secondaries = output.Keyword!.Text switch
            {
                "series" => [(outs[0], lines[0]), (outs[1], lines[2])],
                "series-bucking" => [(lines[0], outs[0]), (lines[2], outs[1])],
                _ => [(outs[0], outs[1]), (outs[2], outs[1])],
            };
        }
        else
        {
            primaries = [(lines[0], lines[1]), (lines[2], new NodeRef(p.Text + "_t2", p.Name.Span))];
            secondaries = [(outs[0], outs[1]), (outs[2], outs[3])];
        }
        for (var k = 0; k < 2; k++)
        {
            var core = $"{head.Text}_{units[k]}";
            cores.Add(new CoreModel(core, head.Name.Span, s.Span) { Rating = rating });
            windings.Add(new WindingModel($"{p.Text}_{units[k]}", p.Name.Span, s.Span, core, primaries[k].Item1, primaries[k].Item2) { Rated = vp });
            windings.Add(new WindingModel($"{q.Text}_{units[k]}", q.Name.Span, s.Span, core, secondaries[k].Item1, secondaries[k].Item2) { Rated = vs });
            if (z is { } impedance)
                impedances.Add(new ImpedanceModel(new WindingPart($"{p.Text}_{units[k]}", null, null, p.Name.Span), new WindingPart($"{q.Text}_{units[k]}", null, null, q.Name.Span),
                    impedance.Value, impedance.Dimension.IsNone, xr, s.Span, zSyntax!.Span));
        }
        if (scott is null) return;
        // The main centre-tapped, the teaser on its 86.6 % tap or the one written, the two taps one point.
        taps.Add(new TapModel(p.Text + "_mc", p.Name.Span, s.Span, p.Text + "_m", 0.5, TapUnit.Fraction, false) { PositionSpan = scott.Span });
        taps.Add(new TapModel(p.Text + "_tt", p.Name.Span, s.Span, p.Text + "_t", teaser ?? TeaserTap, TapUnit.Fraction, false) { PositionSpan = teaserSyntax?.Span ?? scott.Span });
        joins.Add([new NodeRef(p.Text + "_tt", p.Name.Span), new NodeRef(p.Text + "_mc", p.Name.Span)]);
    }
}

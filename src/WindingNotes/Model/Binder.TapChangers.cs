using System.Collections.Immutable;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

// The tap-changer, find and 'expect position' lines.
internal sealed partial class BindRun
{
    private void BindTapChanger(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var winding = Resolve(s.Clause("on")?.Name(0), "a winding", SymbolKind.Winding);
        var let = Resolve(s.Clause("sets")?.Name(0), "a let", SymbolKind.Let);
        var range = s.Clause("positions");
        var low = WholeNumber(range?.Value(0), "the lowest position");
        var high = WholeNumber(range?.Value(1), "the highest position");
        var step = Value(s.Value("step"), $"the step of {name.Text}");
        var start = s.Value("at") is { } at ? WholeNumber(at, $"the position of {name.Text}") : 0;
        if (winding is null || let is null || low is null || high is null || step is null || start is null) return;
        if (low >= high)
        {
            diagnostics.ReportOutOfBounds(range!.Span, "the positions", "the lowest below the highest");
            return;
        }
        if (start < low || start > high)
        {
            // Without 'at' the start is position 0, which the range must then hold.
            diagnostics.ReportOutOfBounds(s.Value("at")?.Span ?? range!.Span, s.Value("at") is null ? $"the positions of {name.Text} (it starts at 0 unless 'at' says)" : $"the position of {name.Text}", $"from {low} to {high}");
            return;
        }
        if (lets.GetValueOrDefault(let.Name) is { } written && !written.Dimension.Fits(step.Value.Dimension))
        {
            diagnostics.ReportWrongDimension(s.Value("step")!.Span, $"{written.Dimension.Describe()} (as let {let.Name})", step.Value.Dimension);
            return;
        }
        var reversing = s.Clause("reversing") is not null;
        if (reversing && declaredThreePhase.Contains(winding.Name))
        {
            // A reversing switch reverses one winding; a three-phase regulator is three of them, one a phase.
            diagnostics.ReportNamePhase(s.Clause("on")!.Name(0)!.Name, winding.Name);
            return;
        }
        if (reversing && low > 0)
        {
            diagnostics.ReportOutOfBounds(range!.Span, "the positions of a reversing tap changer", "from a negative position to a positive one");
            return;
        }
        var onLoad = s.Clause("off-circuit") is null;
        var control = BindTapControl(s, name.Text, onLoad);
        if (control is false) return;
        var follows = s.Clause("follows")?.Name(0) is { } master ? Resolve(master, "a tap changer", SymbolKind.TapChanger) : null;
        if (s.Clause("follows") is not null && follows is null) return;
        if (follows is not null && (control is TapControlModel || follows.Name == name.Text))
        {
            diagnostics.ReportTapFollower(s.Clause("follows")!.Span, name.Text, follows.Name);
            return;
        }
        model = model with
        {
            TapChangers = model.TapChangers.Add(new TapChangerModel(name.Text, name.Name.Span, s.Span, winding.Name, let.Name, low.Value, high.Value, step.Value, onLoad, reversing, start.Value)
            {
                Control = control as TapControlModel,
                Follows = follows?.Name,
            }),
        };
    }

    /// <summary>The control clauses: a model, null where there is no control, false after a diagnostic.</summary>
    private object? BindTapControl(StatementSyntax s, string name, bool onLoad)
    {
        var regulate = s.Clause("regulate");
        string[] parts = ["target", "bandwidth", "pt-ratio", "compensation", "line-current", "ct"];
        if (regulate is null)
        {
            if (parts.FirstOrDefault(p => s.Clause(p) is not null) is { } stray)
            {
                diagnostics.ReportTapControlIncomplete(s.Clause(stray)!.Span, name, "'regulate' naming the nodes whose voltage it holds");
                return false;
            }
            return null;
        }
        if (!onLoad)
        {
            diagnostics.ReportTapControlOffCircuit(regulate.Span, name);
            return false;
        }
        if (s.Clause("target") is null || s.Clause("bandwidth") is null)
        {
            diagnostics.ReportTapControlIncomplete(regulate.Span, name, "a 'target' and a 'bandwidth'");
            return false;
        }
        var a = Observed(regulate.Name(0));
        var b = Observed(regulate.Name(1));
        var target = Real(s.Value("target"), Dimension.Voltage, $"the target of {name}", positive: true);
        var bandwidth = Real(s.Value("bandwidth"), Dimension.Voltage, $"the bandwidth of {name}", positive: true);
        var ratio = s.Value("pt-ratio") is { } r ? Real(r, Dimension.None, "the pt-ratio", positive: true) : 1;
        var comp = s.Clause("compensation");
        var rSet = comp is null ? 0 : Real(comp.Value(0), Dimension.Voltage, "the R setting");
        var xSet = comp is null ? 0 : Real(comp.Value(1), Dimension.Voltage, "the X setting");
        if (a is null || b is null || target is null || bandwidth is null || ratio is null || rSet is null || xSet is null) return false;
        NodeRef? line = null;
        double? ct = null;
        if (comp is not null)
        {
            if (s.Clause("line-current") is null || s.Clause("ct") is null)
            {
                diagnostics.ReportTapControlIncomplete(comp.Span, name, "the 'line-current' it compensates for and the 'ct' rating");
                return false;
            }
            var lineName = s.Clause("line-current")!.Name(0);
            if (Resolve(lineName, "a load, supply or winding", SymbolKind.Load, SymbolKind.Supply, SymbolKind.Winding) is not { } l) return false;
            line = new NodeRef(l.Name, lineName!.Name.Span);
            ct = Real(s.Value("ct"), Dimension.CurrentDim, "the ct rating", positive: true);
            if (ct is null) return false;
        }
        return new TapControlModel(new NodeRef(a.Name, regulate.Name(0)!.Name.Span), new NodeRef(b.Name, regulate.Name(1)!.Name.Span),
            target.Value, bandwidth.Value, ratio.Value, new System.Numerics.Complex(rSet.Value, xSet.Value), line, ct);
    }

    /// <summary>A whole number, or null after a diagnostic.</summary>
    private int? WholeNumber(ValueSyntax? value, string what)
    {
        if (Real(value, Dimension.None, what) is not { } x) return null;
        if (x != Math.Floor(x) || Math.Abs(x) > 1000)
        {
            diagnostics.ReportOutOfBounds(value!.Span, what, "a whole number from -1000 to 1000");
            return null;
        }
        return (int)x;
    }

    private void BindFind(StatementSyntax s)
    {
        if (!Once(s)) return;
        var let = Resolve(s.Head.Name(0), "a let", SymbolKind.Let);
        var measureClause = s.Clauses.FirstOrDefault(c => c.Form?.Group == "measure");
        var range = s.Clause("from");
        if (let is null || measureClause is null || range is null) return;
        if (measureClause.Keyword!.Text == "vector-group")
        {
            diagnostics.ReportFindMeasure(measureClause.Span);
            return;
        }
        var measure = Enum.Parse<MeasureKind>(measureClause.Keyword.Text, ignoreCase: true);
        var targets = ImmutableArray.CreateBuilder<NodeRef>();
        var names = measureClause.Names.ToList();
        for (var i = 0; i < names.Count; i++)
        {
            var isPoint = measure == MeasureKind.Voltage || i > 0;
            var symbol = isPoint ? Observed(names[i]) : Resolve(names[i], names[i].Role.Label, names[i].Role.Kinds);
            if (symbol is null) return;
            targets.Add(new NodeRef(symbol.Name, names[i].Name.Span));
        }
        var (dimension, unit) = MeasureUnit(measure);
        var target = Real(s.Value("equals"), dimension, $"the target of {measureClause.Keyword.Text}", ratio: unit == "%");
        var low = Value(range.Value(0), "the lower bound of the search");
        var high = Value(range.Value(1), "the upper bound of the search");
        if (target is null || low is null || high is null) return;
        var written = lets.GetValueOrDefault(let.Name);
        foreach (var (bound, syntax) in new[] { (low.Value, range.Value(0)!), (high.Value, range.Value(1)!) })
        {
            if (!bound.IsReal || (written is { } w && (!w.Dimension.Fits(bound.Dimension) || w.IsPercent != bound.IsPercent)))
            {
                diagnostics.ReportWrongDimension(syntax.Span, written is { } ww ? $"{ww.Dimension.Describe()} (as let {let.Name})" : "a real value", bound.Dimension);
                return;
            }
        }
        if (low.Value.Real >= high.Value.Real)
        {
            diagnostics.ReportOutOfBounds(range.Span, "the range searched", "the lower bound below the upper");
            return;
        }
        var expect = new ExpectModel(s.Span, tree.Text[s.Span], measure, targets.ToImmutable(), ConditionKind.Near, target.Value, target.Value, unit)
        {
            Target = target.Value,
            MeasureText = tree.Text[measureClause.Span],
            ConditionText = $"equals {tree.Text[s.Value("equals")!.Span]}",
        };
        model = model with { Find = new FindModel(s.Span, let.Name, expect, target.Value, low.Value, high.Value) };
    }

    private static (Dimension Dimension, string Unit) MeasureUnit(MeasureKind measure) => measure switch
    {
        MeasureKind.Voltage => (Dimension.Voltage, "V"),
        MeasureKind.Current => (Dimension.CurrentDim, "A"),
        MeasureKind.Flux => (Dimension.FluxDensity, "T"),
        MeasureKind.Power => (Dimension.ActivePower, "W"),
        MeasureKind.Position => (Dimension.None, ""),
        _ => (Dimension.None, "%"),
    };

    /// <summary>'expect position TC between -10 and 10' (bare whole positions), or 'clear-of-limits'.</summary>
    private void BindPositionExpect(StatementSyntax s, ClauseSyntax measureClause, ClauseSyntax conditionClause)
    {
        var nameSyntax = measureClause.Name(0);
        if (Resolve(nameSyntax, "a tap changer", SymbolKind.TapChanger) is not { } changer) return;
        double low = double.NegativeInfinity, high = double.PositiveInfinity, target = double.NaN;
        const string what = "a bound on position";
        switch (conditionClause.Keyword!.Text)
        {
            case "clear-of-limits":
                // The range is known once the tap-changer line is bound; the check reads it there.
                (low, high) = (double.NaN, double.NaN);
                break;
            case "between":
                if (Real(conditionClause.Value(0), Dimension.None, what) is not { } lo || Real(conditionClause.Value(1), Dimension.None, what) is not { } hi) return;
                (low, high) = (Math.Min(lo, hi), Math.Max(lo, hi));
                break;
            case "below":
                if (Real(conditionClause.Value(0), Dimension.None, what) is not { } below) return;
                high = below;
                break;
            case "above":
                if (Real(conditionClause.Value(0), Dimension.None, what) is not { } above) return;
                low = above;
                break;
            case "near":
                if (Real(conditionClause.Value(0), Dimension.None, what) is not { } near || Real(conditionClause.Value(1), Dimension.None, what) is not { } within) return;
                (low, high, target) = (near - Math.Abs(within), near + Math.Abs(within), near);
                break;
            default:
                diagnostics.ReportPositionCondition(conditionClause.Span);
                return;
        }
        if (conditionClause.Keyword.Text != "clear-of-limits" && conditionClause.Values.Any(v => Value(v, what) is { IsBare: false }))
        {
            diagnostics.ReportPositionCondition(conditionClause.Span);
            return;
        }
        expects.Add(new ExpectModel(s.Span, tree.Text[s.Span], MeasureKind.Position, [new NodeRef(changer.Name, nameSyntax!.Name.Span)],
            conditionClause.Keyword.Text == "near" ? ConditionKind.Near : ConditionKind.Between, low, high, ExpectModel.PositionUnit)
        {
            Target = target,
            MeasureText = tree.Text[measureClause.Span],
            ConditionText = tree.Text[conditionClause.Span],
        });
    }
}

using System.Collections.Immutable;
using WindingNotes.Syntax;
using Phasor = System.Numerics.Complex;

namespace WindingNotes.Model;

/// <summary>'ground N impedance Z': a node earthed through a neutral-grounding resistor or reactor (Grounding.cs).</summary>
internal sealed partial class BindRun
{
    private readonly ImmutableArray<GroundingModel>.Builder groundings = ImmutableArray.CreateBuilder<GroundingModel>();

    /// <summary>The element and earth point of a grounding impedance, named with the line so other lines (an 'expect') may use them.</summary>
    private void DeclareGrounding(StatementSyntax s)
    {
        if (s.Kind != StatementKind.Ground || s.Clause("impedance") is null || rejected.Contains(s) || s.Head.Name(0) is not { } node) return;
        var (element, earth) = GroundingModel.Names(node.Text);
        // A second impedance on the node would be a second element of the same name: one line grounds it.
        if (symbols.Find(element) is { Derived: true, Kind: SymbolKind.Supply } first)
        {
            diagnostics.ReportGroundedTwice(node.Name, first.Span);
            rejected.Add(s);
            return;
        }
        Derive(element, SymbolKind.Supply, node, s);
        Derive(earth, SymbolKind.Node, node, s);
    }

    private void BindGround(StatementSyntax s)
    {
        var name = s.Head.Name(0);
        var node = Node(name, s);
        if (s.Clause("impedance") is null)
        {
            foreach (var clause in new[] { s.Clause("rated-current"), s.Clause("time-rating") }.OfType<ClauseSyntax>())
                diagnostics.ReportOutOfBounds(clause.Span, $"the '{clause.Keyword!.Text}' of a ground", "given with 'impedance': a solid ground has no rating of its own");
            if (node is not null) grounds.Add(node);
            return;
        }
        var z = Complex(s.Value("impedance"), Dimension.Impedance, "the grounding impedance");
        var rated = Real(s.Value("rated-current"), Dimension.CurrentDim, "the rated current of the grounding impedance", positive: true);
        var time = Real(s.Value("time-rating"), Dimension.TimeDim, "the time rating of the grounding impedance", positive: true);
        if (z is { } bad && (bad.Real < 0 || bad == Phasor.Zero))
        {
            diagnostics.ReportOutOfBounds(s.Value("impedance")!.Span, "a grounding impedance", "above zero, with a resistance of zero or more (a solid ground is 'ground N' alone)");
            return;
        }
        if (node is null || z is not { } zg) return;
        var (element, earthName) = GroundingModel.Names(node.Name);
        var earth = MadePoint(earthName, name!);
        grounds.Add(earth);
        supplies.Add(new SupplyModel(element, name!.Name.Span, s.Span, node, earth, Phasor.Zero) { Impedance = zg, Grounding = true });
        groundings.Add(new GroundingModel(node, element, earthName, s.Span, zg) { RatedCurrent = rated, TimeRating = time });
    }
}

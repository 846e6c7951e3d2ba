using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// Cautions the trade gives, as information where they apply and nowhere else, each with its
/// source: no isolation in an autotransformer connection, the common terminal, fusing the output of
/// a variable autotransformer, an output above the supply, and the duty of each fault.
/// </summary>
public static class SafetyCautions
{
    /// <summary>
    /// <paramref name="cases"/>: the cases kept (the normal case, the fault cases, sweep points);
    /// <paramref name="outputs"/> has seen every operating point, kept or not.
    /// </summary>
    public static void Report(Network network, IReadOnlyList<CaseResult> cases, OutputTally outputs, DiagnosticBag diagnostics)
    {
        var model = network.Model;
        var connections = outputs.Connections;
        var warned = new HashSet<string>(StringComparer.Ordinal);
        foreach (var c in connections)
        {
            var load = c.Load.Source;
            // One caution a statement: a three-phase load's phases share its line, and are named by it.
            if (warned.Add($"isolation/{load.NameSpan.Start}"))
                diagnostics.ReportNoIsolation(load.NameSpan, StatementName(model, load.Line, load.Name), StatementName(model, c.Supply.Source.Line, c.Supply.Name));
            foreach (var node in c.IsPhaseElement(model) ? [] : c.Common)
            {
                var end = network.Node(load.A.Name) == node ? load.A : load.B;
                if (warned.Add($"{load.Name}/{end.Name}")) diagnostics.ReportCommonTerminal(end.Span, end.Name, node == network.EarthNode);
            }
        }
        var wound = network.Windings.Select(w => w.Name).ToHashSet(StringComparer.Ordinal);
        var brushes = model.Taps.Where(t => t.IsBrush).DistinctBy(t => t.Name).ToDictionary(t => t.Name, StringComparer.Ordinal);
        foreach (var brush in model.Taps.Where(t => t.IsBrush && wound.Contains(t.Winding)))
            diagnostics.ReportFuseOutput(brush.NameSpan, brush.Name);

        foreach (var (c, highest) in connections.Zip(outputs.Highest))
        {
            var load = c.Load.Source;
            // The output is compared with the voltage between the supply points it is fed from, line
            // to line for a delta load on a three-phase boost: that holds for phase elements too. One
            // caution a statement: a three-phase load's phases share its line.
            if (highest.Ratio <= 1 + 1e-6) continue;
            // Where the output hangs on a brush, the brush's line is where the setting is made.
            var brush = new[] { load.A.Name, load.B.Name }.Select(brushes.GetValueOrDefault).OfType<TapModel>().MinBy(t => t.NameSpan.Start);
            if (warned.Add($"above/{load.NameSpan.Start}"))
                diagnostics.ReportAboveSupply(brush?.NameSpan ?? load.NameSpan, load.Name, highest.Load, outputs.Source(c), highest.Supply, highest.Where);
        }

        OpenDelta.Report(network, cases.FirstOrDefault(x => x.Case == CaseSpec.Normal), diagnostics);
        foreach (var f in cases.Select(x => x.Fault).OfType<FaultResult>())
            diagnostics.ReportFaultDuty(f.Fault.NameSpan, f.Fault.Name, f.Current.Magnitude, f.Peak, f.WorstMultiple, f.WorstWinding);
    }

    /// <summary>The name of the statement a supply or load is written in: a three-phase one's, for each of its phases.</summary>
    private static string StatementName(Model.Model model, TextSpan line, string name) =>
        model.ThreePhase.Loads.FirstOrDefault(l => l.Line.Start == line.Start)?.Name
        ?? model.ThreePhase.Supplies.FirstOrDefault(s => s.Line.Start == line.Start)?.Name
        ?? name;
}

/// <summary>
/// The highest output against supply of each autotransformer connection, over every operating point
/// (the normal case and each sweep point) as it is solved: a long sweep keeps only some of its points.
/// Like is compared with like: the load's voltage with the voltage between the two supply points its
/// terminals are fed from (a 264 V output across two 120 V legs is compared with the 240 V between them).
/// </summary>
public sealed class OutputTally(Network network)
{
    public IReadOnlyList<Connection> Connections { get; } = Solve.Connections.Find(network);

    public List<(double Ratio, double Load, double Supply, string Where)> Highest { get; } = [];

    public void Observe(CaseResult x)
    {
        if (Highest.Count == 0) Highest.AddRange(Connections.Select(_ => (0.0, 0.0, 0.0, "")));
        for (var i = 0; i < Connections.Count; i++)
        {
            var c = Connections[i];
            var vl = x.Loads[c.Load.Index].Voltage.Magnitude;
            var vs = x.Solution.HasVectors
                ? (x.Solution.Voltage(c.FedFrom.A) - x.Solution.Voltage(c.FedFrom.B)).Magnitude
                : x.Supplies[c.Supply.Index].Voltage.Magnitude;
            if (vs > 0 && vl / vs > Highest[i].Ratio) Highest[i] = (vl / vs, vl, vs, x.Case.Where == "as written" ? "" : $"at {x.Case.Where}");
        }
    }

    /// <summary>What the output was compared with, for the message: the supply, or the two points between which it was measured.</summary>
    public string Source(Connection c)
    {
        var (a, b) = c.FedFrom;
        var s = c.Supply;
        return (a, b) == (s.NodeP, s.NodeQ) || (a, b) == (s.NodeQ, s.NodeP)
            ? $"of supply '{s.Name}'"
            : $"between {PointName(a)} and {PointName(b)}";
    }

    /// <summary>A supply point as the first source that ends there names it (earth is no supply point of a neutral impedance).</summary>
    private string PointName(int node)
    {
        pointNames ??= network.Supplies.Where(s => s.Source.IsSource).SelectMany(s => new[] { (s.NodeP, s.Source.Positive.Name), (s.NodeQ, s.Source.Negative.Name) })
            .DistinctBy(p => p.Item1).ToDictionary(p => p.Item1, p => p.Item2);
        return pointNames.GetValueOrDefault(node) ?? network.Nodes[node].Name;
    }

    private Dictionary<int, string>? pointNames;
}

using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// Two single-phase units whose windings bridge two of the three line pairs of a three-phase supply
/// or load are an open delta. Such a pair transforms √3 times one unit's rating: 86.6 % of the pair's
/// two ratings, 57.7 % of a closed bank of three (R32, any machines textbook). Said as a caution, and
/// as a warning where the normal case loads a winding of the pair past its rated current.
/// </summary>
public static class OpenDelta
{
    public static void Report(Network network, CaseResult? normal, DiagnosticBag diagnostics)
    {
        var three = network.Model.ThreePhase;
        if (three.Supplies.IsEmpty && three.Loads.IsEmpty) return;
        var limbs = three.Cores.SelectMany(c => c.Limbs).ToHashSet(StringComparer.Ordinal);
        // Indexed once by the node each winding starts at, so a file of many units stays linear.
        var startingAt = network.Windings
            .Where(w => w.Core >= 0 && !limbs.Contains(network.Cores[w.Core].Name))
            .ToLookup(w => network.Node(w.Source.From.Name));
        var sectionsOf = (normal?.Sections ?? []).ToLookup(s => s.Section.Core);
        var sets = three.Supplies.Select(s => (s.Name, s.LineTerminals)).Concat(three.Loads.Select(l => (l.Name, l.LineTerminals)));
        var said = new HashSet<string>(StringComparer.Ordinal);
        foreach (var (name, terminals) in sets)
        {
            var lines = terminals.Select(t => network.Node(t.Name)).ToArray();
            // Each single-phase core with a winding across two different lines of the set, and the pair it bridges.
            var bridges = lines.Distinct().SelectMany(n => startingAt[n])
                .Select(w => (w.Core, Pair: Pair(lines, network.Node(w.Source.From.Name), network.Node(w.Source.To.Name))))
                .Where(b => b.Pair >= 0)
                .GroupBy(b => b.Core)
                .Select(g => (Core: g.Key, Pairs: g.Select(b => b.Pair).Distinct().ToList()))
                .Where(b => b.Pairs.Count == 1)
                .ToList();
            if (bridges.Count != 2 || bridges[0].Pairs[0] == bridges[1].Pairs[0]) continue;
            var cores = bridges.Select(b => network.Cores[b.Core]).ToList();
            if (!said.Add(string.Join(",", cores.Select(c => c.Name)))) continue;
            var over = cores.SelectMany(c => sectionsOf[c.Index]).Where(s => s.Loading > 1 + 1e-9).MaxBy(s => s.Loading);
            diagnostics.ReportOpenDelta(cores[0].Source.NameSpan, cores[0].Name, cores[1].Name, name, over?.Winding.Name, over?.Loading);
        }
    }

    /// <summary>Which line pair (0 ab, 1 bc, 2 ca) a winding from node a to node b bridges, or −1.</summary>
    private static int Pair(int[] lines, int a, int b)
    {
        var (i, j) = (Array.IndexOf(lines, a), Array.IndexOf(lines, b));
        if (i < 0 || j < 0 || i == j) return -1;
        return (Math.Min(i, j), Math.Max(i, j)) switch { (0, 1) => 0, (1, 2) => 1, _ => 2 };
    }
}

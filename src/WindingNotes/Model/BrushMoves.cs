namespace WindingNotes.Model;

/// <summary>
/// A built network with brushes moved, without binding and building it again. Where each moved brush
/// stays strictly between the same two neighbours on its winding and inside one leakage member, only
/// the turns of the two sections beside it change (computed from the positions as the builder
/// computes them), and its core's matrix follows from them by the core's <see cref="SectionCoupling"/>.
/// Anything else (a brush that reaches or passes a tap, bounds a member, leaves its winding) is null,
/// and the caller binds and builds afresh, so the builder stays the one place that reports.
/// </summary>
public static class BrushMoves
{
    public static Network? Move(Network network, IReadOnlyDictionary<string, Quantity> positions)
    {
        var taps = network.Model.Taps.ToBuilder();
        var sections = network.Sections.ToBuilder();
        var cores = new HashSet<int>();
        foreach (var (name, value) in positions)
        {
            var index = IndexOfBrush(taps, name);
            if (index < 0 || BindRun.Place(value) is not { } place) return null;
            var tap = taps[index] = taps[index] with { Position = place.Position, Unit = place.Unit };
            // A brush on a winding the builder left out (its core is unknown) has nothing to move on.
            if (network.Windings.FirstOrDefault(x => x.Name == tap.Winding) is not { } w) return null;
            var turns = NetworkBuilder.Turns(tap, w);
            if (double.IsNaN(turns) || !NetworkBuilder.OnWinding(turns, w)) return null;
            turns = Math.Clamp(turns, 0, w.Turns);
            var before = Find(sections, w.Index, s => s.ToPoint == name);
            var after = Find(sections, w.Index, s => s.FromPoint == name);
            if (before < 0 || after < 0) return null;
            var (a, b) = (Position(sections[before].FromPoint, w, taps), Position(sections[after].ToPoint, w, taps));
            var core = network.Cores[w.Core];
            if (!(a < turns && turns < b) || core.Coupling is not { } coupling
                || coupling.MemberOf[core.Sections.IndexOf(before)] != coupling.MemberOf[core.Sections.IndexOf(after)]) return null;
            sections[before] = sections[before] with { Turns = turns - a };
            sections[after] = sections[after] with { Turns = b - turns };
            cores.Add(w.Core);
        }
        var built = network.Cores.ToBuilder();
        foreach (var c in cores)
        {
            var core = built[c];
            var turns = new double[core.Sections.Length];
            var changed = new bool[turns.Length];
            for (var p = 0; p < turns.Length; p++)
            {
                turns[p] = sections[core.Sections[p]].Turns;
                changed[p] = turns[p] != network.Sections[core.Sections[p]].Turns;
            }
            // Only the moved sections' rows and columns are computed again (SectionCoupling.Matrix, the same numbers).
            built[c] = core with { Impedance = core.Coupling!.Matrix(turns, core.Impedance, changed) };
        }
        return network with { Model = network.Model with { Taps = taps.ToImmutable() }, Sections = sections.ToImmutable(), Cores = built.ToImmutable() };
    }

    private static int IndexOfBrush(IList<TapModel> taps, string name)
    {
        for (var i = 0; i < taps.Count; i++)
            if (taps[i].Name == name && taps[i].IsBrush) return i;
        return -1;
    }

    private static int Find(IList<Section> sections, int winding, Func<Section, bool> match)
    {
        for (var k = 0; k < sections.Count; k++)
            if (sections[k].Winding == winding && match(sections[k])) return k;
        return -1;
    }

    /// <summary>A point's place on the winding in turns, as the builder places it.</summary>
    private static double Position(string point, WindingNet w, IList<TapModel> taps)
    {
        if (point == w.Source.From.Name) return 0;
        if (point == w.Source.To.Name) return w.Turns;
        var tap = taps.First(t => t.Name == point && t.Winding == w.Name);
        return Math.Clamp(NetworkBuilder.Turns(tap, w), 0, w.Turns);
    }
}

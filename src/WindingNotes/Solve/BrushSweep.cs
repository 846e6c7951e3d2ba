using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// Sweep points that move only brushes, without binding, building and factoring each afresh. A point
/// solved the general way whose network solved cleanly becomes the base; the points after it move
/// its brushes on the built network (<see cref="BrushMoves"/>) and solve by a low-rank update of the
/// base's factors (<see cref="LowRankUpdate"/>), loaded and without loads. Whatever that cannot do
/// exactly falls back: a move the builder must see goes the general way (and makes a new base), an
/// update that is refused is a full solve of the moved network. The diagnostics of a point are then
/// the base's, which depend on the brush only where the move would have been refused.
/// </summary>
internal sealed class BrushSweep(SyntaxTree syntax, Model.Model model)
{
    private Base? current;

    /// <summary>How many points were solved by moving brushes on a base (for tests: the path is taken).</summary>
    public int Moved { get; private set; }

    /// <summary>Whether the overrides move only brushes, the one change this path knows.</summary>
    public bool Covers(BindOverrides overrides) =>
        overrides.Deviations.IsEmpty && overrides.Values.Keys.All(brushes.Contains);

    /// <summary>The names of the model's brushes, found once for every point.</summary>
    private readonly HashSet<string> brushes = [.. model.Taps.Where(t => t.IsBrush).Select(t => t.Name)];

    public PointResult Solve(BindOverrides overrides, CaseSpec spec, CancellationToken cancel)
    {
        if (current is { } b && BrushMoves.Move(b.Network, overrides.Values) is { } moved)
        {
            var point = Points.Solve(moved, spec, withFaults: false, c => b.Solve(moved, c, cancel), cancel);
            Moved++;
            // Most bases have no message of their own: the point is then given as solved, not copied.
            return b.Diagnostics.IsEmpty ? point : point with { Diagnostics = [.. b.Diagnostics, .. point.Diagnostics] };
        }
        var general = Points.Solve(syntax, overrides, spec, withFaults: false, cancel);
        current = Base.Of(general);
        return general;
    }

    /// <summary>A network solved the general way with no message from its solves, and its factors, loaded and without loads.</summary>
    private sealed class Base(Network network, ImmutableArray<Diagnostic> diagnostics)
    {
        private readonly Dictionary<bool, KeptFactors> updates = [];

        public Network Network => network;

        /// <summary>The model's and the builder's messages, which every moved point shares.</summary>
        public ImmutableArray<Diagnostic> Diagnostics => diagnostics;

        public static Base? Of(PointResult p)
        {
            if (p.Case is not { } c || !c.Solution.Diagnostics.IsEmpty || p.NoLoadSolution is { } n && !n.Diagnostics.IsEmpty) return null;
            if (c.Solution.Network.Loads.Length > 0 && p.NoLoadSolution is null) return null;
            return new Base(c.Solution.Network, p.Diagnostics);
        }

        public Solution Solve(Network moved, CaseSpec spec, CancellationToken cancel)
        {
            cancel.ThrowIfCancellationRequested();
            if (!updates.TryGetValue(spec.WithoutLoads, out var kept)) updates[spec.WithoutLoads] = kept = KeptFactors.Of(network, spec);
            return kept.Solve(moved, spec, m => Changed(m, moved)) ?? NetworkSolver.Solve(moved, spec, cancel);
        }

        /// <summary>The unknowns whose rows and columns a move can change: the sections whose turns differ, and their cores.</summary>
        private int[] Changed(MnaSystem m, Network moved)
        {
            var changed = new List<int>(4);
            foreach (var (k, column) in m.SectionColumn)
                if (moved.Sections[k].Turns != network.Sections[k].Turns)
                {
                    changed.Add(column);
                    changed.Add(m.CoreColumn[moved.Sections[k].Core]);
                }
            changed.Sort();
            // In increasing order, each once.
            var distinct = 0;
            for (var i = 0; i < changed.Count; i++)
                if (i == 0 || changed[i] != changed[distinct - 1]) changed[distinct++] = changed[i];
            return [.. changed.Take(distinct)];
        }
    }
}

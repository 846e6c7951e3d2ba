using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>
/// The factors of one case of a network, kept to solve networks of the same wiring whose numbers
/// differ only in the rows and columns of a few unknowns (a moved brush, loads scaled): each part by
/// a low-rank update of its factors (<see cref="LowRankUpdate"/>). Null where that is not exact to
/// rounding (Newton's loads, poor conditioning, an update refused): the caller then solves in full.
/// </summary>
internal sealed class KeptFactors
{
    private readonly List<LowRankUpdate>? parts;

    private KeptFactors(List<LowRankUpdate>? parts) => this.parts = parts;

    /// <summary>The factors of every part of <paramref name="network"/> with a source in case <paramref name="spec"/>.</summary>
    public static KeptFactors Of(Network network, CaseSpec spec)
    {
        var reference = Islands.References(network, []);
        var parts = new List<LowRankUpdate>();
        foreach (var group in SolveGroup.Find(network, spec).Where(g => g.Supplies.Count > 0))
        {
            if (LowRankUpdate.Of(MnaSystem.Assemble(network, group, reference, spec)) is not { } u) return new KeptFactors(null);
            parts.Add(u);
        }
        return new KeptFactors(parts);
    }

    /// <summary>
    /// The solution of <paramref name="changed"/> in case <paramref name="spec"/> (the factored case
    /// by another name), where each part's matrix differs only in the unknowns <paramref name="columns"/> gives; null where refused.
    /// </summary>
    public Solution? Solve(Network changed, CaseSpec spec, Func<MnaSystem, int[]> columns)
    {
        if (parts is null) return null;
        var solved = new List<(MnaSystem, Complex[])>(parts.Count);
        foreach (var part in parts)
        {
            if (part.Solve(changed, columns(part.System)) is not { } x) return null;
            // The first system's layout and loads are the changed one's: only numbers differ.
            solved.Add((part.System, x));
        }
        return NetworkSolver.Collect(changed, spec, solved, true, []);
    }
}

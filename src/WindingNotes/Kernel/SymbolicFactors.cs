namespace WindingNotes.Kernel;

/// <summary>
/// Sparse factorisations kept, by the nonzero pattern of their matrices, so that a system of a shape
/// already factored (a tolerance sample, a sweep point or a load cycle's step: the same network with
/// other numbers) is factored again by <see cref="SparseLu.Refactor"/> on the kept pivot order and fill
/// instead of a fresh Markowitz search. A refactorisation that fails its pivot check, or the
/// solver's (<see cref="SparseFactors.Sound"/>), is a fresh factorisation, which is kept in its place. Not shared between threads: one per study's run of points.
/// </summary>
internal sealed class SymbolicFactors
{
    /// <summary>How many shapes are kept (a point's parts and cases: loaded, without loads, faults); the oldest goes first.</summary>
    private const int Shapes = 16;

    private readonly List<(SparseRows Pattern, SparseLu Lu)> kept = [];

    /// <summary>How many factorisations were refactorisations (for tests: the path is taken).</summary>
    public int Refactored { get; private set; }

    /// <summary>How many systems of a kept pattern were factored afresh: the refactorisation failed its pivot check or the solver's (for tests).</summary>
    public int FellBack { get; private set; }

    /// <summary>The LU of <paramref name="m"/>, refactored on the kept one of its pattern where that passes its pivot check.</summary>
    public (SparseLu Lu, bool Refactored) Factor(SparseRows m)
    {
        var at = kept.FindIndex(k => SparseLu.SamePattern(k.Pattern, m));
        if (at >= 0 && kept[at].Lu.Refactor(m) is { } lu)
        {
            Refactored++;
            return (lu, true);
        }
        return (Refresh(m), false);
    }

    /// <summary>A fresh factorisation of <paramref name="m"/>, kept for its pattern in place of one that failed.</summary>
    public SparseLu Refresh(SparseRows m)
    {
        var fresh = SparseLu.Factor(m);
        var at = kept.FindIndex(k => SparseLu.SamePattern(k.Pattern, m));
        if (at >= 0)
        {
            FellBack++;
            kept[at] = (m, fresh);
            return fresh;
        }
        if (kept.Count == Shapes) kept.RemoveAt(0);
        kept.Add((m, fresh));
        return fresh;
    }
}

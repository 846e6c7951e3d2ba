using Complex = System.Numerics.Complex;

namespace WindingNotes.Kernel;

/// <summary>
/// Sparse LU of an equilibrated matrix. Its weakest direction comes from inverse iteration on the
/// factors instead of an SVD, whose cost grows with the cube of the size: iterating v ← (AᴴA)⁻¹·v
/// turns v towards the right singular vector of the smallest singular value σ, Aᴴ⁻¹·v then points
/// along the left one, and power iteration on AᴴA gives the largest. On a singular matrix the first
/// step already lands in the null space.
/// </summary>
internal sealed class SparseFactors : IFactors
{
    private const int InverseSteps = 4;
    private const int PowerSteps = 12;

    private readonly SparseRows m;
    private readonly SparseLu lu;

    /// <summary>A refactorisation's solve must leave no more than this relative residual (fresh factorisations of networks leave about 1e-16).</summary>
    private const double RefactoredResidual = 1e-12;

    private SparseFactors(SparseRows m, SymbolicFactors? kept, bool afresh)
    {
        this.m = m;
        (lu, Refactored) = kept is null ? (SparseLu.Factor(m), false) : afresh ? (kept.Refresh(m), false) : kept.Factor(m);
    }

    /// <summary>
    /// The factors of the scaled matrix; with <paramref name="kept"/>, a refactorisation where it holds
    /// one of the same pattern that passes its pivot check, unless <paramref name="afresh"/>.
    /// </summary>
    public static SparseFactors Of(SystemMatrix a, double[] rowScale, double[] columnScale, SymbolicFactors? kept = null, bool afresh = false) =>
        new(SparseRows.Of(a, rowScale, columnScale), kept, afresh);

    /// <summary>Whether the factors came from a kept pivot order (<see cref="SparseLu.Refactor"/>).</summary>
    public bool Refactored { get; }

    /// <summary>
    /// A refactorisation's pivots must spread less than this many times the ratio at which the solver
    /// looks for the weakest direction: other pivots of the same matrix spread otherwise, so a
    /// system near that line is factored afresh and judged as the full solve judges it.
    /// </summary>
    private const double PivotMargin = 100;

    /// <summary>
    /// Whether these factors solve <paramref name="b"/> as a fresh factorisation would: pivots whose
    /// spread is well clear of calling for the weakest direction, and a residual to rounding. The
    /// pivot check of <see cref="SparseLu.Refactor"/> bounds the growth; this catches what it lets through.
    /// </summary>
    /// <param name="x">The solution the check found, and <paramref name="residual"/> its relative residual: where sound, the solve's own (the solver does not solve again).</param>
    public bool Sound(Complex[] b, out Complex[]? x, out double residual)
    {
        (x, residual) = (null, double.NaN);
        if (!(SmallestPivot > PivotMargin * LinearSolver.PivotRatio * LargestPivot)) return false;
        x = lu.Solve(b);
        residual = RelativeResidual(x, b);
        return residual <= RefactoredResidual;
    }

    public double SmallestPivot => lu.SmallestPivot;
    public double LargestPivot => lu.LargestPivot;

    public Complex[] Solve(Complex[] b) => lu.Solve(b);

    public double RelativeResidual(Complex[] x, Complex[] b) => LinearSolver.RelativeResidual(m.Times(x), x, b, m.InfinityNorm());

    public Weakest Weakest()
    {
        var n = m.Size;
        // A fixed start, so the same matrix names the same elements every time.
        var random = new Random(1);
        var v = Normalised(Enumerable.Range(0, n).Select(_ => new Complex(random.NextDouble() + 0.5, random.NextDouble() - 0.5)).ToArray(), out _);
        double inverse = 0;
        for (var step = 0; step < InverseSteps; step++)
        {
            v = Normalised(lu.Solve(lu.SolveAdjoint(v)), out inverse);
            if (!double.IsFinite(inverse)) break;
        }
        var left = Normalised(lu.SolveAdjoint(v), out _);
        var w = Normalised(Enumerable.Repeat(Complex.One, n).ToArray(), out _);
        double largest = 0;
        for (var step = 0; step < PowerSteps; step++) w = Normalised(m.AdjointTimes(m.Times(w)), out largest);
        // ‖(AᴴA)⁻¹·v‖ → 1/σ²min and ‖AᴴA·w‖ → σ²max for unit vectors.
        var smallest = double.IsFinite(inverse) && inverse > 0 ? 1 / Math.Sqrt(inverse) : 0;
        return WindingNotes.Kernel.Weakest.Of(smallest, Math.Sqrt(largest), v, left);
    }

    private static Complex[] Normalised(Complex[] v, out double norm)
    {
        norm = Math.Sqrt(v.Sum(x => x.Real * x.Real + x.Imaginary * x.Imaginary));
        if (norm > 0 && double.IsFinite(norm))
            for (var i = 0; i < v.Length; i++) v[i] /= norm;
        return v;
    }
}

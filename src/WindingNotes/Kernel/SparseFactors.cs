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

    private SparseFactors(SparseRows m)
    {
        this.m = m;
        lu = SparseLu.Factor(m);
    }

    public static SparseFactors Of(SystemMatrix a, double[] rowScale, double[] columnScale) => new(SparseRows.Of(a, rowScale, columnScale));

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

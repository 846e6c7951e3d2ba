using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Providers.LinearAlgebra;

namespace WindingNotes.Kernel;

/// <summary>Dense LU (MathNet.Numerics) of an equilibrated matrix; its weakest direction from the SVD.</summary>
/// <remarks>
/// The equilibrated matrix is not kept dense beside its factors: the residual is taken on the
/// system's own rows, scaled entry by entry as the dense copy was, each row summed in the order of
/// its columns as MathNet's dense product sums it (a zero entry adds nothing to a sum), so it is the
/// same number to the last bit (DenseFactorsTests holds the two equal); the SVD, wanted only where
/// the pivots call for it, makes its dense matrix then.
/// </remarks>
internal sealed class DenseFactors : IFactors
{
    private readonly SystemMatrix a;
    private readonly double[] rowScale, columnScale;
    // The LU factors, column by column, in place of the equilibrated matrix, and the row exchanges:
    // what MathNet's dense LU computes, by the same provider call, without the copy of U it makes to read the pivots.
    private readonly Complex[] factors;
    private readonly int[] pivots;

    private DenseFactors(SystemMatrix a, double[] rowScale, double[] columnScale)
    {
        (this.a, this.rowScale, this.columnScale) = (a, rowScale, columnScale);
        var n = a.Size;
        factors = Equilibrated(a, rowScale, columnScale);
        pivots = new int[n];
        LinearAlgebraControl.Provider.LUFactor(factors, n, pivots);
        SmallestPivot = double.PositiveInfinity;
        for (var i = 0; i < n; i++)
        {
            var pivot = factors[i * n + i].Magnitude;
            SmallestPivot = Math.Min(SmallestPivot, pivot);
            LargestPivot = Math.Max(LargestPivot, pivot);
        }
    }

    public static DenseFactors Of(SystemMatrix a, double[] rowScale, double[] columnScale) => new(a, rowScale, columnScale);

    /// <summary>The equilibrated matrix, column-major (the array MathNet's dense matrix binds to; its indexer checks and dispatches per entry).</summary>
    private static Complex[] Equilibrated(SystemMatrix a, double[] rowScale, double[] columnScale)
    {
        var n = a.Size;
        var data = new Complex[n * n];
        for (var i = 0; i < n; i++)
        {
            var columns = a.Columns(i);
            var values = a.Values(i);
            for (var e = 0; e < columns.Length; e++) data[columns[e] * n + i] = values[e] * rowScale[i] * columnScale[columns[e]];
        }
        return data;
    }

    public double SmallestPivot { get; }
    public double LargestPivot { get; }

    public Complex[] Solve(Complex[] b)
    {
        var x = (Complex[])b.Clone();
        LinearAlgebraControl.Provider.LUSolveFactored(1, factors, pivots.Length, pivots, x);
        return x;
    }

    public double RelativeResidual(Complex[] x, Complex[] b)
    {
        // Where x is not finite, a zero entry times it is not zero: the dense product itself, as it always was.
        foreach (var v in x)
            if (!double.IsFinite(v.Real) || !double.IsFinite(v.Imaginary)) return DenseResidual(x, b);
        return LinearSolver.ScaledResidual(a, rowScale, columnScale, x, b, new Complex[a.Size]);
    }

    /// <summary>The residual by MathNet's dense product and norm (the reference of the one above).</summary>
    internal double DenseResidual(Complex[] x, Complex[] b)
    {
        var m = Dense();
        return LinearSolver.RelativeResidual((m * Vector<Complex>.Build.Dense(x)).ToArray(), x, b, m.InfinityNorm());
    }

    private Matrix<Complex> Dense() => Matrix<Complex>.Build.Dense(a.Size, a.Size, Equilibrated(a, rowScale, columnScale));

    public Weakest Weakest()
    {
        var svd = Dense().Svd(computeVectors: true);
        var last = svd.S.Count - 1;
        return WindingNotes.Kernel.Weakest.Of(svd.S[last].Magnitude, svd.S[0].Magnitude, svd.VT.Row(last).ToArray(), svd.U.Column(last).ToArray());
    }
}

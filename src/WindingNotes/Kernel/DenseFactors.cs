using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Providers.LinearAlgebra;

namespace WindingNotes.Kernel;

/// <summary>Dense LU (MathNet.Numerics) of an equilibrated matrix; its weakest direction from the SVD.</summary>
internal sealed class DenseFactors : IFactors
{
    private readonly Matrix<Complex> m;
    // The LU factors in place of a copy of m (column by column), and the row exchanges: what MathNet's
    // dense LU computes, by the same provider call, without the copy of U it makes to read the pivots.
    private readonly Complex[] factors;
    private readonly int[] pivots;

    private DenseFactors(Matrix<Complex> m)
    {
        this.m = m;
        var n = m.RowCount;
        factors = (Complex[])m.AsColumnMajorArray().Clone();
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

    public static DenseFactors Of(SystemMatrix a, double[] rowScale, double[] columnScale)
    {
        // Written straight into the column-major array the matrix binds to: MathNet's indexer checks and dispatches per entry.
        var n = a.Size;
        var data = new Complex[n * n];
        for (var i = 0; i < n; i++)
        {
            var columns = a.Columns(i);
            var values = a.Values(i);
            for (var e = 0; e < columns.Length; e++) data[columns[e] * n + i] = values[e] * rowScale[i] * columnScale[columns[e]];
        }
        return new DenseFactors(Matrix<Complex>.Build.Dense(n, n, data));
    }

    public double SmallestPivot { get; }
    public double LargestPivot { get; }

    public Complex[] Solve(Complex[] b)
    {
        var x = (Complex[])b.Clone();
        LinearAlgebraControl.Provider.LUSolveFactored(1, factors, pivots.Length, pivots, x);
        return x;
    }

    public double RelativeResidual(Complex[] x, Complex[] b) =>
        LinearSolver.RelativeResidual((m * Vector<Complex>.Build.Dense(x)).ToArray(), x, b, m.InfinityNorm());

    public Weakest Weakest()
    {
        var svd = m.Svd(computeVectors: true);
        var last = svd.S.Count - 1;
        return WindingNotes.Kernel.Weakest.Of(svd.S[last].Magnitude, svd.S[0].Magnitude, svd.VT.Row(last).ToArray(), svd.U.Column(last).ToArray());
    }
}

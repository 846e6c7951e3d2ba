using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;

namespace WindingNotes.Solve;

/// <summary>How a linear solve went.</summary>
internal enum SolveStatus { Solved, IllConditioned, Singular }

/// <summary>
/// Dense complex LU (MathNet.Numerics) on a row- and column-equilibrated matrix, so that rows in
/// amperes, volts and ampere-turns weigh alike. The pivots of the LU are the cheap estimate of the
/// condition: where the smallest is far below the largest, the SVD decides. A vanishing singular
/// value makes the system singular, and its singular vectors name the equations and unknowns
/// involved instead of a solution; a small one makes it ill-conditioned, named the same way. After
/// every solve the residual is checked as well.
/// </summary>
internal static class DenseSolver
{
    /// <summary>Below this ratio of smallest to largest singular value the system has no unique solution.</summary>
    private const double SingularRatio = 1e-13;

    /// <summary>A pivot ratio below this calls for the SVD.</summary>
    private const double PivotRatio = 1e-8;

    /// <summary>
    /// Above this condition number fewer than six of the sixteen figures of a double can be trusted:
    /// enough for the text report's four, not for the JSON's ten.
    /// </summary>
    public const double ConditionLimit = 1e10;

    /// <summary>A relative residual above this is reported as an ill-conditioned system.</summary>
    private const double ResidualLimit = 1e-9;

    /// <summary>
    /// The outcome; an ill-conditioned result whose solve broke down has an empty X. <paramref name="Condition"/> is the 2-norm condition number of the equilibrated
    /// matrix where the SVD was taken, NaN where the pivots showed no need.
    /// </summary>
    public sealed record Result(SolveStatus Status, Complex[] X, double Residual, double Condition, List<int> NullUnknowns, List<int> NullEquations);

    public static Result Solve(Complex[,] a, Complex[] b)
    {
        var n = b.Length;
        if (n == 0) return new Result(SolveStatus.Solved, [], 0, 1, [], []);
        var (rowScale, columnScale) = Equilibrate(a);
        var m = Matrix<Complex>.Build.Dense(n, n, (i, j) => a[i, j] * rowScale[i] * columnScale[j]);
        var rhs = Vector<Complex>.Build.Dense(n, i => b[i] * rowScale[i]);
        var lu = m.LU();
        var u = lu.U;
        double smallest = double.PositiveInfinity, largest = 0;
        for (var i = 0; i < n; i++)
        {
            var pivot = u.At(i, i).Magnitude;
            smallest = Math.Min(smallest, pivot);
            largest = Math.Max(largest, pivot);
        }
        Weakest? weakest = null;
        if (!(smallest > PivotRatio * largest))
        {
            weakest = Weakest.Of(m);
            if (weakest.Singular) return new Result(SolveStatus.Singular, new Complex[n], double.PositiveInfinity, double.PositiveInfinity, weakest.Unknowns, weakest.Equations);
        }
        var y = lu.Solve(rhs);
        var x = new Complex[n];
        for (var j = 0; j < n; j++) x[j] = y[j] * columnScale[j];
        var residual = RelativeResidual(m, y, rhs);
        var condition = weakest?.Condition ?? double.NaN;
        if (!double.IsFinite(residual) || x.Any(v => !double.IsFinite(v.Real) || !double.IsFinite(v.Imaginary)))
        {
            weakest ??= Weakest.Of(m);
            return weakest.Singular
                ? new Result(SolveStatus.Singular, new Complex[n], double.PositiveInfinity, double.PositiveInfinity, weakest.Unknowns, weakest.Equations)
                : new Result(SolveStatus.IllConditioned, [], residual, weakest.Condition, weakest.Unknowns, weakest.Equations);
        }
        if (residual > ResidualLimit || condition > ConditionLimit)
        {
            weakest ??= Weakest.Of(m);
            return new Result(SolveStatus.IllConditioned, x, residual, weakest.Condition, weakest.Unknowns, weakest.Equations);
        }
        return new Result(SolveStatus.Solved, x, residual, condition, [], []);
    }

    /// <summary>Scales so every row, then every column, has its largest entry equal to one.</summary>
    public static (double[] Rows, double[] Columns) Equilibrate(Complex[,] a)
    {
        var n = a.GetLength(0);
        var rows = new double[n];
        var columns = new double[n];
        for (var i = 0; i < n; i++)
        {
            double max = 0;
            for (var j = 0; j < n; j++) max = Math.Max(max, a[i, j].Magnitude);
            rows[i] = max > 0 ? 1 / max : 1;
        }
        for (var j = 0; j < n; j++)
        {
            double max = 0;
            for (var i = 0; i < n; i++) max = Math.Max(max, a[i, j].Magnitude * rows[i]);
            columns[j] = max > 0 ? 1 / max : 1;
        }
        return (rows, columns);
    }

    private static double RelativeResidual(Matrix<Complex> m, Vector<Complex> x, Vector<Complex> b)
    {
        var r = m * x - b;
        var scale = m.InfinityNorm() * x.AbsoluteMaximum().Magnitude + b.AbsoluteMaximum().Magnitude;
        return scale == 0 ? 0 : r.AbsoluteMaximum().Magnitude / scale;
    }

    /// <summary>
    /// The weakest direction of the matrix by its SVD: the condition number, and the unknowns (right
    /// singular vector) and equations (left one) of the smallest singular value.
    /// </summary>
    private sealed record Weakest(bool Singular, double Condition, List<int> Unknowns, List<int> Equations)
    {
        public static Weakest Of(Matrix<Complex> m)
        {
            var svd = m.Svd(computeVectors: true);
            var s = svd.S;
            var last = s.Count - 1;
            var ratio = s[last].Magnitude / s[0].Magnitude;
            return new Weakest(!(ratio > SingularRatio), 1 / ratio, Significant(svd.VT.Row(last)), Significant(svd.U.Column(last)));
        }

        private static List<int> Significant(Vector<Complex> v)
        {
            var max = v.AbsoluteMaximum().Magnitude;
            return Enumerable.Range(0, v.Count).Where(i => v[i].Magnitude > 0.05 * max).ToList();
        }
    }
}

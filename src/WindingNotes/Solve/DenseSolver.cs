using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;

namespace WindingNotes.Solve;

/// <summary>How a linear solve went.</summary>
internal enum SolveStatus { Solved, IllConditioned, Singular }

/// <summary>
/// Dense complex LU (MathNet.Numerics) on a row- and column-equilibrated matrix, so that rows in
/// amperes, volts and ampere-turns weigh alike. After every solve the residual is checked; a
/// singular system yields the equations and unknowns of its null space instead of a solution.
/// </summary>
internal static class DenseSolver
{
    /// <summary>Below this ratio of smallest to largest singular value the system has no unique solution.</summary>
    private const double SingularRatio = 1e-13;

    /// <summary>A relative residual above this is reported as an ill-conditioned system.</summary>
    private const double ResidualLimit = 1e-9;

    public sealed record Result(SolveStatus Status, Complex[] X, double Residual, List<int> NullUnknowns, List<int> NullEquations);

    public static Result Solve(Complex[,] a, Complex[] b)
    {
        var n = b.Length;
        if (n == 0) return new Result(SolveStatus.Solved, [], 0, [], []);
        var (rowScale, columnScale) = Equilibrate(a);
        var m = Matrix<Complex>.Build.Dense(n, n, (i, j) => a[i, j] * rowScale[i] * columnScale[j]);
        var rhs = Vector<Complex>.Build.Dense(n, i => b[i] * rowScale[i]);
        var lu = m.LU();
        var pivots = Enumerable.Range(0, n).Select(i => lu.U[i, i].Magnitude).ToArray();
        if (pivots.Min() <= 1e-10 * pivots.Max() && IsSingular(m, out var unknowns, out var equations))
            return new Result(SolveStatus.Singular, new Complex[n], double.PositiveInfinity, unknowns, equations);
        var y = lu.Solve(rhs);
        var x = new Complex[n];
        for (var j = 0; j < n; j++) x[j] = y[j] * columnScale[j];
        var residual = RelativeResidual(m, y, rhs);
        if (!double.IsFinite(residual) || x.Any(v => !double.IsFinite(v.Real) || !double.IsFinite(v.Imaginary)))
            return IsSingular(m, out var u2, out var e2)
                ? new Result(SolveStatus.Singular, new Complex[n], double.PositiveInfinity, u2, e2)
                : new Result(SolveStatus.IllConditioned, new Complex[n], residual, [], []);
        return new Result(residual > ResidualLimit ? SolveStatus.IllConditioned : SolveStatus.Solved, x, residual, [], []);
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
    /// The SVD decides: with a vanishing singular value, the right singular vector names the
    /// unknowns left undetermined and the left one the equations that conflict.
    /// </summary>
    private static bool IsSingular(Matrix<Complex> m, out List<int> unknowns, out List<int> equations)
    {
        var svd = m.Svd(computeVectors: true);
        var s = svd.S;
        var last = s.Count - 1;
        unknowns = [];
        equations = [];
        if (s[last].Magnitude > SingularRatio * s[0].Magnitude) return false;
        var right = svd.VT.Row(last);
        var left = svd.U.Column(last);
        unknowns = Significant(right);
        equations = Significant(left);
        return true;
    }

    private static List<int> Significant(Vector<Complex> v)
    {
        var max = v.AbsoluteMaximum().Magnitude;
        return Enumerable.Range(0, v.Count).Where(i => v[i].Magnitude > 0.05 * max).ToList();
    }
}

using Complex = System.Numerics.Complex;

namespace WindingNotes.Kernel;

/// <summary>How a linear solve went.</summary>
internal enum SolveStatus { Solved, IllConditioned, Singular }

/// <summary>
/// Solves the complex system of one independent part on a row- and column-equilibrated matrix, so
/// that rows in amperes, volts and ampere-turns weigh alike: dense LU for small systems, sparse LU
/// above <see cref="SparseAbove"/> unknowns. The pivots of the LU are the cheap estimate of the
/// condition: where the smallest is far below the largest, the weakest direction of the matrix
/// decides (the SVD when dense, inverse iteration on the factors when sparse). A vanishing singular
/// value makes the system singular, and its singular vectors name the equations and unknowns
/// involved instead of a solution; a small one makes it ill-conditioned, named the same way. After
/// every solve the residual is checked as well.
/// </summary>
internal static class LinearSolver
{
    /// <summary>
    /// Above this many unknowns the sparse LU is faster than MathNet's dense LU on the matrices of
    /// networks: about even at 18 to 20, twice as fast at 40 (SolverBenchmarks; figures in
    /// tests/WindingNotes.Benchmarks/RESULTS.md).
    /// </summary>
    public const int SparseAbove = 20;

    /// <summary>Below this ratio of smallest to largest singular value the system has no unique solution.</summary>
    public const double SingularRatio = 1e-13;

    /// <summary>A pivot ratio below this calls for the weakest direction.</summary>
    internal const double PivotRatio = 1e-8;

    /// <summary>
    /// Above this condition number fewer than six of the sixteen figures of a double can be trusted:
    /// enough for the text report's four, not for the JSON's ten.
    /// </summary>
    public const double ConditionLimit = 1e10;

    /// <summary>A relative residual above this is reported as an ill-conditioned system.</summary>
    private const double ResidualLimit = 1e-9;

    /// <summary>
    /// The outcome; an ill-conditioned result whose solve broke down has an empty X. <paramref name="Condition"/> is the 2-norm condition number of the equilibrated
    /// matrix where the weakest direction was taken, NaN where the pivots showed no need.
    /// </summary>
    public sealed record Result(SolveStatus Status, Complex[] X, double Residual, double Condition, List<int> NullUnknowns, List<int> NullEquations)
    {
        /// <summary>The factors the solution came from, for more right-hand sides (Newton's); null where there is no solution.</summary>
        public Factored? Factors { get; init; }
    }

    /// <summary>The solution; a sparse system with <paramref name="symbolic"/> is refactored on a kept factorisation of its pattern where one passes its pivot check.</summary>
    public static Result Solve(SystemMatrix a, ReadOnlySpan<Complex> b, SymbolicFactors? symbolic = null) => Solve(a, b, sparse: b.Length > SparseAbove, symbolic);

    /// <summary>The same, with the factorisation chosen by the caller (tests compare the two).</summary>
    public static Result Solve(SystemMatrix a, ReadOnlySpan<Complex> b, bool sparse, SymbolicFactors? symbolic = null)
    {
        var n = b.Length;
        if (n == 0) return new Result(SolveStatus.Solved, [], 0, 1, [], []);
        var (rowScale, columnScale) = Equilibrate(a);
        var rhs = new Complex[n];
        for (var i = 0; i < n; i++) rhs[i] = b[i] * rowScale[i];
        IFactors factors = sparse ? SparseFactors.Of(a, rowScale, columnScale, symbolic) : DenseFactors.Of(a, rowScale, columnScale);
        // A refactorisation on kept pivots stands only where it is as sound as a fresh one would be: else the pivots are chosen afresh.
        // Where it is, the check's solve and residual are the solve's: the same factors and right-hand side.
        Complex[]? sound = null;
        var soundResidual = double.NaN;
        if (factors is SparseFactors { Refactored: true } refactored)
        {
            if (refactored.Sound(rhs, out var checkedY, out var checkedResidual)) (sound, soundResidual) = (checkedY, checkedResidual);
            else factors = SparseFactors.Of(a, rowScale, columnScale, symbolic, afresh: true);
        }
        Weakest? weakest = null;
        if (!(factors.SmallestPivot > PivotRatio * factors.LargestPivot))
        {
            weakest = factors.Weakest();
            if (weakest.Singular) return new Result(SolveStatus.Singular, new Complex[n], double.PositiveInfinity, double.PositiveInfinity, weakest.Unknowns, weakest.Equations);
        }
        var y = sound ?? factors.Solve(rhs);
        var x = new Complex[n];
        for (var j = 0; j < n; j++) x[j] = y[j] * columnScale[j];
        var residual = sound is null ? factors.RelativeResidual(y, rhs) : soundResidual;
        var condition = weakest?.Condition ?? double.NaN;
        var kept = new Factored(factors, rowScale, columnScale);
        if (!double.IsFinite(residual) || x.Any(v => !double.IsFinite(v.Real) || !double.IsFinite(v.Imaginary)))
        {
            weakest ??= factors.Weakest();
            return weakest.Singular
                ? new Result(SolveStatus.Singular, new Complex[n], double.PositiveInfinity, double.PositiveInfinity, weakest.Unknowns, weakest.Equations)
                : new Result(SolveStatus.IllConditioned, [], residual, weakest.Condition, weakest.Unknowns, weakest.Equations);
        }
        if (residual > ResidualLimit || condition > ConditionLimit)
        {
            weakest ??= factors.Weakest();
            return new Result(SolveStatus.IllConditioned, x, residual, weakest.Condition, weakest.Unknowns, weakest.Equations) { Factors = kept };
        }
        return new Result(SolveStatus.Solved, x, residual, condition, [], []) { Factors = kept };
    }

    /// <summary>Scales so every row, then every column, has its largest entry equal to one.</summary>
    public static (double[] Rows, double[] Columns) Equilibrate(SystemMatrix a)
    {
        var n = a.Size;
        var rows = new double[n];
        var columns = new double[n];
        for (var i = 0; i < n; i++)
        {
            double max = 0;
            foreach (var v in a.Values(i))
                if (v != Complex.Zero) max = Math.Max(max, v.Magnitude);
            rows[i] = max > 0 ? 1 / max : 1;
        }
        var largest = new double[n];
        for (var i = 0; i < n; i++)
        {
            var cs = a.Columns(i);
            var vs = a.Values(i);
            for (var e = 0; e < cs.Length; e++)
                if (vs[e] != Complex.Zero) largest[cs[e]] = Math.Max(largest[cs[e]], vs[e].Magnitude * rows[i]);
        }
        for (var j = 0; j < n; j++) columns[j] = largest[j] > 0 ? 1 / largest[j] : 1;
        return (rows, columns);
    }

    /// <summary>
    /// <see cref="RelativeResidual(Complex[], Complex[], Complex[], double)"/> of the system <paramref name="a"/>
    /// equilibrated by its scales, taken on its own rows (the scaled matrix is never made): each row's
    /// entries scaled as equilibration scales them and summed in the order of their columns, as a dense
    /// product sums them (a zero entry, which adds nothing, is passed over). A·x goes into <paramref name="ax"/>.
    /// </summary>
    public static double ScaledResidual(SystemMatrix a, double[] rowScale, double[] columnScale, Complex[] x, Complex[] b, Complex[] ax)
    {
        double norm = 0;
        for (var i = 0; i < a.Size; i++)
        {
            var columns = a.Columns(i);
            var values = a.Values(i);
            var sum = Complex.Zero;
            double row = 0;
            for (var e = 0; e < columns.Length; e++)
            {
                if (values[e] == Complex.Zero) continue;
                var entry = values[e] * rowScale[i] * columnScale[columns[e]];
                sum += entry * x[columns[e]];
                row += entry.Magnitude;
            }
            ax[i] = sum;
            norm = Math.Max(norm, row);
        }
        return RelativeResidual(ax, x, b, norm);
    }

    /// <summary>‖A·x − b‖∞ / (‖A‖∞·‖x‖∞ + ‖b‖∞).</summary>
    public static double RelativeResidual(Complex[] ax, Complex[] x, Complex[] b, double norm)
    {
        double r = 0, xs = 0, bs = 0;
        for (var i = 0; i < b.Length; i++)
        {
            r = Math.Max(r, (ax[i] - b[i]).Magnitude);
            xs = Math.Max(xs, x[i].Magnitude);
            bs = Math.Max(bs, b[i].Magnitude);
        }
        var scale = norm * xs + bs;
        return scale == 0 ? 0 : r / scale;
    }
}

/// <summary>The LU of a system's equilibrated matrix with its scales: solves the system for another right-hand side.</summary>
internal sealed class Factored(IFactors factors, double[] rows, double[] columns)
{
    public Complex[] Solve(ReadOnlySpan<Complex> b)
    {
        var scaled = new Complex[b.Length];
        for (var i = 0; i < b.Length; i++) scaled[i] = b[i] * rows[i];
        var x = factors.Solve(scaled);
        for (var j = 0; j < x.Length; j++) x[j] *= columns[j];
        return x;
    }
}

/// <summary>An LU of the equilibrated matrix, as the solver needs it.</summary>
internal interface IFactors
{
    double SmallestPivot { get; }
    double LargestPivot { get; }
    Complex[] Solve(Complex[] b);
    double RelativeResidual(Complex[] x, Complex[] b);
    Weakest Weakest();
}

/// <summary>
/// The weakest direction of the matrix: the condition number, and the unknowns (right singular
/// vector) and equations (left one) of the smallest singular value.
/// </summary>
internal sealed record Weakest(bool Singular, double Condition, List<int> Unknowns, List<int> Equations)
{
    public static Weakest Of(double smallest, double largest, IReadOnlyList<Complex> right, IReadOnlyList<Complex> left)
    {
        var ratio = smallest / largest;
        return new Weakest(!(ratio > LinearSolver.SingularRatio), 1 / ratio, Significant(right), Significant(left));
    }

    private static List<int> Significant(IReadOnlyList<Complex> v)
    {
        var max = v.Max(x => x.Magnitude);
        return Enumerable.Range(0, v.Count).Where(i => v[i].Magnitude > 0.05 * max).ToList();
    }
}

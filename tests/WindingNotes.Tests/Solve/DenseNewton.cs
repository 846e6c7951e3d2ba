using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;
using WindingNotes.Kernel;
using WindingNotes.Solve;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Newton as the solver had it before it worked on the sparse system: the dense 2n × 2n real
/// Jacobian and MathNet's LU at every step, the same step halving and the same test of convergence.
/// The reference <see cref="SparseNewtonTests"/> holds the solver to, and the benchmarks measure
/// against (linked into tests/WindingNotes.Benchmarks).
/// </summary>
internal static class DenseNewton
{
    /// <summary>Newton as it was: the dense 2n × 2n real Jacobian, MathNet's LU each iteration, the same step halving and test.</summary>
    public static NewtonSolver.Result Solve(MnaSystem m, Complex[] start)
    {
        var n = m.Size;
        var (rows, _) = LinearSolver.Equilibrate(m.A);
        var x = (Complex[])start.Clone();
        var f = NewtonSolver.Residual(m, x);
        for (var iteration = 1; iteration <= NewtonSolver.MaxIterations; iteration++)
        {
            var j = Jacobian(m, x, rows);
            var rhs = Vector<double>.Build.Dense(2 * n);
            for (var i = 0; i < n; i++)
            {
                rhs[2 * i] = -f[i].Real * rows[i];
                rhs[2 * i + 1] = -f[i].Imaginary * rows[i];
            }
            var step = j.LU().Solve(rhs);
            if (step.Any(v => !double.IsFinite(v))) return new NewtonSolver.Result(false, x, iteration);
            var norm = NewtonSolver.Norm(f, rows);
            var t = 1.0;
            Complex[] next;
            Complex[] fNext;
            do
            {
                next = new Complex[n];
                for (var i = 0; i < n; i++) next[i] = x[i] + t * new Complex(step[2 * i], step[2 * i + 1]);
                fNext = NewtonSolver.Residual(m, next);
                t /= 2;
            } while (NewtonSolver.Norm(fNext, rows) > norm && t > 1.0 / 1024);
            var moved = Enumerable.Range(0, n).Max(i => (next[i] - x[i]).Magnitude);
            x = next;
            f = fNext;
            var size = x.Max(v => v.Magnitude) + 1e-30;
            if (moved <= 1e-12 * size && NewtonSolver.Norm(f, rows) <= 1e-10 * (NewtonSolver.Scale(m, rows) + size)) return new NewtonSolver.Result(true, x, iteration);
        }
        return new NewtonSolver.Result(false, x, NewtonSolver.MaxIterations);
    }

    private static Matrix<double> Jacobian(MnaSystem m, Complex[] x, double[] rows)
    {
        var n = m.Size;
        var j = Matrix<double>.Build.Dense(2 * n, 2 * n);
        void Add(int row, int column, Complex a, Complex b)
        {
            var s = rows[row];
            j[2 * row, 2 * column] += s * (a + b).Real;
            j[2 * row, 2 * column + 1] -= s * (a - b).Imaginary;
            j[2 * row + 1, 2 * column] += s * (a + b).Imaginary;
            j[2 * row + 1, 2 * column + 1] += s * (a - b).Real;
        }
        for (var r = 0; r < n; r++)
        {
            var columns = m.A.Columns(r);
            var values = m.A.Values(r);
            for (var e = 0; e < columns.Length; e++)
                if (values[e] != Complex.Zero) Add(r, columns[e], values[e], Complex.Zero);
        }
        foreach (var load in m.NonlinearLoads)
        {
            var v = NewtonSolver.Across(load, x);
            if (v == Complex.Zero) continue;
            var i = NewtonSolver.LoadCurrent(load, v);
            var (alpha, beta) = load.Exponent == 0 ? (0.0, -1.0) : (0.5, -0.5);
            var a = alpha * i / v;
            var b = beta * i / Complex.Conjugate(v);
            foreach (var (row, rowSign) in new[] { (load.ColumnA, 1), (load.ColumnB, -1) })
            {
                if (row < 0) continue;
                foreach (var (column, columnSign) in new[] { (load.ColumnA, 1), (load.ColumnB, -1) })
                    if (column >= 0) Add(row, column, rowSign * columnSign * a, rowSign * columnSign * b);
            }
        }
        return j;
    }
}

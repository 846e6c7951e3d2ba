using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;

namespace WindingNotes.Solve;

/// <summary>
/// Newton's method for constant-power and constant-current loads on the linear system. A load
/// draws I = c·V^α·conj(V)^β (constant power: α = 0, β = −1; constant current: α = β·(−1) = ½),
/// which is not analytic in V, so the Jacobian is taken in real form from the Wirtinger
/// derivatives ∂I/∂V = α·I/V and ∂I/∂conj(V) = β·I/conj(V). Steps are halved while they do not reduce
/// the residual, which keeps the method honest near the nose of the voltage curve.
/// </summary>
internal static class NewtonSolver
{
    public const int MaxIterations = 40;

    public sealed record Result(bool Converged, Complex[] X, int Iterations);

    public static Result Solve(MnaSystem m, Complex[] start, CancellationToken cancel)
    {
        var n = m.Size;
        var (rows, _) = LinearSolver.Equilibrate(m.A);
        var x = (Complex[])start.Clone();
        var f = Residual(m, x);
        for (var iteration = 1; iteration <= MaxIterations; iteration++)
        {
            cancel.ThrowIfCancellationRequested();
            var j = Jacobian(m, x, rows);
            var rhs = Vector<double>.Build.Dense(2 * n);
            for (var i = 0; i < n; i++)
            {
                rhs[2 * i] = -f[i].Real * rows[i];
                rhs[2 * i + 1] = -f[i].Imaginary * rows[i];
            }
            var step = j.LU().Solve(rhs);
            if (step.Any(v => !double.IsFinite(v))) return new Result(false, x, iteration);
            var norm = Norm(f, rows);
            var t = 1.0;
            Complex[] next;
            Complex[] fNext;
            do
            {
                next = new Complex[n];
                for (var i = 0; i < n; i++) next[i] = x[i] + t * new Complex(step[2 * i], step[2 * i + 1]);
                fNext = Residual(m, next);
                t /= 2;
            } while (Norm(fNext, rows) > norm && t > 1.0 / 1024);
            var moved = Enumerable.Range(0, n).Max(i => (next[i] - x[i]).Magnitude);
            x = next;
            f = fNext;
            var size = x.Max(v => v.Magnitude) + 1e-30;
            if (moved <= 1e-12 * size && Norm(f, rows) <= 1e-10 * (Scale(m, rows) + size)) return new Result(true, x, iteration);
        }
        return new Result(false, x, MaxIterations);
    }

    /// <summary>The current a nonlinear load draws at voltage V across it.</summary>
    public static Complex LoadCurrent(NonlinearLoad load, Complex v)
    {
        if (v == Complex.Zero) return Complex.Zero;
        var c = Complex.Conjugate(load.S0);
        return load.Exponent == 0 ? c / Complex.Conjugate(v) : c / load.V0 * v / v.Magnitude;
    }

    public static Complex Across(NonlinearLoad load, Complex[] x) =>
        (load.ColumnA >= 0 ? x[load.ColumnA] : 0) - (load.ColumnB >= 0 ? x[load.ColumnB] : 0);

    private static Complex[] Residual(MnaSystem m, Complex[] x)
    {
        var n = m.Size;
        var f = new Complex[n];
        for (var i = 0; i < n; i++)
        {
            var sum = -m.B[i];
            var columns = m.A.Columns(i);
            var values = m.A.Values(i);
            for (var e = 0; e < columns.Length; e++) sum += values[e] * x[columns[e]];
            f[i] = sum;
        }
        foreach (var load in m.NonlinearLoads)
        {
            var current = LoadCurrent(load, Across(load, x));
            if (load.ColumnA >= 0) f[load.ColumnA] += current;
            if (load.ColumnB >= 0) f[load.ColumnB] -= current;
        }
        return f;
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
            var v = Across(load, x);
            if (v == Complex.Zero) continue;
            var i = LoadCurrent(load, v);
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

    private static double Norm(Complex[] f, double[] rows) =>
        f.Select((v, i) => v.Magnitude * rows[i]).DefaultIfEmpty(0).Max();

    private static double Scale(MnaSystem m, double[] rows) =>
        m.B.Select((v, i) => v.Magnitude * rows[i]).DefaultIfEmpty(0).Max();
}

using Complex = System.Numerics.Complex;

namespace WindingNotes.Kernel;

/// <summary>
/// Newton's method for constant-power and constant-current loads on the linear system. A load
/// draws I = c·V^α·conj(V)^β (constant power: α = 0, β = −1; constant current: α = β·(−1) = ½),
/// which is not analytic in V, so the Jacobian is taken in real form from the Wirtinger
/// derivatives ∂I/∂V = α·I/V and ∂I/∂conj(V) = β·I/conj(V). Steps are halved while they do not reduce
/// the residual, which keeps the method honest near the nose of the voltage curve.
/// <para>
/// The Jacobian is the part's sparse system as factored for the starting point M (the loads stamped
/// as admittances there) plus a change D in the rows and columns P of the loads' nodes alone: a real
/// 2|P| × 2|P| block, the loads' derivatives less the admittances M holds. So each step is one solve
/// with M's factors and a small dense system (Sherman–Morrison–Woodbury):
/// J⁻¹·r = w − Z·(I + D·G)⁻¹·D·w_P with w = M⁻¹·r, Z = M⁻¹·E_P (|P| solves, once) and G = Z_P, in
/// real form, where a complex column z of Z stands for two real ones, z and i·z. A part of n
/// unknowns never meets the dense 2n × 2n Jacobian, whose LU cost n³ a step.
/// </para>
/// </summary>
internal static class NewtonSolver
{
    public const int MaxIterations = 40;

    public sealed record Result(bool Converged, Complex[] X, int Iterations);

    /// <summary>An admittance the factored matrix holds between two columns (−1: the reference) that the system's own does not.</summary>
    public readonly record struct Stamp(int ColumnA, int ColumnB, Complex Y);

    /// <param name="factors">The factors of <paramref name="m"/>'s matrix with <paramref name="stamped"/> added.</param>
    public static Result Solve(MnaSystem m, Factored factors, IReadOnlyList<Stamp> stamped, Complex[] start, CancellationToken cancel)
    {
        var n = m.Size;
        var (rows, _) = LinearSolver.Equilibrate(m.A);
        var loads = m.NonlinearLoads;
        // P, the columns the loads and the stamps touch, and each one's place in it.
        var place = new Dictionary<int, int>();
        var p = new List<int>();
        void Touch(int c)
        {
            if (c >= 0 && place.TryAdd(c, p.Count)) p.Add(c);
        }
        foreach (var l in loads) { Touch(l.ColumnA); Touch(l.ColumnB); }
        foreach (var s in stamped) { Touch(s.ColumnA); Touch(s.ColumnB); }
        var k = p.Count;
        var z = new Complex[k][];
        for (var t = 0; t < k; t++)
        {
            var e = new Complex[n];
            e[p[t]] = 1;
            z[t] = factors.Solve(e);
        }
        var g = new double[2 * k, 2 * k];
        for (var t = 0; t < k; t++)
            for (var s = 0; s < k; s++)
            {
                var v = z[t][p[s]];
                (g[s, t], g[s, k + t], g[k + s, t], g[k + s, k + t]) = (v.Real, -v.Imaginary, v.Imaginary, v.Real);
            }

        var x = (Complex[])start.Clone();
        var f = Residual(m, x);
        var scale = Scale(m, rows);
        for (var iteration = 1; iteration <= MaxIterations; iteration++)
        {
            cancel.ThrowIfCancellationRequested();
            var step = Step(m, x, f, factors, stamped, place, z, g);
            if (step is null) return new Result(false, x, iteration);
            var norm = Norm(f, rows);
            var t = 1.0;
            Complex[] next;
            Complex[] fNext;
            do
            {
                next = new Complex[n];
                for (var i = 0; i < n; i++) next[i] = x[i] + t * step[i];
                fNext = Residual(m, next);
                t /= 2;
            } while (Norm(fNext, rows) > norm && t > 1.0 / 1024);
            var moved = 0.0;
            for (var i = 0; i < n; i++) moved = Math.Max(moved, (next[i] - x[i]).Magnitude);
            x = next;
            f = fNext;
            var size = 0.0;
            foreach (var v in x) size = Math.Max(size, v.Magnitude);
            size += 1e-30;
            if (moved <= 1e-12 * size && Norm(f, rows) <= 1e-10 * (scale + size)) return new Result(true, x, iteration);
        }
        return new Result(false, x, MaxIterations);
    }

    /// <summary>The Newton step J⁻¹·(−f) at <paramref name="x"/>; null where it is not finite (J singular).</summary>
    private static Complex[]? Step(MnaSystem m, Complex[] x, Complex[] f, Factored factors, IReadOnlyList<Stamp> stamped,
        Dictionary<int, int> place, Complex[][] z, double[,] g)
    {
        var n = m.Size;
        var k = z.Length;
        var r = new Complex[n];
        for (var i = 0; i < n; i++) r[i] = -f[i];
        var w = factors.Solve(r);
        if (k == 0) return Finite(w) ? w : null;

        // D: per pair of load ends, out_row += α·d_column + β·conj(d_column), in real form.
        var d = new double[2 * k, 2 * k];
        void Add(int row, int column, Complex alpha, Complex beta)
        {
            var (i, j) = (place[row], place[column]);
            d[i, j] += alpha.Real + beta.Real;
            d[i, k + j] += -alpha.Imaginary + beta.Imaginary;
            d[k + i, j] += alpha.Imaginary + beta.Imaginary;
            d[k + i, k + j] += alpha.Real - beta.Real;
        }
        // Rows a then b, in each columns a then b (no arrays of the pairs: this runs for every load at every step).
        void Pair(int a, int b, Complex alpha, Complex beta)
        {
            Row(a, 1, a, b, alpha, beta);
            Row(b, -1, a, b, alpha, beta);
        }
        void Row(int row, int rowSign, int a, int b, Complex alpha, Complex beta)
        {
            if (row < 0) return;
            if (a >= 0) Add(row, a, rowSign * 1 * alpha, rowSign * 1 * beta);
            if (b >= 0) Add(row, b, rowSign * -1 * alpha, rowSign * -1 * beta);
        }
        foreach (var load in m.NonlinearLoads)
        {
            var v = Across(load, x);
            if (v == Complex.Zero) continue;
            var i = LoadCurrent(load, v);
            var (alpha, beta) = load.Exponent == 0 ? (0.0, -1.0) : (0.5, -0.5);
            Pair(load.ColumnA, load.ColumnB, alpha * i / v, beta * i / Complex.Conjugate(v));
        }
        for (var e = 0; e < stamped.Count; e++) Pair(stamped[e].ColumnA, stamped[e].ColumnB, -stamped[e].Y, Complex.Zero);

        // (I + D·G)·y = D·w_P
        var size = 2 * k;
        var small = new double[size, size];
        var rhs = new double[size];
        for (var i = 0; i < size; i++)
        {
            for (var j = 0; j < size; j++)
            {
                double sum = 0;
                for (var e = 0; e < size; e++) sum += d[i, e] * g[e, j];
                small[i, j] = (i == j ? 1 : 0) + sum;
            }
            double b = 0;
            foreach (var (column, t) in place) b += d[i, t] * w[column].Real + d[i, k + t] * w[column].Imaginary;
            rhs[i] = b;
        }
        if (SolveSmall(small, rhs) is not { } y) return null;
        for (var t = 0; t < k; t++)
        {
            var c = new Complex(y[t], y[k + t]);
            if (c == Complex.Zero) continue;
            var zt = z[t];
            for (var i = 0; i < n; i++) w[i] -= zt[i] * c;
        }
        return Finite(w) ? w : null;
    }

    private static bool Finite(Complex[] v)
    {
        foreach (var c in v)
            if (!double.IsFinite(c.Real) || !double.IsFinite(c.Imaginary)) return false;
        return true;
    }

    /// <summary>Gaussian elimination with partial pivoting; null where a pivot is zero or not finite.</summary>
    private static double[]? SolveSmall(double[,] a, double[] b)
    {
        var n = b.Length;
        for (var c = 0; c < n; c++)
        {
            var p = c;
            for (var i = c + 1; i < n; i++)
                if (Math.Abs(a[i, c]) > Math.Abs(a[p, c])) p = i;
            if (!(Math.Abs(a[p, c]) > 0) || !double.IsFinite(a[p, c])) return null;
            if (p != c)
            {
                for (var j = 0; j < n; j++) (a[c, j], a[p, j]) = (a[p, j], a[c, j]);
                (b[c], b[p]) = (b[p], b[c]);
            }
            for (var i = c + 1; i < n; i++)
            {
                var l = a[i, c] / a[c, c];
                if (l == 0) continue;
                for (var j = c; j < n; j++) a[i, j] -= l * a[c, j];
                b[i] -= l * b[c];
            }
        }
        var x = new double[n];
        for (var i = n - 1; i >= 0; i--)
        {
            var sum = b[i];
            for (var j = i + 1; j < n; j++) sum -= a[i, j] * x[j];
            x[i] = sum / a[i, i];
        }
        return x;
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

    internal static Complex[] Residual(MnaSystem m, Complex[] x)
    {
        var n = m.Size;
        var f = new Complex[n];
        var b = m.B;
        for (var i = 0; i < n; i++)
        {
            var sum = -b[i];
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

    internal static double Norm(Complex[] f, double[] rows)
    {
        double max = 0;
        for (var i = 0; i < f.Length; i++) max = Math.Max(max, f[i].Magnitude * rows[i]);
        return max;
    }

    internal static double Scale(MnaSystem m, double[] rows)
    {
        double max = 0;
        var b = m.B;
        for (var i = 0; i < b.Length; i++) max = Math.Max(max, b[i].Magnitude * rows[i]);
        return max;
    }
}

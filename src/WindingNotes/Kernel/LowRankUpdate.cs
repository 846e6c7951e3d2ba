using System.Numerics;
using WindingNotes.Model;

namespace WindingNotes.Kernel;

/// <summary>
/// One factorisation of an independent part, reused for systems that differ from it only in the rows
/// and columns of a few unknowns S (a moved brush changes the turns of the two sections beside it:
/// their rows, their columns and their core's). Such a change is Δ = E_S·R + C·E_Sᵀ, of rank at most
/// 2|S|, so by the Sherman–Morrison–Woodbury identity
/// x = z − W·(I + V·W)⁻¹·V·z with z = A⁻¹·b, U = [E_S C], V = [R; E_Sᵀ] and W = A⁻¹·U:
/// |S| solves with the old factors for A⁻¹·C (A⁻¹·E_S is kept) and a small dense system, instead of
/// a new factorisation. All on the equilibrated matrix of the first system. The result is refused
/// (null, and the caller factors afresh) where the small system is near singular or where the residual
/// of the new system (which would also show a change outside S) is above rounding, so an accepted x is the
/// one a full solve gives, to rounding.
/// </summary>
internal sealed class LowRankUpdate
{
    /// <summary>Pivot ratios below this (of the first factors, or of the small system) leave the point to a full solve.</summary>
    private const double PivotRatio = 1e-6;

    /// <summary>The relative residual an updated solution must reach; a full solve is accepted up to 1e-9.</summary>
    private const double ResidualLimit = 1e-12;

    private readonly MnaSystem first;

    /// <summary>The matrix and right-hand side a point's network is stamped into.</summary>
    private readonly SystemMatrix scratch;
    private readonly Complex[] scratchB;
    private readonly double[] rows, columns;
    private readonly SparseLu lu;
    private readonly Complex[] z;
    private readonly Complex[] firstB;
    private readonly bool[] inS;
    private readonly Complex[][] work;
    private Complex[,] small = new Complex[0, 0];
    private readonly Dictionary<string, Complex[][]> solves = [];
    private int[] lastS = [];
    private Complex[][]? lastW;
    private readonly Complex[] scaledB, product;

    private LowRankUpdate(MnaSystem first, double[] rows, double[] columns, SparseLu lu)
    {
        (this.first, this.rows, this.columns, this.lu) = (first, rows, columns, lu);
        scratch = first.A.Clone();
        scratchB = new Complex[first.Size];
        firstB = Scaled(first.B);
        z = lu.Solve(firstB);
        inS = new bool[first.Size];
        work = [new Complex[first.Size], new Complex[first.Size]];
        (scaledB, product) = (new Complex[first.Size], new Complex[first.Size]);
    }

    public MnaSystem System => first;

    /// <summary>The factors of a linear part, or null where they are not well enough conditioned to update.</summary>
    public static LowRankUpdate? Of(MnaSystem m)
    {
        if (m.NonlinearLoads.Length > 0 || m.Size == 0) return null;
        var (rows, columns) = LinearSolver.Equilibrate(m.A);
        var lu = SparseLu.Factor(SparseRows.Of(m.A, rows, columns));
        return lu.SmallestPivot > PivotRatio * lu.LargestPivot ? new LowRankUpdate(m, rows, columns, lu) : null;
    }

    private Complex[] Scaled(ReadOnlySpan<Complex> b)
    {
        var r = new Complex[b.Length];
        for (var i = 0; i < b.Length; i++) r[i] = b[i] * rows[i];
        return r;
    }

    /// <summary>
    /// The solution of the system of <paramref name="network"/> (the first one's network with brushes
    /// moved), whose matrix may differ from the first only in rows and columns <paramref name="s"/>.
    /// </summary>
    public Complex[]? Solve(Network network, int[] s)
    {
        first.StampInto(network, scratch, scratchB);
        var n = first.Size;
        var (a0, a) = (first.A, scratch);
        // Buffers of this part, used again at every point: a sweep makes no garbage it need not.
        var inS = this.inS;
        Array.Clear(inS);
        foreach (var i in s) inS[i] = true;
        var k = s.Length;
        var b = scaledB;
        for (var i = 0; i < n; i++) b[i] = scratchB[i] * rows[i];
        var zb = b.AsSpan().SequenceEqual(firstB) ? z : lu.Solve(b);
        // W = A⁻¹·[E_S C]: the unit solves are kept for the next point that changes the same S,
        // and so are the arrays for A⁻¹·C (a sweep's points change the same S one after another).
        Complex[][] w;
        if (lastW is not null && s.AsSpan().SequenceEqual(lastS)) w = lastW;
        else if (!solves.TryGetValue(string.Join(",", s), out w!))
        {
            w = new Complex[2 * k][];
            for (var t = 0; t < k; t++)
            {
                var e = new Complex[n];
                e[s[t]] = 1;
                w[t] = lu.Solve(e);
                w[k + t] = new Complex[n];
            }
            solves[string.Join(",", s)] = w;
        }
        (lastS, lastW) = (s, w);
        // Column s_t of Δ outside S: the stamps are structurally symmetric, so its rows are the
        // columns of row s_t (the new matrix has the first one's entries and perhaps more). An entry
        // missed where that does not hold would show in the residual below and refuse the point.
        var c = work[0];
        for (var t = 0; t < k; t++)
        {
            Array.Clear(c);
            foreach (var i in a.Columns(s[t]))
                if (!inS[i]) c[i] = Delta(i, s[t]);
            lu.Solve(c, w[k + t], work[1]);
        }
        // K = I + V·W and V·z, with V's first k rows R = Δ[S, :] and the others E_Sᵀ.
        var size = 2 * k;
        if (small.GetLength(0) != size) small = new Complex[size, size];
        else Array.Clear(small);
        var kk = small;
        var rhs = new Complex[size];
        for (var t = 0; t < k; t++)
        {
            var row = a.Columns(s[t]);
            var values = a.Values(s[t]);
            for (var e = 0; e < row.Length; e++)
            {
                var j = row[e];
                var d = (values[e] - a0[s[t], j]) * rows[s[t]] * columns[j];
                if (d == Complex.Zero) continue;
                for (var u = 0; u < size; u++) kk[t, u] += d * w[u][j];
                rhs[t] += d * zb[j];
            }
            for (var u = 0; u < size; u++) kk[k + t, u] = w[u][s[t]];
            rhs[k + t] = zb[s[t]];
        }
        for (var t = 0; t < size; t++) kk[t, t] += 1;
        if (SolveSmall(kk, rhs) is not { } y) return null;
        var x = (Complex[])zb.Clone();
        for (var u = 0; u < size; u++)
            for (var i = 0; i < n; i++) x[i] -= w[u][i] * y[u];
        // The residual is taken on the new matrix itself, so a change outside S (which the update
        // would not know of) shows here too and refuses the point.
        if (Residual(a, x, b) > ResidualLimit) return null;
        for (var j = 0; j < n; j++) x[j] *= columns[j];
        return x;

        Complex Delta(int i, int j) => (a[i, j] - a0[i, j]) * rows[i] * columns[j];
    }

    /// <summary>The relative residual of the scaled system at the scaled solution.</summary>
    private double Residual(SystemMatrix a, Complex[] x, Complex[] b) => LinearSolver.ScaledResidual(a, rows, columns, x, b, product);

    /// <summary>Gaussian elimination with partial pivoting on the small system; null where a pivot is too small.</summary>
    private static Complex[]? SolveSmall(Complex[,] m, Complex[] b)
    {
        var n = b.Length;
        double largest = 0;
        for (var i = 0; i < n; i++)
            for (var j = 0; j < n; j++) largest = Math.Max(largest, m[i, j].Magnitude);
        for (var c = 0; c < n; c++)
        {
            var p = c;
            for (var i = c + 1; i < n; i++)
                if (m[i, c].Magnitude > m[p, c].Magnitude) p = i;
            if (!(m[p, c].Magnitude > PivotRatio * largest)) return null;
            if (p != c)
            {
                for (var j = 0; j < n; j++) (m[c, j], m[p, j]) = (m[p, j], m[c, j]);
                (b[c], b[p]) = (b[p], b[c]);
            }
            for (var i = c + 1; i < n; i++)
            {
                var l = m[i, c] / m[c, c];
                if (l == Complex.Zero) continue;
                for (var j = c; j < n; j++) m[i, j] -= l * m[c, j];
                b[i] -= l * b[c];
            }
        }
        var x = new Complex[n];
        for (var i = n - 1; i >= 0; i--)
        {
            var sum = b[i];
            for (var j = i + 1; j < n; j++) sum -= m[i, j] * x[j];
            x[i] = sum / m[i, i];
        }
        return x;
    }
}

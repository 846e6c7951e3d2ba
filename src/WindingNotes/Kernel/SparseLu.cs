using System.Numerics;

namespace WindingNotes.Kernel;

/// <summary>A square sparse matrix by rows (compressed sparse rows).</summary>
internal sealed class SparseRows(int size, int[] start, int[] column, Complex[] value)
{
    public int Size => size;
    public int[] Start => start;
    public int[] Column => column;
    public Complex[] Value => value;

    /// <summary>The nonzero entries of a system's matrix, each scaled by its row's and its column's factor.</summary>
    public static SparseRows Of(SystemMatrix a, double[] rowScale, double[] columnScale)
    {
        var n = a.Size;
        var start = new int[n + 1];
        // Counted first, so the arrays are made once at their size (a matrix stamped again keeps its zeros' places).
        var nonzero = 0;
        for (var i = 0; i < n; i++)
            foreach (var v in a.Values(i))
                if (v != Complex.Zero) nonzero++;
        var columns = new int[nonzero];
        var values = new Complex[nonzero];
        var count = 0;
        for (var i = 0; i < n; i++)
        {
            var cs = a.Columns(i);
            var vs = a.Values(i);
            for (var e = 0; e < cs.Length; e++)
                if (vs[e] != Complex.Zero)
                {
                    columns[count] = cs[e];
                    values[count++] = vs[e] * rowScale[i] * columnScale[cs[e]];
                }
            start[i + 1] = count;
        }
        return new SparseRows(n, start, columns, values);
    }

    public Complex[] Times(Complex[] x)
    {
        var y = new Complex[size];
        for (var i = 0; i < size; i++)
        {
            var sum = Complex.Zero;
            for (var e = start[i]; e < start[i + 1]; e++) sum += value[e] * x[column[e]];
            y[i] = sum;
        }
        return y;
    }

    /// <summary>Aᴴ·x.</summary>
    public Complex[] AdjointTimes(Complex[] x)
    {
        var y = new Complex[size];
        for (var i = 0; i < size; i++)
            for (var e = start[i]; e < start[i + 1]; e++) y[column[e]] += Complex.Conjugate(value[e]) * x[i];
        return y;
    }

    public double InfinityNorm()
    {
        double max = 0;
        for (var i = 0; i < size; i++)
        {
            double sum = 0;
            for (var e = start[i]; e < start[i + 1]; e++) sum += value[e].Magnitude;
            max = Math.Max(max, sum);
        }
        return max;
    }
}

/// <summary>
/// Sparse complex LU by right-looking elimination with Markowitz pivoting. At each step the pivot is
/// the entry that can make the least fill, (r − 1)·(c − 1) for the counts of its row and column,
/// among the entries within a threshold of the largest of their column (threshold partial pivoting),
/// searched over the few sparsest columns. So one choice is both the fill-reducing ordering and the
/// numerical pivoting, which the MNA needs: its constraint rows have zeros on the diagonal.
/// The factors are kept as the steps of the elimination: A[r_k, c_k] = (L·U)[k, k] in step order.
/// A step whose column holds nothing but zeros gets a zero pivot: the matrix is singular, and
/// <see cref="Solve"/> stands a tiny value in for it, which is what inverse iteration wants.
/// </summary>
internal sealed class SparseLu
{
    /// <summary>A pivot must be at least this fraction of the largest entry of its column.</summary>
    private const double Threshold = 0.1;

    /// <summary>
    /// A kept pivot may fall to this fraction of the largest entry of its column before a
    /// refactorisation is refused: looser than <see cref="Threshold"/>, so that other values of the
    /// same network keep their pivot order (a load from 20 Ω to 7 Ω on the twenty sections takes a
    /// multiplier from 6 to 17), tight enough that the factors' growth stays bounded; a thousandth is
    /// the relative pivot tolerance circuit solvers commonly use (common practice). The solver checks
    /// the residual besides (<see cref="SparseFactors.Sound"/>).
    /// </summary>
    private const double RefactorThreshold = 1e-3;

    /// <summary>How many of the sparsest columns the pivot search looks at.</summary>
    private const int SearchColumns = 4;

    private readonly int n;
    private readonly int[] pivotRow, pivotColumn;
    private readonly Complex[] pivot;
    private readonly int[] lowerStart, lowerRow, upperStart, upperColumn;
    private readonly Complex[] lowerValue, upperValue;

    public double SmallestPivot { get; }
    public double LargestPivot { get; }

    /// <summary>The entries of L and U together (without U's diagonal): the fill shows here.</summary>
    public int Entries => lowerRow.Length + upperColumn.Length;

    /// <summary>A refactorisation: the pivot order and fill pattern of <paramref name="symbolic"/> with new values.</summary>
    private SparseLu(SparseLu symbolic, Complex[] pivot, Complex[] lowerValue, Complex[] upperValue)
    {
        (n, pivotRow, pivotColumn, lowerStart, lowerRow, upperStart, upperColumn) =
            (symbolic.n, symbolic.pivotRow, symbolic.pivotColumn, symbolic.lowerStart, symbolic.lowerRow, symbolic.upperStart, symbolic.upperColumn);
        (this.pivot, this.lowerValue, this.upperValue, byRow) = (pivot, lowerValue, upperValue, symbolic.byRow);
        (SmallestPivot, LargestPivot) = PivotRange(pivot);
    }

    private static (double Smallest, double Largest) PivotRange(Complex[] pivot)
    {
        if (pivot.Length == 0) return (0, 0);
        double smallest = double.PositiveInfinity, largest = 0;
        foreach (var p in pivot) (smallest, largest) = (Math.Min(smallest, p.Magnitude), Math.Max(largest, p.Magnitude));
        return (smallest, largest);
    }

    private SparseLu(int n, int[] pivotRow, int[] pivotColumn, Complex[] pivot, List<int> lowerStart, List<(int, Complex)> lower,
        List<int> upperStart, List<(int, Complex)> upper)
    {
        this.n = n;
        this.pivotRow = pivotRow;
        this.pivotColumn = pivotColumn;
        this.pivot = pivot;
        this.lowerStart = [.. lowerStart];
        this.upperStart = [.. upperStart];
        lowerRow = [.. lower.Select(e => e.Item1)];
        lowerValue = [.. lower.Select(e => e.Item2)];
        upperColumn = [.. upper.Select(e => e.Item1)];
        upperValue = [.. upper.Select(e => e.Item2)];
        (SmallestPivot, LargestPivot) = PivotRange(pivot);
    }

    public static SparseLu Factor(SparseRows a)
    {
        var n = a.Size;
        var rows = new Dictionary<int, Complex>[n];
        var columns = new HashSet<int>[n];
        for (var j = 0; j < n; j++) columns[j] = [];
        for (var i = 0; i < n; i++)
        {
            rows[i] = new Dictionary<int, Complex>(a.Start[i + 1] - a.Start[i]);
            for (var e = a.Start[i]; e < a.Start[i + 1]; e++)
            {
                rows[i][a.Column[e]] = a.Value[e];
                columns[a.Column[e]].Add(i);
            }
        }
        var rowDone = new bool[n];
        var columnDone = new bool[n];
        var (pivotRow, pivotColumn, pivot) = (new int[n], new int[n], new Complex[n]);
        var (lowerStart, upperStart) = (new List<int> { 0 }, new List<int> { 0 });
        var (lower, upper) = (new List<(int, Complex)>(), new List<(int, Complex)>());
        var candidates = new int[SearchColumns];
        for (var k = 0; k < n; k++)
        {
            var (r, c) = ChoosePivot(rows, columns, columnDone, rowDone, candidates);
            var p = rows[r].GetValueOrDefault(c);
            (pivotRow[k], pivotColumn[k], pivot[k]) = (r, c, p);
            var pivotEntries = rows[r];
            foreach (var (j, v) in pivotEntries)
                if (j != c) upper.Add((j, v));
            upperStart.Add(upper.Count);
            foreach (var i in columns[c])
            {
                if (i == r) continue;
                var row = rows[i];
                var l = p == Complex.Zero ? Complex.Zero : row[c] / p;
                row.Remove(c);
                if (l == Complex.Zero) continue;
                lower.Add((i, l));
                foreach (var (j, v) in pivotEntries)
                {
                    if (j == c) continue;
                    if (row.TryGetValue(j, out var old)) row[j] = old - l * v;
                    else
                    {
                        row[j] = -l * v;
                        columns[j].Add(i);
                    }
                }
            }
            lowerStart.Add(lower.Count);
            foreach (var j in pivotEntries.Keys) columns[j].Remove(r);
            columns[c].Clear();
            (rowDone[r], columnDone[c]) = (true, true);
        }
        return new SparseLu(n, pivotRow, pivotColumn, pivot, lowerStart, lower, upperStart, upper);
    }

    /// <summary>The least-fill entry that passes the threshold, among the sparsest columns; larger magnitude breaks ties.</summary>
    private static (int Row, int Column) ChoosePivot(Dictionary<int, Complex>[] rows, HashSet<int>[] columns, bool[] columnDone, bool[] rowDone, int[] candidates)
    {
        var found = 0;
        for (var j = 0; j < columns.Length; j++)
        {
            if (columnDone[j]) continue;
            // Insertion into the short list of the sparsest columns so far, the last dropping out when full.
            var count = columns[j].Count;
            if (found == candidates.Length && count >= columns[candidates[^1]].Count) continue;
            var at = found < candidates.Length ? found++ : candidates.Length - 1;
            for (; at > 0 && columns[candidates[at - 1]].Count > count; at--) candidates[at] = candidates[at - 1];
            candidates[at] = j;
        }
        int bestRow = -1, bestColumn = candidates[0];
        long bestCost = long.MaxValue;
        double bestSize = 0;
        for (var t = 0; t < found; t++)
        {
            var j = candidates[t];
            double max = 0;
            foreach (var i in columns[j]) max = Math.Max(max, rows[i][j].Magnitude);
            if (max == 0) continue;
            foreach (var i in columns[j])
            {
                var size = rows[i][j].Magnitude;
                if (size < Threshold * max) continue;
                var cost = (long)(rows[i].Count - 1) * (columns[j].Count - 1);
                if (cost < bestCost || (cost == bestCost && size > bestSize)) (bestRow, bestColumn, bestCost, bestSize) = (i, j, cost, size);
            }
        }
        if (bestRow >= 0) return (bestRow, bestColumn);
        // Only zeros left in the sparsest columns: a zero pivot, in a row of that column or any row left.
        foreach (var i in columns[bestColumn]) return (i, bestColumn);
        for (var i = 0; i < rowDone.Length; i++)
            if (!rowDone[i]) return (i, bestColumn);
        throw new InvalidOperationException("no row left for a pivot");
    }

    /// <summary>
    /// The lower factor's entries by the row they eliminate, in step order: for the step whose pivot
    /// row is that row, the entries from <c>Start[k]</c> to <c>Start[k + 1]</c> of <c>Entry</c> (an
    /// index into the lower factor) and <c>Step</c> (the step that made it). Found once, on the first refactorisation.
    /// </summary>
    private sealed record RowIndex(int[] Start, int[] Entry, int[] Step);

    private RowIndex? byRow;

    private RowIndex ByRow()
    {
        if (byRow is { } found) return found;
        var stepOfRow = new int[n];
        for (var k = 0; k < n; k++) stepOfRow[pivotRow[k]] = k;
        var start = new int[n + 1];
        foreach (var r in lowerRow) start[stepOfRow[r] + 1]++;
        for (var k = 0; k < n; k++) start[k + 1] += start[k];
        var (entry, step, fill) = (new int[lowerRow.Length], new int[lowerRow.Length], (int[])start.Clone());
        // The lower factor is kept by step, so each row's entries come in step order.
        for (var j = 0; j < n; j++)
            for (var e = lowerStart[j]; e < lowerStart[j + 1]; e++)
            {
                var at = fill[stepOfRow[lowerRow[e]]]++;
                (entry[at], step[at]) = (e, j);
            }
        return byRow = new RowIndex(start, entry, step);
    }

    /// <summary>
    /// The LU of <paramref name="a"/> with this factorisation's pivots and fill pattern: the numerical
    /// work alone, row by row (each pivot row, in step order, reduced by the earlier steps' upper rows),
    /// into arrays laid out already. Null where it would not do: an entry of <paramref name="a"/> or of
    /// its fill outside the pattern, a multiplier above 1 / <see cref="RefactorThreshold"/> (a pivot
    /// below that fraction of its column, the test <see cref="Factor"/> makes with
    /// <see cref="Threshold"/>: so the factors' growth stays bounded), or a zero or non-finite pivot.
    /// The caller then factors afresh.
    /// </summary>
    public SparseLu? Refactor(SparseRows a)
    {
        if (a.Size != n) return null;
        var index = ByRow();
        var (work, mark) = (new Complex[n], new int[n]);
        var (newPivot, lower, upper) = (new Complex[n], new Complex[lowerRow.Length], new Complex[upperColumn.Length]);
        const double largestMultiplier = 1 / RefactorThreshold;
        for (var k = 0; k < n; k++)
        {
            var r = pivotRow[k];
            var stamp = k + 1;
            // The places this row holds at its step: the columns its earlier steps eliminate, its pivot, its upper row.
            for (var t = index.Start[k]; t < index.Start[k + 1]; t++) mark[pivotColumn[index.Step[t]]] = stamp;
            mark[pivotColumn[k]] = stamp;
            for (var u = upperStart[k]; u < upperStart[k + 1]; u++) mark[upperColumn[u]] = stamp;
            for (var e = a.Start[r]; e < a.Start[r + 1]; e++)
            {
                if (mark[a.Column[e]] != stamp) return null;
                work[a.Column[e]] = a.Value[e];
            }
            for (var t = index.Start[k]; t < index.Start[k + 1]; t++)
            {
                var j = index.Step[t];
                var c = pivotColumn[j];
                var l = work[c] / newPivot[j];
                work[c] = Complex.Zero;
                if (!(l.Magnitude <= largestMultiplier)) return null;
                lower[index.Entry[t]] = l;
                if (l == Complex.Zero) continue;
                for (var u = upperStart[j]; u < upperStart[j + 1]; u++)
                {
                    var column = upperColumn[u];
                    if (mark[column] != stamp) return null;
                    work[column] -= l * upper[u];
                }
            }
            var p = work[pivotColumn[k]];
            work[pivotColumn[k]] = Complex.Zero;
            if (p == Complex.Zero || !double.IsFinite(p.Real) || !double.IsFinite(p.Imaginary)) return null;
            newPivot[k] = p;
            for (var u = upperStart[k]; u < upperStart[k + 1]; u++)
            {
                upper[u] = work[upperColumn[u]];
                work[upperColumn[u]] = Complex.Zero;
            }
        }
        return new SparseLu(this, newPivot, lower, upper);
    }

    /// <summary>Whether <paramref name="a"/> has the nonzero pattern of <paramref name="b"/>.</summary>
    public static bool SamePattern(SparseRows a, SparseRows b) =>
        a.Size == b.Size && a.Start.AsSpan().SequenceEqual(b.Start) && a.Column.AsSpan().SequenceEqual(b.Column);

    /// <summary>A zero pivot is taken as this small a value, so a singular matrix still yields its null direction.</summary>
    private Complex Pivot(int k) => pivot[k] == Complex.Zero ? 1e-18 * Math.Max(LargestPivot, 1) : pivot[k];

    /// <summary>x with A·x = b.</summary>
    public Complex[] Solve(Complex[] b)
    {
        var x = new Complex[n];
        Solve(b, x, new Complex[n]);
        return x;
    }

    /// <summary>The same into <paramref name="x"/>, with <paramref name="work"/> (both of the matrix's size) as scratch: no allocation.</summary>
    public void Solve(ReadOnlySpan<Complex> b, Span<Complex> x, Span<Complex> work)
    {
        b.CopyTo(work);
        for (var k = 0; k < n; k++)
        {
            var t = work[pivotRow[k]];
            if (t == Complex.Zero) continue;
            for (var e = lowerStart[k]; e < lowerStart[k + 1]; e++) work[lowerRow[e]] -= lowerValue[e] * t;
        }
        for (var k = n - 1; k >= 0; k--)
        {
            var sum = work[pivotRow[k]];
            for (var e = upperStart[k]; e < upperStart[k + 1]; e++) sum -= upperValue[e] * x[upperColumn[e]];
            x[pivotColumn[k]] = sum / Pivot(k);
        }
    }

    /// <summary>y with Aᴴ·y = b: Uᴴ forward by columns, then Lᴴ backward by rows.</summary>
    public Complex[] SolveAdjoint(Complex[] b)
    {
        var w = (Complex[])b.Clone();
        var z = new Complex[n];
        for (var k = 0; k < n; k++)
        {
            var t = w[pivotColumn[k]] / Complex.Conjugate(Pivot(k));
            z[k] = t;
            if (t == Complex.Zero) continue;
            for (var e = upperStart[k]; e < upperStart[k + 1]; e++) w[upperColumn[e]] -= Complex.Conjugate(upperValue[e]) * t;
        }
        var y = new Complex[n];
        for (var k = n - 1; k >= 0; k--)
        {
            var sum = z[k];
            for (var e = lowerStart[k]; e < lowerStart[k + 1]; e++) sum -= Complex.Conjugate(lowerValue[e]) * y[lowerRow[e]];
            y[pivotRow[k]] = sum;
        }
        return y;
    }
}

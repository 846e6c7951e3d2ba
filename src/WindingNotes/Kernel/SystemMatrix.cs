using System.Numerics;

namespace WindingNotes.Kernel;

/// <summary>
/// The square complex matrix of a system, kept as it is stamped: by rows, each the columns it has
/// entries in (ascending) and their values. A network's system has a few entries a row, so
/// assembly, equilibration, the sparse LU and the residual never touch its zeros, and a system of
/// 600 unknowns takes kilobytes instead of the 5.8 MB of a dense matrix. An entry once stamped keeps
/// its place when <see cref="Clear"/> sets the values to zero, so a matrix stamped again with other
/// numbers (a brush moved) has the same entries or more. An assembled system's matrix is frozen
/// (<see cref="Freeze"/>): changing it throws, and a <see cref="Clone"/> is the caller's to change.
/// </summary>
internal sealed class SystemMatrix
{
    private readonly int[][] columns;
    private readonly Complex[][] values;
    private readonly int[] counts;

    /// <summary>Per row, the place after the entry <see cref="Add"/> last reached: stamps mostly go along a row.</summary>
    private readonly int[] next;

    public SystemMatrix(int size)
    {
        Size = size;
        columns = new int[size][];
        values = new Complex[size][];
        counts = new int[size];
        next = new int[size];
        for (var i = 0; i < size; i++) (columns[i], values[i]) = ([], []);
    }

    private SystemMatrix(SystemMatrix other)
    {
        Size = other.Size;
        columns = new int[Size][];
        values = new Complex[Size][];
        for (var i = 0; i < Size; i++) (columns[i], values[i]) = ((int[])other.columns[i].Clone(), (Complex[])other.values[i].Clone());
        counts = (int[])other.counts.Clone();
        next = new int[Size];
    }

    public int Size { get; }

    private bool frozen;

    /// <summary>From now on the matrix is read only.</summary>
    public void Freeze() => frozen = true;

    private void CheckWritable()
    {
        if (frozen) throw new InvalidOperationException("an assembled system's matrix is read only: change a clone");
    }

    /// <summary>The columns of the entries of <paramref name="row"/>, ascending.</summary>
    public ReadOnlySpan<int> Columns(int row) => columns[row].AsSpan(0, counts[row]);

    /// <summary>The values of the entries of <paramref name="row"/>, in the order of <see cref="Columns"/>; some may be zero.</summary>
    public ReadOnlySpan<Complex> Values(int row) => values[row].AsSpan(0, counts[row]);

    public Complex this[int row, int column]
    {
        get
        {
            var at = Array.BinarySearch(columns[row], 0, counts[row], column);
            return at >= 0 ? values[row][at] : Complex.Zero;
        }
        set
        {
            CheckWritable();
            var at = Array.BinarySearch(columns[row], 0, counts[row], column);
            if (at < 0) at = Insert(row, ~at, column);
            values[row][at] = value;
        }
    }

    /// <summary>Adds to an entry, finding its place once (the stamps' <c>+=</c>).</summary>
    public void Add(int row, int column, Complex value)
    {
        CheckWritable();
        var at = next[row];
        if (at >= counts[row] || columns[row][at] != column)
        {
            at = Array.BinarySearch(columns[row], 0, counts[row], column);
            if (at < 0) at = Insert(row, ~at, column);
        }
        values[row][at] += value;
        next[row] = at + 1;
    }

    private int Insert(int row, int at, int column)
    {
        var count = counts[row];
        if (count == columns[row].Length)
        {
            // Eight at first: a section's row has its two nodes, its core and the core's other sections, so four was outgrown at once.
            var capacity = Math.Max(8, 2 * count);
            Array.Resize(ref columns[row], capacity);
            Array.Resize(ref values[row], capacity);
        }
        Array.Copy(columns[row], at, columns[row], at + 1, count - at);
        Array.Copy(values[row], at, values[row], at + 1, count - at);
        columns[row][at] = column;
        values[row][at] = Complex.Zero;
        counts[row] = count + 1;
        return at;
    }

    /// <summary>Every value zero; the entries keep their places.</summary>
    public void Clear()
    {
        CheckWritable();
        for (var i = 0; i < Size; i++) Array.Clear(values[i], 0, counts[i]);
    }

    public SystemMatrix Clone() => new(this);

    /// <summary>The number of entries, zeros among them.</summary>
    public int Entries => counts.Sum();
}

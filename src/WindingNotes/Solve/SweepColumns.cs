using System.Collections.Immutable;
using WindingNotes.Kernel;

namespace WindingNotes.Solve;

/// <summary>
/// One result of a sweep (a number of <see cref="CaseValues"/>, by its path in the JSON report):
/// its value at each kept point, NaN where that point does not have it (a section a brush has moved
/// past), and its least and greatest over every point solved, kept or not, with the first point
/// each occurs at ("BR=25 %").
/// </summary>
public sealed record SweepColumn(string Path, string Unit, ImmutableArray<double> Values, double Min, string AtMin, double Max, string AtMax);

/// <summary>
/// A sweep's results in columns: the swept values of the points kept (the same points as the
/// study's kept sweep cases, <see cref="KeptPoints"/>), one array per result over them, and the
/// reductions over every point solved. What a plot or a range reads, without a case's records.
/// </summary>
public sealed record SweepColumns(long Solved, ImmutableArray<ImmutableArray<SweepValue>> Points, ImmutableArray<SweepColumn> Columns)
{
    /// <summary>The column of a path, or null where no point had it.</summary>
    public SweepColumn? this[string path] => Columns.FirstOrDefault(c => c.Path == path);
}

/// <summary>
/// Fills <see cref="SweepColumns"/> as the points are solved, in increasing order: every point goes
/// into the reductions; the points kept follow <see cref="KeptPoints"/>' rule (every one up to the
/// capacity, then every second one let go as the step doubles, and the last point solved), so the
/// columns and the kept cases are the same points.
/// </summary>
internal sealed class SweepColumnsBuilder(int capacity) : CaseValues.ISink
{
    private readonly List<(string Path, string Unit, double Min, string AtMin, double Max, string AtMax)> reductions = [];
    private readonly List<long> keptK = [];
    private readonly List<ImmutableArray<SweepValue>> keptLabels = [];
    // One array per result, a value per kept point; a result first seen after some points were kept is NaN at those.
    private readonly List<List<double>> columns = [];
    private (long K, ImmutableArray<SweepValue> Labels) last = (-1, []);
    private double[] lastValues = [];
    private long stride = 1;
    private long solved;
    private double[] row = [];
    // Each path's column found by its parts ("loads", "heater", "v", "rms"), so a point's numbers are placed without writing a path out.
    private readonly Node root = new("");
    private readonly List<Node> stack = [];
    private ImmutableArray<SweepValue> labels = [];
    private string? where;

    private sealed class Node(string path)
    {
        public readonly string Path = path;
        public readonly Dictionary<string, Node> Parts = new(StringComparer.Ordinal);
        public int Column = -1;
    }

    /// <summary>Point <paramref name="k"/> of the sweep, solved, with its swept values and results.</summary>
    public void Add(long k, ImmutableArray<SweepValue> labels, CaseResult c)
    {
        solved++;
        (this.labels, where) = (labels, null);
        Array.Fill(row, double.NaN);
        stack.Clear();
        stack.Add(root);
        CaseValues.Walk(c, this);
        last = (k, labels);
        if (lastValues.Length != row.Length) lastValues = new double[row.Length];
        row.CopyTo(lastValues, 0);
        if (k % stride != 0) return;
        Keep(labels, k, row);
        if (keptK.Count <= capacity) return;
        stride *= 2;
        var keep = keptK.Select(x => x % stride == 0).ToArray();
        Thin(keptK, keep);
        Thin(keptLabels, keep);
        foreach (var column in columns) Thin(column, keep);
    }

    void CaseValues.ISink.Enter(string part)
    {
        var at = stack[^1];
        if (!at.Parts.TryGetValue(part, out var next)) at.Parts[part] = next = new Node(at == root ? part : $"{at.Path}.{part}");
        stack.Add(next);
    }

    void CaseValues.ISink.Leave() => stack.RemoveAt(stack.Count - 1);

    void CaseValues.ISink.Here(double value, string unit)
    {
        var node = stack[^1];
        if (node.Column < 0)
        {
            node.Column = reductions.Count;
            reductions.Add((node.Path, unit, double.NaN, "", double.NaN, ""));
            columns.Add([.. Enumerable.Repeat(double.NaN, keptK.Count)]);
            Array.Resize(ref row, reductions.Count);
            row[node.Column] = double.NaN;
        }
        var i = node.Column;
        // The first value of a path at a point is the one reports show.
        if (!double.IsNaN(row[i])) return;
        row[i] = value;
        if (double.IsNaN(value)) return;
        var r = reductions[i];
        // The point's name is written once, and only where it holds a least or greatest so far.
        if (!(value >= r.Min)) r = r with { Min = value, AtMin = where ??= string.Join(" ", labels) };
        if (!(value <= r.Max)) r = r with { Max = value, AtMax = where ??= string.Join(" ", labels) };
        reductions[i] = r;
    }

    public SweepColumns Finish()
    {
        var labels = keptLabels.ToList();
        var values = columns.Select(c => c.ToList()).ToList();
        if (last.K >= 0 && (keptK.Count == 0 || keptK[^1] != last.K))
        {
            labels.Add(last.Labels);
            for (var i = 0; i < values.Count; i++) values[i].Add(i < lastValues.Length ? lastValues[i] : double.NaN);
        }
        return new SweepColumns(solved, [.. labels],
            [.. reductions.Select((r, i) => new SweepColumn(r.Path, r.Unit, [.. values[i]], r.Min, r.AtMin, r.Max, r.AtMax))]);
    }

    private void Keep(ImmutableArray<SweepValue> labels, long k, double[] values)
    {
        keptK.Add(k);
        keptLabels.Add(labels);
        for (var i = 0; i < columns.Count; i++) columns[i].Add(values[i]);
    }

    private static void Thin<T>(List<T> list, bool[] keep)
    {
        var n = 0;
        for (var i = 0; i < list.Count; i++)
            if (keep[i]) list[n++] = list[i];
        list.RemoveRange(n, list.Count - n);
    }
}

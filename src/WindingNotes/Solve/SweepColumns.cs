using System.Collections.Immutable;
using System.Numerics;
using System.Runtime.InteropServices;
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
/// A sweep's results in columns: the swept values of the points kept (every one up to the
/// capacity, <see cref="Sweeps.KeptFor"/>, then evenly thinned, with the last point solved), every
/// leaf the JSON report writes of each kept point (<see cref="Walk"/>) and its bands, and the banded
/// numbers as <see cref="Columns"/> with their reductions over every point solved. No case of a
/// point is kept: what the tables, the JSON report, the diff and the plot read is here.
/// </summary>
public sealed record SweepColumns(long Solved, ImmutableArray<ImmutableArray<SweepValue>> Points, ImmutableArray<SweepColumn> Columns)
{
    /// <summary>The column of a path, or null where no point had it.</summary>
    public SweepColumn? this[string path] => Columns.FirstOrDefault(c => c.Path == path);

    internal SweepLeaves Leaves { get; init; } = SweepLeaves.None;

    /// <summary>How many points are kept.</summary>
    public int Count => Points.Length;

    /// <summary>The case's name of kept point <paramref name="point"/> ("sweep BR=25 %").</summary>
    public string Name(int point) => CaseSpec.ForSweep(Points[point]).Name;

    /// <summary>Every leaf of kept point <paramref name="point"/>, told as <see cref="CaseLeaves.Walk"/> told them of its case (with the sweep tables' own values where <paramref name="shown"/>).</summary>
    public void Walk(int point, ICaseLeaves sink, bool shown = false) => Leaves.Walk(point, sink, shown);

    /// <summary>The bands of kept point <paramref name="point"/>, where the study kept bands at sweep points.</summary>
    public ImmutableArray<Band> Bands(int point) => Leaves.Bands(point);
}

/// <summary>What a leaf of a kept point is; the shape of a point says which leaves it has, in order.</summary>
internal enum LeafKind : byte { Object, Array, Number, Null, Integer, Word, Boolean, Phasor }

/// <summary>
/// The leaves of the kept points, one array per leaf over the points: numbers (integers and
/// booleans too) as doubles, phasors as complex numbers, words as shared strings. Each point has a
/// shape, the leaves it has in order (a node's index, -1 closing an object or array), shared by
/// the points of one shape, so a point's JSON is given back byte for byte.
/// </summary>
internal sealed class SweepLeaves
{
    public static readonly SweepLeaves None = new([], [], [], [], [], [], [], [], []);

    private readonly SweepLeavesNode[] nodes;
    private readonly int[][] shapes;
    private readonly double[][] numbers;
    private readonly Complex[][] phasors;
    private readonly string?[][] words;
    private readonly (string Path, string Unit)[] bandPaths;
    private readonly int[][] bandShapes;
    private readonly double[][] bandMin;
    private readonly double[][] bandMax;

    internal SweepLeaves(SweepLeavesNode[] nodes, int[][] shapes, double[][] numbers, Complex[][] phasors, string?[][] words,
        (string, string)[] bandPaths, int[][] bandShapes, double[][] bandMin, double[][] bandMax)
    {
        (this.nodes, this.shapes, this.numbers, this.phasors, this.words) = (nodes, shapes, numbers, phasors, words);
        (this.bandPaths, this.bandShapes, this.bandMin, this.bandMax) = (bandPaths, bandShapes, bandMin, bandMax);
    }

    public void Walk(int point, ICaseLeaves sink, bool shown)
    {
        foreach (var id in shapes[point])
        {
            if (id < 0)
            {
                sink.Close();
                continue;
            }
            var n = nodes[id];
            if (n.IsShown && !shown) continue;
            switch (n.Kind)
            {
                case LeafKind.Object or LeafKind.Array: sink.Open(n.Key, n.Kind == LeafKind.Array); break;
                case LeafKind.Number: sink.Number(n.Key, n.Field!, numbers[n.Column][point]); break;
                case LeafKind.Null: sink.Null(n.Key, n.Field!); break;
                case LeafKind.Integer: sink.Integer(n.Key, n.Field!, (int)numbers[n.Column][point]); break;
                case LeafKind.Boolean: sink.Boolean(n.Key, n.Field!, numbers[n.Column][point] != 0); break;
                case LeafKind.Word: sink.Word(n.Key, n.Field!, words[n.Column][point]!); break;
                case LeafKind.Phasor: sink.Phasor(n.Key, n.Field!, phasors[n.Column][point]); break;
            }
        }
    }

    public ImmutableArray<Band> Bands(int point) =>
        point < bandShapes.Length ? [.. bandShapes[point].Select(b => new Band(bandPaths[b].Path, bandPaths[b].Unit, bandMin[b][point], bandMax[b][point]))] : [];

    /// <summary>A banded number's values over the kept points (a phasor's rms), NaN where a point lacks it.</summary>
    public double[] Values(SweepLeavesNode n) => n.Kind == LeafKind.Phasor
        ? [.. phasors[n.Column].Select(v => double.IsNaN(v.Real) ? double.NaN : v.Magnitude)]
        : numbers[n.Column];
}

/// <summary>A leaf or an object of a point, by the keys from the case's root; a key met twice at one point (two elements of one name) is its twin.</summary>
internal sealed class SweepLeavesNode(int id, string key, LeafKind kind, string path, ResultField? field, bool twin)
{
    public readonly int Id = id;
    public readonly string Key = key;
    public readonly LeafKind Kind = kind;
    public readonly string Path = path;
    public readonly ResultField? Field = field;
    /// <summary>A second leaf of one path at a point: kept and written, but the first is the one reduced (as reports show it).</summary>
    public readonly bool IsTwin = twin;
    /// <summary>A sweep table's own value (<see cref="CaseLeaves.IsShown"/>): not written in the JSON report.</summary>
    public readonly bool IsShown = CaseLeaves.IsShown(key);
    public Dictionary<(string, LeafKind), SweepLeavesNode>? Children;
    public SweepLeavesNode? Twin;
    /// <summary>The object or array holding it (null at the root), and for a twin the node it is the twin of.</summary>
    public SweepLeavesNode? Parent, Before;
    public int Column = -1;
    public int Reduction = -1;
    public long Seen = -1;
}

/// <summary>
/// Fills <see cref="SweepColumns"/> as the points are solved, in increasing order: every point goes
/// into the reductions (its banded leaves only); a point to be kept (every one up to the capacity,
/// then every second one let go as the step doubles, and the last point solved) is walked whole
/// into the columns. The last point solved, when not kept at its step, is walked at <see cref="Finish"/>:
/// only its case is held meanwhile, until the next point replaces it.
/// </summary>
internal sealed class SweepColumnsBuilder(int capacity, long expected = 0) : ICaseLeaves
{
    /// <summary>Each column's room, made once: the points kept at most (all of a short sweep), not grown by doubling as they come.</summary>
    private readonly int room = (int)Math.Min(Math.Max(expected, 0), capacity + 2L);

    private readonly List<(SweepLeavesNode Node, string Unit, double Min, string AtMin, double Max, string AtMax)> reductions = [];
    private readonly List<long> keptK = [];
    private readonly List<ImmutableArray<SweepValue>> keptLabels = [];
    private readonly List<int[]> keptShapes = [];
    private readonly List<int[]> keptBandShapes = [];
    private readonly List<List<double>> numbers = [];
    private readonly List<List<Complex>> phasors = [];
    private readonly List<List<string?>> words = [];
    private readonly List<List<double>> bandMin = [];
    private readonly List<List<double>> bandMax = [];
    private readonly List<(string Path, string Unit)> bandPaths = [];
    private readonly Dictionary<string, int> bandIndex = new(StringComparer.Ordinal);
    private readonly Dictionary<int[], int[]> shapesSeen = new(new ShapeComparer());
    private readonly Dictionary<string, string> wordsSeen = new(StringComparer.Ordinal);
    private readonly List<SweepLeavesNode> nodes = [];
    private (long K, ImmutableArray<SweepValue> Labels, CaseResult Case, ImmutableArray<Band> Bands)? pending;
    private long stride = 1;
    private long solved;
    private long stamp;
    private bool whole;
    private bool reducing;
    private double[] numberRow = [];
    private Complex[] phasorRow = [];
    private string?[] wordRow = [];
    private readonly List<int> shape = [];
    private readonly SweepLeavesNode root = new(-1, "", LeafKind.Object, "", null, false);
    private readonly List<SweepLeavesNode> stack = [];
    /// <summary>The nodes the last walk of each kind (banded, whole) met, in order: a point is most often told as the one before.</summary>
    private readonly List<SweepLeavesNode>[] trails = [[], []];
    private List<SweepLeavesNode> trail = [];
    private int step;
    private ImmutableArray<SweepValue> labels = [];
    private string? where;

    /// <summary>One point kept in every so many.</summary>
    public long Stride => stride;

    /// <summary>The points given, kept or not.</summary>
    public long Solved => solved;

    /// <summary>The points kept so far, with the last one given.</summary>
    public int Count => keptK.Count + (pending is null ? 0 : 1);

    /// <summary>Point <paramref name="k"/> of the sweep, solved, with its swept values, results and bands (where kept at sweep points).</summary>
    public void Add(long k, ImmutableArray<SweepValue> labels, CaseResult c, ImmutableArray<Band> bands = default)
    {
        solved++;
        (this.labels, where) = (labels, null);
        var keep = k % stride == 0;
        pending = keep ? null : (k, labels, c, bands);
        Visit(c, whole: keep, reduce: true);
        if (!keep) return;
        Keep(k, labels, bands);
        if (keptK.Count <= capacity) return;
        stride *= 2;
        var mask = keptK.Select(x => x % stride == 0).ToArray();
        Thin(keptK, mask);
        Thin(keptLabels, mask);
        Thin(keptShapes, mask);
        Thin(keptBandShapes, mask);
        foreach (var column in numbers) Thin(column, mask);
        foreach (var column in phasors) Thin(column, mask);
        foreach (var column in words) Thin(column, mask);
        foreach (var column in bandMin) Thin(column, mask);
        foreach (var column in bandMax) Thin(column, mask);
    }

    public SweepColumns Finish()
    {
        if (pending is { } last)
        {
            Visit(last.Case, whole: true, reduce: false);
            Keep(last.K, last.Labels, last.Bands);
            pending = null;
        }
        var leaves = new SweepLeaves([.. nodes], [.. keptShapes], [.. numbers.Select(c => c.ToArray())], [.. phasors.Select(c => c.ToArray())], [.. words.Select(c => c.ToArray())],
            [.. bandPaths], [.. keptBandShapes], [.. bandMin.Select(c => c.ToArray())], [.. bandMax.Select(c => c.ToArray())]);
        return new SweepColumns(solved, [.. keptLabels],
            [.. reductions.Select(r => new SweepColumn(r.Node.Kind == LeafKind.Phasor ? r.Node.Path + ".rms" : r.Node.Path, r.Unit, [.. leaves.Values(r.Node)], r.Min, r.AtMin, r.Max, r.AtMax))])
        { Leaves = leaves };
    }

    private void Visit(CaseResult c, bool whole, bool reduce)
    {
        (this.whole, reducing) = (whole, reduce);
        stamp++;
        stack.Clear();
        stack.Add(root);
        (trail, step) = (trails[whole ? 1 : 0], 0);
        if (whole)
        {
            shape.Clear();
            Array.Fill(numberRow, double.NaN);
            Array.Fill(phasorRow, new Complex(double.NaN, double.NaN));
            Array.Fill(wordRow, null);
        }
        CaseLeaves.Walk(c, this, banded: !whole, shown: whole);
    }

    private void Keep(long k, ImmutableArray<SweepValue> labels, ImmutableArray<Band> bands)
    {
        keptK.Add(k);
        keptLabels.Add(labels);
        // Most points have the shape of the one before: compared in place, an array is made only for a new shape.
        if (keptShapes.Count > 0 && CollectionsMarshal.AsSpan(shape).SequenceEqual(keptShapes[^1])) keptShapes.Add(keptShapes[^1]);
        else
        {
            var s = shape.ToArray();
            if (shapesSeen.TryGetValue(s, out var seen)) s = seen;
            else shapesSeen[s] = s;
            keptShapes.Add(s);
        }
        for (var i = 0; i < numbers.Count; i++) numbers[i].Add(numberRow[i]);
        for (var i = 0; i < phasors.Count; i++) phasors[i].Add(phasorRow[i]);
        for (var i = 0; i < words.Count; i++) words[i].Add(wordRow[i]);
        int[] ids = bands.IsDefault || bands.IsEmpty ? [] : new int[bands.Length];
        foreach (var column in bandMin) column.Add(double.NaN);
        foreach (var column in bandMax) column.Add(double.NaN);
        for (var b = 0; b < ids.Length; b++)
        {
            var band = bands[b];
            if (!bandIndex.TryGetValue(band.Path, out var i) || bandPaths[i].Unit != band.Unit)
            {
                bandIndex[band.Path] = i = bandPaths.Count;
                bandPaths.Add((band.Path, band.Unit));
                bandMin.Add([.. Enumerable.Repeat(double.NaN, keptK.Count)]);
                bandMax.Add([.. Enumerable.Repeat(double.NaN, keptK.Count)]);
            }
            ids[b] = i;
            bandMin[i][^1] = band.Min;
            bandMax[i][^1] = band.Max;
        }
        if (ids.Length > 0 && !shapesSeen.TryAdd(ids, ids)) ids = shapesSeen[ids];
        keptBandShapes.Add(ids);
    }

    /// <summary>The node of a key under the object open, or its twin where the point has met it already.</summary>
    private SweepLeavesNode Place(string key, LeafKind kind, ResultField? field)
    {
        var parent = stack[^1];
        SweepLeavesNode? node;
        // The node the last walk met at this step, where it is the one the look-up below would give:
        // of this key, kind and parent, not met yet at this point, and the first of its twins not met.
        if (step < trail.Count && trail[step] is var guess && guess.Parent == parent && guess.Kind == kind && guess.Seen != stamp
            && (guess.Before is null || guess.Before.Seen == stamp) && string.Equals(guess.Key, key, StringComparison.Ordinal))
            node = guess;
        else
        {
            parent.Children ??= [];
            if (!parent.Children.TryGetValue((key, kind), out node))
                parent.Children[(key, kind)] = node = New(key, kind, parent, field, parent.IsTwin);
            while (node.Seen == stamp)
            {
                if (node.Twin is null)
                {
                    node.Twin = New(key, kind, parent, field, true);
                    node.Twin.Before = node;
                }
                node = node.Twin;
            }
            if (step < trail.Count) trail[step] = node;
            else trail.Add(node);
        }
        step++;
        node.Seen = stamp;
        if (whole) shape.Add(node.Id);
        return node;
    }

    private SweepLeavesNode New(string key, LeafKind kind, SweepLeavesNode parent, ResultField? field, bool twin)
    {
        var node = new SweepLeavesNode(nodes.Count, key, kind, parent == root ? key : $"{parent.Path}.{key}", field, twin) { Parent = parent };
        nodes.Add(node);
        return node;
    }

    /// <summary>A column of a leaf's kind, NaN (or none) at the points kept before it was first met.</summary>
    private int Column(SweepLeavesNode n)
    {
        if (n.Column >= 0) return n.Column;
        switch (n.Kind)
        {
            case LeafKind.Phasor:
                n.Column = phasors.Count;
                phasors.Add(Fresh(new Complex(double.NaN, double.NaN)));
                Array.Resize(ref phasorRow, phasors.Count);
                phasorRow[^1] = new Complex(double.NaN, double.NaN);
                break;
            case LeafKind.Word:
                n.Column = words.Count;
                words.Add(Fresh<string?>(null));
                Array.Resize(ref wordRow, words.Count);
                break;
            default:
                n.Column = numbers.Count;
                numbers.Add(Fresh(double.NaN));
                Array.Resize(ref numberRow, numbers.Count);
                numberRow[^1] = double.NaN;
                break;
        }
        return n.Column;
    }

    void ICaseLeaves.Open(string key, bool array) => stack.Add(Place(key, array ? LeafKind.Array : LeafKind.Object, null));

    void ICaseLeaves.Close()
    {
        stack.RemoveAt(stack.Count - 1);
        if (whole) shape.Add(-1);
    }

    void ICaseLeaves.Number(string key, ResultField field, double value) => Number(Place(key, LeafKind.Number, field), field, value);

    void ICaseLeaves.Integer(string key, ResultField field, int value) => Number(Place(key, LeafKind.Integer, field), field, value);

    void ICaseLeaves.Boolean(string key, ResultField field, bool value) => Number(Place(key, LeafKind.Boolean, field), field, value ? 1 : 0);

    void ICaseLeaves.Null(string key, ResultField field) => Place(key, LeafKind.Null, field);

    void ICaseLeaves.Word(string key, ResultField field, string value)
    {
        var n = Place(key, LeafKind.Word, field);
        if (!whole) return;
        // A word of many points (a winding's name, a section's) is held once.
        if (!wordsSeen.TryGetValue(value, out var shared)) wordsSeen[value] = shared = value;
        var i = Column(n); // before the row: a new column replaces the row
        wordRow[i] = shared;
    }

    void ICaseLeaves.Phasor(string key, ResultField field, Complex value)
    {
        var n = Place(key, LeafKind.Phasor, field);
        if (whole)
        {
            var i = Column(n); // before the row: a new column replaces the row
            phasorRow[i] = value;
        }
        if (field.Band) Reduce(n, field, value.Magnitude);
    }

    private void Number(SweepLeavesNode n, ResultField field, double value)
    {
        if (whole)
        {
            var i = Column(n); // before the row: a new column replaces the row
            numberRow[i] = value;
        }
        if (field.Band) Reduce(n, field, value);
    }

    private void Reduce(SweepLeavesNode n, ResultField field, double value)
    {
        if (!reducing || n.IsTwin) return;
        if (n.Reduction < 0)
        {
            n.Reduction = reductions.Count;
            reductions.Add((n, field.Unit, double.NaN, "", double.NaN, ""));
            Column(n);
        }
        if (double.IsNaN(value)) return;
        var i = n.Reduction;
        var r = reductions[i];
        // The point's name is written once, and only where it holds a least or greatest so far.
        if (!(value >= r.Min)) r = r with { Min = value, AtMin = where ??= string.Join(" ", labels) };
        if (!(value <= r.Max)) r = r with { Max = value, AtMax = where ??= string.Join(" ", labels) };
        reductions[i] = r;
    }

    /// <summary>A new column: <paramref name="missing"/> at each point kept before it, with room for the points to come.</summary>
    private List<T> Fresh<T>(T missing)
    {
        var column = new List<T>(Math.Max(room, keptK.Count + 1));
        for (var i = 0; i < keptK.Count; i++) column.Add(missing);
        return column;
    }

    private static void Thin<T>(List<T> list, bool[] keep)
    {
        var n = 0;
        for (var i = 0; i < list.Count; i++)
            if (keep[i]) list[n++] = list[i];
        list.RemoveRange(n, list.Count - n);
    }

    /// <summary>Shapes compared by their leaves, so the points of one shape share one array.</summary>
    private sealed class ShapeComparer : IEqualityComparer<int[]>
    {
        public bool Equals(int[]? x, int[]? y) => x.AsSpan().SequenceEqual(y);

        public int GetHashCode(int[] shape)
        {
            var h = new HashCode();
            h.AddBytes(MemoryMarshal.AsBytes(shape.AsSpan()));
            return h.ToHashCode();
        }
    }
}

using WindingNotes.Editing;
using WindingNotes.Kernel;
using WindingNotes.Solve;
using WindingNotes.Tests.Analysis;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A sweep's results in columns: at each kept point the very numbers of that point's case (its
/// <see cref="CaseValues"/>), and each result's least and greatest over every point solved, where
/// each first occurs, whatever number of points is kept.
/// </summary>
public class SweepColumnTests
{
    public static TheoryData<string, string> Sweeps => new()
    {
        { "twenty sections, brush crossing nothing", BrushSweepTests.TwentySections() },
        { "variable autotransformer, brush crossing a tap", SweepTests.Variable("sweep BR from 0 % to 100 % step 2.5 %") },
        { "a grid of a brush and a let", SweepTests.Variable("sweep BR from 10 % to 90 % points 5\nsweep vin from 110 V to 130 V points 3") },
    };

    [Theory]
    [MemberData(nameof(Sweeps))]
    public void Each_kept_point_holds_its_case_numbers(string what, string text)
    {
        var e = Wn.Solved(text);
        var points = Wn.Points(e);
        var sweep = e.SweepColumns!;
        Assert.True(points.Count > 1, what);
        Assert.Equal(points.Count, sweep.Solved);
        Assert.Equal(points.Select(p => string.Join(" ", p.Case.Sweep)), sweep.Points.Select(p => string.Join(" ", p)));
        for (var i = 0; i < points.Count; i++)
        {
            var values = First(points[i]);
            foreach (var column in sweep.Columns)
                if (values.TryGetValue(column.Path, out var v)) Assert.Equal(v.Value, column.Values[i]);
                else Assert.True(double.IsNaN(column.Values[i]), $"{what}: {column.Path} at {points[i].Case.Where}");
            Assert.All(values.Keys, path => Assert.NotNull(sweep[path]));
        }
        // Every point is kept here: the reductions are those of the kept cases.
        foreach (var column in sweep.Columns) AssertExtremesOver(points, column);
    }

    /// <summary>The column's least and greatest, and the first point each occurs at, by a pass over every point.</summary>
    private static void AssertExtremesOver(IReadOnlyList<CaseResult> points, SweepColumn column)
    {
        var at = points.Select(p => (p.Case.Where, Value: First(p).TryGetValue(column.Path, out var v) ? v.Value : double.NaN)).Where(x => !double.IsNaN(x.Value)).ToList();
        Assert.Equal(at.Min(x => x.Value), column.Min);
        Assert.Equal(at.Max(x => x.Value), column.Max);
        Assert.Equal(at.First(x => x.Value == column.Min).Where, column.AtMin);
        Assert.Equal(at.First(x => x.Value == column.Max).Where, column.AtMax);
    }

    [Fact]
    public void The_least_and_greatest_cover_every_point_not_the_points_kept()
    {
        // 41 points fed with room for 4: one in every 16 is kept (0, 16, 32) and the last (40).
        var e = Wn.Solved(BrushSweepTests.TwentySections("sweep BR from 1 % to 99 % points 41"));
        var points = Wn.Points(e);
        var builder = new SweepColumnsBuilder(4);
        for (var k = 0; k < points.Count; k++) builder.Add(k, points[k].Case.Sweep, points[k]);
        var sweep = builder.Finish();
        Assert.Equal(41, sweep.Solved);
        Assert.Equal(["BR=1 %", "BR=40.2 %", "BR=79.4 %", "BR=99 %"], sweep.Points.Select(p => string.Join(" ", p)));
        var keptWhere = sweep.Points.Select(p => string.Join(" ", p)).ToHashSet();
        var elsewhere = 0;
        foreach (var column in sweep.Columns)
        {
            AssertExtremesOver(points, column);
            if (!keptWhere.Contains(column.AtMin) || !keptWhere.Contains(column.AtMax)) elsewhere++;
        }
        // The test bites: some results reach their least or greatest between the kept points.
        Assert.True(elsewhere > 0);
    }

    [Fact]
    public void The_sweep_lines_hint_is_the_range_over_every_point()
    {
        // 117 turns over the 100 fed at 120 V: the brush gives 120 V·(117/100)·x, 0 V at 0 %, 140.4 V at 100 %.
        var e = Wn.Solved(SweepTests.Variable("sweep BR from 0 % to 100 % step 10 %"));
        var v = e.SweepColumns!["loads.bench.v.rms"]!;
        Wn.Near(140.4, v.Max, 1e-9, "highest at the winding's end");
        Assert.Equal("BR=100 %", v.AtMax);
        Assert.True(v.Min < 1e-9);
        Assert.Equal("BR=0 %", v.AtMin);
        Assert.Contains(InlayHints.For(e), h => h.Label.StartsWith("11 points: bench ", StringComparison.Ordinal));
    }

    /// <summary>The sweeps above, and the examples with a sweep: tap changers (integers, words, a regulator's object), a core loss that is null, bands at the points.</summary>
    public static TheoryData<string, string> Leaves()
    {
        var data = new TheoryData<string, string>();
        foreach (var row in Sweeps) data.Add((string)row[0], (string)row[1]);
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").OrderBy(f => f))
            if (File.ReadAllText(file) is var text && text.Contains("\nsweep ", StringComparison.Ordinal)) data.Add(Path.GetFileName(file), text);
        return data;
    }

    [Theory]
    [MemberData(nameof(Leaves))]
    public void Each_kept_point_gives_back_every_leaf_of_its_case(string what, string text)
    {
        var e = Evaluator.Evaluate(text, what);
        var points = Wn.Points(e);
        Assert.DoesNotContain(e.Cases, c => c.Case.IsSweepPoint);
        var sweep = e.SweepColumns!;
        Assert.True(points.Count > 1, what);
        Assert.Equal(points.Count, sweep.Count);
        for (var i = 0; i < points.Count; i++)
        {
            var want = new Recorder();
            CaseLeaves.Walk(points[i], want);
            var got = new Recorder();
            sweep.Walk(i, got);
            Assert.Equal(want.Leaves, got.Leaves);
            Assert.Equal(points[i].Case.Name, sweep.Name(i));
            Assert.Equal(points[i].Bands.ToArray(), sweep.Bands(i).ToArray());
        }
    }

    /// <summary>Every leaf told, written out with its kind and its value's exact bits.</summary>
    private sealed class Recorder : ICaseLeaves
    {
        public List<string> Leaves { get; } = [];

        public void Open(string key, bool array) => Leaves.Add($"{(array ? "[" : "{")} {key}");

        public void Close() => Leaves.Add("}");

        public void Number(string key, ResultField field, double value) => Leaves.Add($"number {key} {field.Key} {BitConverter.DoubleToInt64Bits(value)}");

        public void Null(string key, ResultField field) => Leaves.Add($"null {key} {field.Key}");

        public void Integer(string key, ResultField field, int value) => Leaves.Add($"integer {key} {field.Key} {value}");

        public void Word(string key, ResultField field, string value) => Leaves.Add($"word {key} {field.Key} {value}");

        public void Boolean(string key, ResultField field, bool value) => Leaves.Add($"boolean {key} {field.Key} {value}");

        public void Phasor(string key, ResultField field, System.Numerics.Complex value) =>
            Leaves.Add($"phasor {key} {field.Key} {BitConverter.DoubleToInt64Bits(value.Real)} {BitConverter.DoubleToInt64Bits(value.Imaginary)}");
    }

    /// <summary>A case's numbers by path, the first of a path as reports show it.</summary>
    private static Dictionary<string, CaseValue> First(CaseResult c) =>
        CaseValues.Of(c).GroupBy(v => v.Path).ToDictionary(g => g.Key, g => g.First());
}

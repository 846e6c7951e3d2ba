using System.Text.Json;
using WindingNotes.Kernel;
using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Tests.Analysis;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// A long sweep stays small: the results of at most <see cref="Sweeps.Kept"/> points are kept, each
/// without its solver's vectors, while checks, ratings and cautions cover every point, and a check
/// names at most <see cref="CheckTally.Named"/> of the points it fails at but counts them all.
/// </summary>
[Trait("Category", "Long")]
public class LargeSweepTests
{
    [Fact]
    public void A_sweep_of_4001_points_keeps_every_second_and_checks_them_all()
    {
        // The bench variable autotransformer: 117 turns over 100, so the brush at k/4000 of the travel gives 140.4 V·k/4000.
        var e = Wn.Eval(SweepTests.Variable("sweep BR from 0 % to 100 % points 4001\nexpect voltage BR A below 70.2 V"));
        var d = e.Single("sweep-thinned");
        Assert.Equal("4,001 sweep points solved: checks, ratings and cautions cover every one; the results of 2,001 are kept, one point in every 2 and the last", d.Message);
        // No case of a point is kept: the columns hold the kept points; their reductions and the sweep line's hint cover all 4,001.
        Assert.DoesNotContain(e.Cases, c => c.Case.IsSweepPoint);
        var columns = e.SweepColumns!;
        Assert.Equal("sweep BR=0 %", columns.Name(0));
        Assert.Equal("sweep BR=100 %", columns.Name(columns.Count - 1));
        Assert.Equal(4001, columns.Solved);
        Assert.Equal(2001, columns.Points.Length);
        Wn.Near(140.4 * 2 / 4000, columns["loads.bench.v.rms"]!.Values[1], 1e-9, "the second kept point is the third of the sweep");
        Assert.Equal("BR=100 %", columns["loads.bench.v.rms"]!.AtMax);
        Assert.Contains(WindingNotes.Editing.InlayHints.For(e), h => h.Label.StartsWith("4001 points: bench ", StringComparison.Ordinal));

        // Above 70.2 V for k > 2000: 2,000 points fail, the first 1,000 are named, all are counted.
        var check = Assert.Single(e.Checks);
        Assert.Equal(4002, check.Points);
        Assert.Equal(2000, check.Failing);
        Assert.Equal(CheckTally.Named, check.Failures.Length);
        Assert.Equal("BR=50.025 %", check.Failures[0]);
        Wn.Near(140.4, check.Max!.Value, 1e-9, "highest over every point");
        Assert.Contains("fails at 2000 of 4002 points: BR=50.025 %", e.Single("expect-failed").Message);

        using var json = JsonDocument.Parse(JsonReport.Write(e));
        var written = json.RootElement.GetProperty("cases")[0].GetProperty("checks")[0];
        Assert.Equal(2000, written.GetProperty("failing").GetInt32());
        Assert.Equal(CheckTally.Named, written.GetProperty("failures").GetArrayLength());
        Assert.Contains("fails at 2000: BR=50.025 %", TextReport.Write(e));
    }

    [Fact]
    public void A_sweep_of_20001_points_keeps_an_evenly_spread_sixteenth_without_vectors()
    {
        var e = Wn.Eval(SweepTests.Variable("sweep BR from 0 % to 100 % points 20001\nexpect voltage BR A below 150 V"));
        Assert.Equal("20,001 sweep points solved: checks, ratings and cautions cover every one; the results of 1,251 are kept, one point in every 16 and the last",
            e.Single("sweep-thinned").Message);
        Assert.Equal(20_002, Assert.Single(e.Checks).Points);
        var columns = e.SweepColumns!;
        Assert.Equal(1251, columns.Count);
        Assert.DoesNotContain(e.Cases, c => c.Case.IsSweepPoint);
        // Point k of the sweep gives 140.4 V·k/20,000 at the bench: the kept ones are every sixteenth, the last one among them.
        var bench = columns["loads.bench.v.rms"]!.Values;
        for (var i = 1; i < columns.Count; i++)
            Wn.Near(140.4 * i * 16 / 20_000, bench[i], 1e-9, $"kept point {i}");
    }

    [Fact]
    public void Past_its_capacity_the_step_doubles_and_the_last_point_is_kept_besides()
    {
        var normal = Wn.Solved(SweepTests.Variable("")).Normal!;
        var kept = new SweepColumnsBuilder(4);
        for (var k = 0; k <= 20; k++) kept.Add(k, [new SweepValue("k", k, $"{k}")], normal);
        Assert.Equal(8, kept.Stride);
        Assert.Equal(21, kept.Solved);
        Assert.Equal(4, kept.Count);
        var columns = kept.Finish();
        Assert.Equal(["0", "8", "16", "20"], columns.Points.Select(p => p[0].Text));
    }

    [Fact]
    public void A_point_of_a_thousand_line_file_is_kept_less_often_than_one_of_a_bench_rig()
    {
        // Each point of a large network holds its own network and a result per element: fewer are kept.
        var large = Sweeps.KeptFor(Wn.Solved(ServerMemoryTests.Document(0)).Normal!);
        Assert.InRange(large, 2, 200);
        Assert.Equal(Sweeps.Kept, Sweeps.KeptFor(Wn.Solved(SweepTests.Variable("")).Normal!));
    }

    [Fact]
    public void A_sweep_within_the_kept_points_keeps_them_all()
    {
        var e = Wn.Solved(SweepTests.Variable("sweep BR from 0 % to 100 % points 2001"));
        Assert.Equal(2001, e.SweepColumns!.Count);
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "sweep-thinned");
    }
}

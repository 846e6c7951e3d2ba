using System.Text.Json;
using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>Sweeps over a brush or a let: one case per point, checks at every point, a budget, progress and cancellation.</summary>
public class SweepTests
{
    // A bench variable autotransformer: 117 turns, the supply on a tap at 100 turns (N_tot/N_in = 1.17).
    public static string Variable(string sweep, string extra = "") => $"""
        frequency 60 Hz
        let vin = 120 V
        core K rating 1 kVA
        winding W on K turns 117 from A to B
        tap IN on W at 100 turns
        brush BR on W at 50 %{extra}
        supply line IN A vin
        ground A
        load bench BR A impedance 50 ohm
        {sweep}

        """;

    private static List<CaseResult> SweepCases(Evaluation e) => Wn.Points(e);

    [Fact]
    public void R27_a_swept_variable_autotransformer_reports_0_to_140_4_volts()
    {
        // Common practice, no source (output 0 to about 117 % of line): V_out,max = 120 V · 1.17 = 140.4 V.
        var e = Wn.Solved(Variable("sweep BR from 0 % to 100 % step 10 %\nexpect voltage BR A between 0 V and 140.4 V"));
        var points = SweepCases(e);
        Assert.Equal(11, points.Count);
        Assert.Equal("sweep BR=0 %", points[0].Case.Name);
        Assert.Equal("sweep BR=30 %", points[3].Case.Name);
        Wn.Near(0.3, points[3].Case.Sweep.Single().Value, 1e-12, "swept value as a fraction");
        var outputs = points.Select(c => c.V("BR", "A").Magnitude).ToList();
        Assert.Equal(0, outputs[0], 9);
        Wn.Near(140.4, outputs[^1], 1e-9, "brush at the top");
        for (var k = 0; k < outputs.Count; k++) Wn.Near(140.4 * k / 10, Math.Max(outputs[k], 1e-300), k == 0 ? 1 : 1e-9, $"point {k}");
        var check = Assert.Single(e.Checks);
        Assert.True(check.Passed);
        Assert.Equal(12, check.Points);
        Assert.Equal(0, check.Min!.Value, 9);
        Wn.Near(140.4, check.Max!.Value, 1e-9, "highest over the sweep");
    }

    [Fact]
    public void An_expect_over_a_sweep_fails_at_the_points_where_it_does_not_hold_and_names_them()
    {
        var e = Wn.Eval(Variable("sweep BR from 0 % to 100 % step 10 %\nexpect voltage BR A below 120 V"));
        var d = e.Single("expect-failed");
        Assert.Equal("voltage BR A is 140.4 V at BR=100 %: expected below 120 V; fails at 2 of 12 points: BR=90 %, BR=100 %", d.Message);
        var check = Assert.Single(e.Checks);
        Assert.False(check.Passed);
        Assert.Equal(["BR=90 %", "BR=100 %"], check.Failures.ToArray());
        Wn.Near(70.2, check.Value!.Value, 1e-9, "the value as written");
    }

    [Fact]
    public void Points_spread_evenly_and_two_sweeps_make_a_grid()
    {
        var e = Wn.Solved(Variable("sweep BR from 0 % to 100 % points 5\nsweep vin from 108 V to 132 V step 12 V"));
        var points = SweepCases(e);
        Assert.Equal(15, points.Count);
        Assert.Equal("sweep BR=25 % vin=120 V", points[4].Case.Name);
        Assert.Equal("sweep BR=100 % vin=132 V", points[^1].Case.Name);
        Wn.Near(132 * 1.17, points[^1].V("BR", "A").Magnitude, 1e-9, "both at their top");
        Wn.Near(108 * 0.25 * 1.17, points[3].V("BR", "A").Magnitude, 1e-9, "BR=25 %, vin=108 V");
    }

    [Fact]
    public void A_sweep_point_becomes_a_JSON_case_with_its_swept_values()
    {
        var json = JsonDocument.Parse(JsonReport.Write(Wn.Solved(Variable("sweep BR from 0 % to 100 % step 25 %"))));
        var cases = json.RootElement.GetProperty("cases").EnumerateArray().ToList();
        Assert.Equal(["normal", "sweep BR=0 %", "sweep BR=25 %", "sweep BR=50 %", "sweep BR=75 %", "sweep BR=100 %"], cases.Select(c => c.GetProperty("name").GetString()));
        Assert.Equal(0.25, cases[2].GetProperty("sweep").GetProperty("BR").GetDouble());
        Assert.False(cases[0].TryGetProperty("sweep", out _));
    }

    [Fact]
    public void A_sweep_over_the_budget_is_an_error_and_is_not_run()
    {
        var e = Wn.Eval(Variable("sweep BR from 0 % to 100 % step 0.00001 %"));
        var d = e.Single("sweep-budget");
        Assert.Equal("the sweeps make 10,000,001 points, more than the budget of 1,000,000: use a larger step or fewer points", d.Message);
        Assert.Empty(SweepCases(e));
        Assert.NotNull(e.Normal);
    }

    [Fact]
    public void A_grid_is_held_to_the_budget_as_a_whole()
    {
        var e = Wn.Eval(Variable("sweep BR from 0 % to 100 % points 1001\nsweep vin from 100 V to 140 V points 1001"));
        Assert.Contains("1,002,001 points", e.Single("sweep-budget").Message);
    }

    [Theory]
    [InlineData("sweep BR from 0 % to 100 % step 0 %", "the step must be a real value above zero, of the same kind as the range")]
    [InlineData("sweep BR from 0 % to 100 % step -1 %", "the step must be a real value above zero, of the same kind as the range")]
    [InlineData("sweep BR from 0 % to 100 V step 1 %", "a sweep runs between two real values of one kind")]
    [InlineData("sweep vin from 0 A to 10 A step 1 A", "'vin' is a voltage, but the sweep runs over a current")]
    [InlineData("sweep BR from 0 A to 10 A step 1 A", "a brush moves in turns, % or volts, not in A")]
    public void A_sweep_that_cannot_run_says_why(string sweep, string message)
    {
        var e = Wn.Eval(Variable(sweep));
        Assert.Equal(message, e.Single("sweep-range").Message);
        Assert.Empty(SweepCases(e));
    }

    [Fact]
    public void A_target_swept_twice_is_an_error_at_the_second_line()
    {
        var e = Wn.Eval(Variable("sweep BR from 0 % to 50 % step 10 %\nsweep BR from 50 % to 100 % step 10 %"));
        Assert.Equal("sweep BR from 50 % to 100 % step 10 %", e.TextAt(e.Single("sweep-duplicate").Span));
    }

    [Fact]
    public void A_step_counts_from_the_start_towards_the_end_whatever_its_sign()
    {
        var points = SweepCases(Wn.Solved(Variable("sweep BR from 100 % to 0 % step 25 %")));
        Assert.Equal(["sweep BR=100 %", "sweep BR=75 %", "sweep BR=50 %", "sweep BR=25 %", "sweep BR=0 %"], points.Select(c => c.Case.Name));
    }

    [Fact]
    public void A_message_that_only_some_points_give_is_reported_once_with_the_first_point()
    {
        var e = Wn.Eval(Variable("sweep BR from 0 turns to 130 turns step 10 turns"));
        var d = e.Single("tap-outside");
        Assert.Equal("at BR=120 turns: 'BR' is at 120 turns, outside the winding's 0 to 117 (and at 1 more points)", d.Message);
        Assert.Equal(12, SweepCases(e).Count);
    }

    [Fact]
    public void A_sweep_beyond_the_brush_range_is_a_warning()
    {
        var e = Wn.Eval(Variable("sweep BR from 0 % to 100 % step 10 %", " range 10 % to 95 %"));
        Assert.Equal("the sweep takes brush 'BR' outside its range", e.Single("sweep-outside-range").Message);
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "brush-outside-range");
        var set = Wn.Eval(Variable("", " range 60 % to 95 %"));
        Assert.Equal("50 %", set.TextAt(set.Single("brush-outside-range").Span));
    }

    [Fact]
    public void Progress_is_reported_up_to_the_total_and_cancellation_stops_a_sweep()
    {
        var text = Variable("sweep BR from 0 % to 100 % step 0.5 %");
        var seen = new List<StudyProgress>();
        Evaluator.Evaluate(text, "p.wn", default, seen.Add);
        Assert.Equal(201, seen[^1].Total);
        Assert.Equal(seen[^1].Total, seen[^1].Done);
        using var cancel = new CancellationTokenSource();
        Assert.ThrowsAny<OperationCanceledException>(() => Evaluator.Evaluate(text, "p.wn", cancel.Token, _ => cancel.Cancel()));
    }

    [Fact]
    public void The_text_report_gives_a_sweep_as_tables_with_one_row_a_point()
    {
        var text = TextReport.Write(Wn.Solved(Variable("sweep BR from 0 % to 100 % step 50 %")));
        Assert.Contains("\nSweep BR (3 points; 4 with the file as written)\n", text);
        Assert.Contains("\n    BR=          bench V      bench I      bench P      bench reg\n", text);
        Assert.Contains("\n    100 %        140.4 V      2.808 A      394.2 W      0.000 %\n", text);
    }
}

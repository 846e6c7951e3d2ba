using WindingNotes.Report;
using WindingNotes.Tests.Analysis;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// The time budget (processor time of the evaluating thread where the platform can tell it): an evaluation that meets it stops with a <c>time-limit</c> error and keeps
/// what was whole; a caller's cancellation stops it with an exception instead, at any stage.
/// </summary>
public class TimeLimitTests
{
    private static readonly string MillionPoints = SweepTests.Variable("sweep BR from 0 % to 100 % points 1000000\nexpect voltage BR A below 150 V");

    [Fact]
    public void A_sweep_that_meets_the_time_limit_keeps_the_points_solved_and_says_how_far_it_came()
    {
        // The progress report after the first 64 points works past the limit, so the limit is met part
        // way whatever the machine: a fast one could otherwise solve all million points within it.
        var e = Evaluator.Evaluate(MillionPoints, "t.wn", progress: p => { if (p.Done == 64) Spin(TimeSpan.FromSeconds(1.1)); }, timeLimit: TimeSpan.FromSeconds(1));
        var d = e.Single("time-limit");
        Assert.Matches(@"^the evaluation reached its time limit of 1 s after [\d,]+ of 1,000,000 further solves: results, bands and checks cover only what was solved by then$", d.Message);
        Assert.Equal("sweep BR from 0 % to 100 % points 1000000", e.TextAt(d.Span));
        var solved = long.Parse(System.Text.RegularExpressions.Regex.Match(d.Message, @"after ([\d,]+) of").Groups[1].Value.Replace(",", ""));
        Assert.InRange(solved, 64, 999_999);
        Assert.NotNull(e.Normal);
        // The check covers the normal case and every point solved; the points kept are at most the sweep's share.
        Assert.Equal(1 + solved, Assert.Single(e.Checks).Points);
        Assert.InRange(e.SweepColumns!.Count, 1, WindingNotes.Solve.Sweeps.Kept + 1);
    }

    [Fact]
    public void Tolerance_samples_cut_short_give_no_band_rather_than_a_narrow_one()
    {
        // Eleven toleranced values: a Monte Carlo of 1,000 samples. The progress report after the
        // first 64 works on the evaluating thread past its limit, so the limit is met part way whatever the machine.
        var lets = string.Concat(Enumerable.Range(1, 11).Select(i => $"let r{i} = 1 ohm +- 5 %\n"));
        var sum = string.Join(" + ", Enumerable.Range(1, 11).Select(i => $"r{i}"));
        var text = SweepTests.Variable("") + lets + $"load heater BR A impedance {sum}\n";
        // The same file without its tolerances first, so the normal case solves well within the limit.
        Assert.Empty(Evaluator.Evaluate(text.Replace(" +- 5 %", ""), "t.wn").Errors());
        // A limit of seconds, not milliseconds: in a full test run this thread may do a blocking
        // collection of the whole process's heap (other tests' gigabytes), which counts as its own
        // processor time and could meet a short limit before the samples begin.
        // Each later report works a quarter of a second more: samples restamped on the first network take
        // about 0.1 ms each, so without it the last 936 could finish before a loaded machine's timer
        // thread reads the clock.
        var e = Evaluator.Evaluate(text, "t.wn", progress: p => { if (p.Done >= 64) Spin(TimeSpan.FromSeconds(p.Done == 64 ? 3.5 : 0.25)); }, timeLimit: TimeSpan.FromSeconds(3));
        Assert.Matches("after [0-9]+ of 1,000 further solves", e.Single("time-limit").Message);
        Assert.Empty(Assert.IsType<WindingNotes.Solve.CaseResult>(e.Normal).Bands);
    }

    /// <summary>Works on this thread until it has used the time (processor time where the budget counts it).</summary>
    private static void Spin(TimeSpan time)
    {
        var clock = WindingNotes.Solve.ThreadClock.OfCurrentThread();
        var wall = System.Diagnostics.Stopwatch.StartNew();
        TimeSpan Now() => clock?.Invoke() ?? wall.Elapsed;
        var start = Now();
        while (Now() - start < time) Thread.SpinWait(1000);
    }

    [Fact]
    public void The_budget_counts_the_processor_time_it_is_told_and_stops_at_its_limit()
    {
        var used = TimeSpan.FromSeconds(5); // what the thread had used before the evaluation began
        using var budget = new WindingNotes.Solve.TimeBudget(TimeSpan.FromHours(1), default, () => used);
        Assert.Equal(TimeSpan.FromHours(1), budget.Poll());
        used += TimeSpan.FromMinutes(59);
        Assert.Equal(TimeSpan.FromMinutes(1), budget.Poll());
        Assert.False(budget.Token.IsCancellationRequested);
        used += TimeSpan.FromMinutes(1);
        Assert.Equal(TimeSpan.Zero, budget.Poll());
        Assert.True(budget.Token.IsCancellationRequested);
        Assert.True(budget.Exceeded);
    }

    [Fact]
    public void A_thread_clock_that_cannot_be_read_any_more_ends_the_budget()
    {
        using var budget = new WindingNotes.Solve.TimeBudget(TimeSpan.FromHours(1), default, () => null);
        Assert.Equal(TimeSpan.Zero, budget.Poll());
        Assert.True(budget.Exceeded);
    }

    [Fact]
    public void Waiting_spends_no_processor_time_so_a_loaded_machine_does_not_spend_the_budget()
    {
        // Linux tells a thread's processor time; elsewhere the limit is wall-clock time and this does not apply.
        if (WindingNotes.Solve.ThreadClock.OfCurrentThread() is null) return;
        using var budget = new WindingNotes.Solve.TimeBudget(TimeSpan.FromMilliseconds(50));
        // A thread that waits (as one does on a machine whose cores are busy) uses none of its processor time.
        Thread.Sleep(300);
        Assert.True(budget.Poll() > TimeSpan.Zero);
        Assert.False(budget.Exceeded);
        // Work on the thread does spend it.
        Spin(TimeSpan.FromMilliseconds(60));
        Assert.Equal(TimeSpan.Zero, budget.Poll());
        Assert.True(budget.Exceeded);
    }

    [Fact]
    public void A_limit_met_while_binding_keeps_the_syntax_and_reports_the_stage()
    {
        var e = Evaluator.Evaluate(MillionPoints, "t.wn", timeLimit: TimeSpan.Zero);
        var d = e.Single("time-limit");
        Assert.Equal("the evaluation reached its time limit of 0 s while binding the document: there are no results", d.Message);
        // At the first statement, where binding begins: not the empty range at the file's start.
        Assert.Equal(e.Syntax.Lines.First(l => l.Statement is not null).Span, d.Span);
        Assert.NotEmpty(e.Syntax.Statements);
        Assert.Empty(e.Cases);
    }

    [Fact]
    public void Cancellation_by_the_caller_is_an_exception_not_a_time_limit()
    {
        using var cancel = new CancellationTokenSource();
        cancel.Cancel();
        Assert.ThrowsAny<OperationCanceledException>(() => Evaluator.Evaluate(MillionPoints, "t.wn", cancel.Token));
        using var later = new CancellationTokenSource();
        Assert.ThrowsAny<OperationCanceledException>(() => Evaluator.Evaluate(MillionPoints, "t.wn", later.Token, p => { if (p.Done >= 128) later.Cancel(); }));
    }

    [Fact]
    public void Without_a_limit_an_ordinary_file_is_evaluated_as_with_one()
    {
        var text = SweepTests.Variable("sweep BR from 0 % to 100 % step 25 %");
        var limited = Evaluator.Evaluate(text, "t.wn");
        var unlimited = Evaluator.Evaluate(text, "t.wn", timeLimit: Timeout.InfiniteTimeSpan);
        Assert.Equal(JsonReport.Write(limited), JsonReport.Write(unlimited));
    }
}

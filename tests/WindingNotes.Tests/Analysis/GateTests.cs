using WindingNotes.Editing;
using WindingNotes.Report;
using WindingNotes.Tests.Support;
using WindingNotes.Text;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>
/// The gate never lies: a bare number is not a quantity, a name nothing touches is not a node at
/// 0 V, a file with errors is not solved and its checks are "not evaluated", and what is not given
/// is said, not taken as zero. Each test names the slip that passed before.
/// </summary>
public class GateTests
{
    /// <summary>The notation's example (examples/alder-creek-boost.wn) without its checks: lines 1 to 9, so what a test adds is line 10.</summary>
    private static readonly string Boost = RatingTests.Boost("power 3.2 kW pf 0.82 lagging");

    private static Diagnostic Only(Evaluation e, string code, string at)
    {
        var d = e.Single(code);
        Assert.Equal(at, e.TextAt(d.Span));
        Assert.True(d.IsError, d.Message);
        return d;
    }

    private static void NotEvaluated(Evaluation e)
    {
        Assert.Null(e.Normal);
        Assert.NotEmpty(e.Checks);
        Assert.All(e.Checks, c => Assert.False(c.Passed || c.Evaluated));
    }

    // ---- 1. a bare number where a quantity is meant ----

    [Fact]
    public void A_loading_bound_without_its_percent_is_an_error_with_the_fix()
    {
        // Before: 100 was read as the fraction 100 (10,000 %), so a loading of 82 % always passed.
        var e = Wn.Eval(Boost + "expect loading LV below 100\n");
        var d = Only(e, "missing-unit", "100");
        Assert.Equal("give a bound on loading a unit: 100 %", d.Message);
        var fix = Assert.Single(QuickFixes.For(e, e.Text.GetRange(d.Span)));
        Assert.Equal("100 %", Assert.Single(fix.Edits).NewText);
        NotEvaluated(e);

        // With the fix applied the check runs: LV carries 17.11 A of 500 VA / 24 V = 20.83 A, 82.1 %
        // (the notation's example JSON gives 0.821).
        var fixedUp = Wn.Solved(Boost + "expect loading LV below 100 %\n");
        var check = Assert.Single(fixedUp.Checks);
        Assert.True(check.Passed && check.Evaluated);
        Wn.Near(0.821, check.Value!.Value, 0.002, "loading");
    }

    [Fact]
    public void An_efficiency_bound_without_its_percent_is_an_error()
    {
        // Before: 99 was compared with the fraction 0.9974 and failed with "expected above 99".
        var e = Wn.Eval(Boost + "expect efficiency above 99\n");
        Assert.Equal("give a bound on efficiency a unit: 99 %", Only(e, "missing-unit", "99").Message);
        NotEvaluated(e);
        // 0.99 was likely meant as a fraction: the fix keeps that meaning (1 pu = 100 %).
        var fraction = Wn.Eval(Boost + "expect efficiency above 0.99\n");
        var d = Only(fraction, "missing-unit", "0.99");
        Assert.Equal("give a bound on efficiency a unit: 0.99 pu or 0.99 %", d.Message);
        Assert.Equal("0.99 pu", Assert.Single(d.Hints).Replacement);
    }

    [Theory]
    [InlineData("expect voltage X1 H2 below 240", "240", "give a bound on voltage a unit: 240 V")]
    [InlineData("expect voltage X1 H2 near 230 V within 1", "1", "give the tolerance a unit: 1 % or 1 V")]
    [InlineData("expect current planer below 20", "20", "give a bound on current a unit: 20 A")]
    [InlineData("tap T6 on LV at 6", "6", "give the position of T6 a unit: 6 turns or 6 %")]
    // Before: ±7.5 as a fraction of 5.75 %, a band 130 times the value.
    [InlineData("let z = 5.75 % +- 7.5", "7.5", "give the tolerance a unit: 7.5 %")]
    [InlineData("supply aux H1 H2 208", "208", "give the voltage of aux a unit: 208 V")]
    public void Bounds_tolerances_and_positions_need_their_unit(string line, string at, string message)
    {
        var e = Wn.Eval(Boost + line + "\n");
        Assert.Equal(message, Only(e, "missing-unit", at).Message);
        Assert.Null(e.Normal);
    }

    [Fact]
    public void A_sweep_bound_without_the_unit_of_the_other_says_which_to_give()
    {
        var text = File.ReadAllText(Command.Example("cedar-hollow-bench-sweep.wn")).Replace("from 0 % to 100 % step 10 %", "from 0 to 100 % step 10");
        var e = Wn.Eval(text);
        var messages = e.Errors().Select(d => (e.TextAt(d.Span), d.Message)).ToList();
        Assert.Equal([("0", "give the lower bound a unit: 0 %"), ("10", "give the step a unit: 10 %")], messages);
        NotEvaluated(e);
    }

    [Fact]
    public void Plain_numbers_stay_plain_where_the_notation_says_so()
    {
        // pf 0.82, turns 240, xr 1.1 and points 3 are numbers, not quantities.
        var e = Wn.Solved(Boost + "let p = 3.2 kW\nsweep p from 3 kW to 3.4 kW points 3\n");
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "missing-unit");
    }

    // ---- 2. names that do not exist ----

    [Fact]
    public void An_expect_on_nodes_nothing_touches_is_an_error_not_zero_volts()
    {
        // Before: X9 and H9 became two new nodes at 0 V, and "below 500 V" passed.
        var e = Wn.Eval(Boost + "expect voltage X9 H9 below 500 V\n");
        var unknown = e.Diagnostics.Where(d => d.Code == "unknown-name").ToList();
        Assert.Equal(["unknown terminal or node 'X9'", "unknown terminal or node 'H9'"], unknown.Select(d => d.Message));
        Assert.Equal(["X1", "H1"], unknown.Select(d => Assert.Single(d.Hints).Replacement));
        NotEvaluated(e);
    }

    [Fact]
    public void A_fault_at_a_node_nothing_touches_is_an_error()
    {
        // Before: X7 became a node of its own and the fault case was solved on it.
        var e = Wn.Eval(Boost + "fault F1 X7 H2\n");
        Assert.Equal("did you mean 'X1'?", Assert.Single(Only(e, "lonely-node", "X7").Hints).Message);
    }

    [Fact]
    public void A_load_terminal_that_nothing_else_touches_is_an_error_with_did_you_mean()
    {
        // Before: a warning, and the load 'drew nothing' in a solved, passing file.
        var e = Wn.Eval(Boost + "load lamp X1 H3 power 100 W\n");
        var d = Only(e, "lonely-node", "H3");
        Assert.Equal("did you mean 'H1'?", Assert.Single(d.Hints).Message);
        Assert.Null(e.Normal);
    }

    [Fact]
    public void A_winding_end_left_open_stays_legal()
    {
        // An unloaded secondary is normal: its terminals are the winding's own.
        var e = Wn.Solved(Boost + "winding AUX on K1 turns 12 from Y1 to Y2\n");
        Assert.DoesNotContain(e.Diagnostics, d => d.IsError || d.Severity == Severity.Warning);
    }

    // ---- 3. a file with errors is not solved ----

    [Fact]
    public void A_file_whose_binding_failed_is_not_solved_and_its_checks_are_not_evaluated()
    {
        // Before: the load with 'kQ' was dropped, the rest solved ("throughput 0.000 VA") and the check passed.
        var text = Boost.Replace("power 3.2 kW pf 0.82 lagging", "power 3.2 kQ pf 0.82 lagging") + "expect voltage X1 H2 between 200 V and 240 V\n";
        var e = Wn.Eval(text);
        Only(e, "unknown-unit", "kQ");
        NotEvaluated(e);
        Assert.Empty(e.Cases);

        var report = TextReport.Write(e);
        Assert.Contains("No results: the file has errors, so it was not solved.", report);
        Assert.Contains("not evaluated  line 10: expect voltage X1 H2 between 200 V and 240 V", report);
        Assert.DoesNotContain("throughput", report);
        Assert.Contains("\"notEvaluated\": [", JsonReport.Write(e));
        Assert.Contains("**0 of 1 checks pass, 1 not evaluated**", MarkdownReport.Summary(e));

        var (code, output, _) = Command.Run(text, "check", "-");
        Assert.Equal(1, code);
        Assert.Contains("<stdin>:10:1: not evaluated: expect voltage X1 H2 between 200 V and 240 V\n", output.Replace("\r\n", "\n"));
        Assert.EndsWith("1 file: 1 error, 0 warnings, 0 of 1 check passed, 1 not evaluated\n", output.Replace("\r\n", "\n"));
    }

    [Fact]
    public void The_editor_keeps_the_last_solved_version_marked_as_such_and_never_a_partial_network()
    {
        var workspace = new DocumentWorkspace();
        var good = Boost + "expect voltage X1 H2 between 225 V and 235 V\n";
        workspace.Open("file:///a.wn", "a.wn", 1, good);
        var solved = workspace.Evaluate("file:///a.wn")!;
        var first = InlayHints.For(solved);

        // Version 2 drops the load's unit: nothing of it is solved; version 1's hints stay, marked.
        workspace.Update("file:///a.wn", 2, good.Replace("power 3.2 kW", "power 3.2"));
        var broken = workspace.Evaluate("file:///a.wn")!;
        Assert.False(broken.Solved);
        Assert.Equal(1, broken.LastSolved!.Version);
        var kept = InlayHints.For(broken);
        var supply = first.Single(h => h.Position.Line == 5);
        Assert.Contains(kept, h => h.Position == supply.Position && h.Label == supply.Label + " (version 1)");
        // The changed line has no hint (its old one would describe another load), and every hint is marked.
        Assert.DoesNotContain(kept, h => h.Position.Line == 8);
        Assert.All(kept, h => Assert.EndsWith(" (version 1)", h.Label));

        // A hover on a name shows its result in version 1, marked so.
        var mains = new Position(5, 8);
        Assert.Equal(Hovers.At(solved, mains)!.Markdown + "\n\n*results of version 1: this version has errors and is not solved*", Hovers.At(broken, mains)!.Markdown);

        // Version 3 binds again: its own results, unmarked.
        workspace.Update("file:///a.wn", 3, good);
        var again = InlayHints.For(workspace.Evaluate("file:///a.wn")!);
        Assert.Equal(first, again);
    }

    // ---- 4. missing data is said, not zero ----

    [Fact]
    public void Without_a_no_load_test_core_loss_and_efficiency_are_unknown_not_zero()
    {
        // Before: core loss 0 W and an efficiency of 99.74 % from copper loss alone, and the check passed.
        var e = Wn.Eval(Boost + "expect efficiency above 99 %\n");
        var totals = e.Normal!.Totals;
        Assert.False(totals.CoreLossKnown);
        Assert.Null(totals.Efficiency);
        Assert.Null(totals.MaxEfficiencyLoad);
        var info = e.Single("core-loss-unknown");
        Assert.Equal(Severity.Information, info.Severity);
        Assert.Equal("K1", e.TextAt(info.Span));
        var cannot = e.Single("expect-unknown");
        Assert.Equal("cannot check efficiency: efficiency needs the core loss: give a 'no-load' line for core 'K1'", cannot.Message);
        Assert.False(Assert.Single(e.Checks).Passed);
        var report = TextReport.Write(e);
        Assert.Contains("core loss    unknown (no 'no-load' line)", report);
        Assert.Contains("efficiency   unknown without the core loss", report);
        Assert.Contains("\"coreLoss\": null", JsonReport.Write(e));
    }

    [Fact]
    public void With_a_no_load_test_efficiency_counts_both_losses()
    {
        // η = P_load / P_supply, and P_supply − P_load = copper loss + core loss (R12's terms).
        var e = Wn.Solved(Boost + "no-load K1 current 2 % loss 6 W at HV 240 V\nexpect efficiency above 99 %\n");
        var t = e.Normal!.Totals;
        Assert.True(t.CoreLossKnown);
        var supplied = e.Normal.Supply("mains").Power.Real;
        var delivered = e.Normal.Load("planer").Power.Real;
        Wn.Near(delivered / supplied, t.Efficiency!.Value, 1e-12, "efficiency");
        Wn.Near(supplied - delivered, t.CopperLoss + t.CoreLoss, 1e-6, "losses");
        Assert.True(t.CoreLoss > 0);
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "core-loss-unknown");
    }

    [Fact]
    public void Flux_without_area_or_turns_is_absent_and_said_so()
    {
        var noArea = Wn.Eval(Boost.Replace(" area 26 cm2", "") + "expect flux K1 below 1.6 T\n");
        Assert.Null(noArea.Normal!.Cores[0].Flux);
        Assert.Equal("cannot check flux K1: the flux density of 'K1' needs the core's 'area' and the windings' 'turns'", noArea.Single("expect-unknown").Message);
        Assert.Contains("flux unknown: give the core's area", TextReport.Write(noArea));

        // Rated voltages alone give the ratio, not the turns: the sections still list the turns the
        // ratio gives, so the report must not say "turns not given".
        var rated = Wn.Eval(Boost.Replace(" turns 240", "").Replace(" turns 24", ""));
        var report = TextReport.Write(rated);
        Assert.DoesNotContain("turns not given", report);
        Assert.Contains("flux unknown: give the windings' turns", report);
    }

    // ---- 5. CI fails on exceeded ratings ----

    /// <summary>A 4.5 kW planer: LV carries about 4.5 kW / 0.82 / 228 V = 24 A of its 20.83 A, about 116 %.</summary>
    private static readonly string Overloaded = Boost.Replace("power 3.2 kW", "power 4.5 kW");

    [Fact]
    public void Check_strict_fails_on_a_rating_warning_and_plain_check_does_not()
    {
        var (plain, output, _) = Command.Run(Overloaded, "check", "-");
        Assert.Equal(0, plain);
        Assert.Contains("warning loading-high: winding 'LV' carries", output);
        var (strict, _, _) = Command.Run(Overloaded, "check", "--strict", "-");
        Assert.Equal(1, strict);
        var (clean, _, _) = Command.Run(Boost, "check", "--strict", "-");
        Assert.Equal(0, clean);
    }

    [Fact]
    public void A_file_can_make_a_rating_warning_an_error()
    {
        var e = Wn.Eval(Overloaded + "fail-on loading-high\n");
        // Both windings carry the same 116 % (series-aiding boost: the HV winding is the common one).
        var raised = e.Diagnostics.Where(d => d.Code == "loading-high").ToList();
        Assert.Equal(2, raised.Count);
        Assert.All(raised, d => Assert.Equal(Severity.Error, d.Severity));
        Assert.Equal("an error by 'fail-on loading-high'", Assert.Single(raised[0].Related).Message);
        Assert.Equal(1, Command.Run(Overloaded + "fail-on loading-high\n", "check", "-").Code);
        // A code that is not a rating warning is a parse error with what fits.
        Assert.Contains(Wn.Eval(Boost + "fail-on loading-hi\n").Diagnostics, x => x.IsError);
    }

    [Fact]
    public void An_acknowledged_caution_leaves_check_and_stays_in_reports()
    {
        var text = Boost + "acknowledge caution-no-isolation\n";
        var (code, output, _) = Command.Run(text, "check", "-");
        Assert.Equal(0, code);
        Assert.DoesNotContain("caution-no-isolation", output);
        Assert.Contains("caution-common-terminal", output);
        Assert.Contains("through the windings: an autotransformer connection gives no galvanic isolation", Command.Run(Boost, "check", "-").Out);
        var report = TextReport.Write(Wn.Eval(text));
        Assert.Contains("gives no galvanic isolation, a fault can put the full input voltage on the output, and an open common winding leaves the series winding in the line (acknowledged)", report);
        Assert.Contains("\"acknowledged\": true", JsonReport.Write(Wn.Eval(text)));
    }

    [Fact]
    public void The_readme_ci_recipe_passes_on_every_example()
    {
        var readme = File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "README.md"));
        Assert.Contains("windingnotes check --strict calculations/*.wn", readme);
        var files = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").OrderBy(f => f).ToArray();
        var (code, output, _) = Command.Run("", ["check", "--strict", .. files]);
        Assert.True(code == 0, output);
        Assert.Matches($@"{files.Length} files: 0 errors, 0 warnings, (\d+) of \1 checks passed\n$", output.Replace("\r\n", "\n"));
    }

    [Fact]
    public void Exit_codes_are_as_the_readme_states()
    {
        using var dir = new TemporaryDirectory();
        Assert.Equal(0, Command.Run(Boost, "check", "-").Code);
        Assert.Equal(1, Command.Run(Boost + "expect voltage X1 H2 above 240 V\n", "check", "-").Code);
        Assert.Equal(1, Command.Run(Boost + "expect voltage X1 H2 above 200\n", "check", "-").Code);
        Assert.Equal(1, Command.Run(Overloaded, "check", "--strict", "-").Code);
        Assert.Equal(2, Command.Run("", "check", dir.File("missing.wn")).Code);
        Assert.Equal(2, Command.Run("", "check", "--no-such-option", "-").Code);
        Assert.Equal(1, Command.Run(Boost + "expect voltage X9 H2 above 200 V\n", "report", "-").Code);
    }

    // ---- 12 and 13. wording ----

    [Fact]
    public void What_users_read_carries_no_provenance_remarks()
    {
        // Sources belong in code comments and tests (REFERENCES.md), not in check output or reports.
        string[] remarks = ["from memory", "common practice", "no source", "encyclopedic"];
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn"))
        {
            var e = Evaluator.Evaluate(File.ReadAllText(file), file);
            var texts = new[] { Command.Run("", "check", file).Out, TextReport.Write(e), MarkdownReport.Write(e), JsonReport.Write(e) };
            foreach (var remark in remarks)
                Assert.All(texts, t => Assert.DoesNotContain(remark, t));
        }
    }

    [Fact]
    public void A_power_factor_sense_cut_short_names_the_word_that_fits()
    {
        // Before: "unknown unit 'lag'".
        var e = Wn.Eval(Boost.Replace("pf 0.82 lagging", "pf 0.82 lag"));
        var d = Only(e, "unknown-word", "lag");
        Assert.Equal("'lag' is not a unit; a power factor is followed by 'lagging' or 'leading'", d.Message);
        Assert.Equal("lagging", Assert.Single(d.Hints).Replacement);
        Assert.Equal("leading", Assert.Single(Wn.Eval(Boost.Replace("pf 0.82 lagging", "pf 0.82 lead")).Single("unknown-word").Hints).Replacement);
    }
}

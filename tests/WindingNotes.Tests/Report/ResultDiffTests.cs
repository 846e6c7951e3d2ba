using WindingNotes.Report;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Report;

public class ResultDiffTests
{
    private static readonly string Alder = File.ReadAllText(Command.Example("alder-creek-boost.wn"));

    private static ResultDiff Diff(string old, string @new, double threshold = ResultDiff.DefaultThreshold) =>
        ResultDiff.Compare(Wn.Eval(old), Wn.Eval(@new), threshold, "old.wn", "new.wn");

    [Fact]
    public void The_same_file_moves_nothing()
    {
        var diff = Diff(Alder, Alder);
        Assert.True(diff.IsEmpty);
        Assert.Contains("no result moved by more than 0.1 %", DiffReport.Text(diff));
    }

    [Fact]
    public void Moving_lines_adding_comments_and_respacing_changes_nothing()
    {
        var moved = "# a new first line\n" + Alder.Replace("expect loading LV below 100 %", "expect   loading LV   below 100 %  # moved").Replace("frequency 60 Hz", "frequency 60 Hz\n\n");
        Assert.True(Diff(Alder, moved).IsEmpty);
    }

    [Fact]
    public void A_lower_supply_fails_the_voltage_check_first_and_moves_the_node_voltages_by_their_relative_change()
    {
        var diff = Diff(Alder, Alder.Replace("208 V", "200 V"));
        Assert.True(diff.Regressed);
        var first = diff.Checks[0];
        Assert.Equal("expect voltage X1 H2 between 225 V and 235 V", first.Text);
        Assert.Equal((CheckState.Pass, CheckState.Fail), (first.Old, first.New));
        var x1 = diff.Values.Single(v => v.Label == "node X1 voltage");
        Assert.Equal("normal", x1.Case);
        Wn.Near(228.1, x1.Old!.Value, 0.001, "X1 before");
        // The load is constant power: its voltage falls by a little more than the supply's 200/208.
        Assert.InRange(ResultDiff.Relative(x1.Old.Value, x1.New!.Value)!.Value, -0.045, -0.0385);
        var h1 = diff.Values.Single(v => v.Label == "node H1 voltage");
        Assert.Equal((208.0, 200.0), (h1.Old!.Value, h1.New!.Value));
        Assert.DoesNotContain(diff.Values, v => v.Label.StartsWith("node H2"));
    }

    [Fact]
    public void Changes_at_or_below_the_threshold_are_left_out()
    {
        // 208 V to 208.2 V moves the node voltages by 0.096 %.
        var small = Alder.Replace("208 V", "208.2 V");
        Assert.DoesNotContain(Diff(Alder, small).Values, v => v.Label == "node H1 voltage");
        Assert.Contains(Diff(Alder, small, 0.0005).Values, v => v.Label == "node H1 voltage");
    }

    [Fact]
    public void An_angle_counts_by_its_shift_in_radians_and_is_ignored_on_a_zero_phasor()
    {
        // 0.1 % is 0.0573 degrees: a supply turned by 0.05 degrees moves no angle, by 0.1 degrees every angle.
        Assert.DoesNotContain(Diff(Alder, Alder.Replace("208 V", "208 V angle 0.05 deg")).Values, v => v.Label.EndsWith("angle"));
        var turned = Diff(Alder, Alder.Replace("208 V", "208 V angle 0.1 deg")).Values;
        Assert.Contains(turned, v => v.Label == "node X1 voltage angle");
        Assert.DoesNotContain(turned, v => v.Label == "node H2 voltage angle");
        Assert.DoesNotContain(turned, v => !v.Label.EndsWith("angle"));
        Assert.Equal(0.1, ResultDiff.AngleChange(179.95, -179.95), 9);
    }

    [Fact]
    public void A_check_that_now_passes_does_not_count_as_a_regression()
    {
        var failing = Alder.Replace("between 225 V and 235 V", "between 230 V and 235 V");
        var diff = Diff(failing, Alder);
        Assert.False(diff.Regressed);
        Assert.Equal((CheckState.Fail, CheckState.Pass), (diff.Checks[0].Old, diff.Checks[0].New));
        Assert.Equal("expect voltage X1 H2 between 230 V and 235 V", diff.Checks[0].OldText);
        Assert.Contains("now pass (was FAIL)  line 14: expect voltage X1 H2 between 225 V and 235 V (was expect voltage X1 H2 between 230 V and 235 V)", DiffReport.Text(diff));
    }

    [Fact]
    public void New_and_removed_checks_cases_loads_and_diagnostics_are_listed()
    {
        var changed = Alder.Replace("expect loading LV below 100 %\n", "expect loading HV below 120 %\n")
            + "load fan X1 H2 impedance 50 ohm\nfault F1 X1 H2 impedance 0 ohm\nwinding TV on K1 turns 10 from T1 to T2\n";
        var diff = Diff(Alder, changed);
        Assert.Contains(diff.Checks, c => c.Text == "expect loading HV below 120 %" && c.Old == CheckState.Absent && c.New == CheckState.Pass);
        Assert.Contains(diff.Checks, c => c.Text == "expect loading LV below 100 %" && c.Old == CheckState.Pass && c.New == CheckState.Absent);
        Assert.Equal("fault F1", Assert.Single(diff.CasesAdded));
        Assert.Contains(diff.Values, v => v.Label == "load fan P" && v.Old is null && v.New > 0);
        Assert.Contains(diff.Diagnostics, d => d.Added && d.Code.Length > 0);
        var text = DiffReport.Text(diff);
        Assert.Contains("case fault F1: new", text);
        Assert.Contains("new, pass  line 15: expect loading HV below 120 %", text);
        Assert.Contains("gone (was pass)  expect loading LV below 100 %: was 82.12 %", text);
    }

    [Fact]
    public void The_diff_of_a_design_change_reads_as_expected()
    {
        // A bigger planer on the same unit: the boost winding now runs above its rating.
        var bigger = Alder.Replace("power 3.2 kW pf 0.82 lagging", "power 4.4 kW pf 0.85 lagging");
        var diff = Diff(Alder, bigger);
        Assert.True(diff.Regressed);
        Snapshot.Match(DiffReport.Text(diff), "Data/diffs/alder-bigger-planer.txt");
        Snapshot.Match(DiffReport.Markdown(diff), "Data/diffs/alder-bigger-planer.md");
    }
}

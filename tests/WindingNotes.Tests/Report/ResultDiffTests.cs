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

    private static string Bigger => Alder.Replace("power 3.2 kW pf 0.82 lagging", "power 4.4 kW pf 0.85 lagging");

    [Fact]
    public void A_diagnostic_that_quotes_a_number_is_one_change_with_the_old_and_new_value()
    {
        var diff = Diff(Alder, Bigger);
        var caution = Assert.Single(diff.Diagnostics, d => d.Code == "caution-above-supply");
        Assert.False(caution.Added || caution.Gone);
        Assert.Contains("reaches 228.1 V", caution.Old);
        Assert.Contains("reaches 227.9 V", caution.New);
        var text = DiffReport.Text(diff);
        Assert.Contains("  changed  info caution-above-supply: the output at load 'planer' reaches 228.1 -> 227.9 V, above the 208.0 V of supply 'mains'", text);
        Assert.DoesNotContain("gone  info caution-above-supply", text);
        Assert.Contains("reaches 228.1 → 227.9 V, above the 208.0 V", DiffReport.Markdown(diff));
    }

    [Fact]
    public void Percent_quantities_change_in_percentage_points()
    {
        // Loading 82.12 % to 109.0 % is +26.9 points (a relative +32.77 % would be a percent of a percent).
        var diff = Diff(Alder, Bigger);
        var text = DiffReport.Text(diff);
        Assert.Contains("expect loading LV below 100 %: 82.12 % -> 109.0 % (+26.9 points)", text);
        Assert.Contains("    loading: 82.12 % -> 109.0 % (+26.9 points)", text);
        Assert.Contains("    regulation: 0.3040 % -> 0.3984 % (+0.0945 points)", text);
        Assert.DoesNotContain("82.12 % -> 109.0 % (+32.77 %)", text);
    }

    [Fact]
    public void The_diff_leads_with_what_a_reviewer_decides_on_and_ratings_crossed_are_told_apart()
    {
        var diff = Diff(Alder, Bigger);
        Assert.Equal(["winding 'HV' carries 109.0 % of its rated current", "winding 'LV' carries 109.0 % of its rated current"],
            diff.Diagnostics.Where(d => d.RatingCrossed).Select(d => d.New));
        Assert.Equal("1 expectation now fails; 2 ratings crossed; 31 results moved by more than 0.1 %; 1 diagnostic changed", DiffReport.Summary(diff));
        // Going back crosses them the other way.
        Assert.All(Diff(Bigger, Alder).Diagnostics.Where(d => d.RatingCrossed), d => Assert.True(d.Gone));
        Assert.Contains("  no longer over  winding 'HV' carries 109.0 % of its rated current", DiffReport.Text(Diff(Bigger, Alder)));

        var text = DiffReport.Text(diff);
        var order = new[] { "Expectations", "Ratings crossed", "Largest moves", "Diagnostics", "Results by element" }.Select(h => text.IndexOf("\n" + h + "\n")).ToList();
        Assert.All(order, i => Assert.True(i > 0));
        Assert.Equal(order.Order(), order);
        // The largest moves: copper losses go with the square of the current, +76.28 %.
        Assert.Contains("Largest moves\n  totals copper loss: 8.195 W -> 14.45 W (+76.28 %)\n", text);
    }

    /// <summary>What a pull request shows of a Markdown diff before anything is unfolded: each &lt;details&gt; block as its summary line.</summary>
    private static List<string> Visible(string markdown)
    {
        var lines = new List<string>();
        var folded = false;
        foreach (var line in markdown.Split('\n'))
        {
            if (line.StartsWith("<details><summary>")) { lines.Add(line); folded = true; }
            else if (line == "</details>") folded = false;
            else if (!folded) lines.Add(line);
        }
        return lines;
    }

    [Fact]
    public void The_markdown_diff_of_a_one_load_change_fits_on_one_screen_with_its_summary_first()
    {
        var markdown = DiffReport.Markdown(Diff(Alder, Bigger));
        var lines = markdown.Split('\n');
        Assert.StartsWith("### Results of `new.wn` against `old.wn`", lines[0]);
        Assert.Equal("**1 expectation now fails; 2 ratings crossed; 31 results moved by more than 0.1 %; 1 diagnostic changed**", lines[2]);
        // Every result is there, folded by element, each fold with a one-line summary.
        Assert.Equal(8, lines.Count(l => l.StartsWith("<details><summary>")));
        Assert.Contains("<details><summary>section HV: 5 results, the most: loss +76.28 %</summary>", lines);
        var visible = Visible(markdown).Where(l => l.Length > 0).ToList();
        // A screen of 40 lines, blank lines left out as a rendered comment leaves them.
        Assert.True(visible.Count <= 40, $"{visible.Count} lines before unfolding:\n{string.Join('\n', visible)}");
    }

    [Fact]
    public void A_sweep_is_compared_point_by_point_and_told_by_its_largest_move_and_where()
    {
        var cedar = File.ReadAllText(Command.Example("cedar-hollow-bench-sweep.wn"));
        // The line tap 10 turns lower: the output rises most where the brush is furthest above the tap.
        var lower = cedar.Replace("tap LINE on W at 200 turns", "tap LINE on W at 190 turns");
        var (old, @new) = (Wn.Eval(cedar), Wn.Eval(lower));
        var diff = ResultDiff.Compare(old, @new);
        Assert.DoesNotContain(diff.Values, v => v.Case.StartsWith("sweep "));
        var heater = Assert.Single(diff.Sweeps, s => s.Label == "load heater voltage");
        // By hand from the two evaluations: the relative change of the heater's voltage at each point.
        var newPoints = Wn.Points(@new);
        var moves = Wn.Points(old).Select(c =>
        {
            var before = c.Load("heater").Voltage.Magnitude;
            var after = newPoints.Single(n => n.Case.Name == c.Case.Name).Load("heater").Voltage.Magnitude;
            return (c.Case.Name, Move: Math.Abs(after - before) / before);
        }).ToList();
        Assert.Equal(11, heater.Points);
        Assert.Equal(moves.Count(m => m.Move > ResultDiff.DefaultThreshold), heater.Moved);
        Assert.Equal(moves.MaxBy(m => m.Move).Name, heater.Largest.Case);
        var text = DiffReport.Text(diff);
        Assert.Contains($"  sweep: load heater\n    voltage over the sweep: ", text);
        Assert.Contains($" at {heater.Where}; {heater.Moved} of 11 points)", text);
    }

    [Fact]
    public void Every_group_of_the_results_table_is_compared_taps_and_tap_changers_too()
    {
        // The group list is the results table's: a tap changer's position is compared, by its label in the table.
        var birch = File.ReadAllText(Command.Example("birch-hollow-type-b-regulator.wn"));
        // A relay target 3 V lower is 60 V lower on the 2.4 kV bus (pt-ratio 20), 2.5 %: four steps
        // of 0.625 % lower than position +5 give or take the bandwidth.
        var diff = Diff(birch, birch.Replace("target 120 V", "target 117 V"));
        var position = Assert.Single(diff.Values, v => v.Case == "normal" && v.Label == "tap changer REG position");
        Assert.True(position.New < position.Old, $"{position.Old} -> {position.New}");
        // The supply's voltage and the pumps' power are held, so the series winding's current barely moves; its label is the object's and the field's.
        Assert.Equal("regulation current", ResultValue.FieldLabel("regulation.current"));
        Assert.Contains(diff.Sweeps, s => s.Label == "tap changer REG position");
        Assert.Contains("  tap changer REG\n    position: ", DiffReport.Text(diff));
        foreach (var group in WindingNotes.Solve.ResultTable.Case.Where(g => g.Single is null))
            Assert.StartsWith(group.Element + " X ", ResultValues.Readable($"{group.Key}.X.{group.Fields[0].Key}"));
    }

    [Fact]
    public void The_three_phase_part_and_the_study_sections_are_compared()
    {
        // The parts the study's results table describes (three-phase sets, vector groups, the load
        // cycle) are walked from the table: 10 % more pumping load moves the low-voltage set's currents.
        var maple = File.ReadAllText(Command.Example("maple-ford-station-unit.wn"));
        var diff = Diff(maple, maple.Replace("power 1100 kW", "power 1210 kW"));
        Assert.Contains(diff.Values, v => v.Case == "normal" && v.Element.StartsWith("three phase sets ") && v.New > v.Old);
        Assert.DoesNotContain(diff.Values, v => v.Element.StartsWith("three phase vector groups"));
        // A heavier load heats the unit: the load cycle's peak hot-spot rises.
        var harbour = File.ReadAllText(Command.Example("harbour-lane-offices-dry-type.wn"));
        var hotter = Diff(harbour, harbour.Replace("current 1300 A", "current 1400 A"));
        Assert.Contains(hotter.Values, v => v.Element.StartsWith("thermal units ") && v.Label.EndsWith("peak hot spot") && v.New > v.Old);
    }

    [Fact]
    public void A_band_is_compared_by_its_ends()
    {
        var willow = File.ReadAllText(Command.Example("willow-bend-tolerance-band.wn"));
        var diff = Diff(willow, willow.Replace("400 V +- 5 %", "400 V +- 10 %"));
        Assert.DoesNotContain(diff.Values, v => v.Label.StartsWith("band of"));
        var h1 = Assert.Single(diff.Bands, b => b.Case == "normal" && b.Label == "node H1 voltage");
        // The supply's own band: 400 V +- 5 % is 380 V to 420 V, +- 10 % is 360 V to 440 V.
        Assert.Equal((380.0, 420.0, 360.0, 440.0), (h1.OldMin!.Value, h1.OldMax!.Value, h1.NewMin!.Value, h1.NewMax!.Value));
        Assert.Contains("    node H1 voltage: 380.0 V to 420.0 V -> 360.0 V to 440.0 V (low -5.263 %, high +4.762 %)", DiffReport.Text(diff));
    }

    [Fact]
    public void The_diff_of_a_design_change_reads_as_expected()
    {
        // A bigger planer on the same unit: the boost winding now runs above its rating.
        var diff = Diff(Alder, Bigger);
        Assert.True(diff.Regressed);
        Snapshot.Match(DiffReport.Text(diff), "Data/diffs/alder-bigger-planer.txt");
        Snapshot.Match(DiffReport.Markdown(diff), "Data/diffs/alder-bigger-planer.md");
    }

    [Fact]
    public void A_bus_fault_study_is_compared_by_its_currents_and_each_winding_duty()
    {
        // The grid weaker at its minimum (200 MVA to 150 MVA) lowers the minimum studies' I″k only; a lower
        // peak withstand moves the windings' withstand and the peak-duty checks.
        var quarry = File.ReadAllText(Command.Example("quarry-lane-fault-duty.wn"));
        var weaker = Diff(quarry, quarry.Replace("minimum-fault-level 200 MVA", "minimum-fault-level 150 MVA"));
        Assert.Contains(weaker.Values, v => v.Case == "bus-fault F3 minimum" && v.Label == "bus fault ik" && v.New < v.Old);
        Assert.DoesNotContain(weaker.Values, v => v.Case == "bus-fault F3 maximum" && v.Label == "bus fault ik");
        var withstand = Diff(quarry, quarry.Replace("peak-withstand 120 kA", "peak-withstand 110 kA"));
        Assert.Contains(withstand.Values, v => v.Label == "bus fault winding LV_a peak withstand" && v.New == 110e3);
    }
}

using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A tap on a three-phase winding and a current or loading check of a whole three-phase element,
/// written once for all three phases, against values derived by hand beside each check.
/// </summary>
public class ThreePhaseTapTests
{
    // A delta-wye bank, ideal leakage (no impedance line), 11 kV to 415 V; the brush and section tests add to it.
    internal const string Unit = """
        frequency 50 Hz
        core T1 construction bank rating 300 kVA
        winding HV on T1 rated 11 kV resistance 2 ohm delta H1 H2 H3
        winding LV on T1 rated 415 V resistance 0.003 ohm wye X1 X2 X3 neutral X0
        no-load T1 current 1.5 % loss 900 W at HV 11 kV
        three-phase-supply grid H1 H2 H3 11 kV fault-level 250 MVA
        ground X0

        """;

    [Fact]
    public void A_tap_on_a_three_phase_winding_is_a_tap_on_each_phase_winding()
    {
        var e = Wn.Solved(Unit + "tap T on LV at 25 %\n");
        var taps = e.Model.Taps;
        Assert.Equal(["T_a", "T_b", "T_c"], taps.Select(t => t.Name));
        Assert.Equal(["LV_a", "LV_b", "LV_c"], taps.Select(t => t.Winding));
        Assert.All(taps, t => Assert.Equal(0.25, t.Position));
        var c = e.Normal!;
        // By hand: with no load no current flows in LV, so each phase winding's voltage divides by
        // turns: the tap 25 % of the way from the line terminal (the polarity end) to the neutral
        // stands at 75 % of the line-to-neutral voltage, in phase with it.
        foreach (var (line, tap) in new[] { ("X1", "T_a"), ("X2", "T_b"), ("X3", "T_c") })
        {
            var ratio = c.V(tap, "X0") / c.V(line, "X0");
            Assert.True((ratio - 0.75).Magnitude < 1e-9, $"{tap}: {ratio}");
        }
        // The tap's line shows each phase tap's voltage at its end.
        var hint = InlayHints.For(e).Single(h => h.Position.Line == e.Text.GetPosition(e.Text.Text.IndexOf("tap T", StringComparison.Ordinal)).Line);
        Assert.StartsWith("T_a ", hint.Label);
        Assert.Contains("; T_c ", hint.Label);
        // Each phase winding is two sections, named by the phase tap.
        Assert.Equal(6, c.Sections.Count(s => s.Winding.Name.StartsWith("LV_")));
        Assert.Contains(c.Sections, s => s.Section.Name == "LV_b:T_b-X0");
    }

    [Fact]
    public void A_phase_tap_is_reachable_by_name()
    {
        // A 10 ohm load from phase b's tap to the neutral: by hand, ideal leakage and the 3 mohm of
        // the winding's lower 75 % (2.25 mohm) beside 10 ohm, the load sees very nearly 75 % of
        // 415/sqrt(3) = 179.7 V, so about 17.97 A, all in LV_b's lower section and none in LV_a's or LV_c's.
        var e = Wn.Solved(Unit + "tap T on LV at 25 %\nload lamp T_b X0 impedance 10 ohm\n");
        var c = e.Normal!;
        Wn.Near(0.75 * 415 / Math.Sqrt(3) / 10, c.Load("lamp").Current.Magnitude, 2e-3, "lamp current");
        Wn.Near(c.Load("lamp").Current.Magnitude, c.Section("LV_b:T_b-X0").Current.Magnitude, 1e-9, "LV_b lower section");
        Assert.True(c.Section("LV_a:T_a-X0").Current.Magnitude < 1e-9);
    }

    [Fact]
    public void A_rename_of_a_three_phase_tap_carries_its_phase_taps()
    {
        var (evaluation, position) = Cursor.Parse(Unit + "tap T$0 on LV at 25 %\nload lamp T_b X0 impedance 10 ohm\n");
        var result = Navigation.Rename(evaluation, position, "MID");
        Assert.Null(result.Error);
        var renamed = Cursor.Apply(evaluation.Text.Text, result.Edits);
        Assert.Contains("tap MID on LV at 25 %\nload lamp MID_b X0 impedance 10 ohm\n", renamed);
        Assert.DoesNotContain(Wn.Eval(renamed).Diagnostics, d => d.IsError);
    }

    [Fact]
    public void A_current_check_of_a_whole_winding_checks_every_phase_and_names_the_one_that_fails()
    {
        // One 8 ohm load on phase b alone: LV_b carries it (by hand about 415/sqrt(3)/8 = 29.95 A),
        // LV_a and LV_c carry nothing. The check of LV is the check of its worst phase.
        var text = Unit + "load heater X2 X0 impedance 8 ohm\nexpect current LV below 20 A\nexpect current LV below 40 A\nexpect loading LV below 100 %\n";
        var e = Wn.Eval(text);
        var c = e.Normal!;
        var ib = c.Section("LV_b").Current.Magnitude;
        Wn.Near(415 / Math.Sqrt(3) / 8, ib, 5e-3, "LV_b current");
        Assert.True(c.Section("LV_a").Current.Magnitude < 1e-6 * ib);
        var checks = e.Checks.ToList();
        Assert.False(checks[0].Passed);
        Assert.True(checks[1].Passed);
        Assert.Equal(ib, checks[0].Value!.Value, 9);
        Assert.Equal(ib, checks[1].Value!.Value, 9);
        var failed = e.Single("expect-failed");
        Assert.StartsWith("current LV is ", failed.Message);
        Assert.Contains(" on LV_b: expected below 20 A", failed.Message);
        // Loading: the rated phase current is 300 kVA / 3 / (415 V / sqrt(3)) = 417.4 A, so LV_b is at ib/417.4.
        Assert.True(checks[2].Passed);
        Assert.Equal(ib / (100e3 / (415 / Math.Sqrt(3))), checks[2].Value!.Value, 9);
    }

    [Fact]
    public void A_current_check_of_a_delta_load_and_of_a_supply_checks_their_phases()
    {
        // A balanced delta load: each phase element carries the same current, so the check reads it;
        // a supply's phases likewise. By hand a delta phase current is the line current over sqrt(3).
        var e = Wn.Eval(Unit + "three-phase-load motor X1 X2 X3 delta impedance 12 ohm\nexpect current motor below 1 kA\nexpect current grid below 1 kA\n");
        var c = e.Normal!;
        var phase = c.Load("motor_ab").Current.Magnitude;
        Wn.Near(415.0 / 12, phase, 5e-3, "delta phase current");
        Assert.Equal(c.Loads.Where(l => l.Load.Name.StartsWith("motor_")).Max(l => Math.Abs(l.Current.Magnitude)), e.Checks[0].Value!.Value, 9);
        Assert.Equal(c.Supplies.Where(s => s.Supply.Name is "grid_a" or "grid_b" or "grid_c").Max(s => s.Current.Magnitude), e.Checks[1].Value!.Value, 9);
        Assert.All(e.Checks, x => Assert.True(x.Passed));
    }

    [Fact]
    public void A_check_of_a_tapped_three_phase_winding_asks_for_a_section_of_the_phase()
    {
        var e = Wn.Eval(Unit + "tap T on LV at 25 %\nexpect current LV below 20 A\n");
        Assert.Equal("cannot check current LV: 'LV_a' has 2 sections; name one by its two points", e.Single("expect-unknown").Message);
    }
}

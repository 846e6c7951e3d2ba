using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A current check of a section of a whole three-phase winding between two of its three-phase taps
/// ('expect current LV TA TB'): each phase between its own taps, the worst named.
/// </summary>
public class ThreePhaseSectionTests
{
    // The delta-wye bank of the tap tests (ideal leakage, 11 kV to 415 V) with two taps on the wye.
    private const string Unit = ThreePhaseTapTests.Unit + "tap TA on LV at 25 %\ntap TB on LV at 75 %\n";

    [Fact]
    public void A_section_check_of_a_three_phase_winding_checks_each_phase_between_its_taps_and_names_the_worst()
    {
        // One 8 ohm load from line X2 to the neutral: LV_b carries it through every section in series
        // (by hand about 415/√3/8 = 29.95 A), LV_a and LV_c nothing (R1: with the line ends open, no
        // section of theirs has a path).
        var e = Wn.Eval(Unit + "load heater X2 X0 impedance 8 ohm\nexpect current LV TA TB below 20 A\nexpect current LV TA TB below 40 A\nexpect loading LV TA TB below 100 %\n");
        Assert.DoesNotContain(e.Errors(), d => d.Code != "expect-failed");
        var c = e.Normal!;
        var ib = c.Section("LV_b:TA_b-TB_b").Current.Magnitude;
        Wn.Near(415 / Math.Sqrt(3) / 8, ib, 5e-3, "LV_b between its taps");
        Assert.True(c.Section("LV_a:TA_a-TB_a").Current.Magnitude < 1e-6 * ib);
        var checks = e.Checks.ToList();
        Assert.False(checks[0].Passed);
        Assert.True(checks[1].Passed);
        Assert.Equal(ib, checks[0].Value!.Value, 9);
        Assert.Equal(ib, checks[1].Value!.Value, 9);
        var failed = e.Single("expect-failed");
        Assert.Contains(" on LV_b: expected below 20 A", failed.Message);
        // Loading against the phase winding's rated current: 100 kVA / (415 V/√3) = 417.4 A.
        Assert.True(checks[2].Passed);
        Assert.Equal(ib / (100e3 / (415 / Math.Sqrt(3))), checks[2].Value!.Value, 9);
    }

    [Fact]
    public void A_section_of_a_three_phase_winding_needs_two_of_its_own_three_phase_taps()
    {
        // X0 is one point, not one a phase: the check must name a phase ('LV_a TA_a X0').
        var e = Wn.Eval(Unit + "expect current LV TA X0 below 20 A\n");
        var error = Assert.Single(e.Errors());
        Assert.Equal("LV", e.TextAt(error.Span));
    }
}

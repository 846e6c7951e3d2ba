using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A brush on a three-phase winding: one brush on each phase winding, B_a, B_b, B_c, moved together
/// (ganged), each reachable by name; a sweep of B moves all three.
/// </summary>
public class ThreePhaseBrushTests
{
    // The delta-wye bank of the tap tests (ideal leakage, 11 kV to 415 V) with a brush on the wye.
    private const string Unit = ThreePhaseTapTests.Unit + "brush B on LV at 40 % range 10 % to 90 % current-limit 50 A\n";

    [Fact]
    public void A_brush_on_a_three_phase_winding_is_a_brush_on_each_phase_winding_moved_together()
    {
        var e = Wn.Solved(Unit + "sweep B from 20 % to 80 % step 30 %\n");
        var brushes = e.Model.Taps;
        Assert.Equal(["B_a", "B_b", "B_c"], brushes.Select(t => t.Name));
        Assert.All(brushes, t => Assert.True(t.IsBrush));
        Assert.All(brushes, t => Assert.Equal(0.40, t.Position));
        Assert.All(brushes, t => Assert.Equal(50, t.CurrentLimit));
        Assert.All(brushes, t => Assert.Equal(0.10, t.Range!.From));
        // By hand (R1): no load, no current in LV, so each brush 40 % of the way from the line terminal
        // (the polarity end) to the neutral stands at 60 % of its phase's line-to-neutral voltage.
        var c = e.Normal!;
        foreach (var (line, brush) in new[] { ("X1", "B_a"), ("X2", "B_b"), ("X3", "B_c") })
            Assert.True((c.V(brush, "X0") / c.V(line, "X0") - 0.6).Magnitude < 1e-9, brush);
        // The sweep moves all three: at 20 %, 50 % and 80 % each brush stands at 80 %, 50 % and 20 %.
        var points = Wn.Points(e);
        Assert.Equal(3, points.Count);
        foreach (var (point, expected) in points.Zip(new[] { 0.8, 0.5, 0.2 }))
            foreach (var (line, brush) in new[] { ("X1", "B_a"), ("X2", "B_b"), ("X3", "B_c") })
                Assert.True((point.V(brush, "X0") / point.V(line, "X0") - expected).Magnitude < 1e-9, $"{brush} at {point.Case.Where}");
    }

    [Fact]
    public void Each_phase_brush_is_reachable_by_name()
    {
        // A 10 ohm load from B_b to the neutral: by hand about 60 % of 415/√3 = 143.8 V over 10 ohm,
        // 14.38 A, in LV_b's section below the brush alone; below its 50 A limit.
        var e = Wn.Solved(Unit + "load lamp B_b X0 impedance 10 ohm\nexpect current LV_b B_b X0 below 20 A\n");
        var c = e.Normal!;
        Wn.Near(0.6 * 415 / Math.Sqrt(3) / 10, c.Load("lamp").Current.Magnitude, 2e-3, "lamp current");
        Wn.Near(c.Load("lamp").Current.Magnitude, c.Section("LV_b:B_b-X0").Current.Magnitude, 1e-9);
        Assert.True(c.Section("LV_a:B_a-X0").Current.Magnitude < 1e-9);
        Assert.True(Assert.Single(e.Checks).Passed);
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "brush-current-high");
    }
}

using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The pair's forms beside its first ones (PairTests): an open delta's secondaries in series bucking the
/// outer lines ('series-bucking'), and a Scott-T's teaser tap where the file puts it ('teaser-tap').
/// Ideal units (no impedance line): every voltage follows from the turns by hand.
/// </summary>
public class PairFormTests
{
    /// <summary>Two 3 kVA 480:48 V units in open delta with their secondaries in series with H1 and H3; a load Y1 to Y3.</summary>
    private static string OpenDelta(string output) => $"""
        frequency 60 Hz
        unit-pair B H1 H2 H3 open-delta {output} Y1 Y3 rating 3 kVA primary-winding P 480 V secondary-winding S 48 V
        three-phase-supply grid H1 H2 H3 480 V
        load saw Y1 Y3 impedance 100 ohm
        load fan H2 Y3 impedance 100 ohm

        """;

    [Fact]
    public void An_open_delta_in_series_bucking_takes_a_tenth_from_the_outer_lines_as_boosting_adds_it()
    {
        // By hand, k = 48/480 = 0.1 and ideal units: boosting, the secondary from Y1 to H1 stands at k·(H1 − H2),
        // so Y1 = H1 + k(H1 − H2), Y3 = H3 + k(H3 − H2) and Y1 − Y3 = (1 + k)(H1 − H3): 528 V. Bucking, from H1
        // to Y1: Y1 = H1 − k(H1 − H2), Y3 = H3 − k(H3 − H2), Y1 − Y3 = (1 − k)(H1 − H3): 432 V, in phase with
        // H1 − H3 (Y3 − H2 = (1 − k)(H3 − H2) likewise).
        var boost = Wn.Solved(OpenDelta("series")).Normal!;
        Wn.Near(528, boost.V("Y1", "Y3").Magnitude, 1e-9, "boosting");
        var buck = Wn.Eval(OpenDelta("series-bucking"));
        Assert.DoesNotContain(buck.Diagnostics, d => d.IsError);
        var c = buck.Normal!;
        Wn.Near(432, c.V("Y1", "Y3").Magnitude, 1e-9, "bucking");
        Wn.Near(432, c.V("Y3", "H2").Magnitude, 1e-9, "bucking, Y3 to H2");
        Assert.True(Math.Abs((c.V("Y1", "Y3") / c.V("H1", "H3")).Phase) < 1e-9);
        // The secondaries are written from the line to the output terminal.
        Assert.Contains(buck.Model.Windings, w => w.Name == "S_a" && w.From.Name == "H1" && w.To.Name == "Y1");
        Assert.Contains(buck.Model.Windings, w => w.Name == "S_b" && w.From.Name == "H3" && w.To.Name == "Y3");
        // Still no isolation; no output above the supply where it bucks, as there is where it boosts.
        Assert.Contains(buck.Diagnostics, d => d.Code == "caution-no-isolation");
        Assert.DoesNotContain(buck.Diagnostics, d => d.Code == "caution-above-supply");
        Assert.Contains(Wn.Eval(OpenDelta("series")).Diagnostics, d => d.Code == "caution-above-supply");
    }

    /// <summary>An ideal Scott-T of 10 kVA 480:120 V units, each output loaded with 4 Ω (PairTests' pair).</summary>
    private static string ScottT(string teaser) => $"""
        frequency 60 Hz
        unit-pair K H1 H2 H3 scott-t main-output X1 X2 teaser-output Y1 Y2 rating 10 kVA primary-winding P 480 V secondary-winding S 120 V{teaser}
        three-phase-supply grid H1 H2 H3 480 V
        load lamps X1 X2 impedance 4 ohm
        load heater Y1 Y2 impedance 4 ohm
        ground X2
        ground Y2

        """;

    [Theory]
    [InlineData("", 0.866)]
    [InlineData(" teaser-tap 86.6 %", 0.866)]
    [InlineData(" teaser-tap 90 %", 0.9)]
    [InlineData(" teaser-tap 0.8 pu", 0.8)]
    public void A_Scott_T_teaser_tap_written_sets_the_teaser_output(string written, double tap)
    {
        // By hand: the teaser's tap stands across H3 and the main's centre tap, (√3/2)·480 V, so its whole
        // winding (480:120 V of turns) has (√3/2)·480/f V and its secondary a quarter of that:
        // 120·(√3/2)/f V; at f = 0.9, 115.47 V. The main's output is 480/4 = 120 V whatever f is.
        var e = Wn.Solved(ScottT(written));
        var c = e.Normal!;
        Wn.Near(120, c.V("X1", "X2").Magnitude, 1e-9, "main output");
        Wn.Near(120 * Math.Sqrt(3) / 2 / tap, c.V("Y1", "Y2").Magnitude, 1e-9, "teaser output");
        var t = Assert.Single(e.Model.Taps, t => t.Name == "P_tt");
        Assert.Equal(tap, t.Position, 12);
        // The tap's section from the teaser's line end H3 has f of its turns.
        var sections = e.Network!.Sections.Where(s => s.Name.StartsWith("P_t:", StringComparison.Ordinal)).ToList();
        Wn.Near(tap / (1 - tap), sections[0].Turns / sections[1].Turns, 1e-9, "turns either side of the tap");
    }

    [Theory]
    [InlineData(" teaser-tap 100 %", "100 %")]
    [InlineData(" teaser-tap 0 %", "0 %")]
    [InlineData(" teaser-tap 0.9", "0.9")]
    public void A_teaser_tap_off_the_winding_or_without_a_unit_is_one_error(string written, string at)
    {
        var e = Wn.Eval(ScottT(written));
        var error = Assert.Single(e.Errors());
        Assert.Equal(at, e.TextAt(error.Span));
    }

    [Fact]
    public void A_teaser_tap_on_an_open_delta_is_one_error()
    {
        var e = Wn.Eval(OpenDelta("series").Replace("secondary-winding S 48 V", "secondary-winding S 48 V teaser-tap 90 %"));
        var error = Assert.Single(e.Errors());
        Assert.Equal("teaser-tap 90 %", e.TextAt(error.Span));
        Assert.Contains("an open delta, which has no teaser", error.Message);
    }
}

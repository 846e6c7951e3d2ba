using System.Numerics;
using System.Text.Json;
using WindingNotes.Report;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>The neutral (return) current of a centre-tapped winding, reported without a probe load.</summary>
public class TapCurrentTests
{
    private static string Service(string a, string b) => $"""
        frequency 60 Hz
        core T1 rating 25 kVA
        winding HV on T1 turns 1200 rated 2400 V from H1 to H2
        winding LV on T1 turns 120 rated 240 V from X1 to X3
        tap X2 on LV at 50 %
        supply line H1 H2 2400 V
        ground H2
        ground X2
        load leg_a X1 X2 impedance {a}
        load leg_b X2 X3 impedance {b}

        """;

    [Fact]
    public void The_neutral_of_an_unbalanced_120_240_V_secondary_carries_the_difference_of_the_legs()
    {
        // Ideal unit, 2400/240 V: each half gives 120 V. Leg a takes 120/10 = 12 A, leg b 120/20 = 6 A,
        // both in phase with their half's voltage. Kirchhoff at X2: leg a brings 12 A into X2 and leg b
        // takes 6 A out of it, so 12 − 6 = 6 A returns into the winding at the centre tap: the current
        // out of the winding at X2 is −6 A, in phase with leg a's current.
        var c = Wn.Solved(Service("10 ohm", "20 ohm")).Normal!;
        var neutral = c.Taps.Single();
        Assert.Equal(("X2", "LV"), (neutral.Point, neutral.Winding.Name));
        Wn.Near(6, neutral.Current.Magnitude, 1e-9, "neutral current");
        var expected = -(c.Load("leg_a").Current - c.Load("leg_b").Current);
        Assert.True(Complex.Abs(neutral.Current - expected) < 1e-9, $"{neutral.Current} against {expected}");
        // Balanced legs: no neutral current.
        Assert.True(Wn.Solved(Service("10 ohm", "10 ohm")).Normal!.Taps.Single().Current.Magnitude < 1e-9);
    }

    [Fact]
    public void Reports_give_the_neutral_current()
    {
        var e = Wn.Solved(Service("10 ohm", "20 ohm"));
        Assert.Matches("  Taps, current out of the winding\n    X2           on LV: 6.000 A angle -?180.00 deg\n", TextReport.Write(e));
        Assert.Matches(@"\| X2 \| LV \| 6.000 A \| -?180.00° \|", MarkdownReport.Write(e));
        using var json = JsonDocument.Parse(JsonReport.Write(e));
        var tap = json.RootElement.GetProperty("cases")[0].GetProperty("taps").GetProperty("X2");
        Assert.Equal("LV", tap.GetProperty("winding").GetString());
        Wn.Near(6, tap.GetProperty("i").GetProperty("rms").GetDouble(), 1e-9, "JSON neutral current");
    }
}

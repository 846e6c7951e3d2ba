using System.Numerics;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>Paralleled three-phase units: the current circulating between them and how they share the load.</summary>
public class ParallelUnitTests
{
    internal static string Pair(string lvB, string zB) => $"""
        frequency 60 Hz
        core TA construction bank rating 1500 kVA
        winding HA on TA rated 13.8 kV delta H1 H2 H3
        winding LA on TA rated 480 V wye X1 X2 X3 neutral X0
        impedance HA LA 5.75 % xr 6
        core TB construction bank rating 1500 kVA
        winding HB on TB rated 13.8 kV delta G1 G2 G3
        winding LB on TB rated {lvB} wye Y1 Y2 Y3 neutral Y0
        impedance HB LB {zB} xr 6
        join H1 G1
        join H2 G2
        join H3 G3
        join X1 Y1
        join X2 Y2
        join X3 Y3
        join X0 Y0
        three-phase-supply utility H1 H2 H3 13.8 kV
        ground X0
        three-phase-load plant X1 X2 X3 wye X0 impedance 0.2 ohm pf 0.9

        """;

    [Fact]
    public void Units_on_unequal_ratios_circulate_the_difference_of_their_voltages_over_the_sum_of_their_impedances()
    {
        // By hand (any machines textbook's parallel operation; from the loop alone): with every load
        // removed and an ideal source, the loop of the two units holds ΔE = (492 − 480)/√3 V a phase on
        // the 480 V side, through Z_A + Z_B, each unit's short-circuit impedance in ohms there:
        // Z_A = 5.75 %·480²/1.5 MVA, Z_B = 6 %·492²/1.5 MVA, both at X/R 6 (ideal cores, no magnetising current).
        var e = Wn.Solved(Pair("492 V", "6 %"));
        var group = Assert.Single(e.Parallel);
        var angle = new Complex(1, 6) / Math.Sqrt(37);
        var za = 0.0575 * 480 * 480 / 1.5e6 * angle;
        var zb = 0.06 * 492 * 492 / 1.5e6 * angle;
        var expected = (492 - 480) / Math.Sqrt(3) / (za + zb).Magnitude;
        Wn.Near(expected, group.Units[0].Circulating.Single(c => c.Winding == "LA").Current, 1e-9, "I_circ in A");
        Wn.Near(expected, group.Units[1].Circulating.Single(c => c.Winding == "LB").Current, 1e-9, "I_circ in B");
        // Rated LV current of A: 1.5 MVA/(√3·480 V) = 1804 A.
        Wn.Near(expected / (1.5e6 / (Math.Sqrt(3) * 480)), group.Units[0].Circulating.Single(c => c.Winding == "LA").OfRated!.Value, 1e-9, "of rated");
    }

    [Fact]
    public void Units_on_equal_ratios_share_the_load_inversely_as_their_impedances()
    {
        // By hand: on equal ratios nothing circulates, and two impedances of one X/R in parallel
        // divide the current inversely as their magnitudes: A's share Z_B/(Z_A + Z_B) = 6/(5.75 + 6).
        var e = Wn.Solved(Pair("480 V", "6 %"));
        var group = Assert.Single(e.Parallel);
        Wn.Near(6 / 11.75, group.Units[0].Share, 1e-9, "share of A");
        Wn.Near(5.75 / 11.75, group.Units[1].Share, 1e-9, "share of B");
        Assert.True(group.Units[0].Circulating.All(c => c.Current < 1e-6));
    }
}

using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>Copper loss by winding: never negative, adding up to the core's loss.</summary>
public class CopperLossTests
{
    // R7's three-winding unit (Grainger and Stevenson, Power System Analysis, three-winding example,
    // from memory) with X/R ratios of our own on each pair, all on 15 MVA.
    private const string ThreeWinding = """
        frequency 60 Hz
        core T rating 15 MVA
        winding P on T rated 66 kV from P1 to P2
        winding S on T rated 13.2 kV rating 10 MVA from S1 to S2
        winding U on T rated 2.3 kV rating 5 MVA from U1 to U2
        impedance P S 7 % xr 10
        impedance P U 9 % xr 30
        impedance S U 12 % xr 5
        supply grid P1 P2 66 kV
        ground P2
        ground S2
        ground U2
        load a S1 S2 power 8 MW pf 0.9 lagging
        load b U1 U2 power 4 MW pf 0.9 lagging

        """;

    [Fact]
    public void Resistances_from_pairwise_tests_that_give_a_negative_star_branch_give_no_negative_winding_loss()
    {
        var c = Wn.Solved(ThreeWinding).Normal!;
        // Pair resistances in per unit on 15 MVA (R = Z/√(1 + (X/R)²)):
        //   a = R_PS = 0.07/√101 = 0.0069652, b = R_PU = 0.09/√901 = 0.0029983, c = R_SU = 0.12/√26 = 0.023534.
        // The star split R_P = (a + b − c)/2 = −0.0067853 is negative: no winding has a negative
        // resistance. The non-negative fit fixes R_P at 0 and fits R_S + 0 = a, 0 + R_U = b,
        // R_S + R_U = c by least squares: 2R_S + R_U = a + c and R_S + 2R_U = b + c, so
        //   R_S = (2a − b + c)/3 and R_U = (2b − a + c)/3.
        double a = 0.07 / Math.Sqrt(101), b = 0.09 / Math.Sqrt(901), cc = 0.12 / Math.Sqrt(26);
        double rs = (2 * a - b + cc) / 3, ru = (2 * b - a + cc) / 3;
        Assert.True(rs > 0 && ru > 0);
        var (p, s, u) = (c.Section("P"), c.Section("S"), c.Section("U"));
        Assert.All(c.Sections, x => Assert.True(x.Loss >= 0, $"{x.Section.Name} loss {x.Loss} W"));

        // The total is the power balance: what the supply gives less what the loads take (ideal core).
        var balance = c.Supply("grid").Power.Real - c.Load("a").Power.Real - c.Load("b").Power.Real;
        Wn.Near(balance, c.Totals.CopperLoss, 1e-6, "total copper loss");
        Wn.Near(balance, p.Loss + s.Loss + u.Loss, 1e-6, "the windings' losses add up to it");

        // Shared by each winding's own series resistance: P has none; S and U in the ratio of R·|I|²
        // (currents in per unit of their own base current, 15 MVA over the rated voltage).
        Assert.Equal(0, p.Loss);
        double iS = s.Current.Magnitude / (15e6 / 13.2e3), iU = u.Current.Magnitude / (15e6 / 2.3e3);
        Wn.Near(rs * iS * iS / (ru * iU * iU), s.Loss / u.Loss, 1e-9, "S against U");
    }

    [Fact]
    public void Where_the_resistances_split_into_winding_resistances_each_winding_keeps_its_own_I2R()
    {
        // Stated resistances: each winding's loss is R·|I|² of its own conductor, exactly.
        var c = Wn.Solved("""
            frequency 60 Hz
            core K1 rating 0.5 kVA
            winding HV on K1 turns 240 rated 240 V from H1 to H2 resistance 1.4 ohm
            winding LV on K1 turns 24 rated 24 V from X1 to X2 resistance 0.014 ohm
            impedance HV LV 3.6 %
            supply mains H1 H2 240 V
            ground H2
            ground X2
            load lamp X1 X2 impedance 1.5 ohm

            """).Normal!;
        foreach (var (name, r) in new[] { ("HV", 1.4), ("LV", 0.014) })
        {
            var i = c.Section(name).Current.Magnitude;
            Wn.Near(r * i * i, c.Section(name).Loss, 1e-9, name);
        }
    }
}

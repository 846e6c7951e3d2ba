using System.Collections.Immutable;
using System.Globalization;
using System.Numerics;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Model;

/// <summary>
/// How impedance lines become the leakage of windings and sections (common practice where no source
/// is named): sections inherit their member's row, pairs come back from short-circuit tests,
/// resistances go where the data put them.
/// </summary>
public class LeakageTests
{
    private const string TwoWinding = """
        frequency 50 Hz
        core K rating 10 kVA
        winding HV on K turns 400 rated 400 V from H1 to H2 resistance 0.2 ohm
        winding LV on K turns 100 rated 100 V from X1 to X2 resistance 0.0125 ohm
        impedance HV LV 4 % xr 3

        """;

    private static readonly (string, string) HV = ("H1", "H2"), LV = ("X1", "X2");

    private static string N(double x) => x.ToString("R", CultureInfo.InvariantCulture);

    [Fact]
    public void A_tapped_winding_with_no_section_data_is_one_winding_to_its_neighbours()
    {
        var tapped = TwoWinding + "tap T1 on HV at 100 turns\ntap T2 on HV at 300 turns\n";
        ShortCircuit.Near(ShortCircuit.Impedance(TwoWinding, HV, LV), ShortCircuit.Impedance(tapped, HV, LV), 1e-12, "HV-LV");
        ShortCircuit.Near(ShortCircuit.Impedance(TwoWinding, LV, HV), ShortCircuit.Impedance(tapped, LV, HV), 1e-12, "LV-HV");
        const string loaded = "supply s H1 H2 400 V\nground H2\nground X2\nload l X1 X2 impedance 1.2 + j0.4 ohm\n";
        var plain = Wn.Solved(TwoWinding + loaded).Normal!;
        var split = Wn.Solved(tapped + loaded).Normal!;
        ShortCircuit.Near(plain.V("X1", "X2"), split.V("X1", "X2"), 1e-12, "load voltage");
        ShortCircuit.Near(plain.Supply("s").Current, split.Supply("s").Current, 1e-12, "supply current");
        Wn.Near(plain.Totals.CopperLoss, split.Totals.CopperLoss, 1e-12, "copper loss");
    }

    [Fact]
    public void A_tapped_winding_with_no_leakage_data_divides_like_an_ideal_winding_under_load()
    {
        var c = Wn.Solved("""
            frequency 50 Hz
            core K rating 10 kVA
            winding W on K turns 400 rated 400 V from A to B
            tap T1 on W at 100 turns
            tap T2 on W at 300 turns
            supply s A B 400 V
            ground B
            load inner T2 B impedance 3 ohm
            load far A T1 impedance 5 + j2 ohm
            """).Normal!;
        ShortCircuit.Near(new Complex(100, 0), c.V("T2", "B"), 1e-12, "T2 to B: 100 of 400 turns");
        ShortCircuit.Near(new Complex(100, 0), c.V("A", "T1"), 1e-12, "A to T1: 100 of 400 turns");
        var sum = c.Sections.Aggregate(Complex.Zero, (a, s) => a + s.Section.Turns * s.Current);
        Assert.True(sum.Magnitude <= 1e-12 * 400 * c.Supply("s").Current.Magnitude, $"ampere-turns {sum}");
    }

    [Fact]
    public void Sections_of_one_winding_take_part_like_two_windings()
    {
        // One tapped winding with the impedance between its series and common parts, against the same
        // unit as two windings joined into an autotransformer (the resistance split by turns).
        const string two = """
            frequency 50 Hz
            core K rating 10 kVA
            winding SR on K turns 50 rated 50 V from S1 to S2 resistance 0.034 ohm
            winding C on K turns 200 rated 200 V from C1 to C2 resistance 0.136 ohm
            impedance SR C 3 % xr 4
            join S2 C1
            supply s C1 C2 200 V
            ground C2
            load l S1 C2 apparent 8 kVA pf 0.9

            """;
        const string one = """
            frequency 50 Hz
            core K rating 10 kVA
            winding W on K turns 250 rated 250 V from S1 to C2 resistance 0.17 ohm
            tap C1 on W at 50 turns
            impedance W:S1-C1 W:C1-C2 3 % xr 4
            supply s C1 C2 200 V
            ground C2
            load l S1 C2 apparent 8 kVA pf 0.9

            """;
        var a = Wn.Solved(two).Normal!;
        var b = Wn.Solved(one).Normal!;
        ShortCircuit.Near(a.V("S1", "C2"), b.V("S1", "C2"), 1e-12, "output voltage");
        ShortCircuit.Near(a.Supply("s").Current, b.Supply("s").Current, 1e-12, "supply current");
        ShortCircuit.Near(a.Section("SR").Current, b.Section("W:S1-C1").Current, 1e-12, "series part");
        ShortCircuit.Near(a.Section("C").Current, b.Section("W:C1-C2").Current, 1e-12, "common part");
        Wn.Near(a.Totals.CopperLoss, b.Totals.CopperLoss, 1e-12, "copper loss");
    }

    [Fact]
    public void Negative_star_branches_work_and_every_pair_comes_back()
    {
        // Autotransformer-like data: the star branch of L is negative, (10 + 15 − 30)/2 = −2.5 %.
        const string data = """
            frequency 50 Hz
            core K rating 100 kVA
            winding H on K turns 230 rated 230 V from H1 to H2
            winding L on K turns 115 rated 115 V from L1 to L2
            winding T on K turns 23 rated 23 V from T1 to T2
            impedance H L 10 %
            impedance H T 30 %
            impedance L T 15 %
            """;
        double Base(double kv) => kv * kv / 100e3;
        ShortCircuit.Near(new Complex(0, 0.10 * Base(230)), ShortCircuit.Impedance(data, ("H1", "H2"), ("L1", "L2"), 230), 1e-9, "H-L");
        ShortCircuit.Near(new Complex(0, 0.30 * Base(230)), ShortCircuit.Impedance(data, ("H1", "H2"), ("T1", "T2"), 230), 1e-9, "H-T");
        ShortCircuit.Near(new Complex(0, 0.15 * Base(115)), ShortCircuit.Impedance(data, ("L1", "L2"), ("T1", "T2"), 115), 1e-9, "L-T");

        var e = Wn.Solved(data + "\nsupply s H1 H2 230 V\nground H2\nground L2\nground T2\nload a L1 L2 apparent 60 kVA pf 0.9\nload b T1 T2 apparent 20 kVA pf 0.8\n");
        var core = e.Network!.Cores[0];
        // With H the reference, L's own entry is Z_H + Z_L and the mutual term Z_H, per turn.
        var star = (core.Impedance[1, 1] / (115.0 * 115) - core.Impedance[1, 2] / (115.0 * 23)) * 100e3;
        Wn.Near(-0.025, star.Imaginary, 1e-9, "negative star branch of L, pu");
        Assert.Empty(e.Diagnostics.Where(d => d.Code is "ill-conditioned" or "singular"));
        Assert.InRange(e.Normal!.V("L1", "L2").Magnitude, 100, 130);
    }

    [Theory]
    [InlineData(1e-3)]
    [InlineData(1e-6)]
    [InlineData(1e-9)]
    public void Very_low_impedance_loads_solve_to_full_precision(double ohms)
    {
        var joined = ShortCircuit.Impedance(TwoWinding, HV, LV);
        var e = Wn.Solved(TwoWinding + $"supply s H1 H2 1000 V\nground H2\nground X2\nload short X1 X2 impedance {N(ohms)} ohm\n");
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "ill-conditioned");
        // The load is in series with the test impedance, referred through the ratio 4.
        ShortCircuit.Near(joined + ohms * 16, 1000 / e.Normal!.Supply("s").Current, 1e-9, $"{ohms} ohm");
    }

    [Fact]
    public void Short_circuit_tests_on_a_large_ratio_unit_give_back_the_impedance()
    {
        const string data = """
            frequency 50 Hz
            core K rating 40 MVA
            winding HV on K rated 132 kV from H1 to H2
            winding LV on K rated 415 V from X1 to X2
            impedance HV LV 12.5 % xr 40
            """;
        var zBase = 132e3 * 132e3 / 40e6;
        var expected = Complex.FromPolarCoordinates(0.125 * zBase, Math.Atan(40));
        ShortCircuit.Near(expected, ShortCircuit.Impedance(data, ("H1", "H2"), ("X1", "X2"), 132e3), 1e-9, "from HV");
        ShortCircuit.Near(expected * (415 / 132e3) * (415 / 132e3), ShortCircuit.Impedance(data, ("X1", "X2"), ("H1", "H2"), 415), 1e-9, "from LV");
    }

    [Fact]
    public void Stated_resistances_give_r_and_the_line_gives_x_with_a_warning_past_ten_percent()
    {
        // 4 % on 10 kVA at 400 V is 0.64 ohm; X/R 3 gives R 0.2024 ohm and X 0.6072 ohm. The windings
        // give 0.2 + 0.0125·16 = 0.4 ohm referred: a mismatch of about 98 %.
        var e = Wn.Eval(TwoWinding + "supply s H1 H2 400 V\nground H2\n");
        Assert.Equal("4 %", e.TextAt(e.Single("resistance-mismatch").Span));
        var z = ShortCircuit.Impedance(TwoWinding, HV, LV);
        ShortCircuit.Near(new Complex(0.4, 0.64 * 3 / Math.Sqrt(10)), z, 1e-12, "R from the windings, X from the line");
    }

    [Fact]
    public void A_three_phase_impedance_line_that_mismatches_its_resistances_says_so_once()
    {
        // One unit a phase of 100 kVA, 11 kV / 240 V: 4 % is 48.4 ohm referred to HV, X/R 3 gives R 15.31 ohm;
        // the windings give 10 + 0.01·(11 000/239.6)² = 31.08 ohm. One line, one mistake: one warning, not one a phase.
        var e = Wn.Eval("""
            frequency 50 Hz
            core T1 construction bank rating 300 kVA
            winding HV on T1 rated 11 kV delta H1 H2 H3 resistance 10 ohm
            winding LV on T1 rated 415 V wye X1 X2 X3 neutral X0 resistance 0.01 ohm
            impedance HV LV 4 % xr 3
            three-phase-supply grid H1 H2 H3 11 kV
            ground X0

            """);
        var d = Assert.Single(e.Diagnostics, x => x.Code == "resistance-mismatch");
        Assert.Equal("4 %", e.TextAt(d.Span));
        Assert.Contains("15.31 ohm", d.Message);
        Assert.Contains("31.08 ohm", d.Message);
    }

    [Fact]
    public void A_bare_magnitude_leaves_the_reactance_beside_the_stated_resistances()
    {
        var data = TwoWinding.Replace("4 % xr 3", "4 %");
        var z = ShortCircuit.Impedance(data, HV, LV);
        ShortCircuit.Near(new Complex(0.4, Math.Sqrt(0.64 * 0.64 - 0.4 * 0.4)), z, 1e-12, "R 0.4 ohm, |Z| 0.64 ohm");
    }

    [Fact]
    public void A_pair_resistance_is_shared_equally_between_windings_that_state_none()
    {
        // Common practice: R1 = R2' referred to one side.
        var data = TwoWinding.Replace(" resistance 0.2 ohm", "").Replace(" resistance 0.0125 ohm", "");
        var e = Wn.Solved(data + "supply s H1 H2 400 V\nground H2\n");
        var r = 0.64 / Math.Sqrt(10);
        var core = e.Network!.Cores[0];
        Wn.Near(r / 2, core.Impedance[0, 0].Real, 1e-12, "HV");
        Wn.Near(r / 2 / 16, core.Impedance[1, 1].Real, 1e-12, "LV");
        Assert.Equal(0, core.Impedance[0, 1].Real);
        ShortCircuit.Near(Complex.FromPolarCoordinates(0.64, Math.Atan(3)), ShortCircuit.Impedance(data, HV, LV), 1e-12, "pair");
    }

    [Fact]
    public void A_winding_that_states_no_resistance_takes_what_the_pair_leaves()
    {
        var data = TwoWinding.Replace(" resistance 0.0125 ohm", "");
        var e = Wn.Solved(data + "supply s H1 H2 400 V\nground H2\n");
        var core = e.Network!.Cores[0];
        Wn.Near((0.64 / Math.Sqrt(10) - 0.2) / 16, core.Impedance[1, 1].Real, 1e-12, "LV");
        ShortCircuit.Near(Complex.FromPolarCoordinates(0.64, Math.Atan(3)), ShortCircuit.Impedance(data, HV, LV), 1e-12, "pair");
    }

    [Fact]
    public void A_percentage_on_its_own_base_is_converted_to_the_core_rating()
    {
        var onCore = ShortCircuit.Impedance(TwoWinding, HV, LV);
        var onBase = ShortCircuit.Impedance(TwoWinding.Replace("4 % xr 3", "2 % xr 3 base 5 kVA"), HV, LV);
        ShortCircuit.Near(onCore, onBase, 1e-12, "2 % on 5 kVA is 4 % on 10 kVA");
    }

    [Fact]
    public void A_tolerance_on_an_impedance_moves_the_leakage()
    {
        var data = TwoWinding.Replace(" resistance 0.2 ohm", "").Replace(" resistance 0.0125 ohm", "").Replace("4 % xr 3", "4 % +- 10 % xr 3");
        var text = data + "supply s H1 H2 400 V\nground H2\n";
        var tree = WindingNotes.Syntax.Parser.Parse(text);
        var site = Assert.Single(WindingNotes.Model.Binder.Bind(tree).Tolerances);
        Wn.Near(0.1, site.Spread, 1e-12, "spread");
        var high = WindingNotes.Model.Binder.Bind(tree, new WindingNotes.Model.BindOverrides { Deviations = new Dictionary<int, double> { [site.Span.Start] = 1 }.ToImmutableDictionary() });
        var network = WindingNotes.Model.NetworkBuilder.Build(high);
        Wn.Near(0.64 * 1.1 * 3 / Math.Sqrt(10), network.Cores[0].Impedance[1, 1].Imaginary * 16, 1e-12, "X at +10 %");
    }
}

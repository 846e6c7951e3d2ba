using System.Xml.Linq;
using WindingNotes.Editing;
using WindingNotes.Model;
using WindingNotes.Report.Diagrams;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// IEEE C57.91's aging acceleration factor and equivalent aging factor (REFERENCES R47, from memory),
/// the thermal capability ('capability' lines) against hand solutions of the steady-state equations
/// of IEC 60076-7 (R45), and dry-type units by their insulation class (IEC 60076-11 and -12, from memory).
/// </summary>
public class ThermalCapabilityTests
{
    // The ideal 100 kVA, 1000/100 V unit of ThermalTests: a constant-current load of 1000 A is exactly
    // K = 1 in both windings, and without resistances the unit's K² is the windings' mean.
    private static string Unit(string thermal, string cycle, string load = "current 1000 A pf 1") => $"""
        frequency 50 Hz
        core T rating 100 kVA
        winding HV on T rated 1000 V from H1 to H2
        winding LV on T rated 100 V from X1 to X2
        impedance HV LV 4 %
        supply line H1 H2 1000 V
        ground H2
        ground X2
        load L X1 X2 {load}
        {thermal}
        {cycle}

        """;

    private const string Upgraded = "thermal T cooling ONAN top-oil-rise 52 K hot-spot-gradient 26 K loss-ratio 6 exponents 0.8 and 1.6 time-constants 180 min and 4 min k11 1 k21 1 k22 2 paper upgraded";

    [Theory]
    [InlineData(110, 1)]
    [InlineData(120, 2.70893)]
    [InlineData(98, 0.281738)]
    public void R47_the_aging_acceleration_factor_is_1_at_110_degC(double hotSpot, double faa)
    {
        // IEEE C57.91 F_AA (from memory), R47: F_AA = exp(15000/383 − 15000/(θH + 273)).
        // By hand: 15000/383 = 39.164491; at 120 degC 15000/393 = 38.167939, e^0.996552 = 2.70893;
        // at 98 degC 15000/371 = 40.431267, e^−1.266776 = 0.281738.
        Wn.Near(faa, ThermalEquations.AgingAccelerationFactor(hotSpot), 1e-5, $"F_AA at {hotSpot} degC");
    }

    [Fact]
    public void R47_the_equivalent_aging_factor_of_a_day_at_98_degC_is_its_aging_factor()
    {
        // Rated load all day at 20 degC: hot-spot 20 + 52 + 26 = 98 degC throughout (R45), so
        // F_EQA = Σ F_AA·Δt / Σ Δt = F_AA(98) = 0.281738 (IEEE C57.91, from memory).
        var e = Wn.Solved(Unit(Upgraded, "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu\nexpect equivalent-aging T near 0.2817 within 0.1 %"));
        var u = e.Thermal!.Units[0];
        Wn.Near(0.281738, u.EquivalentAging!.Value, 1e-5, "F_EQA");
        Wn.Near(0.281738, u.PeakAgingFactor!.Value, 1e-5, "highest F_AA");
        Assert.True(e.Checks.Single().Passed);
    }

    [Fact]
    public void The_equivalent_aging_factor_is_the_mean_of_the_aging_factor_over_the_steps_of_a_varying_day()
    {
        // The definition, F_EQA = Σ F_AA·Δt / Σ Δt, over the day's equal steps: the mean of F_AA at
        // each step's end (the hot-spot the step reaches, as the loss of life takes it).
        var e = Wn.Solved(Unit(Upgraded, "load-cycle ambient 25 degC\ncycle-point 0 h load 0.6 pu\ncycle-point 14 h load 1.3 pu\ncycle-point 20 h load 0.8 pu"));
        var u = e.Thermal!.Units[0];
        var mean = u.HotSpot.Skip(1).Average(ThermalEquations.AgingAccelerationFactor);
        Wn.Near(mean, u.EquivalentAging!.Value, 1e-12, "F_EQA");
        // Upgraded paper ages at F_AA (the same Arrhenius form, R47): the day's loss of life is 24 h·F_EQA.
        Wn.Near(24 * u.EquivalentAging.Value, u.LossOfLife, 1e-12, "loss of life");
    }

    [Fact]
    public void R45_the_constant_load_capability_solves_the_steady_state_at_the_hot_spot_limit()
    {
        // Held all day at 20 degC the unit settles at 20 + 52·[(1 + 6K²)/7]^0.8 + 26·K^1.6 (R45).
        // By hand: at K = 1.18 that is 119.458 degC, at K = 1.19 it is 120.715 degC; between them
        // linearly, 120 degC at K = 1.18 + 0.01·0.542/1.257 = 1.18431.
        var e = Wn.Solved(Unit(Upgraded, "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu\ncapability T constant-load hot-spot 120 degC"));
        var c = Assert.Single(e.Thermal!.Capabilities);
        Wn.Near(1.18432, c.Value!.Value, 2e-5, "constant load");
        Assert.Equal("hot-spot", c.Binding);
        Wn.Near(120, c.AtBinding, 1e-5, "hot-spot there");
        Assert.False(c.Beyond);
        Assert.Contains("is 1.184 pu, where the hot-spot reaches its limit (120.0 degC)", e.Single("capability").Message);
    }

    [Fact]
    public void R45_where_the_top_oil_binds_the_capability_has_a_closed_form()
    {
        // Top oil 105 degC at 20 degC ambient: 52·[(1 + 6K²)/7]^0.8 = 85, so
        // K = √((7·(85/52)^1.25 − 1)/6) = √((7·1.848389 − 1)/6) = √1.989787 = 1.410598... by hand;
        // computed in full below. The hot-spot limit is set out of the way.
        var e = Wn.Solved(Unit(Upgraded, "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu\ncapability T constant-load hot-spot 200 degC top-oil 105 degC"));
        var c = e.Thermal!.Capabilities[0];
        Wn.Near(Math.Sqrt((7 * Math.Pow(85.0 / 52, 1.25) - 1) / 6), c.Value!.Value, 1e-6, "constant load");
        Assert.Equal("top-oil", c.Binding);
    }

    [Fact]
    public void R47_a_day_of_life_for_upgraded_paper_is_a_steady_hot_spot_of_110_degC()
    {
        // Loss of life 24 h a day ⇔ ageing 1 all day ⇔ hot-spot 110 degC for upgraded paper (R47).
        // By hand: the steady hot-spot is 109.645 degC at K = 1.10 and 110.848 degC at K = 1.11;
        // linearly, 110 degC at K = 1.10 + 0.01·0.355/1.203 = 1.10295.
        var e = Wn.Solved(Unit(Upgraded, "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu\ncapability T constant-load hot-spot 150 degC loss-of-life 24 h"));
        var c = e.Thermal!.Capabilities[0];
        Wn.Near(1.10295, c.Value!.Value, 2e-5, "constant load");
        Assert.Equal("loss-of-life", c.Binding);
        Wn.Near(24, c.AtBinding, 1e-4, "loss of life there");
    }

    [Fact]
    public void The_cycle_multiple_found_brings_the_scaled_cycle_to_its_limit()
    {
        // Found by the search, then written into the cycle by hand: the day so scaled peaks at the limit.
        const string cycle = "load-cycle ambient 25 degC\ncycle-point 0 h load 0.6 pu\ncycle-point 14 h load 1.2 pu\ncycle-point 20 h load 0.7 pu";
        var e = Wn.Solved(Unit(Upgraded, cycle + "\ncapability T cycle-scale hot-spot 115 degC\nexpect capability T cycle-scale above 1 pu"));
        var s = e.Thermal!.Capabilities[0].Value!.Value;
        Assert.InRange(s, 0.8, 1.2);
        Assert.True(e.Checks.Single().Passed == s > 1);
        var scaled = cycle.Replace("0.6 pu", $"{0.6 * s:R} pu").Replace("1.2 pu", $"{1.2 * s:R} pu").Replace("0.7 pu", $"{0.7 * s:R} pu");
        var again = Wn.Solved(Unit(Upgraded, scaled));
        Assert.InRange(again.Thermal!.Units[0].PeakHotSpot, 115 - 0.02, 115 + 0.02);
    }

    [Fact]
    public void A_capability_beyond_the_search_is_at_least_its_end_and_passes_only_a_lower_bound()
    {
        // A hot-spot limit no load reaches within four times the cycle.
        var e = Wn.Solved(Unit(Upgraded, "load-cycle ambient 20 degC\ncycle-point 0 h load 0.1 pu\ncapability T cycle-scale hot-spot 190 degC\nexpect capability T cycle-scale above 2 pu"));
        var c = e.Thermal!.Capabilities[0];
        Assert.True(c.Beyond);
        Assert.Equal(ThermalCapability.Reach, c.Value);
        Assert.True(e.Checks.Single().Passed);
    }

    [Fact]
    public void A_class_155_dry_type_unit_at_rated_load_in_20_degC_runs_at_its_rated_hot_spot_and_ages_a_day_a_day()
    {
        // IEC 60076-11 (from memory): class 155 allows an average winding rise of 100 K; IEC 60076-12
        // (from memory): rated hot-spot 145 degC in a 20 degC ambient, so the gradient is 25 K. At K = 1:
        // 20 + 100 + 25 = 145 degC, the reference of its ageing (rate 1): 24 h a day. No F_AA: IEEE
        // defines it for oil-immersed units.
        var e = Wn.Solved(Unit("thermal T cooling AN class 155 degC loss-ratio 6", "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu"));
        var u = e.Thermal!.Units[0];
        Wn.Near(120, u.PeakTopOil, 1e-9, "winding average");
        Wn.Near(145, u.PeakHotSpot, 1e-9, "hot-spot");
        Wn.Near(24, u.LossOfLife, 1e-9, "loss of life");
        Assert.Null(u.EquivalentAging);
        Assert.Contains("average winding rise 100 K; hot-spot gradient 25 K", e.Single("thermal-defaults").Message);
        // Ten kelvin above the rated hot-spot the rate doubles (a 10 K halving interval, common practice).
        Assert.Equal(2, ThermalEquations.AgeingRate(u.Unit, 155), 12);
    }

    [Fact]
    public void A_dry_type_unit_above_its_insulation_class_is_warned_and_has_no_top_oil()
    {
        // At 35 degC the class 155 unit's hot-spot is 35 + 125 = 160 degC, above the 155 degC of its class.
        var e = Wn.Eval(Unit("thermal T cooling AN class 155 degC loss-ratio 6", "load-cycle ambient 35 degC\ncycle-point 0 h load 1 pu\nexpect top-oil below 100 degC"));
        Assert.Contains("reaches 160.0 degC", e.Single("hot-spot-high").Message);
        Assert.DoesNotContain(e.Diagnostics, d => d.Code is "top-oil-high" or "caution-hot-spot");
        Assert.Contains("a dry-type unit has no top oil", e.Single("expect-unknown").Message);
    }

    [Fact]
    public void The_thermal_and_capability_lines_show_their_results_in_hints_and_hover()
    {
        var text = Unit(Upgraded, "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu\ncapability T constant-load hot-spot 120 degC");
        var e = Wn.Solved(text);
        var hints = InlayHints.For(e);
        Assert.Contains(hints, h => h.Label == "1.184 pu, hot-spot 120.0 degC");
        var line = text.Split('\n').ToList().FindIndex(l => l.StartsWith("thermal T"));
        var hover = Hovers.At(e, new WindingNotes.Text.Position(line, "thermal T".Length - 1))!;
        Assert.Contains("FEQA 0.2817", hover.Markdown);
        Assert.Contains("capability (constant-load): 1.184 pu, where the hot-spot reaches 120.0 degC", hover.Markdown);
    }

    [Fact]
    public void The_sweep_plot_of_a_load_cycle_draws_the_day()
    {
        var e = Wn.Solved(Unit(Upgraded, "load-cycle ambient 20 degC step 4 min\ncycle-point 0 h load 0.6 pu\ncycle-point 16 h load 1.2 pu"));
        var plot = SweepPlot.Draw(e, null, out var problem);
        Assert.Null(problem);
        XNamespace svg = "http://www.w3.org/2000/svg";
        var root = XDocument.Parse(plot!.Svg).Root!;
        var texts = root.Descendants(svg + "text").Select(t => t.Value).ToList();
        Assert.Contains("T hot-spot", texts);
        Assert.Contains("T top oil", texts);
        Assert.Contains("load (pu)", texts);
        Assert.Contains("time of day (h)", texts);
        // A line a result over the 361 samples of the day, no marks.
        var lines = root.Descendants(svg + "polyline").ToList();
        Assert.Equal(4, lines.Count);
        Assert.All(lines, l => Assert.Equal(361, l.Attribute("points")!.Value.Split(' ').Length));
        Assert.Null(SweepPlot.Draw(e, ["hot-spot", "oil"], out problem));
        Assert.StartsWith("no result of the load cycle is called 'oil'", problem);
    }
}

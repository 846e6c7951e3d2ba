using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The thermal model of IEC 60076-7 against hand values: steady rises (REFERENCES R45), the
/// response to a load step against the closed form, ageing rates (R47), the typical constants (R46)
/// and limits (R48, from memory), and an autotransformer connection heated by the transformed power.
/// </summary>
public class ThermalTests
{
    // An ideal 100 kVA, 1000/100 V unit without magnetising branch, feeding a constant-current load:
    // every winding's current is exactly known, so each winding's K is.
    internal static string Unit(string load, string thermal, string cycle) => $"""
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

    private const string Data = "thermal T cooling ONAN top-oil-rise 52 K hot-spot-gradient 26 K loss-ratio 6 exponents 0.8 and 1.6";

    private static ThermalUnitModel Onan(double step = 60) => new("T", default, default, CoolingMode.ONAN, 52, 26)
    {
        LossRatio = 6, X = 0.8, Y = 1.6, OilTimeConstant = 180 * 60, WindingTimeConstant = 4 * 60, K11 = 1, K21 = 1, K22 = 2,
    };

    [Fact]
    public void R45_steady_rises_at_rated_and_at_1_2_per_unit()
    {
        // IEC 60076-7 (equations), R45: Δθo = Δθor·[(1 + R·K²)/(1 + R)]^x, Δθh = H·gr·K^y.
        // At K = 1: 52 K exactly, and 26 K.
        var u = Onan();
        Assert.Equal(52, ThermalEquations.TopOilRise(u, 6, 1), 12);
        Assert.Equal(26, ThermalEquations.HotSpotGradient(u, 1), 12);
        // At K = 1.2, by hand: (1 + 6·1.44)/(1 + 6) = 9.64/7 = 1.377143; 1.377143^0.8 = 1.291764;
        // 52·1.291764 = 67.17 K. 1.2^1.6 = e^(1.6·0.182322) = 1.338721; 26·1.338721 = 34.81 K.
        Wn.Near(67.17, ThermalEquations.TopOilRise(u, 6, 1.44), 1e-4, "top-oil rise");
        Wn.Near(34.81, ThermalEquations.HotSpotGradient(u, 1.2), 1e-3, "hot-spot gradient");
    }

    [Fact]
    public void R45_a_constant_load_of_1_2_per_unit_through_the_solved_network_settles_at_the_steady_rises()
    {
        // The load draws 1200 A from the 100 V winding (rated 1000 A) and so 120 A from the 1000 V
        // winding (rated 100 A): K = 1.2 in each. Without resistances the unit's K² is the windings'
        // mean, 1.44. Steady top oil 20 + 67.17 = 87.17 degC, hot-spot 87.17 + 34.81 = 121.98 degC
        // (R45 as above), held all day.
        var e = Wn.Solved(Unit("current 1200 A pf 1", Data, "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu"));
        var u = Assert.Single(e.Thermal!.Units);
        Wn.Near(87.1717, u.PeakTopOil, 1e-5, "top oil");
        Wn.Near(121.9785, u.PeakHotSpot, 1e-5, "hot-spot");
        Assert.All(u.HotSpot, h => Wn.Near(121.9785, h, 1e-5, "hot-spot through the day"));
        Assert.All(u.Windings, w => Wn.Near(1.2, w.PeakLoad, 1e-9, $"load of {w.Winding}"));
        // Above the 120 degC of normal cyclic loading (R48, from memory): a warning at the thermal line.
        var warning = e.Single("hot-spot-high");
        Assert.StartsWith("T", e.TextAt(warning.Span));
        // Ageing (R47, from memory): 2^((121.98 − 98)/6) = 2^3.9964 = 15.96 a day's hours each hour: 383.1 h.
        Wn.Near(Math.Pow(2, (121.9785 - 98) / 6) * 24, u.LossOfLife, 1e-4, "loss of life");
    }

    [Fact]
    public void A_per_unit_cycle_scales_every_load_and_solves_the_network_at_each_point()
    {
        // 0.5 pu of 1200 A is 600 A: K = 0.6 in both windings; K² = 0.36.
        // Steady: 52·[(1 + 6·0.36)/7]^0.8 = 52·0.451429^0.8 = 52·0.529263 = 27.52 K; 26·0.6^1.6 = 26·0.441613 = 11.48 K.
        var e = Wn.Solved(Unit("current 1200 A pf 1", Data, "load-cycle ambient 20 degC\ncycle-point 0 h load 0.5 pu"));
        var u = e.Thermal!.Units[0];
        Wn.Near(20 + 27.520, u.PeakTopOil, 1e-4, "top oil");
        Wn.Near(20 + 27.520 + 11.482, u.PeakHotSpot, 1e-4, "hot-spot");
    }

    [Theory]
    [InlineData(10)]
    [InlineData(30)]
    [InlineData(60)]
    [InlineData(120)]
    [InlineData(300)]
    public void A_load_step_follows_the_closed_form_exponential_response(double minutes)
    {
        // IEC 60076-7, exponential equations: from the steady state at K1 to K2 the hot-spot gradient is
        // Δθh1 + (Δθh2 − Δθh1)·f2(t), f2 = k21·(1 − e^(−t/(k22·τw))) − (k21 − 1)·(1 − e^(−t/(τo/k22))),
        // and the top-oil rise Δθo2 + (Δθo1 − Δθo2)·e^(−t/(k11·τo)). ONAN medium values, k21 = 2, so the
        // hot-spot overshoots; the difference equations at 1 s steps come within 0.05 K of it.
        var u = Onan() with { K11 = 0.5, K21 = 2, K22 = 2, OilTimeConstant = 210 * 60, WindingTimeConstant = 10 * 60, Y = 1.3 };
        var (o1, o2) = (ThermalEquations.TopOilRise(u, 6, 0.64), ThermalEquations.TopOilRise(u, 6, 1.69));
        var (g1, g2) = (ThermalEquations.HotSpotGradient(u, 0.8), ThermalEquations.HotSpotGradient(u, 1.3));
        var t = minutes * 60;
        var closedOil = o2 + (o1 - o2) * Math.Exp(-t / (0.5 * 210 * 60));
        var f2 = 2 * (1 - Math.Exp(-t / (2 * 10 * 60))) - (2 - 1) * (1 - Math.Exp(-t / (210 * 60 / 2.0)));
        var closedGradient = g1 + (g2 - g1) * f2;

        var difference = new ThermalEquations.State(1);
        difference.Settle(u, o1, [g1]);
        for (var s = 0; s < t; s++) difference.Step(u, 1, o2, [g2]);
        Assert.InRange(difference.TopOil - closedOil, -0.05, 0.05);
        Assert.InRange(difference.Gradient(0) - closedGradient, -0.05, 0.05);

        var exponential = new ThermalEquations.State(1);
        exponential.Settle(u, o1, [g1]);
        for (var s = 0; s < minutes; s++) exponential.Exponential(u, 60, o2, [g2], changed: s == 0);
        Assert.Equal(closedOil, exponential.TopOil, 9);
        Assert.Equal(closedGradient, exponential.Gradient(0), 9);
        Assert.Equal(f2, ThermalEquations.F2(u, t), 12);
    }

    [Theory]
    [InlineData(98, 1)]
    [InlineData(104, 2)]
    [InlineData(110, 4)]
    [InlineData(92, 0.5)]
    public void R47_ageing_of_non_upgraded_paper_doubles_every_6_kelvin(double hotSpot, double rate)
    {
        // IEC 60076-7 (from memory), R47: V = 2^((θh − 98)/6).
        Assert.Equal(rate, ThermalEquations.AgeingRate(hotSpot, upgraded: false), 12);
    }

    [Fact]
    public void R47_ageing_of_upgraded_paper_is_1_at_110_degC()
    {
        // IEC 60076-7 (from memory); IEEE C57.91 F_AA (same Arrhenius form), R47:
        // V = exp(15000/383 − 15000/(θh + 273)): 1 at 110 degC; at 120 degC exp(39.1645 − 38.1679) = 2.709.
        Assert.Equal(1, ThermalEquations.AgeingRate(110, upgraded: true), 12);
        Wn.Near(2.709, ThermalEquations.AgeingRate(120, upgraded: true), 1e-3, "upgraded at 120 degC");
    }

    [Fact]
    public void An_autotransformer_connection_heats_its_windings_by_the_transformed_power()
    {
        // The 1100/220 V, 15 kVA unit of R4 (published solved problem, read on a page) connected
        // as a 1100/1320 V step-up autotransformer carrying 90 kVA: throughput six times the rating.
        // By hand: the load takes 90 kVA / 1320 V = 68.18 A, which is the series winding's current,
        // 15 kVA / 220 V = 68.18 A rated: K = 1. The common winding carries the supply's 81.82 A less
        // 68.18 A = 13.64 A, its rated 15 kVA / 1100 V: K = 1. So the unit runs at its rating:
        // top oil 25 + 52 = 77 degC, hot-spot 77 + 26 = 103 degC; were it heated by the throughput,
        // K would be 6. Ageing 2^((103 − 98)/6) = 1.782, 42.77 h a day.
        var e = Wn.Solved("""
            frequency 50 Hz
            core T rating 15 kVA
            winding C on T rated 1100 V from C1 to C2
            winding S on T rated 220 V from S1 to S2
            supply line C1 C2 1100 V
            ground C2
            join C1 S2
            load out S1 C2 current 68.181818181818 A pf 1
            thermal T cooling ONAN top-oil-rise 52 K hot-spot-gradient 26 K loss-ratio 6
            load-cycle ambient 25 degC
            cycle-point 0 h load 1 pu
            """);
        Wn.Near(90e3, e.Normal!.Totals.Throughput, 1e-6, "throughput");
        var u = e.Thermal!.Units[0];
        Assert.All(u.Windings, w => Wn.Near(1, w.PeakLoad, 1e-6, $"load of {w.Winding}"));
        Wn.Near(77, u.PeakTopOil, 1e-6, "top oil");
        Wn.Near(103, u.PeakHotSpot, 1e-6, "hot-spot");
        Wn.Near(24 * Math.Pow(2, 5.0 / 6), u.LossOfLife, 1e-6, "loss of life");
    }

    [Fact]
    public void The_hottest_winding_is_the_one_loaded_most()
    {
        // A 480 V winding with two 240 V secondaries, one loaded to 0.9 of its rating, the other to 0.3.
        var e = Wn.Solved("""
            frequency 60 Hz
            core T rating 20 kVA
            winding P on T rated 480 V from H1 to H2
            winding A on T rated 240 V rating 10 kVA from A1 to A2
            winding B on T rated 240 V rating 10 kVA from B1 to B2
            impedance P A 3 %
            impedance P B 3 %
            impedance A B 5 %
            supply line H1 H2 480 V
            ground H2
            ground A2
            ground B2
            load heavy A1 A2 current 37.5 A pf 1
            load light B1 B2 current 12.5 A pf 1
            thermal T cooling ONAF top-oil-rise 50 K hot-spot-gradient 20 K loss-ratio 5
            load-cycle ambient 30 degC
            cycle-point 0 h load 1 pu
            """);
        var u = e.Thermal!.Units[0];
        Assert.Equal("A", u.HottestWinding);
        Wn.Near(0.9, u.Windings.Single(w => w.Winding == "A").PeakLoad, 1e-9, "load of A");
        Wn.Near(0.3, u.Windings.Single(w => w.Winding == "B").PeakLoad, 1e-9, "load of B");
    }

    [Fact]
    public void The_cycle_repeats_itself_and_the_peak_comes_at_the_end_of_the_heavy_hours()
    {
        var e = Wn.Solved(Unit("current 1000 A pf 1", Data,
            "load-cycle ambient 20 degC step 1 min\ncycle-point 0 h load 0.6 pu\ncycle-point 16 h load 1.3 pu\ncycle-point 20 h load 0.6 pu"));
        var r = e.Thermal!;
        var u = r.Units[0];
        Assert.Equal(u.HotSpot[0], u.HotSpot[^1], 3);
        Assert.Equal("20:00", r.Clock(u.PeakHotSpotTime));
        Assert.Equal(1441, r.Times.Length);
    }

    [Fact]
    public void Defaults_are_said_and_checks_hold_over_the_day()
    {
        var e = Wn.Eval(Unit("current 1000 A pf 1", "thermal T cooling ONAN top-oil-rise 52 K hot-spot-gradient 26 K loss-ratio 6",
            "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu\nexpect hot-spot below 99 degC\nexpect loss-of-life T between 23 h and 25 h\nexpect top-oil below 75 degC"));
        // Distribution ONAN (R46, from memory): x 0.8, y 1.6, τo 180 min, τw 4 min, k11 1, k21 1, k22 2.
        Assert.Contains("exponents x 0.8, y 1.6; time constants 180 min oil, 4 min winding", e.Single("thermal-defaults").Message);
        // Rated load all day at 20 degC: hot-spot 20 + 52 + 26 = 98 degC, ageing 1, 24 h.
        Assert.Equal([true, true, true], e.Checks.Select(c => c.Passed));
        Wn.Near(98, e.Checks[0].Value!.Value, 1e-9, "hot-spot");
        Wn.Near(24, e.Checks[1].Value!.Value, 1e-9, "loss of life");
    }

    [Fact]
    public void A_thermal_check_without_a_cycle_cannot_be_checked()
    {
        var e = Wn.Eval(Unit("current 1000 A pf 1", "", "expect hot-spot below 120 degC"));
        Assert.Contains("no load cycle", e.Single("expect-unknown").Message);
        Assert.False(e.Checks[0].Passed);
    }

    [Fact]
    public void Above_140_degC_the_hot_spot_is_a_caution()
    {
        var e = Wn.Eval(Unit("current 1000 A pf 1", Data, "load-cycle ambient 40 degC duty short-time-emergency\ncycle-point 0 h load 1.5 pu"));
        Assert.Contains("gas bubbles", e.Single("caution-hot-spot").Message);
    }

    [Fact]
    public void A_cycle_of_a_let_sets_the_let_at_each_point()
    {
        var e = Wn.Solved(Unit("current demand pf 1", Data,
            "load-cycle of demand ambient 20 degC\ncycle-point 0 h load 1200 A").Replace("frequency 50 Hz", "frequency 50 Hz\nlet demand = 500 A"));
        Wn.Near(1.2, e.Thermal!.Units[0].Windings[0].PeakLoad, 1e-9, "K from the let's value");
        Assert.Equal("A", e.Thermal.LoadUnit);
    }

    [Fact]
    public void The_thermal_line_shows_the_peak_hot_spot_and_the_loss_of_life()
    {
        var e = Wn.Solved(Unit("current 1000 A pf 1", Data, "load-cycle ambient 20 degC\ncycle-point 0 h load 1 pu"));
        var hints = WindingNotes.Editing.InlayHints.For(e);
        // Rated load all day at 20 degC: 98 degC, ageing 1, 24 h.
        Assert.Contains(hints, h => h.Label == "hot-spot up to 98.00 degC at 00:00 in 'HV', loss of life 24.00 h a day");
    }
}

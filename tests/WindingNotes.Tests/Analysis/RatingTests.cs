using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>Rating checks: warnings at the line of what is over its rating, and silence where all is within it.</summary>
public class RatingTests
{
    internal static string Boost(string load) => $"""
        frequency 60 Hz
        core K1 rating 0.5 kVA area 26 cm2 flux-limit 1.6 T
        winding HV on K1 turns 240 rated 240 V from H1 to H2 resistance 1.4 ohm
        winding LV on K1 turns 24 rated 24 V from X1 to X2 resistance 0.014 ohm
        impedance HV LV 3.6 % xr 1.1
        supply mains H1 H2 208 V
        ground H2
        join H1 X2
        load planer X1 H2 {load}

        """;

    [Fact]
    public void A_winding_over_its_rated_current_is_warned_at_its_line()
    {
        var e = Wn.Solved(Boost("power 5 kW pf 0.82 lagging"));
        // Both windings of a boost connection carry their share; each is warned at its own line.
        Assert.Equal(["HV", "LV"], e.Diagnostics.Where(x => x.Code == "loading-high").Select(x => e.TextAt(x.Span)));
        var d = e.Diagnostics.Single(x => x.Code == "loading-high" && e.TextAt(x.Span) == "LV");
        Assert.Equal(WindingNotes.Text.Severity.Warning, d.Severity);
        Assert.StartsWith("winding 'LV' carries 12", d.Message);
        Assert.DoesNotContain(Wn.Solved(Boost("power 3.2 kW pf 0.82 lagging")).Diagnostics, x => x.Code == "loading-high");
    }

    [Fact]
    public void Over_a_sweep_the_rating_warning_gives_the_worst_point_and_how_many_are_over()
    {
        var e = Wn.Solved(Boost("power p pf 0.82 lagging").Replace("frequency 60 Hz", "frequency 60 Hz\nlet p = 3 kW") + "sweep p from 3 kW to 6 kW step 1 kW\n");
        var d = e.Diagnostics.Single(x => x.Code == "loading-high" && e.TextAt(x.Span) == "LV");
        Assert.Matches(@"^winding 'LV' carries 1\d\d\.\d+ % of its rated current at p=6 kW \(over the rating at 3 of 5 points\)$", d.Message);
    }

    [Fact]
    public void R13_peak_flux_over_the_core_limit_is_warned_at_the_core()
    {
        // Hubert, Electric Machines, 2nd ed., Ex. 2.1: E = 4.44 f N Φmax, 240 V on 200 turns at 60 Hz
        // gives Φmax = 4.505 mWb; on 30 cm² that is 1.502 T, over a 1.4 T limit.
        var e = Wn.Solved("""
            frequency 60 Hz
            core K rating 1 kVA area 30 cm2 flux-limit 1.4 T
            winding P on K turns 200 rated 240 V from P1 to P2
            supply s P1 P2 240 V
            ground P2
            """);
        Wn.Near(4.505e-3 / 30e-4, e.Normal!.Cores.Single().Flux!.Value, 1e-3, "peak flux density");
        var d = e.Single("flux-high");
        Assert.Equal("K", e.TextAt(d.Span));
        Assert.Equal("the peak flux density of core 'K' is 1.501 T, above its flux-limit of 1.400 T", d.Message);
    }

    [Fact]
    public void R14_turns_from_flux_density_give_the_design_flux_back()
    {
        // Hubert, Electric Machines, 2nd ed., Ex. 2.2: 2400/240 V, 1.5 T, 50 cm², 60 Hz give 1201 and 120 turns.
        var e = Wn.Solved("""
            frequency 60 Hz
            core K rating 10 kVA area 50 cm2 flux-limit 1.55 T
            winding HV on K turns 1201 rated 2400 V from H1 to H2
            winding LV on K turns 120 from X1 to X2
            supply s H1 H2 2400 V
            ground H2
            """);
        Wn.Near(1.5, e.Normal!.Cores.Single().Flux!.Value, 1e-3, "flux density");
        Wn.Near(240, e.Normal.V("X1", "X2").Magnitude, 2e-3, "secondary");
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "flux-high");
    }

    private static string Excited(double volts, bool loaded) => $"""
        frequency 60 Hz
        core K rating 1 kVA
        winding P on K turns 200 rated 240 V from P1 to P2
        winding S on K turns 20 from S1 to S2
        supply s P1 P2 {volts} V
        ground P2
        ground S2
        {(loaded ? "load l S1 S2 impedance 10 ohm" : "")}

        """;

    [Fact]
    public void Volts_per_turn_over_105_percent_on_load_and_110_percent_at_no_load_are_warned()
    {
        // IEEE C57.12.00 (from memory): 105 % of rated volts per turn on load, 110 % at no load.
        var onLoad = Wn.Solved(Excited(240 * 1.07, loaded: true));
        var d = onLoad.Single("overexcited");
        Assert.Equal("core 'K' runs at 107.0 % of its rated volts per hertz on load, above the 105.0 % IEEE C57.12.00 allows", d.Message);
        Assert.Equal("K", onLoad.TextAt(d.Span));
        Assert.DoesNotContain(Wn.Solved(Excited(240 * 1.07, loaded: false)).Diagnostics, x => x.Code == "overexcited");
        Assert.Contains("at no load, above the 110.0 %", Wn.Solved(Excited(240 * 1.12, loaded: false)).Single("overexcited").Message);
        // Loaded at 112 %: over both limits, reported for each condition.
        Assert.Equal(2, Wn.Solved(Excited(240 * 1.12, loaded: true)).Diagnostics.Count(x => x.Code == "overexcited"));
        Assert.DoesNotContain(Wn.Solved(Excited(240 * 1.04, loaded: true)).Diagnostics, x => x.Code == "overexcited");
    }

    [Fact]
    public void A_brush_over_its_current_limit_is_warned_at_the_brush()
    {
        // The brush carries the whole output current (R28, common practice): 2.808 A at the top of the travel.
        var e = Wn.Solved(SweepTests.Variable("sweep BR from 0 % to 100 % step 10 %", " current-limit 2.5 A"));
        var d = e.Single("brush-current-high");
        Assert.Equal("BR", e.TextAt(d.Span));
        Assert.Equal("brush 'BR' carries 2.808 A, above its current-limit of 2.500 A at BR=100 % (over the rating at 2 of 12 points)", d.Message);
    }

    [Fact]
    public void An_autotransformer_connection_that_needs_more_two_winding_rating_than_its_core_has_is_warned()
    {
        // R5 (any electric machines textbook): the 15 kVA 1100/220 V unit as a 1320/1100 V autotransformer
        // transforms S_load·(1 − 1100/1320) = S_load/6, so 90 kVA needs 15 kVA and 100 kVA needs 16.67 kVA.
        string Unit(string load) => $"""
            frequency 50 Hz
            core T rating 15 kVA
            winding C on T rated 1100 V from C1 to C2
            winding S on T rated 220 V from S1 to S2
            supply line C1 C2 1100 V
            ground C2
            join C1 S2
            load out S1 C2 apparent {load} pf 0.8
            """;
        var ok = Wn.Solved(Unit("90 kVA"));
        Wn.Near(1.0 / 6, ok.Normal!.Connections.Single().CoRatio!.Value, 1e-9, "co-ratio");
        Wn.Near(15e3, ok.Normal.Connections.Single().TwoWindingRating, 1e-9, "two-winding rating needed");
        Assert.DoesNotContain(ok.Diagnostics, d => d.Code == "connection-rating");
        var over = Wn.Solved(Unit("100 kVA"));
        var d = over.Single("connection-rating");
        Assert.Equal("T", over.TextAt(d.Span));
        Assert.Equal("the autotransformer connection needs a two-winding rating of 16.67 kVA (100.0 kVA throughput at a co-ratio of 0.1667) but core 'T' is rated 15.00 kVA", d.Message);
    }
}

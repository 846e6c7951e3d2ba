using System.Text.Json;
using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>Tolerance bands: corners of up to ten toleranced values, else a seeded Monte Carlo; checks across the band (R20, R21).</summary>
public class ToleranceBandTests
{
    // A 25 kVA 2400/240 V unit with Z = 4 %.
    private static string Unit(string ratio, string impedance, string rest = "") => $"""
        frequency 60 Hz
        core T rating 25 kVA
        winding HV on T turns 1000 rated 2400 V from H1 to H2
        winding LV on T turns 100{ratio} from X1 to X2
        impedance HV LV {impedance}
        supply line H1 H2 2400 V
        ground H2
        ground X2
        {rest}

        """;

    [Fact]
    public void R20_ratio_and_impedance_tolerances_of_IEC_60076_1()
    {
        // IEC 60076-1, Table 1 (ratio and loss rows read; impedance row from memory): for Z = 4 % the
        // ratio tolerance is the lower of ±0.5 % and ±1/10 of the % impedance, so ±0.4 %; the impedance
        // tolerance is ±10 % (Z < 10 %), so 3.6–4.4 %.
        var ratio = Math.Min(0.5, 4.0 / 10);
        Wn.Near(0.4, ratio, 1e-12, "ratio tolerance");
        var e = Wn.Solved(Unit(" +- 0.4 %", "4 % +- 10 %", "fault F1 X1 X2"));
        var normal = e.Normal!;
        var voltage = normal.Bands.Single(b => b.Path == "nodes.X1.v.rms");
        Wn.Near(240 * 1.004, voltage.Max, 1e-9, "open-circuit voltage, ratio +0.4 %");
        Wn.Near(240 * 0.996, voltage.Min, 1e-9, "open-circuit voltage, ratio −0.4 %");
        var fault = e.Cases.Single(c => c.Fault is not null);
        var rated = 25e3 / 240;
        var band = fault.Bands.Single(b => b.Path == "faults.F1.i.rms");
        // The fault current also follows the turns: referred to the low-voltage side the impedance grows
        // with N_LV² and the voltage with N_LV, so I ∝ 1/N_LV; each end of the band is a corner.
        Wn.Near(rated / 0.036 / 0.996, band.Max, 1e-9, "fault current at 3.6 % and ratio −0.4 %");
        Wn.Near(rated / 0.044 / 1.004, band.Min, 1e-9, "fault current at 4.4 % and ratio +0.4 %");
    }

    [Fact]
    public void R21_impedance_tolerance_of_an_autotransformer_is_wider()
    {
        // IEEE C57.12.00 (from memory in part): ±7.5 % for two-winding units, ±10 % for autotransformers
        // and three-winding units; 5.75 % at −7.5 % is 5.32 %.
        Wn.Near(5.32, 5.75 * 0.925, 1e-3, "two-winding low end");
        var e = Wn.Solved(FaultTests.Bolted("5.75 % +- 10 %"));
        var band = e.Cases.Single(c => c.Fault is not null).Bands.Single(b => b.Path == "faults.F1.i.rms");
        Wn.Near(20918 / 0.9, band.Max, 1e-4, "fault current at 5.175 %");
    }

    [Fact]
    public void An_expect_must_hold_across_the_band_and_the_failure_names_the_corner()
    {
        var e = Wn.Eval(Unit(" +- 0.4 %", "4 %", "expect voltage X1 X2 between 239.5 V and 241 V"));
        var d = e.Single("expect-failed");
        Assert.Equal("voltage X1 X2 is 239.0 V with the turns of LV at -0.4 %: expected between 239.5 V and 241 V", d.Message);
        var check = Assert.Single(e.Checks);
        Assert.False(check.Passed);
        Wn.Near(240, check.Value!.Value, 1e-12, "nominal");
        Wn.Near(240 * 0.996, check.Min!.Value, 1e-9, "band low");
    }

    [Fact]
    public void Corners_cover_every_combination_of_up_to_ten_values()
    {
        var e = Wn.Solved(Unit(" +- 0.4 %", "4 % +- 10 %", "load l X1 X2 impedance 2.304 ohm +- 5 %"));
        var i = e.Normal!.Bands.Single(b => b.Path == "loads.l.i.rms");
        // Highest current: ratio high, impedance low, load impedance low; lowest the other way round.
        var high = Wn.Solved(Unit(" +- 0.4 %", "4 %", "load l X1 X2 impedance 2.304 ohm").Replace("turns 100 +- 0.4 %", "turns 100.4").Replace("HV LV 4 %", "HV LV 3.6 %").Replace("2.304 ohm", "2.304 ohm * 0.95"));
        Wn.Near(high.Normal!.Load("l").Current.Magnitude, i.Max, 1e-9, "worst corner");
        Assert.DoesNotContain(e.Diagnostics, d => d.Code == "tolerance-samples");
    }

    private static string ManyTolerances() => Unit(" +- 0.4 %", "4 % +- 10 %", string.Join("\n", Enumerable.Range(1, 9).Select(k => $"load l{k} X1 X2 impedance {20 + k} ohm +- 5 %")));

    [Fact]
    public void More_than_ten_toleranced_values_use_a_seeded_Monte_Carlo_that_gives_the_same_bytes_every_run()
    {
        var first = Wn.Solved(ManyTolerances());
        var d = first.Single("tolerance-samples");
        Assert.Equal("11 toleranced values: bands from 1,000 samples drawn uniformly within the tolerances (seed 1) instead of all 2,048 corners", d.Message);
        var band = first.Normal!.Bands.Single(b => b.Path == "nodes.X1.v.rms");
        Assert.True(band.Min < 240 && band.Max > 239, $"{band.Min} to {band.Max}");
        Assert.Equal(JsonReport.Write(first), JsonReport.Write(Wn.Solved(ManyTolerances())));
    }

    [Fact]
    public void Every_band_path_names_a_number_of_its_case_in_the_JSON_report()
    {
        var e = Wn.Solved(Unit(" +- 0.4 %", "4 % +- 10 %", "load l X1 X2 power 20 kW pf 0.8\nfault F1 X1 X2"));
        var json = JsonDocument.Parse(JsonReport.Write(e));
        var cases = json.RootElement.GetProperty("cases").EnumerateArray().ToList();
        Assert.Equal(2, cases.Count);
        foreach (var c in cases)
        {
            var bands = c.GetProperty("bands").EnumerateObject().ToList();
            Assert.NotEmpty(bands);
            foreach (var band in bands)
            {
                var node = c;
                foreach (var key in band.Name.Split('.')) node = node.GetProperty(key);
                var (min, max) = (band.Value.GetProperty("min").GetDouble(), band.Value.GetProperty("max").GetDouble());
                Assert.True(node.GetDouble() >= min * (1 - 1e-9) - 1e-12 && node.GetDouble() <= max * (1 + 1e-9) + 1e-12, $"{band.Name}: {node.GetDouble()} outside {min} to {max}");
            }
        }
        // Every path the bands may use is a number in the report, varying or not.
        foreach (var value in CaseValues.Of(e.Normal!))
        {
            var node = cases[0];
            foreach (var key in value.Path.Split('.')) node = node.GetProperty(key);
            Wn.Near(value.Value, node.GetDouble(), 1e-9, value.Path);
        }
    }

    [Fact]
    public void Without_tolerances_there_are_no_bands()
    {
        var e = Wn.Solved(Unit("", "4 %", "fault F1 X1 X2"));
        Assert.All(e.Cases, c => Assert.Empty(c.Bands));
        Assert.DoesNotContain("\"bands\"", JsonReport.Write(e));
    }
}

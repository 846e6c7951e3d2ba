using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>Fault cases: bolted faults (R24), the asymmetrical peak (R25), multiples of rated current and the fault-duty caution.</summary>
public class FaultTests
{
    // One phase of a 1000 kVA, 480 V three-phase unit: 333.3 kVA at 277.1 V to neutral, fed from an infinite bus.
    public static string Bolted(string impedance = "5.75 %") => $"""
        frequency 60 Hz
        core T rating 1000 kVA / 3
        winding HV on T rated 4160 V / sqrt(3) from H1 to H2
        winding LV on T rated 480 V / sqrt(3) from X1 to X2
        impedance HV LV {impedance}
        supply bus H1 H2 4160 V / sqrt(3)
        ground H2
        ground X2
        fault F1 X1 X2

        """;

    [Fact]
    public void R24_bolted_fault_on_an_infinite_bus()
    {
        // Standard method (published engineering pages): I = I_rated / Z_pu; 1202.8 A rated, 20 918 A fault.
        var e = Wn.Solved(Bolted());
        var fault = e.Cases.Single(c => c.Case.Name == "fault F1");
        Wn.Near(1202.8, e.Network!.Windings.Single(w => w.Name == "LV").RatedCurrent!.Value, 1e-4, "rated current");
        Wn.Near(20918, fault.Fault!.Current.Magnitude, 1e-4, "fault current");
        Wn.Near(20918, fault.Section("LV").Current.Magnitude, 1e-4, "the winding carries the fault");
        Wn.Near(1 / 0.0575, fault.Section("LV").Loading!.Value, 1e-9, "multiple of rated current");
        Wn.Near(1 / 0.0575, fault.Fault.WorstMultiple!.Value, 1e-9, "worst multiple");
        // A purely reactive loop: X/R infinite, the peak factor its upper bound 2√2.
        Assert.True(double.IsPositiveInfinity(fault.Fault.XR));
        Wn.Near(2 * Math.Sqrt(2) * 20918, fault.Fault.Peak, 1e-4, "peak");
    }

    [Fact]
    public void R24_fault_current_at_the_low_end_of_the_impedance_band()
    {
        // Standard method (published engineering pages): 22 615 A at −7.5 % impedance; IEEE C57.12.00
        // (from memory in part) gives the ±7.5 % band of a two-winding unit, lowest 5.32 % of 5.75 % (R21).
        var e = Wn.Solved(Bolted("5.75 % +- 7.5 %"));
        var fault = e.Cases.Single(c => c.Case.Name == "fault F1");
        var band = fault.Bands.Single(b => b.Path == "faults.F1.i.rms");
        Wn.Near(22615, band.Max, 1e-4, "low-end impedance");
        Wn.Near(20918 / 1.075, band.Min, 1e-4, "high-end impedance");
        Wn.Near(5.32, 5.75 * (1 - 0.075), 1e-3, "R21 lowest impedance");
        Wn.Near(20918, fault.Fault!.Current.Magnitude, 1e-4, "nominal stays nominal");
        Assert.Contains(fault.Bands, b => b.Path == "sections.LV.i.rms" && Math.Abs(b.Max - 22615) < 3);
    }

    [Theory]
    [InlineData(1, 1.509)]
    [InlineData(4, 2.079)]
    [InlineData(14, 2.547)]
    public void R25_asymmetrical_peak_factor(double xr, double expected)
    {
        // IEC 60076-5 (formula from memory, values computed): k√2 with k = 1 + e^(−(φ+π/2)/(X/R))·sin φ.
        Wn.Near(expected, Faults.PeakFactor(xr), 5e-4, $"X/R {xr}");
    }

    [Fact]
    public void R25_peak_of_a_fault_follows_the_loop_X_over_R()
    {
        // IEC 60076-5 (formula from memory, values computed): X/R = 4 gives 2.079 times the rms current.
        var fault = Wn.Solved(Bolted("5.75 % xr 4")).Cases.Single(c => c.Case.Fault is not null).Fault!;
        Wn.Near(4, fault.XR, 1e-9, "loop X/R");
        Wn.Near(2.079, fault.Peak / fault.Current.Magnitude, 5e-4, "peak factor");
    }

    [Fact]
    public void A_fault_through_an_impedance_draws_less_and_has_its_own_case()
    {
        var e = Wn.Solved(Bolted().Replace("fault F1 X1 X2", "fault F1 X1 X2 impedance 0.1 ohm"));
        var fault = e.Cases.Single(c => c.Case.Fault is not null).Fault!;
        var zBase = 277.128 * 277.128 / 333333.3;
        var expected = 277.128 / Math.Sqrt(0.1 * 0.1 + 0.0575 * zBase * 0.0575 * zBase);
        Wn.Near(expected, fault.Current.Magnitude, 1e-4, "fault current");
        Wn.Near(0.0575 * zBase / 0.1, fault.XR, 1e-6, "X/R of the loop");
        Assert.Equal("normal", e.Cases[0].Case.Name);
    }

    [Fact]
    public void Each_fault_has_its_duty_caution_at_its_line_and_only_faults_do()
    {
        // IEC 60076-5: a transformer must carry its short-circuit current for 2 s (thermal ability, from memory).
        var e = Wn.Solved(Bolted());
        var d = e.Single("caution-fault-duty");
        Assert.Equal("F1", e.TextAt(d.Span));
        Assert.Contains("20.92 kA", d.Message);
        Assert.Contains("17.39 times the rated current of 'LV'", d.Message);
        Assert.Contains("2 s (IEC 60076-5", d.Message);
        Assert.DoesNotContain(Wn.Solved(Bolted().Replace("fault F1 X1 X2", "")).Diagnostics, x => x.Code == "caution-fault-duty");
    }
}

using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Report;
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
        // A purely reactive loop: X/R infinite; the peak factor of IEC 60076-5 stops at 2.55 above X/R 14 (R39, from memory).
        Assert.True(double.IsPositiveInfinity(fault.Fault.XR));
        Wn.Near(2.55 * 20918, fault.Fault.Peak, 1e-4, "peak");
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

    [Theory]
    [InlineData(14.25)]
    [InlineData(20)]
    [InlineData(1e6)]
    public void R39_the_peak_factor_of_a_two_node_fault_stops_at_2_55_above_X_over_R_14(double xr)
    {
        // IEC 60076-5, table of peak factors (from memory): k·√2 = 2.55 for X/R ≥ 14; the formula of R25 gives 2.547 at 14 and runs on to 2√2.
        var fault = Wn.Solved(Bolted($"5.75 % xr {xr}")).Cases.Single(c => c.Case.Fault is not null).Fault!;
        Wn.Near(xr, fault.XR, 1e-6, "loop X/R");
        Assert.Equal(2.55, fault.PeakFactor);
        Wn.Near(2.55 * fault.Current.Magnitude, fault.Peak, 1e-12, "peak");
    }

    // The unit of R24 at X/R 4 with a load across its secondary and a fault-study line (or none).
    private static string Loaded(string study, string load = "load heater X1 X2 impedance 2 ohm", string fault = "fault F1 X1 X2") =>
        Bolted("5.75 % xr 4").Replace("fault F1 X1 X2", $"{load}\n{study}\n{fault}");

    // By hand: zBase = 277.128²/333 333 = 0.2304 ohm; the unit's loop Zt = 0.0575·zBase at X/R 4.
    private static readonly double ZBase = Math.Pow(480 / Math.Sqrt(3), 2) / (1e6 / 3);
    private static readonly Complex Zt = 0.0575 * ZBase * new Complex(1, 4) / Math.Sqrt(17);

    [Fact]
    public void Equivalent_source_leaves_loads_out_of_the_loop_and_applies_cmax()
    {
        // IEC 60909-0 (equivalent voltage source at the fault, non-motor loads left out; R36 Table 1 from memory:
        // cmax 1.10 up to 1 kV for a +10 % system). By hand: E = 1.10·277.128 V at no load on an infinite bus,
        // the loop is the unit alone, so X/R = 4 exactly and I = 1.10·277.128/|Zt| = 1.10·20 918 A.
        var fault = Wn.Solved(Loaded("fault-study equivalent-source")).Cases.Single(c => c.Case.Fault is not null).Fault!;
        Assert.Equal(FaultMethod.EquivalentSource, fault.Method);
        Assert.Equal(1.10, fault.VoltageFactor);
        Wn.Near(4, fault.XR, 1e-9, "X/R of the unit alone: the heater is left out");
        Wn.Near(1.10 * 480 / Math.Sqrt(3) / Zt.Magnitude, fault.Current.Magnitude, 1e-9, "c·E/|Zt|");
        Wn.Near(1.10 * 20918, fault.Current.Magnitude, 1e-4, "R24 times cmax");
        // IEC 60076-5 (formula from memory, values computed), R25: X/R 4 gives 2.079.
        Wn.Near(2.079, fault.PeakFactor, 5e-4, "peak factor");
        // Minimum currents only: cmin 0.90 (+10 % system, R36 from memory).
        var minimum = Wn.Solved(Loaded("fault-study equivalent-source currents minimum")).Cases.Single(c => c.Case.Fault is not null).Fault!;
        Wn.Near(0.90 * 480 / Math.Sqrt(3) / Zt.Magnitude, minimum.Current.Magnitude, 1e-9, "cmin");
    }

    [Fact]
    public void As_loaded_keeps_the_loads_in_the_loop_as_files_without_a_fault_study_do()
    {
        // By Thévenin (standard circuit theory): the heater's 2 ohm in parallel with Zt from the fault,
        // pre-fault voltage E·Zl/(Zt + Zl), so I = E/Zt exactly and the loop is Zt∥Zl, X/R its own.
        var e = 480 / Math.Sqrt(3);
        var zl = new Complex(2, 0);
        var loop = Zt * zl / (Zt + zl);
        foreach (var study in new[] { "", "fault-study as-loaded" })
        {
            var fault = Wn.Solved(Loaded(study)).Cases.Single(c => c.Case.Fault is not null).Fault!;
            Assert.Equal(FaultMethod.AsLoaded, fault.Method);
            Assert.Null(fault.VoltageFactor);
            Wn.Near(e / Zt.Magnitude, fault.Current.Magnitude, 1e-9, "E/|Zt|");
            Wn.Near(loop.Imaginary / loop.Real, fault.XR, 1e-9, "X/R of Zt∥Zl");
            Assert.Empty(fault.LoadsAsImpedance);
            Assert.Equal("network as loaded: supplies as written", FaultDutyReport.Method(fault));
        }
    }

    [Fact]
    public void As_loaded_a_constant_power_load_is_its_pre_fault_impedance()
    {
        // Common practice: through the fault a constant-power load is the impedance drawing its pre-fault
        // power at its pre-fault voltage, Zl = |V|²/S*. By hand from the normal case's load voltage V:
        // Thévenin at the fault, E_th = V, Z_th = Zt∥Zl, so I = V/(Z_th + Zf) with Zf = 0.01 ohm.
        var text = Loaded("", "load drive X1 X2 power 50 kW pf 0.8 lagging", "fault F1 X1 X2 impedance 0.01 ohm");
        var e = Wn.Solved(text);
        var v = e.Cases[0].Loads.Single().Voltage;
        var zl = v.Magnitude * v.Magnitude / Complex.Conjugate(new Complex(50e3, 37.5e3));
        var zth = Zt * zl / (Zt + zl);
        var faultCase = e.Cases.Single(c => c.Case.Fault is not null);
        var fault = faultCase.Fault!;
        Wn.Near((v / (zth + 0.01)).Magnitude, fault.Current.Magnitude, 1e-9, "V/(Zt∥Zl + Zf)");
        Wn.Near(zth.Imaginary / (zth.Real + 0.01), fault.XR, 1e-6, "X/R of Zt∥Zl + Zf");
        var load = faultCase.Loads.Single();
        Wn.Near(zl.Magnitude, (load.Voltage / load.Current).Magnitude, 1e-9, "the load is its pre-fault impedance");
        Assert.Equal("drive", fault.LoadsAsImpedance.Single().Name);
        Assert.Equal("network as loaded: supplies as written, constant-power load 'drive' as its pre-fault impedance", FaultDutyReport.Method(fault));
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

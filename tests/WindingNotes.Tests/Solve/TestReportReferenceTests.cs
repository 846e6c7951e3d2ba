using System.Globalization;
using System.Numerics;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The magnetising branch and the short-circuit impedance from a test report (REFERENCES.md R10),
/// given back by simulating the same tests on the solved model.
/// </summary>
public class TestReportReferenceTests
{
    // R10 data: 20 kVA 8000/240 V 60 Hz, HV side. OC 8000 V, 0.214 A, 400 W. SC 489 V, 2.5 A, 240 W.
    private static readonly double ScR = 240 / (2.5 * 2.5);
    private static readonly double ScX = Math.Sqrt(489 / 2.5 * (489 / 2.5) - ScR * ScR);

    private static readonly string Unit = $"""
        frequency 60 Hz
        core K rating 20 kVA
        winding HV on K rated 8000 V from H1 to H2
        winding LV on K rated 240 V from X1 to X2
        no-load K current 0.214 A loss 400 W at HV 8000 V
        impedance HV LV {ScR.ToString("R", CultureInfo.InvariantCulture)} + j{ScX.ToString("R", CultureInfo.InvariantCulture)} ohm

        """;

    [Fact]
    public void R10_open_circuit_test_gives_back_rc_and_xm()
    {
        // Chapman, equivalent-circuit example (from memory; data read on a page): Rc ≈ 160 kΩ, Xm ≈ 38.4 kΩ,
        // from Rc = V²/P and Xm = V/√(I² − (P/V)²).
        var c = Wn.Solved(Unit + "supply oc H1 H2 8000 V\nground H2\n").Normal!;
        var supply = c.Supply("oc");
        var (v, i, p) = (8000.0, supply.Current.Magnitude, supply.Power.Real);
        var rc = v * v / p;
        var xm = v / Math.Sqrt(i * i - p / v * (p / v));
        Wn.Near(160e3, rc, 0.01, "Rc");
        Wn.Near(38.4e3, xm, 0.01, "Xm");
        // The test winding is the reference of the leakage, so the test sees no leakage reactance; it keeps
        // the winding's half of the series resistance: Req/2 against Zm moves the current by about 1e-4,
        // and its copper loss I²·Req/2 adds 0.2 % to the loss, as in a real test.
        Wn.Near(0.214, i, 2e-4, "no-load current");
        Wn.Near(400, p, 0.005, "no-load loss");
        var core = c.Cores.Single();
        Wn.Near(p, core.Loss + i * i * ScR / 2, 1e-9, "core loss reported, with the copper loss the supply's power");
        Wn.Near(i, core.NoLoadCurrent!.Value.Magnitude, 1e-9, "no-load current reported");
        Assert.Equal("HV", core.NoLoadWinding!.Name);
    }

    [Fact]
    public void R10_short_circuit_test_gives_back_req_and_xeq()
    {
        // Chapman (from memory): Req = P/I² = 38.4 Ω, Xeq = √((V/I)² − Req²) = 191.8 Ω. The model keeps its
        // magnetising branch during the test, which moves the figures by about 0.5 %, inside the 1 %
        // allowed for printed figures.
        var c = Wn.Solved(Unit + "supply sc H1 H2 489 V\nground H2\njoin X1 X2\n").Normal!;
        var supply = c.Supply("sc");
        var (v, i, p) = (489.0, supply.Current.Magnitude, supply.Power.Real);
        var req = p / (i * i);
        var xeq = Math.Sqrt(v / i * (v / i) - req * req);
        Wn.Near(38.4, req, 0.01, "Req");
        Wn.Near(191.8, xeq, 0.01, "Xeq");
        Wn.Near(2.5, i, 0.01, "test current");
    }

    [Fact]
    public void Core_loss_goes_with_the_square_of_the_volts_per_turn()
    {
        var full = Wn.Solved(Unit + "supply oc H1 H2 8000 V\nground H2\n").Normal!.Cores.Single();
        var half = Wn.Solved(Unit + "supply oc H1 H2 4000 V\nground H2\n").Normal!.Cores.Single();
        Wn.Near(full.Loss / 4, half.Loss, 1e-9, "loss at half voltage");
        Wn.Near(full.NoLoadCurrent!.Value.Magnitude / 2, half.NoLoadCurrent!.Value.Magnitude, 1e-9, "current at half voltage");
    }

    [Fact]
    public void A_no_load_test_on_the_low_voltage_side_gives_the_same_branch()
    {
        // The same test made from LV draws 8000/240 times the current at 240 V.
        var fromLv = Unit.Replace("no-load K current 0.214 A loss 400 W at HV 8000 V", $"no-load K current {(0.214 * 8000 / 240).ToString("R", CultureInfo.InvariantCulture)} A loss 400 W at LV 240 V");
        var c = Wn.Solved(fromLv + "supply oc H1 H2 8000 V\nground H2\n").Normal!;
        // Seen from HV the branch now sits behind the leakage: a difference of the order Zsc/Zm.
        Wn.Near(400, c.Supply("oc").Power.Real, 0.01, "loss");
        Wn.Near(0.214, c.Supply("oc").Current.Magnitude, 0.01, "current");
    }

    [Fact]
    public void A_no_load_current_in_percent_is_of_the_winding_rated_current()
    {
        // 3 % of 20 kVA / 8000 V = 2.5 A is 75 mA.
        var percent = Unit.Replace("current 0.214 A", "current 3 %");
        var c = Wn.Solved(percent + "supply oc H1 H2 8000 V\nground H2\n").Normal!;
        Wn.Near(0.075, c.Supply("oc").Current.Magnitude, 2e-4, "no-load current");
    }

    [Fact]
    public void The_report_gives_core_loss_and_no_load_current()
    {
        var e = Wn.Solved(Unit + "supply oc H1 H2 8000 V\nground H2\n");
        var text = WindingNotes.Report.TextReport.Write(e);
        Assert.Contains("core loss 399.9 W, no-load current 214.0 mA in HV", text);
        var json = WindingNotes.Report.JsonReport.Write(e);
        Assert.Contains("\"loss\": 399.9", json);
        Assert.Contains("\"noLoadCurrent\": {", json);
    }
}

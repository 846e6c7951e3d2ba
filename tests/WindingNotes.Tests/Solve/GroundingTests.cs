using System.Numerics;
using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A node earthed through a neutral-grounding impedance ('ground N impedance …'): part of the network
/// in every case, checked against symmetrical components by hand (R30: I = 3E/(Z1 + Z2 + Z0 + 3Zf),
/// any power-systems textbook, Grainger and Stevenson from memory; the neutral impedance Zn enters the
/// zero-sequence network as 3·Zn, so it adds to the loop as 3Zf does).
/// </summary>
public class GroundingTests
{
    // A delta-wye bank (Dyn11): 1500 kVA, 11 kV / 415 V, 6 % at X/R 8, on a 250 MVA source at X/R 10;
    // the wye's neutral earthed through 0.2 ohm (a resistor) unless a test says otherwise: the fault-study tests' bank.
    private const string Unit = Analysis.FaultStudyTests.DeltaWyeBank + """
        ground X0 impedance 0.2 ohm
        bus-fault LG X1 X2 X3 line-to-ground
        fault-study equivalent-source

        """;

    // The bank's and source's impedances at 415 V and E = c·Un/√3, c = 1.10 up to 1 kV (IEC 60909-0,
    // from memory, R36), as derived in the fault-study tests for the same bank.
    private static readonly Complex Zt = Analysis.FaultStudyTests.Zt;
    private static readonly Complex Zs = Analysis.FaultStudyTests.Zs;
    private static readonly double E = Analysis.FaultStudyTests.E;

    private static ShortCircuitResult Bus(Evaluation e, string fault) =>
        e.Cases.Select(c => c.ShortCircuit).OfType<ShortCircuitResult>().Single(s => s.Fault.Name == fault && !s.Minimum);

    [Theory]
    [InlineData("0.2 ohm", 0.2, 0)]
    [InlineData("0.05 + j0.1 ohm", 0.05, 0.1)]
    public void A_line_to_ground_fault_through_a_neutral_impedance_follows_symmetrical_components(string written, double r, double x)
    {
        var e = Wn.Solved(Unit.Replace("impedance 0.2 ohm", "impedance " + written));
        var zn = new Complex(r, x);
        // By hand, per phase on the 415 V side: Z1 = Z2 = Zs + Zt; the delta passes no zero sequence
        // from the source, so Z0 = Zt + 3·Zn; I = 3E/(Z1 + Z2 + Z0) (R30).
        var expected = 3 * E / (2 * (Zs + Zt) + Zt + 3 * zn);
        var sc = Bus(e, "LG");
        Wn.Near(expected.Magnitude, sc.Initial, 1e-7, "I = 3E/(Z1 + Z2 + Z0 + 3Zn)");
        // All of it returns through the neutral impedance, which stands at I·Zn to earth.
        var g = Assert.Single(sc.Groundings);
        Wn.Near(expected.Magnitude, g.Current.Magnitude, 1e-7, "the neutral's current");
        Wn.Near((expected * zn).Magnitude, g.Voltage.Magnitude, 1e-7, "the neutral's voltage");
        // Current from the node to earth and the voltage over it: V = I·Zn, phasors and all.
        Assert.True((g.Voltage / g.Current - zn).Magnitude < 1e-9 * zn.Magnitude, $"V/I = {g.Voltage / g.Current}");
        Wn.Near(expected.Magnitude * expected.Magnitude * 2, g.I2t, 1e-7, "I²t over the default 2 s");
        // The same element is in the case's supplies, by the name the report gives it.
        var faulted = e.Cases.Single(c => c.ShortCircuit == sc);
        Wn.Near(expected.Magnitude, faulted.Supply("X0_ground").Current.Magnitude, 1e-7);
    }

    [Fact]
    public void A_grounding_impedance_is_kept_where_loads_are_left_out()
    {
        // A load is left out by the equivalent source (IEC 60909-0); 'ground … impedance' stays, so the
        // fault current is that of R30 with 3Zn in the loop, far below the solidly grounded unit's.
        var asGround = Bus(Wn.Solved(Unit), "LG").Initial;
        var solid = Bus(Wn.Solved(Unit.Replace("ground X0 impedance 0.2 ohm", "ground X0")), "LG").Initial;
        Wn.Near((3 * E / (2 * (Zs + Zt) + Zt)).Magnitude, solid, 1e-7, "solidly grounded");
        Assert.True(asGround < solid / 2);
        // A load from a line to earth (E, grounded): its current returns by the resistor.
        var loaded = Wn.Solved(Unit + "load lamp X1 E impedance 1 ohm\nground E\nload heater X2 X0 impedance 1 ohm\n");
        var normal = loaded.Normal!;
        var through = normal.Supply("X0_ground");
        Wn.Near(normal.Load("lamp").Current.Magnitude, through.Current.Magnitude, 1e-9, "the load's current returns through the resistor");
        Wn.Near(through.Current.Magnitude * 0.2, through.Voltage.Magnitude, 1e-9, "V = I·R");
        // A load beside it is not fed through it: no autotransformer connection, no caution of one.
        Assert.DoesNotContain(loaded.Diagnostics, d => d.Code == "caution-no-isolation");
        // Its power is a loss of the network, not power supplied.
        Assert.True(through.Power.Real < 0);
    }

    [Fact]
    public void A_fault_current_above_the_rating_is_a_fault_duty_warning_at_the_ground_line()
    {
        var rated = Unit.Replace("impedance 0.2 ohm", "impedance 0.2 ohm rated-current 1000 A time-rating 10 s");
        var e = Wn.Eval(rated);
        var current = Bus(e, "LG").Groundings[0];
        // By hand: 3E/|2·(Zs + Zt) + Zt + 0.6| ≈ 3 × 263.6 V / 0.6115 ohm ≈ 1.29 kA, above 1000 A.
        Assert.InRange(current.Current.Magnitude, 1200, 1400);
        Assert.True(current.CurrentExceeded);
        var warning = Assert.Single(e.Diagnostics, d => d.Code == "fault-duty-high" && d.Message.Contains("grounding impedance"));
        Assert.Equal("ground X0 impedance 0.2 ohm rated-current 1000 A time-rating 10 s", e.TextAt(warning.Span));
        Assert.Contains("above its rated 1.000 kA", warning.Message);
        Assert.Contains("not withstood by X0_ground (current above its rating)", TextReport.Write(e));

        // Within its current but longer than its time rating: I²t = I²·5 s against (1500 A)²·1 s.
        var slow = Wn.Eval(Unit.Replace("impedance 0.2 ohm", "impedance 0.2 ohm rated-current 1500 A time-rating 1 s")
            .Replace("fault-study equivalent-source", "fault-study equivalent-source duration 5 s"));
        var g = Bus(slow, "LG").Groundings[0];
        Assert.False(g.CurrentExceeded);
        Wn.Near(1500.0 * 1500, g.RatedI2t!.Value, 1e-12);
        Assert.True(g.I2tExceeded);
        Assert.Contains(slow.Diagnostics, d => d.Code == "fault-duty-high" && d.Message.Contains("I²t"));

        // Within both: no warning; the reports give its duty.
        var fine = Wn.Eval(Unit.Replace("impedance 0.2 ohm", "impedance 0.2 ohm rated-current 2000 A time-rating 10 s"));
        Assert.DoesNotContain(fine.Diagnostics, d => d.Code == "fault-duty-high" && d.Message.Contains("grounding"));
        Assert.Contains("X0_ground", TextReport.Write(fine));
        Assert.Contains("\"groundings\"", JsonReport.Write(fine));
        Assert.Contains("| grounding impedance |", MarkdownReport.Write(fine));
    }

    [Theory]
    [InlineData("ground X0 rated-current 400 A", "rated-current 400 A")]
    [InlineData("ground X0 time-rating 10 s", "time-rating 10 s")]
    [InlineData("ground X0 impedance 0 ohm", "0 ohm")]
    [InlineData("ground X0 impedance -2 ohm", "-2 ohm")]
    public void A_ground_rating_without_an_impedance_or_an_impedance_of_nothing_is_one_error(string line, string at)
    {
        var e = Wn.Eval(Unit.Replace("ground X0 impedance 0.2 ohm", line));
        var error = Assert.Single(e.Errors());
        Assert.Equal("out-of-bounds", error.Code);
        Assert.Equal(at, e.TextAt(error.Span));
    }

    [Fact]
    public void A_node_earthed_through_two_impedance_lines_is_one_error_at_the_second()
    {
        // Both lines would make the element 'X0_ground': the second ended in an internal error (fuzz seed 7027072).
        var e = Wn.Eval(Unit.Replace("ground X0 impedance 0.2 ohm", "ground X0 impedance 0.2 ohm\nground X0 impedance 0.3 ohm"));
        var error = Assert.Single(e.Errors());
        Assert.Equal("duplicate-statement", error.Code);
        var first = Assert.Single(error.Related).Span;
        Assert.Equal(("X0", "X0"), (e.TextAt(error.Span), e.TextAt(first)));
        Assert.Equal(e.Text.GetPosition(first.Start).Line + 1, e.Text.GetPosition(error.Span.Start).Line);
    }

    [Fact]
    public void A_winding_below_the_through_fault_curves_has_no_time_allowed_and_is_not_judged_on_them()
    {
        // IEEE C57.109 (from memory: verify any figure used), R41: the curves start at 2 times rated
        // current. In a line-to-ground fault on X1 of a delta-wye unit, LV_b and LV_c carry next to nothing
        // (only the magnetising and rounding currents): 1250/M² would read as thousands of years.
        Assert.Null(FaultStudy.AllowedSeconds("I", 0.0013));
        Assert.Null(FaultStudy.AllowedSeconds("III", 1.99));
        Assert.Equal(1250.0 / 4, FaultStudy.AllowedSeconds("II", 2)!.Value, 9);
        var e = Wn.Solved(Unit.Replace("ground X0 impedance 0.2 ohm", "ground X0"));
        var lvb = Bus(e, "LG").Duties.Single(d => d.Winding.Name == "LV_b");
        Assert.True(lvb.Multiple < 2);
        Assert.Null(lvb.AllowedSeconds);
        Assert.Null(lvb.FrequentSeconds);
        Assert.False(lvb.CategoryExceeded(1e9));
        var text = TextReport.Write(e);
        Assert.Contains("category II: below the through-fault curves (2 × rated), not judged", text);
        Assert.Contains("category time of HV_b, HV_c, LV_b, LV_c (below the through-fault curves, which start at 2 × rated)", text);
        // Nothing else judged for it: its verdict is "not judged", never "withstands".
        Assert.Contains("LV_b", MarkdownReport.Write(e));
        Assert.Matches(@"\| LV_b \|[^\n]*\| — \| — \| not judged \|", MarkdownReport.Write(e));
    }
}

using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Model;

public class BinderTests
{
    private const string Unit = """
        frequency 60 Hz
        core K1 rating 0.5 kVA
        winding HV on K1 turns 240 rated 240 V from H1 to H2
        winding LV on K1 turns 24 rated 24 V from X1 to X2
        supply mains H1 H2 240 V
        ground H2

        """;

    [Fact]
    public void An_unknown_name_is_an_error_at_the_name_with_a_suggestion()
    {
        var e = Wn.Eval(Unit + "expect current HW below 3 A\n");
        var d = e.Single("unknown-name");
        Assert.Equal("HW", e.TextAt(d.Span));
        Assert.Equal("HV", Assert.Single(d.Hints).Replacement);
    }

    [Fact]
    public void A_mistyped_core_is_an_error_under_the_name()
    {
        var e = Wn.Eval(Unit.Replace("winding LV on K1", "winding LV on K9"));
        var d = e.Single("unknown-name");
        Assert.Equal("K9", e.TextAt(d.Span));
        Assert.Equal("K1", d.Hints.Single().Replacement);
    }

    [Fact]
    public void A_duplicate_name_is_an_error_at_the_second_with_the_first_related()
    {
        var e = Wn.Eval("core K1\ncore K1\n");
        var d = e.Single("duplicate-name");
        Assert.Equal(1, e.Text.GetPosition(d.Span.Start).Line);
        Assert.Equal(0, e.Text.GetPosition(Assert.Single(d.Related).Span.Start).Line);
    }

    [Fact]
    public void Adding_volts_to_amperes_is_an_error_at_the_plus()
    {
        var e = Wn.Eval("let x = 240 V + 3 A\n");
        var d = e.Single("mixed-dimensions");
        Assert.Equal("+", e.TextAt(d.Span));
        Assert.Equal("cannot add a current to a voltage", d.Message);
    }

    [Theory]
    [InlineData("0.5 kVA", 500.0, "apparent power")]
    [InlineData("2 mohm", 0.002, "impedance")]
    [InlineData("3 Ω", 3.0, "impedance")]
    [InlineData("2.5 mm2", 2.5e-6, "area")]
    [InlineData("2.5 mm²", 2.5e-6, "area")]
    [InlineData("26 cm2", 26e-4, "area")]
    [InlineData("250 kcmil", 126.677e-6, "area")]
    [InlineData("75 degC", 348.15, "temperature")]
    [InlineData("20 °C", 293.15, "temperature")]
    [InlineData("13.8 kV", 13800.0, "voltage")]
    [InlineData("1.6 T", 1.6, "flux density")]
    [InlineData("1_000 V", 1000.0, "voltage")]
    [InlineData("0.5 kV * 2 A", 1000.0, "power")]
    [InlineData("sqrt(4 ohm * 9 ohm)", 6.0, "impedance")]
    public void Units_convert_to_si(string value, double expected, string dimension)
    {
        var model = Binder.Bind(Parser.Parse($"let x = {value}\n"));
        Assert.DoesNotContain(model.Diagnostics, d => d.IsError);
        var q = model.Lets["x"];
        Wn.Near(expected, q.Real, 1e-4, value);
        Assert.Contains(dimension, q.Dimension.Describe());
    }

    [Fact]
    public void Watts_voltamperes_and_vars_are_kept_apart()
    {
        var e = Wn.Eval("core K1 rating 500 W\nload L a b power 3 kVA\n");
        var ds = e.Diagnostics.Where(d => d.Code == "wrong-dimension").ToList();
        Assert.Equal(2, ds.Count);
        Assert.Equal("expected an apparent power, found an active power", ds[0].Message);
        Assert.Equal("expected an active power, found an apparent power", ds[1].Message);
        Assert.Contains(Wn.Eval("let p = 3 kW + 2 kvar\n").Diagnostics, d => d.Code == "mixed-dimensions");
    }

    [Fact]
    public void An_unknown_unit_gets_a_suggestion_and_a_let_name_a_hint_to_multiply()
    {
        var e = Wn.Eval("frequency 60 Hzz\nlet v = 2 V\nlet w = 2 v\n");
        var units = e.Diagnostics.Where(d => d.Code == "unknown-unit").ToList();
        Assert.Equal("Hz", units[0].Hints.Single().Replacement);
        Assert.Equal("* v", units[1].Hints.Single().Replacement);
    }

    [Fact]
    public void A_let_may_use_only_the_lets_above_it()
    {
        var e = Wn.Eval("let a = b * 2\nlet b = 3 V\n");
        var d = e.Single("used-before-let");
        Assert.Equal("b", e.TextAt(d.Span));
    }

    [Fact]
    public void Tolerances_are_carried_with_their_spread()
    {
        var model = Binder.Bind(Parser.Parse(Unit + "impedance HV LV 4 % +- 10 %\nload L X1 X2 impedance 0.62 ohm +- 0.05 ohm\n"));
        Assert.Equal(2, model.Tolerances.Length);
        Wn.Near(0.10, model.Tolerances[0].Spread, 1e-12);
        Wn.Near(0.05 / 0.62, model.Tolerances[1].Spread, 1e-12);
    }

    [Fact]
    public void A_lonely_node_is_a_warning_with_a_suggestion()
    {
        var e = Wn.Eval(Unit + "load L X1 X3 impedance 5 ohm\n");
        var d = e.Single("lonely-node");
        Assert.Equal("X3", e.TextAt(d.Span));
        Assert.Equal("X1", d.Hints.Single().Replacement);
    }

    [Fact]
    public void A_missing_frequency_is_information()
    {
        var e = Wn.Eval("core K1\n");
        Assert.Equal(WindingNotes.Text.Severity.Information, e.Single("default-frequency").Severity);
    }

    [Fact]
    public void Loads_become_a_demand_at_a_voltage_with_an_exponent()
    {
        var model = Binder.Bind(Parser.Parse(Unit + """
            load a X1 X2 power 3.2 kW pf 0.8 lagging
            load b X1 X2 apparent 4 kVA pf 0.6 leading
            load c X1 X2 impedance 3 + j4 ohm
            load d X1 X2 current 8 A pf 1
            load e X1 X2 power 1 kW model constant-impedance at 230 V
            """));
        var loads = model.Loads.ToDictionary(l => l.Name);
        Wn.Near(2400, loads["a"].S0.Imaginary, 1e-12);
        Wn.Near(-3200, loads["b"].S0.Imaginary, 1e-12);
        Assert.Equal(LoadBehaviour.ConstantImpedance, loads["c"].Behaviour);
        Wn.Near(0.12, loads["c"].S0.Real, 1e-12);
        Wn.Near(0.16, loads["c"].S0.Imaginary, 1e-12);
        Assert.Equal(LoadBehaviour.ConstantCurrent, loads["d"].Behaviour);
        Assert.Equal(LoadBehaviour.ConstantImpedance, loads["e"].Behaviour);
        Assert.Equal(230, loads["e"].V0);
    }
}

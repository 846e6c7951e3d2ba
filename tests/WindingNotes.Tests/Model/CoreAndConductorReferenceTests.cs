using WindingNotes.Model;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Model;

/// <summary>Flux, conductors and temperature against REFERENCES.md rows R13–R19.</summary>
public class CoreAndConductorReferenceTests
{
    [Fact]
    public void R13_flux_from_the_emf_equation()
    {
        // Hubert, Electric Machines, 2nd ed., Ex. 2.1: E = 4.44 f N Φmax; 240 V, 200 turns, 60 Hz give 4.505 mWb.
        var c = Wn.Solved("""
            frequency 60 Hz
            core K area 30 cm2
            winding W on K turns 200 rated 240 V from A to B
            supply s A B 240 V
            ground B
            """).Normal!;
        Wn.Near(4.505e-3, c.Cores.Single().Flux!.Value * 30e-4, 0.01, "peak flux");
    }

    [Fact]
    public void R14_turns_chosen_for_a_flux_density()
    {
        // Hubert, Electric Machines, 2nd ed., Ex. 2.2: 2400/240 V, 1.5 T, 50 cm², 60 Hz give 1201 and 120 turns.
        var c = Wn.Solved("""
            frequency 60 Hz
            core K area 50 cm2
            winding HV on K turns 1201 from H1 to H2
            winding LV on K turns 120 from X1 to X2
            supply s H1 H2 2400 V
            ground H2
            """).Normal!;
        Wn.Near(1.5, c.Cores.Single().Flux!.Value, 0.01, "peak flux density");
        Wn.Near(240, c.V("X1", "X2").Magnitude, 0.01, "low-voltage side");
    }

    [Theory]
    [InlineData("copper", "75 degC", 1.2161)]
    [InlineData("copper", "85 degC", 1.2554)]
    [InlineData("aluminium", "75 degC", 1.2245)]
    public void R15_resistance_corrected_for_temperature(string material, string temperature, double expected)
    {
        // IEEE C57.12.90 (constants read on a page quoting it): R_T = R_t (K + T)/(K + t), K = 234.5 for
        // copper and 225 for aluminium; 1.000 ohm at 20 degC.
        var network = Build($"temperature {temperature}\nwinding W on K turns 100 from A to B resistance 1 ohm at 20 degC conductor {material} 2.5 mm2 length 10 m\n");
        Wn.Near(expected, network.Windings.Single().Resistance, 1e-4, $"{material} at {temperature}");
        var k = material == "copper" ? ConductorMaterial.Copper : ConductorMaterial.Aluminium;
        Wn.Near(expected, Conductors.Correct(1, 293.15, 273.15 + double.Parse(temperature.Split(' ')[0]), k), 1e-4, "the formula");
    }

    [Fact]
    public void R15_a_conductor_resistance_is_corrected_from_20_degC_to_the_file_temperature()
    {
        // IEEE C57.12.90: copper from 20 to 75 degC is the factor 309.5/254.5; 75 degC is the default.
        var at20 = Build("temperature 20 degC\nwinding W on K turns 100 from A to B conductor copper 2.5 mm2 mean-turn 0.31 m\n");
        var at75 = Build("winding W on K turns 100 from A to B conductor copper 2.5 mm2 mean-turn 0.31 m\n");
        // IEC 60028: 0.017241 ohm mm2/m over 100 turns of 0.31 m.
        Wn.Near(0.017241 * 31 / 2.5, at20.Windings.Single().Resistance, 1e-12, "at 20 degC");
        Wn.Near(1.2161, at75.Windings.Single().Resistance / at20.Windings.Single().Resistance, 1e-4, "75 over 20 degC");
    }

    [Fact]
    public void R16_annealed_copper_resistivity()
    {
        // IEC 60028: ρ = 0.017241 ohm mm2/m at 20 degC (1/58), α = 0.00393/K, which is 1/(234.5 + 20).
        Assert.Equal(0.017241e-6, Conductors.CopperResistivity20);
        Wn.Near(1 / 58e6, Conductors.CopperResistivity20, 1e-4, "1/58");
        Wn.Near(0.00393, 1 / (Conductors.TemperatureConstant(ConductorMaterial.Copper) + 20), 1e-3, "α at 20 degC");
    }

    [Theory]
    [InlineData(12, 3.31, 5.21)]
    [InlineData(10, 5.26, 3.28)]
    public void R17_awg_sizes(int gauge, double mm2, double ohmsPerKm)
    {
        // ASTM B258: d = 0.127·92^((36 − n)/39) mm; 12 AWG 3.31 mm2 and 5.21 ohm/km, 10 AWG 5.26 mm2 and
        // 3.28 ohm/km (copper, 20 degC).
        Wn.Near(mm2 * 1e-6, Conductors.AwgArea(gauge), 0.005, "area");
        var network = Build($"temperature 20 degC\nwinding W on K turns 100 from A to B conductor copper AWG {gauge} length 1000 m\n");
        Wn.Near(ohmsPerKm, network.Windings.Single().Resistance, 0.005, "resistance of 1 km");
    }

    [Fact]
    public void R17_the_largest_awg_sizes_are_written_with_zeros()
    {
        // ASTM B258: 0000 AWG is n = −3, 11.68 mm across.
        var network = Build("winding W on K turns 100 from A to B conductor copper AWG 0000 length 1 m\n");
        Wn.Near(Conductors.AwgArea(-3), network.Model.Windings.Single().Conductor!.Area, 1e-12, "area");
        Wn.Near(11.684e-3, Conductors.AwgDiameter(-3), 1e-3, "diameter");
    }

    [Theory]
    [InlineData("2.5 mm2", 7.41)]
    [InlineData("16 mm2", 1.15)]
    public void R18_nominal_winding_wire_sits_below_the_cable_maximum(string size, double maximum)
    {
        // IEC 60228: maximum resistance of metric conductors (2.5 mm2: 7.41 ohm/km; 16 mm2 Cu: 1.15 ohm/km),
        // about 7 % above ρ/A. A winding's resistance is figured on ρ/A of the nominal section.
        var network = Build($"temperature 20 degC\nwinding W on K turns 100 from A to B conductor copper {size} length 1000 m\n");
        var r = network.Windings.Single().Resistance;
        Assert.True(r < maximum, $"{r} below {maximum}");
        Wn.Near(maximum / 1.07, r, 0.01, "about 7 % under the maximum");
    }

    [Fact]
    public void A_kcmil_size_is_a_thousand_circular_mils()
    {
        var network = Build("winding W on K turns 100 from A to B conductor copper 250 kcmil length 1000 m\n");
        Wn.Near(126.68e-6, network.Model.Windings.Single().Conductor!.Area, 1e-4, "250 kcmil");
    }

    [Fact]
    public void R19_current_density_is_reported_and_warned_above_the_band()
    {
        // Common practice, no source: 1.5 to 3.4 A/mm2 in naturally cooled copper windings.
        var e = Wn.Solved("""
            frequency 50 Hz
            core K rating 2 kVA
            winding P on K turns 200 rated 230 V from P1 to P2 conductor copper 1.5 mm2 mean-turn 0.2 m
            winding S on K turns 20 rated 23 V from S1 to S2 conductor copper 2.5 mm2 mean-turn 0.25 m
            supply s P1 P2 230 V
            ground P2
            ground S2
            load l S1 S2 impedance 2.3 ohm
            """);
        var c = e.Normal!;
        var s = c.Section("S");
        Wn.Near(s.Current.Magnitude / 2.5e-6, s.CurrentDensity!.Value, 1e-12, "density in S");
        Assert.InRange(s.CurrentDensity!.Value, 3.4e6, 5e6);
        var d = e.Single("current-density-high");
        Assert.Equal("conductor copper 2.5 mm2 mean-turn 0.25 m", e.TextAt(d.Span));
        Assert.Contains("'S'", d.Message);
        Assert.InRange(c.Section("P").CurrentDensity!.Value, 0.5e6, 3.4e6);
        Assert.Contains("\"currentDensity\": ", WindingNotes.Report.JsonReport.Write(e));
        Assert.Contains(" A/mm2", WindingNotes.Report.TextReport.Write(e));
    }

    private static Network Build(string windings)
    {
        var tree = WindingNotes.Syntax.Parser.Parse("frequency 50 Hz\ncore K\n" + windings);
        var model = Binder.Bind(tree);
        Assert.False(model.HasErrors, string.Join("\n", model.Diagnostics.Select(d => d.Message)));
        return NetworkBuilder.Build(model);
    }
}

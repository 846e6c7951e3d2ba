using System.Text;

namespace WindingNotes.Benchmarks;

/// <summary>
/// The documents the benchmarks evaluate, written out here so their size is exact: a 50-line
/// calculation, a 1,000-line file of many units, one connected network of 300 sections, and a
/// 20-section network with a brush to sweep. Invented scenarios.
/// </summary>
public static class Documents
{
    /// <summary>One control-power unit of a pumping station, 23 lines, its names ending in <paramref name="k"/>.</summary>
    private static void ControlUnit(StringBuilder o, int k)
    {
        o.Append($"""
            # station {k}: control power, one 480 V primary and three secondaries
            core CT{k} rating 1.5 kVA area 17 cm2 flux-limit 1.55 T
            winding PRI{k} on CT{k} turns 800 rated 480 V from H1_{k} to H2_{k} resistance 1.5 ohm
            winding CTL{k} on CT{k} turns 200 rated 120 V from X1_{k} to X2_{k} resistance 0.085 ohm rating 1 kVA
            winding PLC{k} on CT{k} turns 40 rated 24 V from Y1_{k} to Y3_{k} resistance 0.0063 ohm rating 0.5 kVA
            tap Y2_{k} on PLC{k} at 50 %
            impedance PRI{k} CTL{k} 3.2 % xr 1.4
            impedance PRI{k} PLC{k} 4.1 % xr 1.2
            supply feeder{k} H1_{k} H2_{k} 480 V fault-level 14 kA xr 6
            ground H2_{k}
            ground X2_{k}
            ground Y3_{k}
            load contactors{k} X1_{k} X2_{k} apparent 620 VA pf 0.45 lagging
            load lighting{k} X1_{k} X2_{k} power 180 W
            load plc{k} Y1_{k} Y3_{k} power 240 W pf 0.95
            load floats{k} Y2_{k} Y3_{k} impedance 6 ohm
            fault short{k} X1_{k} X2_{k} impedance 0 ohm
            expect voltage X1_{k} X2_{k} between 114 V and 126 V
            expect voltage Y1_{k} Y3_{k} between 22.8 V and 25.2 V
            expect loading CTL{k} below 100 %
            expect loading PLC{k} below 100 %
            expect flux CT{k} below 1.55 T

            """);
    }

    private static string Units(int count, int lines)
    {
        var o = new StringBuilder("# pumping stations, one control-power unit each\nfrequency 60 Hz\ntemperature 75 degC\n");
        for (var k = 1; k <= count; k++) ControlUnit(o, k);
        while (o.ToString().Split('\n').Length <= lines) o.Append("# spare\n");
        var text = o.ToString();
        return text[..text.LastIndexOf('\n')] + "\n";
    }

    /// <summary>Two units and their faults: 50 lines.</summary>
    public static readonly string FiftyLines = Units(2, 50);

    /// <summary>Forty-three units: 1,000 lines.</summary>
    public static readonly string ThousandLines = Units(43, 1000);

    /// <summary><paramref name="count"/> such units and nothing else (how evaluation grows with the number of units).</summary>
    public static string ManyUnits(int count) => Units(count, 0);

    /// <summary>
    /// A hundred bench units on one 2.4 kV bus, each with a centre-tapped winding: 300 sections in one
    /// part, about 600 unknowns, solved by the sparse LU.
    /// </summary>
    public static string Connected(int units)
    {
        var o = new StringBuilder("# test hall: bench units on one 2.4 kV bus\nfrequency 60 Hz\nsupply bus H1a H1b 2400 V fault-level 8 kA xr 6\n");
        for (var k = 1; k <= units; k++)
        {
            o.Append($"core K{k} rating 10 kVA area 60 cm2 flux-limit 1.6 T\n");
            o.Append($"winding H{k} on K{k} turns 1000 rated 2400 V from H{k}a to H{k}b resistance 2.1 ohm\n");
            o.Append($"winding X{k} on K{k} turns 100 rated 240 V from A{k} to C{k} resistance 0.02 ohm\n");
            o.Append($"tap M{k} on X{k} at 50 %\nimpedance H{k} X{k} 3 % xr 4\n");
            if (k > 1) o.Append($"join H1a H{k}a\n");
            o.Append($"ground H{k}b\nground M{k}\n");
            o.Append($"load a{k} A{k} M{k} impedance {6 + k % 5} ohm\nload b{k} M{k} C{k} impedance {8 + k % 3} ohm\n");
        }
        return o.ToString();
    }

    /// <summary>
    /// The twenty sections with the heater's impedance a <c>let</c>, swept over <paramref name="points"/>
    /// points (a load changed, no brush: each point is bound, built and solved).
    /// </summary>
    public static string TwentySectionsLoadSweep(int points) =>
        TwentySections(2).Replace("load heater BR A impedance 20 ohm", "let rh = 20 ohm\nload heater BR A impedance rh")
            .Replace("sweep BR from 1 % to 99 % points 2", $"sweep rh from 5 ohm to 50 ohm points {points}");

    /// <summary>The twenty sections with eleven values given with a tolerance: a Monte Carlo of 1,000 samples.</summary>
    public static string TwentySectionsMonteCarlo()
    {
        var text = TwentySections(2).Replace("sweep BR from 1 % to 99 % points 2\n", "")
            .Replace("impedance P W 4 % xr 3", "impedance P W 4 % +- 7.5 % xr 3")
            .Replace("load heater BR A impedance 20 ohm", "load heater BR A impedance 20 ohm +- 10 %")
            .Replace("load lamp P9 H2 impedance 200 ohm", "load lamp P9 H2 impedance 200 ohm +- 10 %")
            .Replace("resistance 1.2 ohm", "resistance 1.2 ohm +- 5 %")
            .Replace("resistance 0.3 ohm", "resistance 0.3 ohm +- 5 %")
            .Replace("480 V fault-level 10 kA", "480 V +- 5 % fault-level 10 kA +- 20 %");
        for (var i = 1; i <= 5; i++) text = text.Replace($"tap P{i} on P at {i * 26} turns", $"tap P{i} on P at {i * 26} turns +- 1 %");
        return text;
    }

    /// <summary>Twenty sections: a primary tapped seventeen times feeding a winding with a brush, swept over <paramref name="points"/> points.</summary>
    public static string TwentySections(int points)
    {
        var o = new StringBuilder("# dyeing line: a tapped primary and a variable winding\nfrequency 60 Hz\ncore K rating 5 kVA area 40 cm2 flux-limit 1.6 T\n");
        o.Append("winding P on K turns 480 rated 480 V from H1 to H2 resistance 1.2 ohm\n");
        for (var i = 1; i <= 17; i++) o.Append($"tap P{i} on P at {i * 26} turns\n");
        o.Append("winding W on K turns 240 rated 240 V from A to B resistance 0.3 ohm rated-current 20 A\n");
        o.Append("brush BR on W at 50 % range 0 % to 100 %\nimpedance P W 4 % xr 3\n");
        o.Append("supply mains H1 H2 480 V fault-level 10 kA xr 5\nground H2\nground A\n");
        o.Append("load heater BR A impedance 20 ohm\nload lamp P9 H2 impedance 200 ohm\n");
        o.Append($"sweep BR from 1 % to 99 % points {points}\nexpect voltage BR A between 0 V and 250 V\n");
        return o.ToString();
    }

    /// <summary>
    /// A supply on a winding tapped every ten turns into 300 sections, a second winding feeding one
    /// load of 20 kW at pf 0.9: a 301-section part (605 unknowns), its load constant-power (Newton's
    /// method) or, with <paramref name="constantImpedance"/>, the same demand as an impedance (one linear solve).
    /// </summary>
    public static string ThreeHundredOneSections(bool constantImpedance)
    {
        var o = new StringBuilder("# a test winding tapped every ten turns\nfrequency 60 Hz\ncore K rating 50 kVA area 200 cm2 flux-limit 1.6 T\n");
        o.Append("winding P on K turns 3000 rated 4160 V from H1 to H2 resistance 2 ohm\n");
        for (var i = 1; i < 300; i++) o.Append($"tap P{i} on P at {i * 10} turns\n");
        o.Append("winding S on K turns 300 rated 416 V from X1 to X2 resistance 0.02 ohm\nimpedance P S 4 % xr 5\n");
        o.Append("supply mains H1 H2 4160 V fault-level 5 kA xr 8\nground H2\nground X2\n");
        o.Append($"load heater X1 X2 power 20 kW pf 0.9{(constantImpedance ? " model constant-impedance" : "")}\n");
        return o.ToString();
    }
}

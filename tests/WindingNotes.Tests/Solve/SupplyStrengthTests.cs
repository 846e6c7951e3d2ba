using System.Numerics;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The internal impedance of a supply from its fault level: a bolted fault at its terminals draws the
/// stated fault current, or the stated fault power at its voltage (the definition, common practice).
/// </summary>
public class SupplyStrengthTests
{
    private static Complex FaultAtTerminals(string supply)
    {
        var e = Wn.Solved($"frequency 50 Hz\n{supply}\nground N\nfault F A N\n");
        return e.Cases.Single(c => c.Case.Name == "fault F").Solution.FaultCurrent;
    }

    [Fact]
    public void A_fault_level_in_MVA_with_xr_gives_its_current_and_angle()
    {
        var i = FaultAtTerminals("supply s A N 11 kV fault-level 250 MVA xr 10");
        Wn.Near(250e6 / 11e3, i.Magnitude, 1e-12, "fault current");
        Wn.Near(-Math.Atan(10) * 180 / Math.PI, i.Phase * 180 / Math.PI, 1e-12, "angle");
    }

    [Fact]
    public void A_fault_level_in_kA_without_xr_is_a_pure_reactance()
    {
        var i = FaultAtTerminals("supply s A N 480 V fault-level 14 kA");
        Wn.Near(14e3, i.Magnitude, 1e-12, "fault current");
        Wn.Near(-90, i.Phase * 180 / Math.PI, 1e-12, "angle");
    }

    [Fact]
    public void A_supply_with_a_fault_level_drops_under_load()
    {
        // 480 V behind |Z| = 480/14000 ohm at X/R 6, loaded with 4.8 ohm: the divider.
        var c = Wn.Solved("frequency 50 Hz\nsupply s A N 480 V fault-level 14 kA xr 6\nground N\nload l A N impedance 4.8 ohm\n").Normal!;
        var z = Complex.FromPolarCoordinates(480 / 14e3, Math.Atan(6));
        ShortCircuit.Near(480 * 4.8 / (4.8 + z), c.V("A", "N"), 1e-12, "load voltage");
    }
}

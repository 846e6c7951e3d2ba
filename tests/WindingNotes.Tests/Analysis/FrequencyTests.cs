using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>
/// A change of frequency (a swept or toleranced frequency): impedances are given at the frequency as
/// written, reactances follow the frequency and resistances do not, and excitation is judged in volts
/// per hertz.
/// </summary>
public class FrequencyTests
{
    private static CaseResult At(WindingNotes.Workspace.Evaluation e, double hertz) =>
        Wn.Points(e).Single(c => Math.Abs(c.Case.Sweep.Single().Value - hertz) < 1e-9);

    [Fact]
    public void A_60_Hz_core_at_rated_voltage_and_50_Hz_is_over_excited_by_20_percent()
    {
        // Flux goes with V/f (E = 4.44 f N Φ, R13): 240 V on a core rated 240 V at 60 Hz, fed at
        // 50 Hz, runs at (240/240)·(60/50) = 120 % of its rated volts per hertz, over the 110 % at
        // no load (IEEE C57.12.00, from memory). At 60 Hz it is at 100 %: nothing to say.
        var e = Wn.Solved("""
            let f = 60 Hz
            frequency f
            core K rating 1 kVA
            winding P on K turns 200 rated 240 V from P1 to P2
            winding S on K turns 20 from S1 to S2
            supply s P1 P2 240 V
            ground P2
            ground S2
            sweep f from 50 Hz to 60 Hz step 10 Hz

            """);
        var d = e.Single("overexcited");
        Assert.Equal("K", e.TextAt(d.Span));
        Assert.StartsWith("core 'K' runs at 120.0 % of its rated volts per hertz at no load, above the 110.0 %", d.Message);
        Assert.Contains("at f=50 Hz", d.Message);
        // Volts per turn are the same at both points: only the frequency changed.
        Wn.Near(At(e, 60).Cores.Single().VoltsPerTurn!.Value.Magnitude, At(e, 50).Cores.Single().VoltsPerTurn!.Value.Magnitude, 1e-12, "volts per turn");
    }

    [Fact]
    public void Leakage_reactance_follows_the_frequency_and_resistance_stays()
    {
        // A 1:1 unit with 3 + j4 ohm between its windings at 60 Hz (as written), an ideal core, and a
        // 5 ohm load: |I| = 100 V / |(3 + 5) + j4·f/60|.
        //   30 Hz: 100/|8 + j2| = 12.127 A; 60 Hz: 100/|8 + j4| = 11.180 A; 120 Hz: 100/|8 + j8| = 8.8388 A.
        var e = Wn.Solved("""
            let f = 60 Hz
            frequency f
            core K rating 2 kVA
            winding P on K turns 100 rated 100 V from P1 to P2
            winding S on K turns 100 rated 100 V from S1 to S2
            impedance P S 3 + j4 ohm
            supply s P1 P2 100 V
            ground P2
            ground S2
            load r S1 S2 impedance 5 ohm
            sweep f from 30 Hz to 120 Hz step 30 Hz

            """);
        foreach (var (hertz, x) in new[] { (30.0, 2.0), (60.0, 4.0), (120.0, 8.0) })
            Wn.Near(100 / Math.Sqrt(8 * 8 + x * x), At(e, hertz).Load("r").Current.Magnitude, 1e-9, $"load current at {hertz} Hz");
        // The copper loss is 3 ohm times I² at every frequency: the resistance is not scaled.
        var i = At(e, 120).Load("r").Current.Magnitude;
        Wn.Near(3 * i * i, At(e, 120).Totals.CopperLoss, 1e-9, "copper loss at 120 Hz");
    }

    [Fact]
    public void Magnetising_reactance_follows_the_frequency_and_core_loss_conductance_stays()
    {
        // Open-circuit test at 60 Hz: 240 V, 0.5 A, 30 W, so G = 30/240² and the magnetising part of the
        // current is √(0.5² − (30/240)²) = 0.48412 A. At 50 Hz the magnetising reactance is 50/60 of
        // it, so at 240 V that part is 0.48412·60/50 = 0.58095 A, and the loss part stays 0.125 A:
        // |I| = √(0.125² + 0.58095²) = 0.59425 A.
        var e = Wn.Solved("""
            let f = 60 Hz
            frequency f
            core K rating 1 kVA
            winding P on K turns 200 rated 240 V from P1 to P2
            no-load K current 0.5 A loss 30 W at P 240 V
            supply s P1 P2 240 V
            ground P2
            sweep f from 50 Hz to 60 Hz step 10 Hz

            """);
        var magnetising = Math.Sqrt(0.5 * 0.5 - 0.125 * 0.125) * 60 / 50;
        Wn.Near(Math.Sqrt(0.125 * 0.125 + magnetising * magnetising), At(e, 50).Supply("s").Current.Magnitude, 1e-9, "no-load current at 50 Hz");
        Wn.Near(0.5, At(e, 60).Supply("s").Current.Magnitude, 1e-9, "no-load current at 60 Hz, as tested");
        Wn.Near(30, At(e, 50).Totals.CoreLoss, 1e-9, "core loss at 50 Hz");
    }

    [Fact]
    public void A_supply_impedance_is_given_at_the_frequency_as_written()
    {
        // 100 V behind 3 + j4 ohm (at 60 Hz) into a 5 ohm load: |I| = 100/|8 + j4·f/60|, as for the
        // leakage above: 12.127 A at 30 Hz, 11.180 A at 60 Hz.
        var e = Wn.Solved("""
            let f = 60 Hz
            frequency f
            supply s P N 100 V impedance 3 + j4 ohm
            ground N
            load r P N impedance 5 ohm
            sweep f from 30 Hz to 60 Hz step 30 Hz

            """);
        Wn.Near(100 / Math.Sqrt(8 * 8 + 2 * 2), At(e, 30).Load("r").Current.Magnitude, 1e-9, "at 30 Hz");
        Wn.Near(100 / Math.Sqrt(8 * 8 + 4 * 4), At(e, 60).Load("r").Current.Magnitude, 1e-9, "at 60 Hz");
    }
}

namespace WindingNotes.Tests.Editing;

/// <summary>Invented networks that exercise every kind of line (demo data, not reference values).</summary>
internal static class Fixtures
{
    /// <summary>A tapped control transformer with a let, a fault, a failing check and non-ASCII units.</summary>
    public const string Tapped = """
        # Pump-house control supply (invented)
        frequency 50 Hz
        let vin = 2 * 115 V
        core K2 rating 1.5 kVA area 40 cm² flux-limit 1.5 T
        winding P on K2 turns 460 rated vin from P1 to P2 resistance 1.2 Ω
        tap T50 on P at 50 %
        winding S on K2 turns 48 rated 24 V from S1 to S2 resistance 0.02 Ω
        impedance P S 4 % ± 10 % xr 1.5
        supply line P1 P2 230 V angle 0 °
        ground P2
        ground S2
        load lamps S1 S2 impedance 1.2 Ω
        load coil T50 P2 apparent 200 VA pf 0.7 lagging
        fault F1 S1 S2
        expect voltage S1 S2 above 23 V
        expect flux K2 below 1.5 T
        """;
}

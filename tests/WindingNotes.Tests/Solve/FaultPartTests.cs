using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A fault changes only the independent part it is in: its case solves and reports that part, with
/// the values that part gives alone, and says nothing about the others (the normal case does).
/// </summary>
public class FaultPartTests
{
    private const string First = """
        core K1 rating 1.5 kVA
        winding P1 on K1 turns 800 rated 480 V from H1 to H2 resistance 1.5 ohm
        winding S1 on K1 turns 200 rated 120 V from X1 to X2 resistance 0.085 ohm
        impedance P1 S1 3.2 % xr 1.4
        supply f1 H1 H2 480 V fault-level 14 kA xr 6
        ground H2
        ground X2
        load a1 X1 X2 impedance 12 ohm
        fault short1 X1 X2 impedance 0 ohm

        """;

    private const string Second = """
        core K2 rating 3 kVA
        winding P2 on K2 turns 400 rated 240 V from J1 to J2 resistance 0.9 ohm
        winding S2 on K2 turns 100 rated 60 V from Y1 to Y2 resistance 0.05 ohm
        tap Y3 on S2 at 50 %
        impedance P2 S2 4 % xr 2
        supply f2 J1 J2 240 V
        ground J2
        ground Y2
        load a2 Y1 Y2 power 400 W pf 0.9
        fault short2 Y3 Y2 impedance 0.01 ohm

        """;

    // Windings of almost no resistance across a supply: ill-conditioned, said where this part is solved.
    private const string Rig = """
        core L rating 1 kVA
        winding LA on L turns 100 rated 100 V from LA1 to LA2 resistance 1e-8 ohm
        winding LB on L turns 100 rated 100 V from LB1 to LB2 resistance 1e-8 ohm
        supply rig LA1 LA2 100 V
        ground LA2
        join LA1 LB1
        join LA2 LB2

        """;

    [Fact]
    public void A_fault_case_is_its_own_part_with_the_values_that_part_gives_alone()
    {
        var all = Wn.Eval("frequency 60 Hz\n" + First + Second + Rig);
        foreach (var (unit, fault) in new[] { (First, "short1"), (Second, "short2") })
        {
            var alone = Wn.Solved("frequency 60 Hz\n" + unit).Cases.Single(c => c.Case.Name == $"fault {fault}");
            var inFile = all.Cases.Single(c => c.Case.Name == $"fault {fault}");
            Assert.Equal(CaseValues.Of(alone).ToList(), CaseValues.Of(inFile).ToList());
        }
        // The rig's part is solved in the normal case and without loads, and in no fault case.
        Assert.Equal(2, all.Diagnostics.Count(d => d.Code == "ill-conditioned"));
        Assert.DoesNotContain(all.Diagnostics, d => d.Code == "ill-conditioned" && d.Case is { } c && c.StartsWith("fault", StringComparison.Ordinal));
    }
}

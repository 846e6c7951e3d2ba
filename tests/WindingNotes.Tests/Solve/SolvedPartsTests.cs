using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A fault case takes over from the normal case every part it leaves as it was; its results and
/// messages must be what solving the whole network again gives, including next to a part whose
/// solve reports something (that part is solved again, so its message is repeated as before).
/// </summary>
public class SolvedPartsTests
{
    private const string Text = """
        frequency 60 Hz
        core K1 rating 1.5 kVA
        winding P1 on K1 turns 800 rated 480 V from H1 to H2 resistance 1.5 ohm
        winding S1 on K1 turns 200 rated 120 V from X1 to X2 resistance 0.085 ohm
        impedance P1 S1 3.2 % xr 1.4
        supply f1 H1 H2 480 V fault-level 14 kA xr 6
        ground H2
        ground X2
        load a1 X1 X2 impedance 12 ohm
        fault short1 X1 X2 impedance 0 ohm
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
        core L rating 1 kVA
        winding LA on L turns 100 rated 100 V from LA1 to LA2 resistance 1e-8 ohm
        winding LB on L turns 100 rated 100 V from LB1 to LB2 resistance 1e-8 ohm
        supply rig LA1 LA2 100 V
        ground LA2
        join LA1 LB1
        join LA2 LB2
        """;

    [Fact]
    public void Faults_that_take_over_parts_equal_a_full_solve()
    {
        var network = NetworkBuilder.Build(Binder.Bind(Parser.Parse(Text)));
        var point = Points.Solve(network, CaseSpec.Normal, withFaults: true, default);
        var normal = NetworkSolver.Solve(network, CaseSpec.Normal);
        Assert.Equal(2, point.Faults.Length);
        var messages = normal.Diagnostics.Concat(NetworkSolver.Solve(network, CaseSpec.NoLoad).Diagnostics).ToList();
        foreach (var fault in network.Model.Faults)
        {
            var full = NetworkSolver.Solve(network, CaseSpec.ForFault(fault));
            messages.AddRange(full.Diagnostics.Where(d => d.Code != "load-without-voltage"));
            var expected = CaseValues.Of(Results.Compute(full, null, normal)).ToList();
            var actual = CaseValues.Of(point.Faults.Single(f => f.Case.Fault == fault)).ToList();
            Assert.Equal(expected, actual);
        }
        // The ill-conditioned part is named in the normal case, without loads and again in each fault case.
        Assert.Equal(4, messages.Count(d => d.Code == "ill-conditioned"));
        Assert.Equal(messages.Select(d => d.Message), point.Diagnostics.Where(d => d.Code == "ill-conditioned").Select(d => d.Message));
    }
}

using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Solve;
using Xunit;

namespace WindingNotes.Tests.Support;

/// <summary>
/// The laws a solved case is built from, checked on its numbers: KCL at every node, ampere-turn
/// balance on every core (Σ N·I = Y·e; R1, any electric machines textbook), every section's
/// equation V_a − V_b = N·e + Σ Z·I, and the supplies' power equal to the loads' plus the losses.
/// </summary>
public static class CircuitLaws
{
    public static void Hold(Network network, CaseResult c, string context, double tolerance = 1e-9)
    {
        var s = c.Solution;
        var scale = s.SectionCurrents.ToArray().Concat(s.SupplyCurrents.ToArray()).Concat(s.LoadCurrents.ToArray()).Max(i => i.Magnitude);
        var leaving = new Complex[network.Nodes.Length];
        foreach (var k in network.Sections) { leaving[k.NodeA] += s.SectionCurrents[k.Index]; leaving[k.NodeB] -= s.SectionCurrents[k.Index]; }
        foreach (var p in network.Supplies) { leaving[p.NodeP] -= s.SupplyCurrents[p.Index]; leaving[p.NodeQ] += s.SupplyCurrents[p.Index]; }
        foreach (var l in network.Loads) { leaving[l.NodeA] += s.LoadCurrents[l.Index]; leaving[l.NodeB] -= s.LoadCurrents[l.Index]; }
        for (var n = 0; n < leaving.Length; n++)
            Assert.True(leaving[n].Magnitude <= tolerance * scale, $"KCL at {network.Nodes[n].Name}: {leaving[n]} ({context})");

        var vScale = s.NodeVoltages.ToArray().Max(v => v.Magnitude);
        foreach (var core in network.Cores)
        {
            var e = s.CoreVoltsPerTurn[core.Index];
            var sum = core.Sections.Aggregate(Complex.Zero, (a, k) => a + network.Sections[k].Turns * s.SectionCurrents[k]) - core.Admittance * e;
            var size = core.Sections.Sum(k => network.Sections[k].Turns * s.SectionCurrents[k].Magnitude) + (core.Admittance * e).Magnitude;
            Assert.True(sum.Magnitude <= tolerance * size, $"ampere-turns on {core.Name}: {sum} ({context})");
            for (var r = 0; r < core.Sections.Length; r++)
            {
                var k = network.Sections[core.Sections[r]];
                var expected = k.Turns * e;
                for (var j = 0; j < core.Sections.Length; j++) expected += core.Impedance[r, j] * s.SectionCurrents[core.Sections[j]];
                Assert.True((s.SectionVoltage(k) - expected).Magnitude <= tolerance * vScale, $"section {k.Name}: {s.SectionVoltage(k)} against {expected} ({context})");
            }
        }

        var supplied = c.Supplies.Sum(p => p.Power.Real);
        var balance = c.Loads.Sum(l => l.Power.Real) + c.Totals.CopperLoss + c.Totals.CoreLoss;
        Assert.True(Math.Abs(supplied - balance) <= tolerance * c.Supplies.Sum(p => p.Power.Magnitude), $"power {supplied} against {balance} ({context})");
    }
}

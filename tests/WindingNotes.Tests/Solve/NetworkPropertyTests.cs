using System.Numerics;
using CsCheck;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Over random well-formed networks, the solution obeys the laws it was built from: KCL at every
/// node, ampere-turn balance on every core (R1, any electric machines textbook), every section's
/// equation, and the supply's power equal to the loads' power plus the losses.
/// </summary>
public class NetworkPropertyTests
{
    [Fact]
    public void Solutions_obey_kcl_ampere_turns_and_power_balance()
    {
        Gen.Int[0, int.MaxValue].Sample(seed =>
        {
            var text = RandomNetworks.Write(seed);
            var e = Wn.Solved(text);
            var c = e.Normal!;
            var network = e.Network!;
            var s = c.Solution;
            var scale = s.SectionCurrents.Concat(s.SupplyCurrents).Concat(s.LoadCurrents).Max(i => i.Magnitude);

            var leaving = new Complex[network.Nodes.Length];
            foreach (var k in network.Sections) { leaving[k.NodeA] += s.SectionCurrents[k.Index]; leaving[k.NodeB] -= s.SectionCurrents[k.Index]; }
            foreach (var p in network.Supplies) { leaving[p.NodeP] -= s.SupplyCurrents[p.Index]; leaving[p.NodeQ] += s.SupplyCurrents[p.Index]; }
            foreach (var l in network.Loads) { leaving[l.NodeA] += s.LoadCurrents[l.Index]; leaving[l.NodeB] -= s.LoadCurrents[l.Index]; }
            for (var n = 0; n < leaving.Length; n++)
                Assert.True(leaving[n].Magnitude <= 1e-9 * scale, $"KCL at {network.Nodes[n].Name}: {leaving[n]} (seed {seed})\n{text}");

            foreach (var core in network.Cores)
            {
                var sum = core.Sections.Aggregate(Complex.Zero, (a, k) => a + network.Sections[k].Turns * s.SectionCurrents[k]);
                var size = core.Sections.Sum(k => network.Sections[k].Turns * s.SectionCurrents[k].Magnitude);
                Assert.True(sum.Magnitude <= 1e-9 * size, $"ampere-turns on {core.Name}: {sum} (seed {seed})");
                for (var r = 0; r < core.Sections.Length; r++)
                {
                    var k = network.Sections[core.Sections[r]];
                    var expected = k.Turns * s.CoreVoltsPerTurn[core.Index];
                    for (var j = 0; j < core.Sections.Length; j++) expected += core.Impedance[r, j] * s.SectionCurrents[core.Sections[j]];
                    var vScale = s.NodeVoltages.Max(v => v.Magnitude);
                    Assert.True((s.SectionVoltage(k) - expected).Magnitude <= 1e-9 * vScale, $"section {k.Name} (seed {seed})");
                }
            }

            var supplied = c.Supplies.Sum(p => p.Power.Real);
            var balance = c.Loads.Sum(l => l.Power.Real) + c.Totals.CopperLoss + c.Totals.CoreLoss;
            Assert.True(Math.Abs(supplied - balance) <= 1e-9 * c.Supplies.Sum(p => p.Power.Magnitude), $"power {supplied} vs {balance} (seed {seed})");
        }, iter: 150);
    }
}

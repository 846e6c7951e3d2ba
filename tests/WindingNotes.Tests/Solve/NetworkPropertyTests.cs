using CsCheck;
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
            CircuitLaws.Hold(e.Network!, e.Normal!, $"seed {seed}\n{text}");
        }, iter: 150);
    }
}

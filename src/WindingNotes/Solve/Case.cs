using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>What a case changes on the network: the loads taken off (the no-load case for regulation), a fault put on.</summary>
public sealed record CaseSpec(string Name, bool WithoutLoads = false, FaultModel? Fault = null)
{
    public static readonly CaseSpec Normal = new("normal");

    public static readonly CaseSpec NoLoad = new("no-load", WithoutLoads: true);

    public static CaseSpec ForFault(FaultModel fault) => new($"fault {fault.Name}", Fault: fault);
}

/// <summary>
/// The solved unknowns of one case, indexed like the network's arrays. Currents follow the
/// conventions of the notation: a section's current enters its from-side end, a supply's leaves its
/// positive terminal, a load's enters its first node, a fault's flows from its first node to its second.
/// </summary>
public sealed record Solution(
    Network Network,
    CaseSpec Case,
    Complex[] NodeVoltages,
    Complex[] SectionCurrents,
    Complex[] CoreVoltsPerTurn,
    Complex[] SupplyCurrents,
    Complex[] LoadCurrents,
    Complex FaultCurrent,
    bool Solved,
    ImmutableArray<Diagnostic> Diagnostics)
{
    public Complex Voltage(int node) => node < 0 ? Complex.Zero : NodeVoltages[node];

    public Complex SectionVoltage(Section s) => Voltage(s.NodeA) - Voltage(s.NodeB);

    public Complex LoadVoltage(LoadNet l) => Voltage(l.NodeA) - Voltage(l.NodeB);

    public Complex SupplyVoltage(SupplyNet s) => Voltage(s.NodeP) - Voltage(s.NodeQ);
}

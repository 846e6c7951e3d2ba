using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A result record's equality is of its values: a record's own equality compared its lists
/// (ImmutableArray, arrays) by reference and took in its look-up caches, so two results of the same
/// values were equal only when they shared lists, and one that had been searched differed from its copy.
/// </summary>
public class ResultEqualityTests
{
    // Forty points and eighty loads: more than the 32 elements below which a case is searched rather than
    // indexed, so a look-up builds the case's caches.
    private static readonly string Ladder = "frequency 50 Hz\nsupply mains A B 230 V\nground B\n"
        + string.Concat(Enumerable.Range(1, 40).Select(i => $"load L{i} A N{i} impedance {i} ohm\nload M{i} N{i} B impedance 10 ohm\n"));

    [Fact]
    public void A_case_result_is_equal_to_one_of_the_same_values_in_other_lists_whatever_its_caches_hold()
    {
        var first = Wn.Solved(Ladder).Normal!;
        Assert.True(first.Points.Length > 32 && first.Loads.Length > 32);
        var again = first with { Points = [.. first.Points], Loads = [.. first.Loads], Supplies = [.. first.Supplies] };
        Assert.Equal(first, again);
        Assert.Equal(first.GetHashCode(), again.GetHashCode());
        // One searched, building its indexes; the other not: still equal. By hand, M40 carries
        // 230 V/(40 + 10) Ω = 4.6 A and stands at 4.6 A × 10 Ω = 46 V, N40 likewise.
        Wn.Near(4.6, again.LoadNamed("M40")!.Current.Magnitude, 1e-9, "M40");
        Wn.Near(46, again.PointVoltage("N40").Magnitude, 1e-9, "N40");
        Assert.True(first.Equals(again));
        Assert.True(again.Equals(first));
        // A value that differs makes them differ.
        Assert.NotEqual(first, again with { Totals = again.Totals with { CopperLoss = 1 } });
        Assert.NotEqual(first, again with { Loads = again.Loads.RemoveAt(0) });
        // The solution's unknowns compare by value too: a copy of its values, held as a part's, is the same solution.
        var voltages = first.Solution.NodeVoltages;
        var copy = new Phasors.Builder(voltages.Length, partOnly: true);
        for (var i = 0; i < voltages.Length; i++) copy.Set(i, voltages[i]);
        var solution = first.Solution with { NodeVoltages = copy.Build() };
        Assert.Equal(first.Solution, solution);
        Assert.NotEqual(first.Solution, solution.Compact());
    }

    [Fact]
    public void A_sweep_point_is_the_same_case_with_the_same_swept_values_in_any_list()
    {
        ImmutableArray<SweepValue> Values(double v) => [new SweepValue("BR", v, $"{v * 100} %")];
        Assert.Equal(CaseSpec.ForSweep(Values(0.25)), CaseSpec.ForSweep(Values(0.25)));
        Assert.Equal(CaseSpec.ForSweep(Values(0.25)).GetHashCode(), CaseSpec.ForSweep(Values(0.25)).GetHashCode());
        Assert.NotEqual(CaseSpec.ForSweep(Values(0.25)), CaseSpec.ForSweep(Values(0.5)) with { Name = CaseSpec.ForSweep(Values(0.25)).Name });
        Assert.Equal(CaseSpec.Normal, new CaseSpec("normal"));
    }

    [Fact]
    public void A_three_phase_result_copied_with_other_sets_finds_its_own_sets()
    {
        var e = Wn.Solved("""
            frequency 50 Hz
            three-phase-supply grid A B C 400 V impedance 0.1 ohm
            three-phase-load heaters A B C wye impedance 10 ohm

            """);
        var three = e.Normal!.ThreePhase;
        Assert.NotNull(three.SetOf("grid"));
        // Its index was built from the first sets and copied by 'with': a set renamed was not found.
        var renamed = three with { Sets = [.. three.Sets.Select(s => s with { Name = s.Name + "2" })] };
        Assert.Same(renamed.Sets.First(s => s.Name == "grid2"), renamed.SetOf("grid2"));
        Assert.Null(renamed.SetOf("grid"));
        Assert.Equal(three, three with { Sets = [.. three.Sets] });
        Assert.NotEqual(three, renamed);
    }

    /// <summary>The records whose equality names each property: a property added must be added to it.</summary>
    [Theory]
    [InlineData(typeof(CaseResult), "Bands Case Connections Cores Fault Loads Points Sections ShortCircuit Solution Supplies Taps TapPositions ThreePhase Totals")]
    [InlineData(typeof(ShortCircuitResult), "Currents DcTimeConstant Duties EarthCurrent EarthFaultFactor EndTemperature EquivalentFrequency EquivalentImpedance EquivalentRX Fault Groundings Initial Kappa KappaAtFault KappaExempt LineCurrents LineVoltages Minimum Nominal NominalFrom Peak Peak60076 PreFault Study Thermal ThermalFactorM TransformerCorrections Voltages VoltageFactor WeakestSources Z1")]
    [InlineData(typeof(Solution), "Case CoreVoltsPerTurn Diagnostics FaultCurrent LoadCurrents Network NodeVoltages Scope SectionCurrents Solved SupplyCurrents")]
    [InlineData(typeof(CaseSpec), "Fault Name Sweep WithoutLoads")]
    [InlineData(typeof(Connection), "Common Cores FedFrom Island Load Series Supply")]
    [InlineData(typeof(PhaseSetResult), "Acb CurrentSequence Kind LineCurrents LineToLine Name NeutralCurrent PhaseCurrents Power Voltages VoltageSequence")]
    public void Equality_names_every_stored_property(Type record, string named)
    {
        // Stored: positional or 'init' properties (computed ones have no setter).
        var stored = record.GetProperties().Where(p => p.SetMethod is { IsPublic: true }).Select(p => p.Name).Order(StringComparer.Ordinal);
        Assert.Equal(named.Split(' ').Order(StringComparer.Ordinal), stored);
    }
}

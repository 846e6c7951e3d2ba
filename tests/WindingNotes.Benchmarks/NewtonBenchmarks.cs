using System.Numerics;
using BenchmarkDotNet.Attributes;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Tests.Solve;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Issue 19's Newton target, side by side: one point (the normal case solved on the built network)
/// of a 301-section part whose load is constant-impedance (one linear solve) or constant-power
/// (Newton on the sparse system), and the same constant-power part through Newton with the dense
/// 2n × 2n Jacobian the solver had before (tests' DenseNewton, from the same start).
/// </summary>
[MemoryDiagnoser]
public class NewtonBenchmarks
{
    private Network impedance = null!, power = null!;

    [GlobalSetup]
    public void Setup()
    {
        impedance = NetworkBuilder.Build(Binder.Bind(Parser.Parse(Documents.ThreeHundredOneSections(constantImpedance: true))));
        power = NetworkBuilder.Build(Binder.Bind(Parser.Parse(Documents.ThreeHundredOneSections(constantImpedance: false))));
        var m = Part(power);
        Console.WriteLine($"// {power.Sections.Length} sections, {m.Size} unknowns, {m.NonlinearLoads.Length} constant-power load");
    }

    private static MnaSystem Part(Network network) =>
        MnaSystem.Assemble(network, SolveGroup.Find(network, CaseSpec.Normal).Single(g => g.Supplies.Count > 0), Islands.References(network, []), CaseSpec.Normal);

    [Benchmark(Baseline = true)]
    public Solution ConstantImpedance() => NetworkSolver.Solve(impedance, CaseSpec.Normal);

    [Benchmark]
    public Solution ConstantPower() => NetworkSolver.Solve(power, CaseSpec.Normal);

    /// <summary>Assembly, the open-circuit solve, the start solve, then the dense Newton as it was.</summary>
    [Benchmark]
    public object ConstantPowerDenseJacobian()
    {
        var m = Part(power);
        var first = LinearSolver.Solve(m.A, m.B);
        var a = m.A.Clone();
        foreach (var load in m.NonlinearLoads)
        {
            var v = NewtonSolver.Across(load, first.X).Magnitude;
            var y = Complex.Conjugate(load.S0) / (v * v);
            if (load.ColumnA >= 0) { a[load.ColumnA, load.ColumnA] += y; if (load.ColumnB >= 0) a[load.ColumnA, load.ColumnB] -= y; }
            if (load.ColumnB >= 0) { a[load.ColumnB, load.ColumnB] += y; if (load.ColumnA >= 0) a[load.ColumnB, load.ColumnA] -= y; }
        }
        var result = DenseNewton.Solve(m, LinearSolver.Solve(a, m.B).X);
        if (!result.Converged) throw new InvalidOperationException("the dense Newton did not converge");
        return result;
    }
}

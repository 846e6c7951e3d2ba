using System.Numerics;
using BenchmarkDotNet.Attributes;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Dense against sparse LU through the solver (equilibration, factors, residual) on the system of
/// 2 to 30 bench units on one bus (14 to 182 unknowns): where the two cross is LinearSolver.SparseAbove.
/// </summary>
[MemoryDiagnoser]
public class SolverBenchmarks
{
    private SystemMatrix a = null!;
    private Complex[] b = null!;

    [Params(2, 3, 4, 7, 14, 30)]
    public int Units;

    [GlobalSetup]
    public void Setup()
    {
        var network = NetworkBuilder.Build(Binder.Bind(Parser.Parse(Documents.Connected(Units))));
        var group = SolveGroup.Find(network, CaseSpec.Normal).Single(g => g.Supplies.Count > 0);
        var m = MnaSystem.Assemble(network, group, Islands.References(network, []), CaseSpec.Normal);
        (a, b) = (m.A, m.B.ToArray());
        Console.WriteLine($"// {Units} units: {m.Size} unknowns");
    }

    [Benchmark(Baseline = true)]
    public object Dense() => LinearSolver.Solve(a, b, sparse: false);

    [Benchmark]
    public object Sparse() => LinearSolver.Solve(a, b, sparse: true);
}

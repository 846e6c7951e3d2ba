using Complex = System.Numerics.Complex;
using BenchmarkDotNet.Attributes;
using MathNet.Numerics.LinearAlgebra;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Brush sweeps. On the 20-section network, side by side in one run: the whole pipeline per sweep
/// point (a 1,000-point sweep evaluated, reported per point), the points alone (moved, updated,
/// their results made, loaded and without loads), and the bare factor-and-solve of the same matrix
/// (the loaded system at one point) by MathNet's dense LU and by the sparse LU.
/// </summary>
[MemoryDiagnoser]
public class SweepBenchmarks
{
    private const int Points = 1000;
    private string bench = "", twenty = "", loadSweep = "", monteCarlo = "";
    private SystemMatrix matrix = null!;
    private Complex[,] dense = null!;
    private Complex[] rhs = null!;
    private SyntaxTree syntax = null!;
    private Model.Model model = null!;
    private System.Collections.Immutable.ImmutableArray<SweepAxis> axes;

    [GlobalSetup]
    public void Setup()
    {
        bench = """
            frequency 60 Hz
            core VT rating 1.4 kVA area 18 cm2 flux-limit 1.5 T
            winding W on VT turns 234 rated 140.4 V from A to B resistance 0.55 ohm rated-current 8 A
            tap LINE on W at 200 turns
            brush BR on W at 50 % range 0 % to 100 % current-limit 8 A
            supply bench LINE A 120 V fault-level 2 kA xr 2
            ground A
            load heater BR A impedance 40 ohm
            sweep BR from 0 % to 100 % step 1 %
            expect voltage BR A between 0 V and 141 V
            """;
        twenty = Documents.TwentySections(Points);
        loadSweep = Documents.TwentySectionsLoadSweep(Points);
        monteCarlo = Documents.TwentySectionsMonteCarlo();
        syntax = Parser.Parse(twenty);
        model = Binder.Bind(syntax);
        axes = Sweeps.Plan(model, new Text.DiagnosticBag());
        var network = NetworkBuilder.Build(Binder.Bind(syntax, Sweeps.Point(axes, Points / 3).Overrides));
        var group = SolveGroup.Find(network, CaseSpec.Normal).Single(g => g.Supplies.Count > 0);
        var system = MnaSystem.Assemble(network, group, Islands.References(network, []), CaseSpec.Normal);
        (matrix, rhs) = (system.A, system.B.ToArray());
        dense = new Complex[rhs.Length, rhs.Length];
        for (var i = 0; i < rhs.Length; i++)
            for (var j = 0; j < rhs.Length; j++) dense[i, j] = matrix[i, j];
    }

    /// <summary>The bench variable autotransformer, 3 sections, 101 brush positions across a tap.</summary>
    [Benchmark]
    public Evaluation BrushSweep101Points() => Evaluator.Evaluate(bench, "sweep.wn");

    /// <summary>The whole pipeline, per point of a 1,000-point sweep on 20 sections.</summary>
    [Benchmark(OperationsPerInvoke = Points)]
    public Evaluation TwentySectionsPipelinePerPoint() => Evaluator.Evaluate(twenty, "twenty.wn");

    /// <summary>The sweep points alone, per point: move, update the factors, results, loaded and without loads.</summary>
    [Benchmark(OperationsPerInvoke = Points)]
    public PointResult? TwentySectionsPointsOnly()
    {
        var sweep = new BrushSweep(syntax, model);
        PointResult? last = null;
        for (var k = 0; k < Points; k++)
        {
            var (overrides, labels) = Sweeps.Point(axes, k);
            last = sweep.Solve(overrides, CaseSpec.ForSweep(labels), default);
        }
        return last;
    }

    /// <summary>The whole pipeline, per point of a 1,000-point sweep of a let that sets a load's impedance (no brush).</summary>
    [Benchmark(OperationsPerInvoke = Points)]
    public Evaluation TwentySectionsLoadSweepPerPoint() => Evaluator.Evaluate(loadSweep, "load-sweep.wn");

    /// <summary>The whole evaluation of the twenty sections with eleven tolerances: 1,000 Monte Carlo samples.</summary>
    [Benchmark]
    public Evaluation TwentySectionsMonteCarlo() => Evaluator.Evaluate(monteCarlo, "monte-carlo.wn");

    /// <summary>The bare dense LU factor-and-solve of the same (42-unknown) matrix.</summary>
    [Benchmark]
    public Vector<Complex> BareDenseFactorAndSolve() =>
        Matrix<Complex>.Build.DenseOfArray(dense).LU().Solve(Vector<Complex>.Build.Dense(rhs));

    /// <summary>The bare sparse LU factor-and-solve of the same matrix.</summary>
    [Benchmark]
    public Complex[] BareSparseFactorAndSolve()
    {
        var ones = Enumerable.Repeat(1.0, rhs.Length).ToArray();
        return SparseLu.Factor(SparseRows.Of(matrix, ones, ones)).Solve(rhs);
    }
}

using System.Diagnostics;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Where a tolerance sample's and a let sweep point's time goes, by stage (Stopwatch, best of five
/// passes over the 1,000 samples or points, after one pass to warm up). Run:
/// dotnet run -c Release --project tests/WindingNotes.Benchmarks -- profile
/// </summary>
public static class Profile
{
    public static void Run()
    {
        var syntax = Parser.Parse(Documents.TwentySectionsMonteCarlo());
        var model = Binder.Bind(syntax);
        var samples = Tolerances.Plan(model, new Text.DiagnosticBag());
        var overrides = samples.Select(s => new BindOverrides { Deviations = s.Deviations, RatedFrequency = model.Frequency }).ToArray();
        var models = overrides.Select(o => Binder.Rebind(model, o)!.Value.Model).ToArray();
        var networks = models.Select(NetworkBuilder.Build).ToArray();
        Console.WriteLine($"Monte Carlo, {samples.Length} samples of twelve values on twenty sections, µs a sample:");
        Report("bind the document in full", () => { foreach (var o in overrides) Binder.Bind(syntax, o); });
        Report("bind again what the values reach", () => { foreach (var o in overrides) Binder.Rebind(model, o); });
        Report("build the network", () => { foreach (var m in models) NetworkBuilder.Build(m); });
        Report("solve loaded, without loads, results", () => { foreach (var n in networks) Points.Solve(n, CaseSpec.Normal, withFaults: false, default); });
        Report("the same with the fault", () => { foreach (var n in networks) Points.Solve(n, CaseSpec.Normal, withFaults: true, default); });
        Report("one full solve of the loaded case alone", () => { foreach (var n in networks) NetworkSolver.Solve(n, CaseSpec.Normal); });
        Report("the same, refactored on kept pivots", () =>
        {
            var kept = new SymbolicFactors();
            foreach (var n in networks) NetworkSolver.Solve(n, CaseSpec.Normal, kept);
        });
        Report("solve loaded, without loads, results, refactored", () =>
        {
            var kept = new SymbolicFactors();
            foreach (var n in networks) Points.Solve(n, CaseSpec.Normal, withFaults: false, c => NetworkSolver.Solve(n, c, kept), default, kept);
        });
        Report("the same with the fault, refactored", () =>
        {
            var kept = new SymbolicFactors();
            foreach (var n in networks) Points.Solve(n, CaseSpec.Normal, withFaults: true, c => NetworkSolver.Solve(n, c, kept), default, kept);
        });
        Report("the sample whole (Rebinding: bound again, built, refactored, with the fault)", () =>
        {
            var r = new Rebinding(syntax, model);
            foreach (var o in overrides) r.Solve(o, CaseSpec.Normal, withFaults: true, default);
        });
        Report("  of which: the network restamped on the first sample's (NetworkBuilder.Restamp)", () => { foreach (var m in models) NetworkBuilder.Restamp(networks[0], m); });
        var loadedSystems = NetworkSolver.Systems(networks[0], CaseSpec.Normal);
        Report("  of which: the loaded system restamped (MnaSystem.Restamped, a matrix made for it)", () => { foreach (var n in networks) foreach (var m in loadedSystems) m.Restamped(n); });
        var scratch = loadedSystems.Select(m => (m.A.Clone(), new System.Numerics.Complex[m.Size])).ToArray();
        Report("  of which: the loaded system restamped into a kept matrix (MnaSystem.RestampedInto, as Rebinding does)", () =>
        {
            foreach (var n in networks)
                for (var i = 0; i < loadedSystems.Count; i++) loadedSystems[i].RestampedInto(n, scratch[i].Item1, scratch[i].Item2);
        });
        var nominal = Points.Solve(networks[0], CaseSpec.Normal, withFaults: false, default);
        var sampled = networks.Select(n => Points.Solve(n, CaseSpec.Normal, withFaults: false, default)).ToArray();
        Report("the bands over every number of the loaded case (BandSet.Add)", () =>
        {
            var bands = new BandSet(nominal.Case!);
            foreach (var p in sampled) bands.Add(p.Case!);
        });
        Report("  the same by paths written out and looked up (BandSet before wn-restamp)", () =>
        {
            var index = new Dictionary<string, int>(StringComparer.Ordinal);
            var ranges = new List<(double Min, double Max)>();
            foreach (var v in CaseValues.Of(nominal.Case!))
                if (index.TryAdd(v.Path, ranges.Count)) ranges.Add((v.Value, v.Value));
            foreach (var p in sampled)
                foreach (var v in CaseValues.Of(p.Case!))
                    if (index.TryGetValue(v.Path, out var i)) ranges[i] = (Math.Min(ranges[i].Min, v.Value), Math.Max(ranges[i].Max, v.Value));
        });
        Report("the checks of a sample (CheckTally.Observe)", () =>
        {
            var checks = new CheckTally([.. model.Expects]);
            checks.BeginPoint(nominal.Case!.Case.Where);
            foreach (var p in sampled) checks.Observe(p.Case!, "in a sample");
        });
        var system = MnaSystem.Assemble(networks[0], SolveGroup.Find(networks[0], CaseSpec.Normal).Single(g => g.Supplies.Count > 0), Islands.References(networks[0], []), CaseSpec.Normal);
        var ones = Enumerable.Repeat(1.0, system.Size).ToArray();
        var rows = SparseRows.Of(system.A, ones, ones);
        var lu = SparseLu.Factor(rows);
        Report("bare sparse factorisation of one sample's system, 1,000 times", () => { for (var i = 0; i < 1000; i++) SparseLu.Factor(rows); });
        Report("bare refactorisation of the same, 1,000 times", () => { for (var i = 0; i < 1000; i++) lu.Refactor(rows); });
        // The parts of one solve of the loaded case, refactored.
        static MnaSystem Assemble(Network n) =>
            MnaSystem.Assemble(n, SolveGroup.Find(n, CaseSpec.Normal).Single(g => g.Supplies.Count > 0), Islands.References(n, []), CaseSpec.Normal);
        var systems = networks.Select(Assemble).ToArray();
        var solutions = networks.Select(n => NetworkSolver.Solve(n, CaseSpec.Normal)).ToArray();
        Report("  of which: assemble the loaded system (parts, references, stamps)", () => { foreach (var n in networks) Assemble(n); });
        Report("  of which: equilibrate and gather the scaled entries", () =>
        {
            foreach (var m in systems)
            {
                var (r, c) = LinearSolver.Equilibrate(m.A);
                SparseRows.Of(m.A, r, c);
            }
        });
        Report("  of which: the linear solve, refactored (equilibration, refactorisation, checks, solve, residual)", () =>
        {
            var kept = new SymbolicFactors();
            foreach (var m in systems) LinearSolver.Solve(m.A, m.B, kept);
        });
        Report("  of which: the linear solve, factored afresh", () => { foreach (var m in systems) LinearSolver.Solve(m.A, m.B); });
        Report("results of a solved case (Results.Compute)", () => { foreach (var x in solutions) Results.Compute(x, null); });

        var letSyntax = Parser.Parse(Documents.TwentySectionsLoadSweep(1000));
        var let = Binder.Bind(letSyntax);
        var axes = Sweeps.Plan(let, new Text.DiagnosticBag());
        var points = Enumerable.Range(0, 1000).Select(k => Sweeps.Point(axes, k)).Select(p => (p.Overrides with { RatedFrequency = let.Frequency }, CaseSpec.ForSweep(p.Labels))).ToArray();
        Console.WriteLine("Let sweep of a load, 1,000 points on twenty sections, µs a point:");
        Report("bind the document in full", () => { foreach (var (o, _) in points) Binder.Bind(letSyntax, o); });
        Report("bind again what the value reaches", () => { foreach (var (o, _) in points) Binder.Rebind(let, o); });
        Report("the point: bound again, updated, results (Rebinding)", () =>
        {
            var r = new Rebinding(letSyntax, let);
            foreach (var (o, spec) in points) r.Solve(o, spec, withFaults: false, default);
        });

        // The brush sweep of SweepBenchmarks: what the whole pipeline does beyond the points.
        var brushText = Documents.TwentySections(1000);
        var brushSyntax = Parser.Parse(brushText);
        var brush = Binder.Bind(brushSyntax);
        var brushAxes = Sweeps.Plan(brush, new Text.DiagnosticBag());
        var brushPoints = Enumerable.Range(0, 1000).Select(k => Sweeps.Point(brushAxes, k)).Select(p => (p.Overrides with { RatedFrequency = brush.Frequency }, CaseSpec.ForSweep(p.Labels), p.Labels)).ToArray();
        var solved = new BrushSweep(brushSyntax, brush);
        var results = brushPoints.Select(p => solved.Solve(p.Item1, p.Item2, default)).ToArray();
        var kept = Sweeps.KeptFor(results[0].Case!);
        Console.WriteLine("Brush sweep, 1,000 points on twenty sections, µs a point:");
        Report("the whole evaluation", () => Workspace.Evaluator.Evaluate(brushText, "twenty.wn"));
        Report("the points: moved, updated, loaded and without loads, both results (BrushSweep)", () =>
        {
            var b = new BrushSweep(brushSyntax, brush);
            foreach (var (o, spec, _) in brushPoints) b.Solve(o, spec, default);
        });
        Report("the results of a point, loaded and without loads (Results.Compute twice)", () =>
        {
            foreach (var r in results) Results.Compute(r.Case!.Solution, r.NoLoad!.Solution);
        });
        Report("the columns: every leaf of a kept point's case, the banded numbers of every point reduced (SweepColumnsBuilder)", () =>
        {
            var c = new SweepColumnsBuilder(kept);
            for (var k = 0; k < results.Length; k++) c.Add(k, brushPoints[k].Labels, results[k].Case!);
        });
        Report("the point's values and name (Sweeps.Point, CaseSpec.ForSweep)", () =>
        {
            for (var k = 0; k < 1000; k++) CaseSpec.ForSweep(Sweeps.Point(brushAxes, k).Labels);
        });
        var baseNetwork = results[0].Case!.Solution.Network;
        Report("the brush moved on the built network (BrushMoves.Move)", () =>
        {
            foreach (var (o, _, _) in brushPoints) BrushMoves.Move(baseNetwork, o.Values);
        });
        Report("the ratings over every point (RatingTally.Observe)", () =>
        {
            var ratings = new RatingTally();
            foreach (var r in results) ratings.Observe(r);
        });
        Report("the checks over every point (CheckTally)", () =>
        {
            var checks = new CheckTally([.. brush.Expects]);
            foreach (var r in results)
            {
                checks.BeginPoint(r.Case!.Case.Where);
                checks.Observe(r.Case!, null);
            }
        });
    }

    private static void Report(string what, Action pass)
    {
        pass();
        var allocated = GC.GetAllocatedBytesForCurrentThread();
        pass();
        // Every pass here is over 1,000 samples or points: KB an item.
        var kb = (GC.GetAllocatedBytesForCurrentThread() - allocated) / 1e6;
        var best = double.MaxValue;
        for (var i = 0; i < 5; i++)
        {
            var clock = Stopwatch.StartNew();
            pass();
            best = Math.Min(best, clock.Elapsed.TotalMilliseconds);
        }
        Console.WriteLine($"  {what}: {best:F1} µs, {kb:F1} KB");
    }
}

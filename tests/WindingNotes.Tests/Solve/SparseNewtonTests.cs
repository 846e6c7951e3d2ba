using System.Numerics;
using System.Text;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Newton's method on the sparse system (the start's factors and a small block of the loads' nodes)
/// against Newton with the dense 2n × 2n real Jacobian it replaced (kept here as the reference):
/// from the same start, the same solution within 1e-9 of its largest unknown, on every part of every
/// example with constant-power or constant-current loads and on a 301-section winding.
/// </summary>
public class SparseNewtonTests
{
    /// <summary>A supply on a winding tapped into 300 sections, a second winding feeding one load: a 301-section part.</summary>
    public static string ThreeHundredOneSections(string load = "power 20 kW pf 0.9")
    {
        var o = new StringBuilder("# a test winding tapped every ten turns\nfrequency 60 Hz\ncore K rating 50 kVA area 200 cm2 flux-limit 1.6 T\n");
        o.Append("winding P on K turns 3000 rated 4160 V from H1 to H2 resistance 2 ohm\n");
        for (var i = 1; i < 300; i++) o.Append($"tap P{i} on P at {i * 10} turns\n");
        o.Append("winding S on K turns 300 rated 416 V from X1 to X2 resistance 0.02 ohm\nimpedance P S 4 % xr 5\n");
        o.Append("supply mains H1 H2 4160 V fault-level 5 kA xr 8\nground H2\nground X2\n");
        o.Append($"load heater X1 X2 {load}\nload lamp P150 H2 current 2 A pf 0.95\n");
        return o.ToString();
    }

    public static TheoryData<string> Files()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").OrderBy(f => f, StringComparer.Ordinal))
            data.Add(Path.GetFileName(file));
        return data;
    }

    [Theory]
    [MemberData(nameof(Files))]
    public void Newton_on_the_sparse_system_equals_the_dense_Jacobian_on_every_example(string name) =>
        AssertSameAsDense(File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "examples", name)).Replace("\r\n", "\n"), name);

    // The dense reference takes seconds on this part (its LU of 1,210 × 1,210 a step).
    [Fact]
    [Trait("Category", "Long")]
    public void Newton_on_the_sparse_system_equals_the_dense_Jacobian_on_301_sections() =>
        Assert.Equal(1, AssertSameAsDense(ThreeHundredOneSections(), "301 sections"));

    [Fact]
    public void Newton_through_the_solver_converges_on_301_sections_to_the_demand()
    {
        var e = Wn.Solved(ThreeHundredOneSections());
        Assert.Equal(301, e.Network!.Sections.Length);
        // A constant-power load draws its 20 kW at pf 0.9 whatever its voltage.
        var heater = e.Normal!.Load("heater");
        Wn.Near(20e3, heater.Power.Real, 1e-9, "heater P");
        Wn.Near(20e3 * Math.Tan(Math.Acos(0.9)), heater.Power.Imaginary, 1e-9, "heater Q");
    }

    /// <summary>Both methods from both starts the solver uses; the number of parts compared.</summary>
    private static int AssertSameAsDense(string text, string what)
    {
        var model = Binder.Bind(Parser.Parse(text));
        if (model.HasErrors) return 0;
        var network = NetworkBuilder.Build(model);
        if (network.Diagnostics.Any(d => d.IsError)) return 0;
        var reference = Islands.References(network, []);
        var compared = 0;
        foreach (var group in SolveGroup.Find(network, CaseSpec.Normal).Where(g => g.Supplies.Count > 0))
        {
            var m = MnaSystem.Assemble(network, group, reference, CaseSpec.Normal);
            if (m.NonlinearLoads.IsEmpty) continue;
            var first = LinearSolver.Solve(m.A, m.B);
            if (first.Status != SolveStatus.Solved) continue;
            // The solver's start: the loads as the admittances that draw their demand at the open-circuit voltage.
            var a = m.A.Clone();
            var stamps = new List<NewtonSolver.Stamp>();
            foreach (var load in m.NonlinearLoads)
            {
                var v = NewtonSolver.Across(load, first.X).Magnitude;
                var y = Complex.Conjugate(load.Exponent == 0 ? load.S0 : load.S0 * (v / load.V0)) / (v * v);
                stamps.Add(new NewtonSolver.Stamp(load.ColumnA, load.ColumnB, y));
                if (load.ColumnA >= 0) { a[load.ColumnA, load.ColumnA] += y; if (load.ColumnB >= 0) a[load.ColumnA, load.ColumnB] -= y; }
                if (load.ColumnB >= 0) { a[load.ColumnB, load.ColumnB] += y; if (load.ColumnA >= 0) a[load.ColumnB, load.ColumnA] -= y; }
            }
            var start = LinearSolver.Solve(a, m.B);
            Assert.Equal(SolveStatus.Solved, start.Status);
            // From the start, with its factors; and from the open-circuit solution with the bare system's.
            foreach (var (factors, held, x0) in new[] { (start.Factors!, stamps, start.X), (first.Factors!, new List<NewtonSolver.Stamp>(), first.X) })
            {
                var sparse = NewtonSolver.Solve(m, factors, held, x0, default);
                var dense = DenseNewton.Solve(m, x0);
                Assert.True(dense.Converged && sparse.Converged, $"{what}: dense {dense.Converged}, sparse {sparse.Converged}");
                var scale = dense.X.Max(v => v.Magnitude);
                for (var i = 0; i < m.Size; i++)
                    Assert.True((dense.X[i] - sparse.X[i]).Magnitude <= 1e-9 * scale, $"{what}: {m.Unknowns[i]} dense {dense.X[i]} sparse {sparse.X[i]}");
            }
            compared++;
        }
        return compared;
    }
}

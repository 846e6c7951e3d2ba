using System.Numerics;
using CsCheck;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The sparse LU against MathNet's dense LU: the same solutions on the systems of random networks
/// (loaded and without loads), the same verdicts and named elements on singular and ill-conditioned
/// ones, exact solves of random sparse matrices and their adjoints, and little fill.
/// </summary>
public class SparseLuTests
{
    /// <summary>The assembled system of every independent part that has a supply.</summary>
    private static List<MnaSystem> Systems(string text, CaseSpec spec)
    {
        var network = NetworkBuilder.Build(Binder.Bind(Parser.Parse(text)));
        var reference = Islands.References(network, []);
        return [.. SolveGroup.Find(network, spec).Where(g => g.Supplies.Count > 0).Select(g => MnaSystem.Assemble(network, g, reference, spec))];
    }

    private static void AssertSame(Complex[] expected, Complex[] actual, string what)
    {
        var scale = expected.Max(v => v.Magnitude);
        for (var i = 0; i < expected.Length; i++)
            Assert.True((expected[i] - actual[i]).Magnitude <= 1e-9 * scale, $"{what}: unknown {i} dense {expected[i]} sparse {actual[i]}");
    }

    [Fact]
    public void Sparse_and_dense_solutions_agree_on_random_networks()
    {
        var large = 0;
        Gen.Int[0, int.MaxValue].Sample(seed =>
        {
            var text = RandomNetworks.Write(seed, maxCores: 16);
            foreach (var spec in new[] { CaseSpec.Normal, CaseSpec.NoLoad })
                foreach (var m in Systems(text, spec))
                {
                    var dense = LinearSolver.Solve(m.A, m.B, sparse: false);
                    var sparse = LinearSolver.Solve(m.A, m.B, sparse: true);
                    Assert.Equal(dense.Status, sparse.Status);
                    if (dense.Status != SolveStatus.Solved) continue;
                    AssertSame(dense.X, sparse.X, $"seed {seed}, {spec.Name}, {m.Size} unknowns");
                    Assert.True(sparse.Residual <= 1e-12, $"seed {seed}: residual {sparse.Residual}");
                    if (m.Size > LinearSolver.SparseAbove) large++;
                }
        }, iter: 30);
        Assert.True(large > 5, $"only {large} systems above the sparse threshold");
    }

    /// <summary>A random sparse n × n matrix, regular by a permuted diagonal (zeros on the diagonal itself make pivoting needed), with up to three more entries a row.</summary>
    internal static SystemMatrix RandomRegular(Random random, int n)
    {
        var a = new SystemMatrix(n);
        var permutation = Enumerable.Range(0, n).OrderBy(_ => random.Next()).ToArray();
        for (var i = 0; i < n; i++)
        {
            a[i, permutation[i]] = new Complex(random.NextDouble() + 1, random.NextDouble());
            for (var e = random.Next(0, 4); e > 0; e--) a[i, random.Next(n)] += new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5);
        }
        return a;
    }

    [Fact]
    public void Random_sparse_matrices_and_their_adjoints_solve_to_rounding()
    {
        Gen.Int[0, int.MaxValue].Sample(seed =>
        {
            var random = new Random(seed);
            var n = random.Next(1, 80);
            var a = RandomRegular(random, n);
            var ones = Enumerable.Repeat(1.0, n).ToArray();
            var m = SparseRows.Of(a, ones, ones);
            var lu = SparseLu.Factor(m);
            var b = Enumerable.Range(0, n).Select(_ => new Complex(random.NextDouble(), random.NextDouble())).ToArray();
            var x = lu.Solve(b);
            var y = lu.SolveAdjoint(b);
            var norm = m.InfinityNorm();
            Assert.True(LinearSolver.RelativeResidual(m.Times(x), x, b, norm) <= 1e-13, $"seed {seed}: A·x = b");
            Assert.True(LinearSolver.RelativeResidual(m.AdjointTimes(y), y, b, norm) <= 1e-13, $"seed {seed}: Aᴴ·y = b");
        }, iter: 200);
    }

    [Theory]
    [InlineData("ideal loop", """
        frequency 50 Hz
        core K rating 1 kVA
        winding A on K turns 100 rated 100 V from A1 to A2
        winding B on K turns 100 rated 100 V from B1 to B2
        supply s A1 A2 100 V
        ground A2
        join A1 B1
        join A2 B2
        load l A1 A2 impedance 10 ohm
        """)]
    [InlineData("supply shorted", """
        frequency 50 Hz
        core Q rating 1 kVA
        winding QA on Q turns 100 rated 100 V from QA1 to QA2
        winding QB on Q turns 10 rated 10 V from QB1 to QB2
        supply bench QA1 QA2 100 V
        ground QA2
        join QB1 QB2
        """)]
    [InlineData("ill-conditioned", """
        frequency 50 Hz
        core L rating 1 kVA
        winding LA on L turns 100 rated 100 V from LA1 to LA2 resistance 1e-8 ohm
        winding LB on L turns 100 rated 100 V from LB1 to LB2 resistance 1e-8 ohm
        supply rig LA1 LA2 100 V
        ground LA2
        join LA1 LB1
        join LA2 LB2
        """)]
    public void Singular_and_ill_conditioned_systems_name_the_same_elements(string what, string text)
    {
        var m = Assert.Single(Systems(text, CaseSpec.Normal));
        var dense = LinearSolver.Solve(m.A, m.B, sparse: false);
        var sparse = LinearSolver.Solve(m.A, m.B, sparse: true);
        Assert.NotEqual(SolveStatus.Solved, dense.Status);
        Assert.Equal(dense.Status, sparse.Status);
        Assert.Equal(dense.NullUnknowns, sparse.NullUnknowns);
        Assert.Equal(dense.NullEquations, sparse.NullEquations);
        if (dense.Status == SolveStatus.IllConditioned)
            Assert.True(Math.Abs(sparse.Condition / dense.Condition - 1) < 0.02, $"{what}: condition {sparse.Condition} against {dense.Condition}");
    }

    [Fact]
    public void A_chain_of_units_factors_with_little_fill()
    {
        var text = RandomNetworks.Write(7, maxCores: 60);
        var m = Systems(text, CaseSpec.Normal).MaxBy(s => s.Size)!;
        var (rows, columns) = LinearSolver.Equilibrate(m.A);
        var a = SparseRows.Of(m.A, rows, columns);
        var lu = SparseLu.Factor(a);
        Assert.True(m.Size > 100, $"{m.Size} unknowns");
        Assert.True(lu.Entries <= 3 * a.Value.Length, $"{lu.Entries} entries in L and U for {a.Value.Length} in A");
    }
}

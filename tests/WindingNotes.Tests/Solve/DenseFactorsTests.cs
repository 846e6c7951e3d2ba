using System.Numerics;
using CsCheck;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The dense factors' residual, taken on the system's own rows, is the number MathNet's dense product
/// and infinity norm of the equilibrated matrix give, to the last bit: it decides an ill-conditioned
/// verdict and is printed in its message. Held on every part of every example (loaded and without
/// loads), on random networks, and on random matrices with entries of very different sizes.
/// </summary>
public class DenseFactorsTests
{
    private static void AssertSameResidual(SystemMatrix a, Complex[] b, string what)
    {
        var (rows, columns) = LinearSolver.Equilibrate(a);
        var rhs = b.Select((v, i) => v * rows[i]).ToArray();
        var factors = DenseFactors.Of(a, rows, columns);
        var y = factors.Solve(rhs);
        // Another x as well: a residual well away from zero, where every bit of the sums shows.
        var rough = y.Select((v, i) => v * (1 + 1e-3 * (i % 7)) + new Complex(1e-6 * i, 0)).ToArray();
        foreach (var x in new[] { y, rough })
        {
            var expected = factors.DenseResidual(x, rhs);
            var actual = factors.RelativeResidual(x, rhs);
            Assert.True(BitConverter.DoubleToInt64Bits(expected) == BitConverter.DoubleToInt64Bits(actual), $"{what}: dense {expected:R}, by rows {actual:R}");
        }
    }

    private static IEnumerable<MnaSystem> Systems(string text)
    {
        var model = Binder.Bind(Parser.Parse(text));
        if (model.HasErrors || model.Supplies.IsEmpty) yield break;
        var network = NetworkBuilder.Build(model);
        if (network.Diagnostics.Any(d => d.IsError)) yield break;
        var reference = Islands.References(network, []);
        foreach (var spec in new[] { CaseSpec.Normal, CaseSpec.NoLoad })
            foreach (var g in SolveGroup.Find(network, spec).Where(g => g.Supplies.Count > 0))
                yield return MnaSystem.Assemble(network, g, reference, spec);
    }

    [Fact]
    public void The_residual_by_rows_is_the_dense_products_on_every_examples_parts()
    {
        var count = 0;
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").Order())
            foreach (var m in Systems(File.ReadAllText(file)))
            {
                AssertSameResidual(m.A, m.B.ToArray(), $"{Path.GetFileName(file)}, {m.Size} unknowns");
                count++;
            }
        Assert.True(count > 20, $"only {count} parts");
    }

    [Fact]
    public void The_residual_by_rows_is_the_dense_products_on_random_networks() =>
        Gen.Int[0, int.MaxValue].Sample(seed =>
        {
            foreach (var m in Systems(RandomNetworks.Write(seed, maxCores: 4)))
                AssertSameResidual(m.A, m.B.ToArray(), $"seed {seed}, {m.Size} unknowns");
        }, iter: 30);

    [Fact]
    public void The_residual_by_rows_is_the_dense_products_on_random_matrices()
    {
        var random = new Random(20261205);
        for (var round = 0; round < 200; round++)
        {
            var n = random.Next(1, LinearSolver.SparseAbove + 1);
            var a = SparseLuTests.RandomRegular(random, n);
            // Entries from 1e-6 to 1e6 times what the random matrix holds, some set to zero (kept as entries).
            for (var i = 0; i < n; i++)
                foreach (var c in a.Columns(i).ToArray())
                    a[i, c] = random.Next(9) == 0 ? Complex.Zero : a[i, c] * Math.Pow(10, random.Next(-6, 7));
            var b = Enumerable.Range(0, n).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
            AssertSameResidual(a, b, $"round {round}, {n} unknowns");
        }
    }
}

using System.Numerics;
using CsCheck;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The numerical refactorisation on a kept pivot order (<see cref="SparseLu.Refactor"/>,
/// <see cref="SymbolicFactors"/>) against a fresh factorisation of the same matrix: the same solution
/// within 1e-9 of its largest unknown wherever the refactorisation passes its pivot check, and a
/// fresh factorisation (the same answer) wherever it fails it.
/// </summary>
public class RefactorTests
{
    private static void AssertSame(Complex[] expected, Complex[] actual, string what)
    {
        var scale = expected.Max(v => v.Magnitude);
        for (var i = 0; i < expected.Length; i++)
            Assert.True((expected[i] - actual[i]).Magnitude <= 1e-9 * scale, $"{what}: unknown {i} fresh {expected[i]} refactored {actual[i]}");
    }

    /// <summary>
    /// The same pattern as <paramref name="a"/> with every value moved by up to 5 % of itself, or
    /// with <paramref name="decades"/>, scaled by anything down to a millionth.
    /// </summary>
    private static SparseRows Moved(SparseRows a, Random random, bool decades) =>
        new(a.Size, a.Start, a.Column, [.. a.Value.Select(v => decades
            ? v * Math.Pow(10, -6 * random.NextDouble())
            : v * new Complex(1 + 0.05 * (2 * random.NextDouble() - 1), 0.05 * (2 * random.NextDouble() - 1)))]);

    [Fact]
    public void Refactorisations_of_random_sparse_matrices_solve_as_fresh_ones_or_fall_back()
    {
        var (refactored, fellBack) = (0, 0);
        Gen.Int[0, int.MaxValue].Sample(seed =>
        {
            var random = new Random(seed);
            var n = random.Next(2, 80);
            var a = SparseLuTests.RandomRegular(random, n);
            var ones = Enumerable.Repeat(1.0, n).ToArray();
            var m = SparseRows.Of(a, ones, ones);
            var kept = new SymbolicFactors();
            kept.Factor(m);
            var b = Enumerable.Range(0, n).Select(_ => new Complex(random.NextDouble(), random.NextDouble())).ToArray();
            // Small moves keep the pivots good; values moved by decades sometimes do not.
            foreach (var decades in new[] { false, true })
            {
                var moved = Moved(m, random, decades);
                var x = kept.Factor(moved).Lu.Solve(b);
                AssertSame(SparseLu.Factor(moved).Solve(b), x, $"seed {seed}, {(decades ? "by decades" : "by 5 %")}");
                Assert.True(LinearSolver.RelativeResidual(moved.Times(x), x, b, moved.InfinityNorm()) <= 1e-12, $"seed {seed}: residual");
            }
            refactored += kept.Refactored;
            fellBack += kept.FellBack;
        }, iter: 200);
        Assert.True(refactored > 100, $"{refactored} refactorisations");
        Assert.True(fellBack > 0, $"{fellBack} fell back");
    }

    [Fact]
    public void A_pivot_that_falls_below_a_thousandth_of_its_column_fails_the_check()
    {
        // Markowitz finds every entry of a full 2 × 2 of equal cost, (2 − 1)·(2 − 1), and takes the
        // largest: 4 at (0, 0). With 0.01 there row 1's multiplier is 1 / 0.01 = 100, within the
        // refactorisation's 1 / 0.001; with 1e-4 it is 10,000, beyond it: a fresh factorisation.
        static SparseRows Of(Complex corner) => new(2, [0, 2, 4], [0, 1, 0, 1], [corner, 1, 1, 4]);
        var lu = SparseLu.Factor(Of(4));
        Assert.NotNull(lu.Refactor(Of(0.01)));
        Assert.Null(lu.Refactor(Of(1e-4)));
        Assert.Null(lu.Refactor(Of(0)));
        var kept = new SymbolicFactors();
        kept.Factor(Of(4));
        Complex[] b = [1, 2];
        // By hand: [[1e-4, 1], [1, 4]]·x = [1, 2]: x1 = 1 − 1e-4·x0, x0 + 4·(1 − 1e-4·x0) = 2, x0 = −2 / 0.9996.
        var (factors, refactored) = kept.Factor(Of(1e-4));
        var x = factors.Solve(b);
        Assert.False(refactored);
        Assert.Equal(1, kept.FellBack);
        Assert.Equal(-2 / 0.9996, x[0].Real, 12);
        Assert.Equal(1 + 2e-4 / 0.9996, x[1].Real, 12);
    }

    [Fact]
    public void Another_pattern_is_factored_afresh()
    {
        var lu = SparseLu.Factor(new SparseRows(2, [0, 2, 4], [0, 1, 0, 1], [4, 1, 1, 4]));
        // A diagonal: the entry (0, 1) gone, (1, 0) too; the pattern is a subset, which the refactorisation takes.
        Assert.NotNull(lu.Refactor(new SparseRows(2, [0, 1, 2], [0, 1], [4, 4])));
        var diagonal = SparseLu.Factor(new SparseRows(2, [0, 1, 2], [0, 1], [4, 4]));
        // Entries the kept factors never had: refused.
        Assert.Null(diagonal.Refactor(new SparseRows(2, [0, 2, 4], [0, 1, 0, 1], [4, 1, 1, 4])));
    }

    /// <summary>
    /// The twenty sections' system (42 unknowns, above the sparse threshold) solved through kept
    /// factorisations: another load refactors; an entry shrunk until the kept pivots fail the check
    /// falls back; both equal the full solve within 1e-9.
    /// </summary>
    [Fact]
    public void A_networks_system_refactors_and_falls_back_to_the_full_solve()
    {
        static MnaSystem System(string text)
        {
            var network = NetworkBuilder.Build(Binder.Bind(Parser.Parse(text)));
            var group = SolveGroup.Find(network, CaseSpec.Normal).Single(g => g.Supplies.Count > 0);
            return MnaSystem.Assemble(network, group, Islands.References(network, []), CaseSpec.Normal);
        }
        var text = BrushSweepTests.TwentySections(sweep: "");
        var first = System(text);
        Assert.True(first.Size > LinearSolver.SparseAbove, $"{first.Size} unknowns");
        var kept = new SymbolicFactors();
        AssertSame(LinearSolver.Solve(first.A, first.B).X, LinearSolver.Solve(first.A, first.B, kept).X, "first");
        var other = System(text.Replace("load heater BR A impedance 20 ohm", "load heater BR A impedance 7 ohm"));
        AssertSame(LinearSolver.Solve(other.A, other.B).X, LinearSolver.Solve(other.A, other.B, kept).X, "another load");
        Assert.Equal((1, 0), (kept.Refactored, kept.FellBack));

        var fellBack = 0;
        for (var row = 0; row < first.Size && fellBack == 0; row++)
            foreach (var column in first.A.Columns(row).ToArray())
            {
                var a = first.A.Clone();
                a[row, column] *= 1e-7;
                if (a[row, column] == Complex.Zero) continue;
                var before = kept.FellBack;
                var solved = LinearSolver.Solve(a, first.B, kept);
                var full = LinearSolver.Solve(a, first.B);
                // A shrunk entry can leave the system ill-conditioned, where the verdict rests on the pivots' spread: only solved systems compare.
                if (full.Status != SolveStatus.Solved || solved.Status != SolveStatus.Solved) continue;
                AssertSame(full.X, solved.X, $"entry ({row}, {column}) shrunk");
                if (kept.FellBack > before) { fellBack++; break; }
            }
        Assert.True(fellBack > 0, "no entry's shrinking failed the pivot check");
    }
}

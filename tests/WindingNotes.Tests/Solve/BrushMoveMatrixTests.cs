using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Text;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A moved brush's core matrix is computed again only in the rows and columns of the sections whose
/// turns changed (<see cref="SectionCoupling.Matrix(IReadOnlyList{double}, System.Numerics.Complex[,], bool[])"/>):
/// at every point of the brush sweeps of <see cref="BrushSweepTests"/> it is the whole matrix of the
/// moved turns, bit for bit.
/// </summary>
public class BrushMoveMatrixTests
{
    [Theory]
    [MemberData(nameof(BrushSweepTests.Networks), MemberType = typeof(BrushSweepTests))]
    public void A_moved_cores_matrix_is_the_whole_matrix_of_its_turns(string what, string text)
    {
        var syntax = Parser.Parse(text);
        var model = Binder.Bind(syntax);
        var axes = Sweeps.Plan(model, new DiagnosticBag());
        var first = NetworkBuilder.Build(Binder.Bind(syntax, Sweeps.Point(axes, 0).Overrides));
        var moved = 0;
        for (long k = 1; k < Sweeps.Count(axes); k++)
        {
            if (BrushMoves.Move(first, Sweeps.Point(axes, k).Overrides.Values) is not { } network) continue;
            foreach (var core in network.Cores)
            {
                if (core.Coupling is not { } coupling) continue;
                var whole = coupling.Matrix([.. core.Sections.Select(s => network.Sections[s].Turns)]);
                for (var p = 0; p < whole.GetLength(0); p++)
                    for (var q = 0; q < whole.GetLength(1); q++)
                        Assert.True(BitConverter.DoubleToInt64Bits(whole[p, q].Real) == BitConverter.DoubleToInt64Bits(core.Impedance[p, q].Real)
                            && BitConverter.DoubleToInt64Bits(whole[p, q].Imaginary) == BitConverter.DoubleToInt64Bits(core.Impedance[p, q].Imaginary), $"{what}, point {k}: [{p}, {q}]");
            }
            moved++;
        }
        // The test bites: most points move the brush without the builder.
        Assert.True(moved > 0, what);
    }
}

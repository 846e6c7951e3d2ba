using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Model;

/// <summary>
/// The N-winding leakage model against REFERENCES.md rows R7–R9: the star equivalent, the
/// short-circuit tests it must give back, and the bordered admittance matrix.
/// </summary>
public class LeakageReferenceTests
{
    // R7 data: 66/13.2/2.3 kV, 15/10/5 MVA; Z_ps = 7 %, Z_pt = 9 % on 15 MVA; Z_st = 8 % on 10 MVA.
    private const string ThreeWinding = """
        frequency 60 Hz
        core K rating 15 MVA
        winding P on K rated 66 kV from P1 to P2
        winding S on K rated 13.2 kV rating 10 MVA from S1 to S2
        winding T on K rated 2.3 kV rating 5 MVA from T1 to T2
        impedance P S 7 %
        impedance P T 9 %
        impedance S T 8 % base 10 MVA
        """;

    private static readonly (string, string) P = ("P1", "P2"), S = ("S1", "S2"), T = ("T1", "T2");

    private static Complex PerUnit(Complex ohms, double kv) => ohms / (kv * kv * 1e6 / 15e6);

    [Fact]
    public void R7_star_equivalent_of_the_three_winding_unit()
    {
        // Grainger and Stevenson, Power System Analysis, three-winding example (from memory):
        // Zp = j0.02, Zs = j0.05, Zt = j0.07 pu on 15 MVA. With P the reference, the per-turn matrix
        // holds Zp off the diagonal and Zp + Zs, Zp + Zt on it.
        var z = PerTurnPerUnit(ThreeWinding, 15e6);
        Wn.Near(0.02, z[0, 1].Imaginary, 0.01, "Zp");
        Wn.Near(0.05, (z[0, 0] - z[0, 1]).Imaginary, 0.01, "Zs");
        Wn.Near(0.07, (z[1, 1] - z[0, 1]).Imaginary, 0.01, "Zt");
    }

    [Fact]
    public void R8_every_simulated_short_circuit_test_gives_back_its_impedance()
    {
        // Brandwajn, Dommel and Dommel, "Matrix representation of three-phase N-winding transformers
        // for steady-state and transient studies", IEEE Trans. PAS-101(6), 1982 (from memory):
        // j0.07, j0.09 and j0.12 pu on 15 MVA, exact to 1e-9.
        ShortCircuit.Near(new Complex(0, 0.07), PerUnit(ShortCircuit.Impedance(ThreeWinding, P, S, 66e3), 66), 1e-9, "P-S");
        ShortCircuit.Near(new Complex(0, 0.09), PerUnit(ShortCircuit.Impedance(ThreeWinding, P, T, 66e3), 66), 1e-9, "P-T");
        ShortCircuit.Near(new Complex(0, 0.12), PerUnit(ShortCircuit.Impedance(ThreeWinding, S, T, 13.2e3), 13.2), 1e-9, "S-T");
        // Seen from the other side the same tests give the same per-unit values.
        ShortCircuit.Near(new Complex(0, 0.07), PerUnit(ShortCircuit.Impedance(ThreeWinding, S, P, 13.2e3), 13.2), 1e-9, "S-P");
        ShortCircuit.Near(new Complex(0, 0.12), PerUnit(ShortCircuit.Impedance(ThreeWinding, T, S, 2.3e3), 2.3), 1e-9, "T-S");
    }

    [Fact]
    public void R9_reduced_impedance_matrix_inverted_and_bordered()
    {
        // Same paper (from memory), numbers recomputed: Y_red = Z_red⁻¹, bordered so that rows and
        // columns sum to zero: [[−j20.339, j11.864, j8.475], [j11.864, −j15.254, j3.390], [j8.475, j3.390, −j11.864]].
        var z = PerTurnPerUnit(ThreeWinding, 15e6);
        var reduced = Matrix<Complex>.Build.DenseOfArray(z).Inverse();
        var y = new Complex[3, 3];
        for (var i = 0; i < 2; i++)
            for (var k = 0; k < 2; k++)
                y[i + 1, k + 1] = reduced[i, k];
        for (var i = 1; i < 3; i++) y[0, i] = y[i, 0] = -(y[i, 1] + y[i, 2]);
        y[0, 0] = -(y[0, 1] + y[0, 2]);
        double[,] expected = { { -20.339, 11.864, 8.475 }, { 11.864, -15.254, 3.390 }, { 8.475, 3.390, -11.864 } };
        for (var i = 0; i < 3; i++)
            for (var k = 0; k < 3; k++)
            {
                Assert.Equal(0, y[i, k].Real, 9);
                Assert.True(Math.Abs(y[i, k].Imaginary - expected[i, k]) <= 6e-4, $"Y[{i}][{k}] = {y[i, k]}");
            }
    }

    /// <summary>
    /// The per-turn matrix of the secondaries (P, the first winding, is the reference) in per unit on
    /// <paramref name="rating"/>, read back from the section matrix: Z̃ = Z/(N_i·N_k) over the base of one turn.
    /// </summary>
    private static Complex[,] PerTurnPerUnit(string text, double rating)
    {
        var e = Wn.Solved(text + "\nsupply s P1 P2 66 kV\nground P2\n");
        var network = e.Network!;
        var core = network.Cores[0];
        Assert.Equal(3, core.Sections.Length);
        var perTurn = network.Windings[0].RatedVoltage!.Value / network.Windings[0].Turns;
        var z = new Complex[2, 2];
        for (var i = 0; i < 2; i++)
            for (var k = 0; k < 2; k++)
            {
                var (a, b) = (network.Sections[core.Sections[i + 1]], network.Sections[core.Sections[k + 1]]);
                z[i, k] = core.Impedance[i + 1, k + 1] / (a.Turns * b.Turns) * rating / (perTurn * perTurn);
            }
        Assert.Equal(Complex.Zero, core.Impedance[0, 0]);
        return z;
    }
}

using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>
/// The leakage of the windings on one core, from their pairwise short-circuit impedances, by the
/// N-winding matrix method (Brandwajn, Dommel and Dommel, IEEE Trans. PAS-101(6), 1982) in per-turn
/// form: with winding 0 as reference, Z̃[i][i] = z_0i and Z̃[i][k] = (z_0i + z_0k − z_ik)/2, where z_ik is
/// the pair's impedance referred to one turn. A section k of winding w(k) then sees
/// V = N_k·e + Σ_j N_k·N_j·Z̃[w(k)][w(j)]·I_j, so taps and sections take part like windings.
/// Pairs not given are ideally coupled (z = 0).
/// </summary>
internal static class Leakage
{
    public static Complex[,] PerTurnMatrix(Model model, CoreModel core, List<WindingNet> onCore, DiagnosticBag diagnostics, out double[] extraResistance)
    {
        var m = onCore.Count;
        var x = new double[m, m];
        var pairResistance = new List<(int I, int K, double R)>();
        var seen = new Dictionary<(int, int), ImpedanceModel>();
        var index = onCore.Select((w, i) => (w.Name, i)).ToDictionary(p => p.Name, p => p.i);
        foreach (var line in model.Impedances)
        {
            if (!index.TryGetValue(line.First.Winding, out var i)) continue;
            if (!index.TryGetValue(line.Second.Winding, out var k))
            {
                if (model.Windings.Any(w => w.Name == line.Second.Winding))
                    diagnostics.ReportDifferentCores(line.Second.Span, line.First.Winding, line.Second.Winding);
                continue;
            }
            if (line.First.From is not null || line.Second.From is not null)
            {
                diagnostics.ReportNotEvaluated(line.First.Span, "leakage between sections");
                continue;
            }
            if (i == k)
            {
                diagnostics.ReportSameWinding(line.Second.Span);
                continue;
            }
            var key = (Math.Min(i, k), Math.Max(i, k));
            if (seen.TryGetValue(key, out var first))
            {
                diagnostics.ReportDuplicatePair(line.ValueSpan, line.First.Winding, line.Second.Winding, first.Line);
                continue;
            }
            seen[key] = line;
            if (Referred(line, core, onCore[i], onCore[k], diagnostics) is not { } z) continue;
            var n2 = onCore[i].Turns * onCore[i].Turns;
            x[i, k] = x[k, i] = z.Imaginary / n2;
            pairResistance.Add((i, k, z.Real / n2));
        }

        extraResistance = ShareResistances(onCore, pairResistance);
        var result = new Complex[m, m];
        for (var i = 1; i < m; i++)
            for (var k = 1; k < m; k++)
                result[i, k] = new Complex(0, i == k ? x[0, i] : (x[0, i] + x[0, k] - x[i, k]) / 2);
        return result;
    }

    /// <summary>
    /// The pair's R + jX in ohms referred to the first winding. Where both windings state their
    /// resistances those give R; the line then gives the reactance.
    /// </summary>
    private static Complex? Referred(ImpedanceModel line, CoreModel core, WindingNet a, WindingNet b, DiagnosticBag diagnostics)
    {
        var value = line.Value;
        if (line.PerUnit)
        {
            if (core.Rating is not { } s || a.RatedVoltage is not { } v)
            {
                diagnostics.ReportPercentNeedsRating(line.ValueSpan, core.Name);
                return null;
            }
            value *= v * v / s;
        }
        var ratio = a.Turns / b.Turns;
        var fromWindings = a.Resistance + b.Resistance * ratio * ratio;
        var windingsGiveR = a.Resistance > 0 && b.Resistance > 0;
        double r, reactance;
        if (value.Imaginary != 0 || line.XR is not null)
        {
            (r, reactance) = value.Imaginary != 0 ? (value.Real, value.Imaginary) : SplitByXR(value.Magnitude, line.XR!.Value);
            if (windingsGiveR && Math.Abs(r - fromWindings) > 0.1 * fromWindings)
                diagnostics.ReportResistanceMismatch(line.ValueSpan, r, fromWindings);
        }
        else if (windingsGiveR)
        {
            if (fromWindings >= value.Magnitude)
            {
                diagnostics.ReportResistanceExceedsImpedance(line.ValueSpan, fromWindings, value.Magnitude);
                return null;
            }
            (r, reactance) = (fromWindings, Math.Sqrt(value.Magnitude * value.Magnitude - fromWindings * fromWindings));
        }
        else (r, reactance) = (0, value.Magnitude);
        // The windings' own resistances stand on their own; the pair's R goes to the windings that state none.
        return new Complex(windingsGiveR ? 0 : r, reactance);
    }

    private static (double R, double X) SplitByXR(double magnitude, double xr)
    {
        var r = magnitude / Math.Sqrt(1 + xr * xr);
        return (r, r * xr);
    }

    /// <summary>
    /// Per-turn resistances of windings that state none, from r_i + r_k = r_ik over the given pairs:
    /// the least-squares solution of least norm, so two windings share a pair's resistance equally
    /// (common practice) and three give the star values.
    /// </summary>
    private static double[] ShareResistances(List<WindingNet> onCore, List<(int I, int K, double R)> pairs)
    {
        var result = new double[onCore.Count];
        var unknown = Enumerable.Range(0, onCore.Count).Where(i => onCore[i].Resistance == 0).ToList();
        var rows = pairs.Where(p => p.R != 0 && (unknown.Contains(p.I) || unknown.Contains(p.K))).ToList();
        if (rows.Count == 0 || unknown.Count == 0) return result;
        var a = Matrix<double>.Build.Dense(rows.Count, unknown.Count);
        var b = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(rows.Count);
        for (var r = 0; r < rows.Count; r++)
        {
            var (i, k, value) = rows[r];
            b[r] = value;
            foreach (var w in new[] { i, k })
            {
                var u = unknown.IndexOf(w);
                if (u >= 0) a[r, u] = 1;
                else b[r] -= onCore[w].Resistance / (onCore[w].Turns * onCore[w].Turns);
            }
        }
        var solution = a.PseudoInverse() * b;
        for (var u = 0; u < unknown.Count; u++) result[unknown[u]] = solution[u];
        return result;
    }
}

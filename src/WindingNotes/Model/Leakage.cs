using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>
/// The impedance matrix among the sections of one core: their resistances and the leakage built
/// from the pairwise short-circuit impedances by the N-winding matrix method (Brandwajn, Dommel and
/// Dommel, IEEE Trans. PAS-101(6), 1982) in per-turn form.
/// <para>
/// <b>Members.</b> The operands of the impedance lines are the leakage members: a whole winding, or a
/// run of its sections between two of its points (<c>HV:H1-T60</c>). Members of one winding must not
/// overlap. Sections that no line names form members of their own, one for each unbroken stretch of a
/// winding. Every section inherits the per-turn row of its member, so the sections of one member are
/// ideally coupled to each other and a tapped winding without section data acts as one winding.
/// </para>
/// <para>
/// <b>Pairs.</b> Each line gives z_ab, the pair's impedance referred to one turn of the first member
/// (ohms referred to it over its turns squared). Members' own resistances stand in series: stated
/// (from the winding, split by turns) or, where none is stated, shared out of the pairs' resistances
/// by a least-norm, non-negative least-squares fit of r_a + r_b = Re z_ab (two members share a pair's
/// resistance equally when referred to one side, common practice). What the series resistances cannot
/// carry, ζ_ab = z_ab − r_a − r_b (the reactance, and any residue of the fit), goes into the leakage
/// matrix, so the simulated short-circuit test of every given pair gives back z_ab exactly. Pairs not
/// given are ideally coupled: ζ = 0.
/// </para>
/// <para>
/// <b>Matrix.</b> With member 0 the reference, Z̃[i][i] = ζ_0i and Z̃[i][k] = (ζ_0i + ζ_0k − ζ_ik)/2, row
/// and column 0 zero; negative star branches are simply numbers here. Section p of member m(p) then
/// sees V_p = N_p·e + Σ_q N_p·N_q·Z̃[m(p)][m(q)]·I_q + R_p·I_p. With an ideal core (Σ N·I = 0) the
/// choice of reference changes nothing; with a magnetising branch it sits behind the reference's
/// leakage, so the member that holds the open-circuit test winding is the reference and that test is
/// reproduced exactly.
/// </para>
/// </summary>
internal static class Leakage
{
    /// <summary>A member: sections First..Last (positions in the core's section list) of one winding, named at Span.</summary>
    private sealed record Member(string Name, WindingNet Winding, int First, int Last, double Turns, TextSpan Span)
    {
        public double? RatedVoltage => Winding.RatedVoltage * Turns / Winding.Turns;

        /// <summary>The stated resistance per turn squared, when the winding states one.</summary>
        public double? StatedPerTurn => Winding.Resistance > 0 && Turns > 0 ? Winding.Resistance / (Winding.Turns * Turns) : null;
    }

    /// <summary>A given pair: the pair resistance per turn squared (when known) and reactance per turn.</summary>
    private readonly record struct Pair(int A, int B, double R, double X, bool FitsResistance);

    /// <summary>The matrix over <paramref name="sections"/> (the core's, winding by winding), in ohms, as a function of their turns.</summary>
    /// <param name="lines">The impedance lines whose first member is a winding of this core (the builder sorts them out once for all cores).</param>
    /// <param name="reference">The winding of the core's open-circuit test, if any.</param>
    public static SectionCoupling SectionMatrix(Model model, int coreIndex, IReadOnlyList<Section> sections, IReadOnlyList<WindingNet> windings,
        IEnumerable<ImpedanceModel> lines, string? reference, DiagnosticBag diagnostics) =>
        new CoreLeakage(model, coreIndex, sections, windings, lines, diagnostics).Build(reference);

    private sealed class CoreLeakage(Model model, int coreIndex, IReadOnlyList<Section> sections, IReadOnlyList<WindingNet> windings,
        IEnumerable<ImpedanceModel> lines, DiagnosticBag diagnostics)
    {
        // The core's windings by name, from its sections: a file of many cores must not search them all for each.
        private readonly Dictionary<string, WindingNet> onCore = sections.Select(s => windings[s.Winding]).DistinctBy(w => w.Name).ToDictionary(w => w.Name, StringComparer.Ordinal);

        private readonly CoreModel core = model.Cores[coreIndex];
        private readonly List<Member> members = [];
        private readonly int[] memberOf = Enumerable.Repeat(-1, sections.Count).ToArray();
        private readonly List<Pair> pairs = [];

        public SectionCoupling Build(string? reference)
        {
            var seen = new Dictionary<(int, int), ImpedanceModel>();
            foreach (var line in lines)
            {
                if (OnCore(line.First.Winding) is null) continue;
                if (OnCore(line.Second.Winding) is null)
                {
                    if (model.Windings.Any(w => w.Name == line.Second.Winding))
                        diagnostics.ReportDifferentCores(line.Second.Span, line.First.Winding, line.Second.Winding);
                    continue;
                }
                if (Run(line.First) is not { } a || Run(line.Second) is not { } b) continue;
                if (a.Winding == b.Winding && a.First <= b.Last && b.First <= a.Last)
                {
                    if (a.First == b.First && a.Last == b.Last) diagnostics.ReportSameWinding(line.Second.Span);
                    else diagnostics.ReportLeakageOverlap(line.Second.Span, line.Second.ToString(), line.First.ToString(), line.First.Span);
                    continue;
                }
                if (!Free(a, line.First) || !Free(b, line.Second)) continue;
                var (i, k) = (Add(a, line.First), Add(b, line.Second));
                var key = (Math.Min(i, k), Math.Max(i, k));
                if (seen.TryGetValue(key, out var first))
                {
                    diagnostics.ReportDuplicatePair(line.ValueSpan, members[i].Name, members[k].Name, first.Line);
                    continue;
                }
                seen[key] = line;
                if (PairOf(line, i, k) is { } pair) pairs.Add(pair);
            }
            AddUnnamedStretches();
            ReportMissingPairs(seen.Keys);

            var series = SeriesResistances();
            var tested = Enumerable.Range(0, sections.Count).FirstOrDefault(p => windings[sections[p].Winding].Name == reference);
            var perTurn = PerTurnMatrix(series, sections.Count > 0 ? memberOf[tested] : 0);

            return new SectionCoupling([.. memberOf], perTurn, [.. members.Select((m, i) => series[i] * m.Turns)]);
        }

        private WindingNet? OnCore(string name) => onCore.GetValueOrDefault(name);

        /// <summary>The winding's sections as positions First..Last in the core's list, or null when a point is off the winding.</summary>
        private (WindingNet Winding, int First, int Last)? Run(WindingPart part)
        {
            var w = OnCore(part.Winding)!;
            var start = Enumerable.Range(0, sections.Count).First(p => sections[p].Winding == w.Index);
            var end = Enumerable.Range(0, sections.Count).Last(p => sections[p].Winding == w.Index);
            if (part.From is null) return (w, start, end);
            // Points along the winding: the from end, then the far end of each section.
            var points = new List<string> { sections[start].FromPoint };
            for (var p = start; p <= end; p++) points.Add(sections[p].ToPoint);
            var (a, b) = (points.IndexOf(part.From), points.IndexOf(part.To!));
            // A point missing here is a tap off the winding, reported where it is defined.
            if (a < 0 || b < 0) return null;
            var (lo, hi) = (Math.Min(a, b), Math.Max(a, b));
            if (lo == hi || Enumerable.Range(start + lo, hi - lo).Sum(p => sections[p].Turns) <= 0)
            {
                diagnostics.ReportOutOfBounds(part.Span, $"'{part}'", "a part of at least one turn");
                return null;
            }
            return (w, start + lo, start + hi - 1);
        }

        /// <summary>False (after a diagnostic) when the run overlaps a member other than itself.</summary>
        private bool Free((WindingNet Winding, int First, int Last) run, WindingPart part)
        {
            foreach (var m in members)
            {
                if (m.Winding != run.Winding || m.Last < run.First || run.Last < m.First) continue;
                if (m.First == run.First && m.Last == run.Last) return true;
                diagnostics.ReportLeakageOverlap(part.Span, part.ToString(), m.Name, m.Span);
                return false;
            }
            return true;
        }

        private int Add((WindingNet Winding, int First, int Last) run, WindingPart part) =>
            memberOf[run.First] >= 0 ? memberOf[run.First] : AddMember(part.ToString(), run.Winding, run.First, run.Last, part.Span);

        private int AddMember(string name, WindingNet winding, int first, int last, TextSpan line)
        {
            var turns = 0.0;
            for (var p = first; p <= last; p++)
            {
                memberOf[p] = members.Count;
                turns += sections[p].Turns;
            }
            members.Add(new Member(name, winding, first, last, turns, line));
            return members.Count - 1;
        }

        /// <summary>Each unbroken stretch of sections that no line names is a member with no data.</summary>
        private void AddUnnamedStretches()
        {
            for (var p = 0; p < sections.Count; p++)
            {
                if (memberOf[p] >= 0) continue;
                var last = p;
                while (last + 1 < sections.Count && memberOf[last + 1] < 0 && sections[last + 1].Winding == sections[p].Winding) last++;
                var w = windings[sections[p].Winding];
                var whole = (p == 0 || sections[p - 1].Winding != w.Index) && (last + 1 == sections.Count || sections[last + 1].Winding != w.Index);
                AddMember(whole ? w.Name : $"{w.Name}:{sections[p].FromPoint}-{sections[last].ToPoint}", w, p, last, w.Source.NameSpan);
                p = last;
            }
        }

        /// <summary>Where a core has leakage data, the pairs it lacks are said once: they are taken as ideally coupled.</summary>
        private void ReportMissingPairs(ICollection<(int, int)> given)
        {
            if (given.Count == 0) return;
            var missing = new List<string>();
            for (var i = 0; i < members.Count; i++)
                for (var k = i + 1; k < members.Count; k++)
                    if (members[i].Turns > 0 && members[k].Turns > 0 && !given.Contains((i, k)))
                        missing.Add($"'{members[i].Name}' with '{members[k].Name}'");
            if (missing.Count > 0) diagnostics.ReportLeakageMissing(core.NameSpan, missing);
        }

        /// <summary>
        /// The pair as per-turn values: R from the windings where both state it, else from the line
        /// when it gives one (complex, or with X/R); a bare magnitude gives the reactance that is left
        /// beside the stated resistances.
        /// </summary>
        private Pair? PairOf(ImpedanceModel line, int i, int k)
        {
            var (a, b) = (members[i], members[k]);
            var value = line.Value;
            if (line.PerUnit)
            {
                if ((line.Base ?? core.Rating) is not { } s || a.RatedVoltage is not { } v)
                {
                    diagnostics.ReportPercentNeedsRating(line.ValueSpan, core.Name);
                    return null;
                }
                value *= v * v / s;
            }
            var n2 = a.Turns * a.Turns;
            var z = value / n2;
            var stated = (a.StatedPerTurn ?? 0) + (b.StatedPerTurn ?? 0);
            var bothStated = a.StatedPerTurn is not null && b.StatedPerTurn is not null;
            // The line is given at the frequency as written; leakage reactance follows the frequency, resistance does not.
            var f = model.Frequency / model.RatedFrequency;
            if (z.Imaginary != 0 || line.XR is not null)
            {
                var (r, x) = z.Imaginary != 0 ? (z.Real, z.Imaginary) : SplitByXR(z.Magnitude, line.XR!.Value);
                if (!bothStated) return new Pair(i, k, r, x * f, FitsResistance: true);
                if (Math.Abs(r - stated) > 0.1 * stated) diagnostics.ReportResistanceMismatch(line.ValueSpan, r * n2, stated * n2);
                return new Pair(i, k, stated, x * f, FitsResistance: false);
            }
            if (stated >= z.Magnitude)
            {
                diagnostics.ReportResistanceExceedsImpedance(line.ValueSpan, stated * n2, z.Magnitude * n2);
                return null;
            }
            return new Pair(i, k, stated, Math.Sqrt(z.Magnitude * z.Magnitude - stated * stated) * f, FitsResistance: false);
        }

        private static (double R, double X) SplitByXR(double magnitude, double xr)
        {
            var r = magnitude / Math.Sqrt(1 + xr * xr);
            return (r, r * xr);
        }

        /// <summary>
        /// Each member's series resistance per turn squared: stated, or fitted to the pairs that give a
        /// resistance (least squares of least norm, kept non-negative by fixing negative ones at zero).
        /// </summary>
        private double[] SeriesResistances()
        {
            var result = members.Select(m => m.StatedPerTurn ?? 0).ToArray();
            var free = Enumerable.Range(0, members.Count).Where(i => members[i].StatedPerTurn is null && members[i].Turns > 0).ToList();
            var rows = pairs.Where(p => p.FitsResistance && (free.Contains(p.A) || free.Contains(p.B))).ToList();
            while (rows.Count > 0 && free.Count > 0)
            {
                var a = Matrix<double>.Build.Dense(rows.Count, free.Count);
                var b = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(rows.Count);
                for (var r = 0; r < rows.Count; r++)
                {
                    b[r] = rows[r].R;
                    foreach (var m in new[] { rows[r].A, rows[r].B })
                    {
                        var u = free.IndexOf(m);
                        if (u >= 0) a[r, u] = 1;
                        else b[r] -= result[m];
                    }
                }
                var solution = a.PseudoInverse() * b;
                var worst = Enumerable.Range(0, free.Count).MinBy(u => solution[u]);
                if (solution[worst] >= 0)
                {
                    for (var u = 0; u < free.Count; u++) result[free[u]] = solution[u];
                    break;
                }
                result[free[worst]] = 0;
                free.RemoveAt(worst);
            }
            return result;
        }

        /// <summary>Z̃ over the members, referred to one turn, with <paramref name="root"/> as reference.</summary>
        private Complex[,] PerTurnMatrix(double[] series, int root)
        {
            var m = members.Count;
            var zeta = new Complex[m, m];
            foreach (var p in pairs)
            {
                var residue = p.R - series[p.A] - series[p.B];
                // What the fit carries to rounding is carried exactly: two or three windings stay purely reactive.
                if (Math.Abs(residue) <= 1e-12 * Math.Abs(p.R)) residue = 0;
                zeta[p.A, p.B] = zeta[p.B, p.A] = new Complex(residue, p.X);
            }
            var result = new Complex[m, m];
            for (var i = 0; i < m; i++)
                for (var k = 0; k < m; k++)
                    if (i != root && k != root)
                        result[i, k] = i == k ? zeta[root, i] : (zeta[root, i] + zeta[root, k] - zeta[i, k]) / 2;
            return result;
        }
    }
}

using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>
/// The limbs of one three-phase core linked through their yokes, with the admittance per turn of
/// the path the zero-sequence flux returns by (tank and air, outer limbs or shell).
/// </summary>
public sealed record MagneticCoupling(string Core, ImmutableArray<int> Limbs, Complex ReturnAdmittance);

/// <summary>
/// The magnetic circuit of a three-phase core as a reluctance network in the phase domain. Each
/// limb k carries the flux Φ_k = e_k/(jω) (e volts per turn) through its own reluctance (limb and
/// yokes: the magnetising admittance per turn Y1 of its open-circuit test); the limbs meet at the
/// yokes, and the sum of their fluxes returns through the return path of reluctance R0. The
/// magnetic potential across the yokes is R0·ΣΦ, so each limb's ampere-turn balance reads
/// Σ N·I = Y1·e_k + Yr·(e_a + e_b + e_c) with Yr = R0/(jω). Balanced (positive-sequence) flux sums to
/// zero and sees Y1 alone; zero-sequence flux sees Y0 = Y1 + 3·Yr, so Yr = (Y0 − Y1)/3. A bank's
/// cores share no yoke and are not coupled.
/// </summary>
public static class MagneticCircuit
{
    public static ImmutableArray<MagneticCoupling> Couplings(Model model, ImmutableArray<WindingNet> windings, ImmutableArray<CoreNet> cores, DiagnosticBag diagnostics)
    {
        if (model.ThreePhase.Cores.IsEmpty) return [];
        var result = ImmutableArray.CreateBuilder<MagneticCoupling>();
        var coreIndex = cores.ToDictionary(c => c.Name, c => c.Index, StringComparer.Ordinal);
        var windingsOn = windings.ToLookup(w => w.Core);
        foreach (var core in model.ThreePhase.Cores)
        {
            if (core.Construction == CoreConstruction.Bank) continue;
            if (core.ZeroSequence is not { } z0)
            {
                if (core.Construction == CoreConstruction.ThreeLimb) diagnostics.ReportNoZeroSequence(core.NameSpan, core.Name);
                continue;
            }
            var limbs = core.Limbs.Select(l => coreIndex.GetValueOrDefault(l, -1)).ToImmutableArray();
            if (limbs.Any(l => l < 0 || cores[l].Sections.IsEmpty)) continue;
            // Y0 per turn from the per-unit impedance on the core's rating: a winding of N turns rated V
            // per phase has the base impedance V²/S_phase, so Y0·N² = S_phase/(z0·V²) and Y0 = S_phase/(z0·(V/N)²).
            var rated = windingsOn[limbs[0]].FirstOrDefault(w => w.TurnsKnown && w.RatedVoltage is not null)
                ?? windingsOn[limbs[0]].FirstOrDefault(w => w.RatedVoltage is not null);
            if (core.Rating is not { } rating || rated is null)
            {
                diagnostics.ReportPercentNeedsRating(core.Line, core.Name);
                continue;
            }
            var voltsPerTurn = rated.RatedVoltage!.Value / rated.Turns;
            var y0 = rating / 3 / (z0 * voltsPerTurn * voltsPerTurn);
            var y1 = cores[limbs[0]].Admittance;
            result.Add(new MagneticCoupling(core.Name, limbs, (y0 - y1) / 3));
        }
        return result.ToImmutable();
    }
}

using System.Collections.Immutable;
using Phasor = System.Numerics.Complex;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

public static class ZigzagImpedances
{
    /// <summary>
    /// 'impedance HV Z' with Z a zigzag: the positive-sequence short-circuit impedance a test gives,
    /// HV's lines energised, Z's lines shorted, its neutral open (the first winding written energised,
    /// as <see cref="SequenceImpedances"/> measures it). On limb k sit HV_k, Z's half k and Z's
    /// half n of phase k − 1: a three-winding member whose halves' leakage is 'impedance Z Z'.
    /// Assumed: HV's leakage to either half is the same, Zh (ohms referred to HV's phase winding);
    /// a test gives one figure, so the two cannot be told apart from it. Zh is found so that the
    /// solved test gives the value written: the test impedance is affine in Zh (a linear network
    /// where Zh adds to the star branch of HV), so two solves fix it and a third checks it.
    /// </summary>
    /// <remarks>Run on every model the binder gives before it is solved (<see cref="Bind"/>); a model with errors is left as it is.</remarks>
    /// <summary>The binder's model with the zigzag's impedances fitted: the one way the study and the evaluation bind.</summary>
    public static Model.Model Bind(Syntax.SyntaxTree syntax, BindOverrides? overrides = null, CancellationToken cancel = default) =>
        Fit(Binder.Bind(syntax, overrides, cancel));

    public static Model.Model Fit(Model.Model bound)
    {
        if (bound.ZigzagImpedances.IsEmpty || bound.HasErrors) return bound;
        var made = ImmutableArray.CreateBuilder<ImpedanceModel>();
        var diagnostics = new DiagnosticBag();
        foreach (var pending in bound.ZigzagImpedances)
        {
            var line = pending.Line;
            var other = bound.ThreePhase.Windings.Single(w => w.Name == pending.Other);
            var zigzag = bound.ThreePhase.Windings.Single(w => w.Name == pending.Zigzag);
            var core = bound.ThreePhase.Cores.First(c => c.Name == zigzag.Core);
            var energised = line.First.Winding == other.Name ? other : zigzag;
            var shorted = energised == other ? zigzag : other;
            var halves = bound.Impedances.FirstOrDefault(z => z.First.Winding == zigzag.PhaseWindings[0] && z.Second.Winding == zigzag.PhaseWindings[2] + "n");
            if (halves is null)
            {
                diagnostics.ReportZigzagHalvesMissing(line.Line, zigzag.Name);
                continue;
            }
            ImpedanceModel[] Lines(Phasor zh) => [.. Enumerable.Range(0, 3).SelectMany(k => new[] { zigzag.PhaseWindings[k], zigzag.PhaseWindings[(k + 2) % 3] + "n" }
                .Select(half => line with { First = line.First with { Winding = other.PhaseWindings[k], From = null, To = null }, Second = line.Second with { Winding = half, From = null, To = null }, Value = zh, PerUnit = false, XR = null, Base = null }))];
            Phasor? Measured(Phasor zh) => SequenceImpedances.Measure(bound with { Impedances = [.. bound.Impedances, .. Lines(zh)] }, core, SequenceKind.Positive, energised, shorted)?.Impedance;

            // The value written, in ohms per phase at the energised lines.
            var baseVoltage = SequenceImpedances.RatedLineVoltage(bound, energised);
            var basePower = line.Base ?? SequenceImpedances.RatedPower(bound, core);
            var value = line.Value;
            if (line.PerUnit)
            {
                if (baseVoltage is not { } v || basePower is not { } s)
                {
                    diagnostics.ReportPercentNeedsRating(line.ValueSpan, core.Name);
                    continue;
                }
                value *= v * v / s;
            }
            var complex = value.Imaginary != 0 || line.XR is not null;
            var target = value.Imaginary != 0 ? value
                : line.XR is { } xr ? Phasor.FromPolarCoordinates(value.Magnitude, Math.Atan(xr))
                : Phasor.ImaginaryOne * value.Magnitude;
            // Two trial values fix the affine map f(Zh) = a + b·Zh.
            var (t1, t2) = (target, 2 * target);
            if (Measured(t1) is not { } f1 || Measured(t2) is not { } f2 || f1 == f2)
            {
                diagnostics.ReportZigzagImpedanceUnfitted(line.ValueSpan, "the unit's short-circuit test could not be solved");
                continue;
            }
            var b = (f2 - f1) / (t2 - t1);
            var a = f1 - b * t1;
            Phasor zh;
            if (complex) zh = (target - a) / b;
            else
            {
                // A bare magnitude is a reactance beside the windings' resistances: |a + j·b·X| = |Z|, the larger root.
                var c = Phasor.ImaginaryOne * b;
                var p = (a * Phasor.Conjugate(c)).Real;
                var disc = p * p - c.Magnitude * c.Magnitude * (a.Magnitude * a.Magnitude - value.Magnitude * value.Magnitude);
                zh = Phasor.ImaginaryOne * ((-p + Math.Sqrt(Math.Max(disc, 0))) / (c.Magnitude * c.Magnitude));
            }
            // Physical where HV's star branch, Zh − Zzz/2, has no negative reactance (Zzz referred to HV).
            if (HalvesReferred(bound, halves, other, zigzag) is { } zzz && zh.Imaginary < zzz.Imaginary / 2 * (1 - 1e-12))
            {
                var least = Measured(zzz / 2) is { } f && baseVoltage is { } v && basePower is { } s
                    ? line.PerUnit ? Numbers.Format(f.Magnitude * s / (v * v) * 100, "%") : Numbers.Format(f.Magnitude, "Ω")
                    : null;
                diagnostics.ReportZigzagImpedanceBelowHalves(line.ValueSpan, zigzag.Name, least);
                continue;
            }
            if (Measured(zh) is not { } check || (complex ? (check - target).Magnitude : Math.Abs(check.Magnitude - target.Magnitude)) > 1e-9 * target.Magnitude)
            {
                diagnostics.ReportZigzagImpedanceUnfitted(line.ValueSpan, "the resistances stated on the windings leave it out of reach");
                continue;
            }
            made.AddRange(Lines(zh));
        }
        return bound with { Impedances = [.. bound.Impedances, .. made], Diagnostics = [.. bound.Diagnostics, .. diagnostics] };
    }

    /// <summary>The zigzag's leakage between its halves on a limb, in ohms referred to the other winding's phase; null where a rating or rated voltage is unknown.</summary>
    private static Phasor? HalvesReferred(Model.Model bound, ImpedanceModel halves, ThreePhaseWindingModel other, ThreePhaseWindingModel zigzag)
    {
        var half = bound.Windings.FirstOrDefault(w => w.Name == zigzag.PhaseWindings[0]);
        var phase = bound.Windings.FirstOrDefault(w => w.Name == other.PhaseWindings[0]);
        if (half?.Rated is not { } vh || phase?.Rated is not { } vp) return null;
        var ratio = half.Turns is { } nh && phase.Turns is { } np ? np / nh : vp / vh;
        var value = halves.Value;
        if (halves.PerUnit)
        {
            if ((halves.Base ?? bound.Cores.FirstOrDefault(c => c.Name == half.Core)?.Rating) is not { } s) return null;
            value *= vh * vh / s;
        }
        var z = value.Imaginary != 0 ? value
            : halves.XR is { } xr ? Phasor.FromPolarCoordinates(value.Magnitude, Math.Atan(xr))
            : Phasor.ImaginaryOne * value.Magnitude;
        return z * ratio * ratio;
    }
}

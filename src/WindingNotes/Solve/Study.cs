using System.Collections.Immutable;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>How far a long evaluation has come: solves done of the total planned.</summary>
public readonly record struct StudyProgress(long Done, long Total);

/// <summary>Every case of a document (normal, faults, sweep points, in that order) and the checks over them.</summary>
public sealed record StudyResult(ImmutableArray<CaseResult> Cases, ImmutableArray<CheckResult> Checks);

/// <summary>
/// Everything solved for one document: the normal case and its faults, each sweep point, and for
/// each of those the tolerance samples that give its bands; then the checks, the ratings and the
/// cautions over all of them. Points are solved one at a time and only their results are kept.
/// </summary>
public static class Study
{
    public static StudyResult Run(SyntaxTree syntax, Model.Model model, Network network, DiagnosticBag diagnostics,
        CancellationToken cancel = default, Action<StudyProgress>? progress = null)
    {
        var nominal = Points.Solve(network, CaseSpec.Normal, withFaults: true, cancel);
        diagnostics.AddRange(nominal.Diagnostics);
        if (nominal.Case is not { } normal) return new StudyResult([], []);

        var axes = Sweeps.Plan(model, diagnostics);
        var samples = Tolerances.Plan(model, diagnostics);
        RatingTally.CheckBrushRanges(network, axes, diagnostics);
        var points = Sweeps.Count(axes);
        var bandsAtPoints = samples.Length > 0 && (1 + points) * (1 + samples.Length) <= Sweeps.Budget;
        if (samples.Length > 0 && points > 0 && !bandsAtPoints)
            diagnostics.ReportBandsNotSwept(model.Sweeps[0].Line, points, samples.Length, Sweeps.Budget);

        var run = new PointRun(syntax, new BrushSweep(syntax, model), diagnostics, cancel, progress, samples.Length + points * (1 + (bandsAtPoints ? samples.Length : 0)));
        var checks = new CheckTally(model.Expects);
        var ratings = new RatingTally();
        var cases = ImmutableArray.CreateBuilder<CaseResult>();

        checks.BeginPoint(normal.Case.Where);
        checks.Observe(normal, null);
        ratings.Observe(nominal);
        var normalBands = samples.IsEmpty ? null : new BandSet(normal);
        var faultBands = samples.IsEmpty ? [] : nominal.Faults.Select(f => new BandSet(f)).ToList();
        foreach (var sample in samples)
        {
            var p = run.Solve(new BindOverrides { Deviations = sample.Deviations }, CaseSpec.Normal, withFaults: true, sample.Where);
            if (p.Case is null)
            {
                checks.Unsolved(sample.Where);
                continue;
            }
            checks.Observe(p.Case, sample.Where);
            normalBands!.Add(p.Case);
            foreach (var (fault, bands) in nominal.Faults.Zip(faultBands))
                if (p.Faults.FirstOrDefault(f => f.Case.Name == fault.Case.Name) is { } sampled) bands.Add(sampled);
        }
        cases.Add(normalBands is null ? normal : normal with { Bands = normalBands.ToBands() });
        cases.AddRange(nominal.Faults.Select((f, i) => samples.IsEmpty ? f : f with { Bands = faultBands[i].ToBands() }));

        for (long k = 0; k < points; k++)
        {
            var (overrides, labels) = Sweeps.Point(axes, k);
            var spec = CaseSpec.ForSweep(labels);
            checks.BeginPoint(spec.Where);
            var p = run.Solve(overrides, spec, withFaults: false, "");
            if (p.Case is not { } at)
            {
                checks.Unsolved(null);
                continue;
            }
            checks.Observe(at, null);
            ratings.Observe(p);
            if (!bandsAtPoints)
            {
                cases.Add(at);
                continue;
            }
            var bands = new BandSet(at);
            foreach (var sample in samples)
            {
                var s = run.Solve(overrides with { Deviations = sample.Deviations }, spec, withFaults: false, sample.Where);
                if (s.Case is null) checks.Unsolved(sample.Where);
                else
                {
                    checks.Observe(s.Case, sample.Where);
                    bands.Add(s.Case);
                }
            }
            cases.Add(at with { Bands = bands.ToBands() });
        }

        var all = cases.ToImmutable();
        var checkResults = checks.Finish(diagnostics);
        ratings.Report(diagnostics);
        SafetyCautions.Report(network, all, diagnostics);
        run.ReportNew();
        return new StudyResult(all, checkResults);
    }

    /// <summary>
    /// Solves points after the nominal one and keeps what they report that the nominal evaluation did
    /// not: each such message once, with the first point it came from and how many more.
    /// </summary>
    private sealed class PointRun(SyntaxTree syntax, BrushSweep brushes, DiagnosticBag diagnostics, CancellationToken cancel, Action<StudyProgress>? progress, long total)
    {
        private readonly HashSet<(string, TextSpan, string)> known = [.. diagnostics.Select(d => (d.Code, d.Span, d.Message))];
        private readonly Dictionary<(string, TextSpan), (Diagnostic First, string Where, int More)> fresh = [];
        private readonly List<(string, TextSpan)> order = [];
        private long done;

        public PointResult Solve(BindOverrides overrides, CaseSpec spec, bool withFaults, string sample)
        {
            cancel.ThrowIfCancellationRequested();
            var p = !withFaults && spec.IsSweepPoint && brushes.Covers(overrides)
                ? brushes.Solve(overrides, spec, cancel)
                : Points.Solve(syntax, overrides, spec, withFaults, cancel);
            var where = $"{(spec.IsSweepPoint ? $"at {spec.Where}" : "")} {sample}".Trim();
            foreach (var d in p.Diagnostics)
            {
                // The solver names a sweep point's case in its messages already; compare without it.
                if (known.Contains((d.Code, d.Span, d.Message)) || known.Contains((d.Code, d.Span, Unprefixed(d.Message)))) continue;
                var key = (d.Code, d.Span);
                if (fresh.TryGetValue(key, out var f)) fresh[key] = f with { More = f.More + 1 };
                else
                {
                    fresh[key] = (d, where, 0);
                    order.Add(key);
                }
            }
            done++;
            if (progress is not null && (done % 64 == 0 || done == total)) progress(new StudyProgress(done, total));
            return p;
        }

        private static string Unprefixed(string message) =>
            message.StartsWith("in case '", StringComparison.Ordinal) && message.IndexOf("': ", StringComparison.Ordinal) is var i and > 0 ? message[(i + 3)..] : message;

        public void ReportNew()
        {
            foreach (var key in order)
            {
                var (first, where, more) = fresh[key];
                diagnostics.ReportAtPoints(first, first.Message.StartsWith("in case '", StringComparison.Ordinal) ? "" : where, more);
            }
        }
    }
}

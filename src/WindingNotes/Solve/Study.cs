using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>How far a long evaluation has come: solves done of the total planned.</summary>
public readonly record struct StudyProgress(long Done, long Total);

/// <summary>Every case of a document (normal, faults, short circuits, in that order) and the checks over them; a sweep's points are in <see cref="SweepColumns"/>.</summary>
public sealed record StudyResult(ImmutableArray<CaseResult> Cases, ImmutableArray<CheckResult> Checks)
{
    /// <summary>The load cycle through the units' thermal data, where the file gives both.</summary>
    public ThermalResult? Thermal { get; init; }

    /// <summary>The sequence impedances of each three-phase unit, from its test connections solved on the unit alone.</summary>
    public ImmutableArray<UnitSequenceImpedances> SequenceImpedances { get; init; } = [];

    /// <summary>Paralleled three-phase units: the current circulating with every load removed, and each one's share of the load.</summary>
    public ImmutableArray<ParallelGroup> Parallel { get; init; } = [];

    /// <summary>The sweep's results in columns over its kept points, with each result's least and greatest over every point; null without a sweep.</summary>
    public SweepColumns? SweepColumns { get; init; }
}

/// <summary>
/// Everything solved for one document: the normal case and its faults, each sweep point, and for
/// each of those the tolerance samples that give its bands; then the checks, the ratings and the
/// cautions over all of them. Points are solved one at a time; a sweep point's results are kept only
/// in the sweep's columns (<see cref="SweepColumnsBuilder"/>), no case of it.
/// When the time budget runs out after the normal case, the study stops with a diagnostic and keeps
/// what is whole: the cases solved so far (with bands only where all their samples were solved), and
/// the checks and ratings over them.
/// </summary>
public static class Study
{
    public static StudyResult Run(SyntaxTree syntax, Model.Model model, Network network, DiagnosticBag diagnostics,
        TimeBudget budget, Action<StudyProgress>? progress = null, TapPlan? taps = null, Action<CaseResult>? sweepPoint = null)
    {
        var cancel = budget.Token;
        var nominal = Points.Solve(network, CaseSpec.Normal, withFaults: true, cancel);
        diagnostics.AddRange(nominal.Diagnostics);
        if (nominal.Case is not { } normal) return new StudyResult([], []);
        if (taps is not null) normal = normal with { TapPositions = taps.Nominal };

        if (!normal.Totals.CoreLossKnown && !normal.Loads.IsEmpty)
            diagnostics.ReportCoreLossUnknown([.. normal.Cores.Where(k => !k.LossKnown).Select(k => k.Core.Source)]);
        var axes = Sweeps.Plan(model, diagnostics);
        var samples = Tolerances.Plan(model, diagnostics);
        RatingTally.CheckBrushRanges(network, axes, diagnostics);
        var points = Sweeps.Count(axes);
        var bandsAtPoints = samples.Length > 0 && (1 + points) * (1 + samples.Length) <= Sweeps.Budget;
        if (samples.Length > 0 && points > 0 && !bandsAtPoints)
            diagnostics.ReportBandsNotSwept(model.Sweeps[0].Line, points, samples.Length, Sweeps.Budget);

        var run = new PointRun(model.Frequency, new BrushSweep(syntax, model), new Rebinding(syntax, model), taps, diagnostics, cancel, progress, samples.Length + points * (1 + (bandsAtPoints ? samples.Length : 0)));
        var studied = model.Expects.Where(e => !ThermalStudy.IsThermal(e) && !SequenceImpedances.IsSequence(e)).ToImmutableArray();
        var checks = new CheckTally([.. studied.Where(e => !FaultChecks.InFault(e))]);
        var shortCircuits = FaultStudy.Run(network, normal.Solution, diagnostics, cancel);
        var ratings = new RatingTally();
        var outputs = new OutputTally(network);
        var cases = ImmutableArray.CreateBuilder<CaseResult>();
        var columns = new SweepColumnsBuilder(Sweeps.KeptFor(normal), points);

        checks.BeginPoint(normal.Case.Where);
        checks.Observe(normal, null);
        ratings.Observe(nominal);
        outputs.Observe(normal);
        var stopped = false;
        try
        {
            var (normalBands, faultBands) = SampleNominal();
            cases.Add(normal with { Bands = normalBands });
            cases.AddRange(nominal.Faults.Select((f, i) => Kept(f) with { Bands = faultBands.IsEmpty ? [] : faultBands[i] }));
            cases.AddRange(shortCircuits);
            for (long k = 0; k < points; k++) SweepPoint(k);
        }
        catch (OperationCanceledException) when (budget.Exceeded)
        {
            stopped = true;
            if (cases.Count == 0)
            {
                cases.Add(normal);
                cases.AddRange(nominal.Faults.Select(Kept));
                cases.AddRange(shortCircuits);
            }
        }

        var all = cases.ToImmutable();
        if (columns.Stride > 1) diagnostics.ReportSweepThinned(model.Sweeps[0].Line, columns.Solved, columns.Count, columns.Stride);
        var checkResults = FaultChecks.Merge(studied, checks.Finish(diagnostics), all, diagnostics);
        ThermalResult? thermal = null;
        if (!stopped && (!model.Thermal.IsEmpty || model.Expects.Any(ThermalStudy.IsThermal)))
            try
            {
                (thermal, var thermalChecks) = ThermalStudy.Run(syntax, model, network, normal, diagnostics, cancel);
                checkResults = [.. checkResults.Concat(thermalChecks).OrderBy(c => c.Expect.Line.Start)];
            }
            catch (OperationCanceledException) when (budget.Exceeded)
            {
                stopped = true;
            }
        var sequence = ImmutableArray<UnitSequenceImpedances>.Empty;
        if (!stopped && !model.ThreePhase.Cores.IsEmpty)
            try
            {
                sequence = SequenceImpedances.Run(model, cancel);
                checkResults = [.. checkResults.Concat(SequenceImpedances.Check(model, sequence, diagnostics)).OrderBy(c => c.Expect.Line.Start)];
            }
            catch (OperationCanceledException) when (budget.Exceeded)
            {
                stopped = true;
            }
        ratings.Report(diagnostics);
        SafetyCautions.Report(network, all, outputs, diagnostics);
        run.ReportNew();
        if (stopped)
            diagnostics.ReportTimeLimit(model.Sweeps.FirstOrDefault()?.Line ?? model.Tolerances.FirstOrDefault()?.Span ?? model.Thermal.Cycle?.Line ?? model.Supplies[0].Line, budget.Limit, run.Done, run.Total);
        return new StudyResult(all, checkResults) { Thermal = thermal, SequenceImpedances = sequence, Parallel = ParallelUnits.Find(network, normal, nominal.NoLoad), SweepColumns = points > 0 ? columns.Finish() : null };

        // The bands of the normal case and of each fault over the tolerance samples.
        (ImmutableArray<Band> Normal, ImmutableArray<ImmutableArray<Band>> Faults) SampleNominal()
        {
            if (samples.IsEmpty) return ([], []);
            var normalBands = new BandSet(normal);
            var faultBands = nominal.Faults.Select(f => new BandSet(f)).ToList();
            foreach (var sample in samples)
            {
                var p = run.Solve(new BindOverrides { Deviations = sample.Deviations }, CaseSpec.Normal, withFaults: true, sample.Where);
                if (p.Case is null)
                {
                    checks.Unsolved(sample.Where);
                    continue;
                }
                checks.Observe(p.Case, sample.Where);
                normalBands.Add(p.Case);
                foreach (var (fault, bands) in nominal.Faults.Zip(faultBands))
                    if (p.Faults.FirstOrDefault(f => f.Case.Name == fault.Case.Name) is { } sampled) bands.Add(sampled);
            }
            return (normalBands.ToBands(), [.. faultBands.Select(b => b.ToBands())]);
        }

        void SweepPoint(long k)
        {
            var (overrides, labels) = Sweeps.Point(axes, k);
            var spec = CaseSpec.ForSweep(labels);
            var p = run.Solve(overrides, spec, withFaults: false, "");
            checks.BeginPoint(spec.Where);
            if (p.Case is not { } at)
            {
                checks.Unsolved(null);
                return;
            }
            checks.Observe(at, null);
            ratings.Observe(p);
            outputs.Observe(at);
            if (!bandsAtPoints)
            {
                columns.Add(k, labels, at);
                sweepPoint?.Invoke(at);
                return;
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
            var pointBands = bands.ToBands();
            columns.Add(k, labels, at, pointBands);
            sweepPoint?.Invoke(at with { Bands = pointBands });
        }
    }

    /// <summary>A fault case as the study keeps it: its results, not its solver's vectors.</summary>
    private static CaseResult Kept(CaseResult c) => c with { Solution = c.Solution.Compact() };

    /// <summary>
    /// Solves points after the nominal one and keeps what they report that the nominal evaluation did
    /// not: each such message once, with the first point it came from and how many more.
    /// </summary>
    private sealed class PointRun(double ratedFrequency, BrushSweep brushes, Rebinding values, TapPlan? taps, DiagnosticBag diagnostics, CancellationToken cancel, Action<StudyProgress>? progress, long total)
    {
        private readonly HashSet<(string, TextSpan, string, string?)> known = [.. diagnostics.Select(d => (d.Code, d.Span, d.Message, d.Case))];
        private readonly Dictionary<(string, TextSpan), (Diagnostic First, string Where, int More)> fresh = [];
        private readonly List<(string, TextSpan)> order = [];
        private long done;

        public long Done => done;

        public long Total => total;

        public PointResult Solve(BindOverrides overrides, CaseSpec spec, bool withFaults, string sample)
        {
            cancel.ThrowIfCancellationRequested();
            // Every point keeps the frequency as written as the one its impedances are given at.
            overrides = overrides with { RatedFrequency = ratedFrequency };
            var p = taps is not null ? taps.Solve(overrides, spec, withFaults, cancel)
                : !withFaults && spec.IsSweepPoint && brushes.Covers(overrides)
                ? brushes.Solve(overrides, spec, cancel)
                : values.Solve(overrides, spec, withFaults, cancel);
            // Worded only for a message not seen before: most points have none.
            string? where = null;
            foreach (var d in p.Diagnostics)
            {
                // Known where the file as written or the same case said it.
                if (known.Contains((d.Code, d.Span, d.Message, null)) || known.Contains((d.Code, d.Span, d.Message, d.Case))) continue;
                var key = (d.Code, d.Span);
                if (fresh.TryGetValue(key, out var f)) fresh[key] = f with { More = f.More + 1 };
                else
                {
                    fresh[key] = (d, where ??= $"{(spec.IsSweepPoint ? $"at {spec.Where}" : "")} {sample}".Trim(), 0);
                    order.Add(key);
                }
            }
            done++;
            if (progress is not null && (done % 64 == 0 || done == total)) progress(new StudyProgress(done, total));
            return p;
        }

        public void ReportNew()
        {
            foreach (var key in order)
            {
                var (first, where, more) = fresh[key];
                diagnostics.ReportAtPoints(first, first.Case is not null ? "" : where, more);
            }
        }
    }
}

using System.Collections.Immutable;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// An evaluated expectation: the value it measured as written, and whether it held there, at every
/// sweep point and across the tolerance band. <see cref="Min"/> and <see cref="Max"/> span all of
/// those; <see cref="Failures"/> names the points where it did not hold, of <see cref="Points"/> checked.
/// </summary>
public sealed record CheckResult(ExpectModel Expect, bool Passed, double? Value)
{
    /// <summary>
    /// False where the file was not solved (an error in it, or a network that could not be solved):
    /// such a check neither passed nor failed, and is counted apart.
    /// </summary>
    public bool Evaluated { get; init; } = true;

    /// <summary>A check of a file that was not solved: never "passed".</summary>
    public static CheckResult NotEvaluated(ExpectModel expect) => new(expect, false, null) { Evaluated = false, Points = 0 };

    public double? Min { get; init; }

    public double? Max { get; init; }

    public ImmutableArray<string> Failures { get; init; } = [];

    /// <summary>How many points it failed at; <see cref="Failures"/> names the first <see cref="CheckTally.Named"/> of them.</summary>
    public int Failing { get; init; }

    public int Points { get; init; } = 1;

    /// <summary>What a check that is not a number found as written: the connection symbol of a 'vector-group' check.</summary>
    public string? Shown { get; init; }
}

/// <summary>
/// Evaluates each <c>expect</c> line over every case it applies to (the normal case and each sweep
/// point, each with its tolerance samples) and reports the ones that fail, naming where.
/// </summary>
public static class Checks
{
    /// <summary>The checks of a single case, as written.</summary>
    public static ImmutableArray<CheckResult> Evaluate(Model.Model model, CaseResult result, DiagnosticBag diagnostics)
    {
        var tally = new CheckTally(model.Expects);
        tally.BeginPoint(result.Case.Where);
        tally.Observe(result, null);
        return tally.Finish(diagnostics);
    }

    /// <summary>The measured value in SI or as a fraction; null with the reason when it cannot be measured.</summary>
    public static double? Measure(ExpectModel expect, CaseResult result, out string? problem) => Measure(expect, result, out problem, out _);

    /// <summary>
    /// As above; a check of a whole three-phase element measures each phase element and gives the
    /// value of the phase furthest past its bounds (or nearest to them, where all hold), and names it.
    /// </summary>
    public static double? Measure(ExpectModel expect, CaseResult result, out string? problem, out string? phase)
    {
        phase = null;
        if (expect.Phases.IsEmpty) return MeasureOne(expect, result, out problem);
        problem = null;
        double? worst = null;
        var worstExcess = double.NegativeInfinity;
        for (var k = 0; k < expect.Phases.Length; k++)
        {
            var name = expect.Phases[k];
            // A section of a whole three-phase winding between two of its three-phase taps: each phase's own taps.
            var targets = expect.Targets.Select((t, i) => t with { Name = i == 0 ? name : Phases.Of(t.Name, k) }).ToImmutableArray();
            if (MeasureOne(expect with { Targets = targets, Phases = [] }, result, out problem) is not { } v)
            {
                phase = name;
                return null;
            }
            var excess = Math.Max(expect.Low - v, v - expect.High);
            if (excess > worstExcess) (worst, worstExcess, phase) = (v, excess, name);
        }
        return worst;
    }

    private static double? MeasureOne(ExpectModel expect, CaseResult result, out string? problem)
    {
        problem = null;
        var t = expect.Targets;
        switch (expect.Measure)
        {
            case MeasureKind.Voltage:
                return (result.PointVoltage(t[0].Name) - result.PointVoltage(t[1].Name)).Magnitude;
            case MeasureKind.Current or MeasureKind.Loading:
                var terminal = result.SupplyNamed(t[0].Name)?.Current ?? result.LoadNamed(t[0].Name)?.Current;
                if (terminal is { } current)
                {
                    if (expect.Measure == MeasureKind.Current) return current.Magnitude;
                    problem = "loading is measured on windings and sections";
                    return null;
                }
                var sections = result.SectionsOf(t[0].Name).ToList();
                if (t.Length == 3)
                {
                    var names = new HashSet<string> { t[1].Name, t[2].Name };
                    sections = sections.Where(s => names.SetEquals([s.Section.FromPoint, s.Section.ToPoint])).ToList();
                    if (sections.Count == 0)
                    {
                        problem = $"no section of '{t[0].Name}' runs from '{t[1].Name}' to '{t[2].Name}'";
                        return null;
                    }
                }
                else if (sections.Count > 1 && expect.Measure == MeasureKind.Current)
                {
                    problem = $"'{t[0].Name}' has {sections.Count} sections; name one by its two points";
                    return null;
                }
                if (sections.Count == 0)
                {
                    problem = $"'{t[0].Name}' was left out of the network";
                    return null;
                }
                if (expect.Measure == MeasureKind.Current) return sections[0].Current.Magnitude;
                if (sections.Any(s => s.Loading is null))
                {
                    problem = $"the rated current of '{t[0].Name}' is unknown: give a rating";
                    return null;
                }
                return sections.Max(s => s.Loading!.Value);
            case MeasureKind.Flux:
                var core = result.CoreNamed(t[0].Name);
                if (core?.Flux is { } flux) return flux;
                problem = $"the flux density of '{t[0].Name}' needs the core's 'area' and the windings' 'turns'";
                return null;
            case MeasureKind.Power:
                if (result.SupplyNamed(t[0].Name) is { } ps) return ps.Power.Real;
                if (result.LoadNamed(t[0].Name) is { } pl) return pl.Power.Real;
                problem = $"'{t[0].Name}' was left out of the network";
                return null;
            case MeasureKind.VectorGroup:
                var group = result.ThreePhase.GroupOf(t[0].Name);
                if (group?.Symbol is { } symbol) return symbol == expect.Symbol ? 1 : 0;
                problem = group?.Problem ?? $"'{t[0].Name}' has no two three-phase windings to compare";
                return null;
            case MeasureKind.Position:
                if (result.TapPositions.FirstOrDefault(p => p.Changer.Name == t[0].Name) is { } tap) return tap.Position;
                problem = $"the position of '{t[0].Name}' is not known in this case";
                return null;
            case MeasureKind.FaultCurrent or MeasureKind.PeakCurrent or MeasureKind.ThermalCurrent or MeasureKind.EarthFaultFactor or MeasureKind.PeakDuty:
                return FaultChecks.Measure(expect, result, out problem);
            case MeasureKind.Efficiency:
                if (result.Totals.Efficiency is { } efficiency) return efficiency;
                problem = result.Totals.CoreLossKnown
                    ? "efficiency needs a supply that delivers power to a load"
                    : $"efficiency needs the core loss: give a 'no-load' line for {string.Join(", ", result.Cores.Where(k => !k.LossKnown).Take(4).Select(k => $"core '{k.Core.Name}'"))}";
                return null;
            default:
                if (result.LoadNamed(t[0].Name)?.Regulation is { } regulation) return regulation;
                problem = $"the regulation of '{t[0].Name}' is unknown";
                return null;
        }
    }
}

/// <summary>Gathers, per expect line, what each point and sample measured, then reports once per line.</summary>
public sealed class CheckTally(ImmutableArray<ExpectModel> expects)
{
    /// <summary>The failing points named at most, per check: a long sweep may fail at a million.</summary>
    public const int Named = 1000;

    private readonly Entry[] entries = [.. expects.Select(e => new Entry(e))];
    private int points;
    private string point = "";

    private sealed class Entry(ExpectModel expect)
    {
        public readonly ExpectModel Expect = expect;
        public double? Nominal;
        public string? Problem;
        public double Min = double.PositiveInfinity, Max = double.NegativeInfinity;
        public readonly List<string> Failures = [];
        public int Failing;
        public double WorstExcess = double.NegativeInfinity;
        public double? WorstValue;
        public string WorstWhere = "";
        public bool FailedHere;

        /// <summary>What a check that is not a number found as written: the connection symbol.</summary>
        public string? Shown;
    }

    /// <summary>Starts a point: the normal case ("as written") or a sweep point ("BR=25 %").</summary>
    public void BeginPoint(string where)
    {
        points++;
        point = where;
        foreach (var e in entries) e.FailedHere = false;
    }

    /// <summary>A result at the current point: its nominal case (sample null) or one tolerance sample.</summary>
    public void Observe(CaseResult result, string? sample)
    {
        var first = points == 1 && sample is null;
        foreach (var e in entries)
        {
            var value = Checks.Measure(e.Expect, result, out var problem, out var phase);
            if (first)
            {
                e.Nominal = value;
                e.Problem = problem;
                if (e.Expect.Measure == MeasureKind.VectorGroup)
                    e.Shown = result.ThreePhase.GroupOf(e.Expect.Targets[0].Name)?.Symbol;
            }
            if (value is not { } v)
            {
                Fail(e, null, double.NegativeInfinity, sample);
                continue;
            }
            (e.Min, e.Max) = (Math.Min(e.Min, v), Math.Max(e.Max, v));
            var x = e.Expect;
            // Bounds written with four figures hold for values that round to them.
            var slack = 1e-9 * Math.Max(Math.Abs(x.Low), Math.Abs(x.High)) is var s && double.IsFinite(s) ? s : 1e-9 * Math.Abs(v);
            var excess = Math.Max(x.Low - slack - v, v - x.High - slack);
            if (excess > 0) Fail(e, v, excess, sample, phase);
        }
    }

    /// <summary>The current point (or one of its samples) could not be solved: no check holds there.</summary>
    public void Unsolved(string? sample)
    {
        foreach (var e in entries) Fail(e, null, double.NegativeInfinity, sample ?? "(not solved)");
    }

    private void Fail(Entry e, double? value, double excess, string? sample, string? phase = null)
    {
        if (!e.FailedHere && e.Failing++ < Named) e.Failures.Add(point);
        e.FailedHere = true;
        if (value is null || excess <= e.WorstExcess) return;
        e.WorstExcess = excess;
        e.WorstValue = value;
        var at = point == "as written" ? "" : $"at {point}";
        // A check of a whole three-phase element says which phase failed.
        if (phase is not null) at = $"on {phase} {at}".Trim();
        e.WorstWhere = sample is null ? at : $"{at} {sample}".Trim();
    }

    public ImmutableArray<CheckResult> Finish(DiagnosticBag diagnostics)
    {
        var results = ImmutableArray.CreateBuilder<CheckResult>();
        foreach (var e in entries)
        {
            var result = new CheckResult(e.Expect, e.Failing == 0, e.Nominal)
            {
                Min = double.IsFinite(e.Min) ? e.Min : null,
                Max = double.IsFinite(e.Max) ? e.Max : null,
                Failures = [.. e.Failures],
                Failing = e.Failing,
                Points = points,
                Shown = e.Shown,
            };
            if (e.Problem is { } problem) diagnostics.ReportCannotCheck(e.Expect, problem);
            else if (e.Failing > 0 && e.Expect.Measure == MeasureKind.VectorGroup) diagnostics.ReportVectorGroupFailed(e.Expect, e.Shown);
            else if (e.Failing > 0 && e.WorstValue is { } worst) diagnostics.ReportCheckFailed(e.Expect, worst, e.WorstWhere, e.Failures, e.Failing, points);
            else if (e.Failing > 0) diagnostics.ReportCannotCheck(e.Expect, $"not solved at {SolveMessages.ListPoints(e.Failures)}");
            results.Add(result);
        }
        return results.ToImmutable();
    }
}

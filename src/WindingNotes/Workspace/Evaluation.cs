using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Workspace;

/// <summary>
/// Everything known about one version of a document: its syntax, its model, its network, the
/// cases solved and the checks, with the diagnostics of every stage in document order.
/// </summary>
public sealed record Evaluation(
    string Path,
    SyntaxTree Syntax,
    Model.Model Model,
    Network? Network,
    ImmutableArray<CaseResult> Cases,
    ImmutableArray<CheckResult> Checks,
    ImmutableArray<Diagnostic> Diagnostics)
{
    public SourceText Text => Syntax.Text;

    /// <summary>The normal case, when the network could be solved.</summary>
    public CaseResult? Normal => Cases.FirstOrDefault(c => c.Case == CaseSpec.Normal);

    public bool HasErrors => Diagnostics.Any(d => d.IsError);

    public bool AllChecksPass => Checks.All(c => c.Passed);

    /// <summary>Whether the normal case was solved: only a file that bound completely is.</summary>
    public bool Solved => Normal is not null;

    /// <summary>
    /// Where this version was not solved: the last version of the document that was, kept by the
    /// workspace so an editor can show its results, marked as that version's. Null for the CLI.
    /// </summary>
    public SolvedVersion? LastSolved { get; init; }

    /// <summary>The load cycle through the units' thermal data, where the file gives both and it was solved.</summary>
    public ThermalResult? Thermal { get; init; }

    /// <summary>The sequence impedances of each three-phase unit, where the file was solved.</summary>
    public ImmutableArray<UnitSequenceImpedances> SequenceImpedances { get; init; } = [];

    /// <summary>Paralleled three-phase units: circulating currents and load shares.</summary>
    public ImmutableArray<ParallelGroup> Parallel { get; init; } = [];

    /// <summary>The sweep's results in columns (kept points) and their least and greatest over every point; null without a sweep run.</summary>
    public SweepColumns? SweepColumns { get; init; }
}

/// <summary>An earlier version of a document that was solved, and its evaluation.</summary>
public sealed record SolvedVersion(int Version, Evaluation Evaluation);

/// <summary>
/// The pipeline: text → syntax → model → network → the study (normal case, faults, sweep points,
/// tolerance bands) → results, checks, ratings and cautions.
/// </summary>
public static class Evaluator
{
    /// <summary>
    /// How long an evaluation may run unless the caller says otherwise: far beyond any ordinary file,
    /// so only a runaway study (a huge sweep, a huge file) meets it and stops with a diagnostic.
    /// </summary>
    public static readonly TimeSpan DefaultTimeLimit = TimeSpan.FromSeconds(60);

    // MathNet looks for native providers (MKL, OpenBLAS, CUDA) on its first matrix, a search that
    // cost the command about 12 ms at every start in a profile. Its managed provider is the one every
    // result is tested with, so it is chosen before the first evaluation; a machine with MKL installed
    // then gives the same bytes too.
    static Evaluator() => MathNet.Numerics.Providers.LinearAlgebra.LinearAlgebraControl.UseManaged();

    /// <summary>
    /// Never throws but for cancellation: a fault of the tool itself becomes an error diagnostic, so
    /// the editor and the command line stay up and say what happened. Past <paramref name="timeLimit"/>
    /// the evaluation stops with a <c>time-limit</c> error and keeps what was complete.
    /// </summary>
    /// <param name="progress">Told how far a long run (sweeps, tolerance samples) has come; the front end decides how to show it.</param>
    /// <param name="timeLimit">Budget of processor time on the calling thread (wall-clock time where the platform cannot tell it, <see cref="TimeBudget"/>); <see cref="DefaultTimeLimit"/> when null, none with <see cref="Timeout.InfiniteTimeSpan"/>.</param>
    /// <param name="sweepPoint">Told each sweep point's case as it is solved, for a caller that wants the whole case: the evaluation keeps a sweep's points only in its columns.</param>
    public static Evaluation Evaluate(string text, string path = "", CancellationToken cancel = default, Action<StudyProgress>? progress = null, TimeSpan? timeLimit = null, Action<CaseResult>? sweepPoint = null)
    {
        using var budget = new TimeBudget(timeLimit ?? DefaultTimeLimit, cancel);
        Stages? stages = null;
        try
        {
            // Parsing always runs to the end: it is linear, and every editor feature needs its tree.
            stages = new Stages(Parser.Parse(text));
            return Run(stages, path, budget, progress, sweepPoint);
        }
        catch (OperationCanceledException) when (budget.Exceeded && stages is not null)
        {
            stages.Diagnostics.ReportTimeLimitWhile(stages.At, budget.Limit, stages.Doing);
            return Finish(path, stages);
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            var diagnostics = new DiagnosticBag();
            var syntax = stages?.Syntax ?? SafeParse(text);
            // At the line the failing stage began from: the tool cannot know which line it failed on.
            diagnostics.ReportInternalError(stages?.At ?? Stages.FirstLine(syntax), e);
            return Finish(path, new Stages(syntax) { Diagnostics = diagnostics });
        }
    }

    /// <summary>What the pipeline has made so far, so a stage stopped by the time limit keeps the ones before it.</summary>
    private sealed class Stages(SyntaxTree syntax)
    {
        public SyntaxTree Syntax { get; } = syntax;
        public Model.Model Model { get; set; } = new(syntax, new SymbolTable(), []);
        public Network? Network { get; set; }
        public StudyResult Study { get; set; } = new([], []);
        public DiagnosticBag Diagnostics { get; init; } = new();
        public string Doing { get; set; } = "binding the document";

        /// <summary>The line a stage's time-limit or internal error is shown at: the first statement, the first tap changer, the first supply.</summary>
        public TextSpan At { get; set; } = FirstLine(syntax);

        /// <summary>The first line with a statement (or a broken one), else the first line.</summary>
        public static TextSpan FirstLine(SyntaxTree syntax) =>
            (syntax.Lines.FirstOrDefault(l => l.Statement is not null || l.Error is not null) ?? syntax.Lines.FirstOrDefault())?.Span ?? default;
    }

    private static SyntaxTree SafeParse(string text)
    {
        try
        {
            return Parser.Parse(text);
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            return new SyntaxTree(new SourceText(text), [], []);
        }
    }

    private static Evaluation Run(Stages stages, string path, TimeBudget budget, Action<StudyProgress>? progress, Action<CaseResult>? sweepPoint)
    {
        var cancel = budget.Token;
        cancel.ThrowIfCancellationRequested();
        var model = ZigzagImpedances.Bind(stages.Syntax, cancel: cancel);
        var diagnostics = stages.Diagnostics;
        stages.Model = model;
        diagnostics.AddRange(model.Diagnostics);
        // Only a model that bound completely is solved: a dropped load or an unknown name would
        // leave a partial network whose numbers, and checks, would mislead.
        if (model.HasErrors || model.Supplies.IsEmpty) return Finish(path, stages);

        stages.Doing = "building the network";
        var network = NetworkBuilder.Build(model);
        stages.Network = network;
        diagnostics.AddRange(network.Diagnostics);
        // A network the builder could not make whole is not solved: its numbers would mislead.
        if (network.Diagnostics.Any(d => d.IsError)) return Finish(path, stages);

        // Tap changers and 'find' set lets before anything is solved: the document is then solved at those values.
        var plan = TapPlan.For(stages.Syntax, model);
        if (plan is not null)
        {
            stages.Doing = "finding values and settling tap changers";
            stages.At = stages.Syntax.Statements.FirstOrDefault(s => s.Kind is StatementKind.TapChanger or StatementKind.Find)?.Span ?? stages.At;
            if (TapStudy.Prepare(plan, model, diagnostics, cancel) is not { } settled) return Finish(path, stages);
            (model, network) = settled;
            (stages.Model, stages.Network) = settled;
        }

        stages.Doing = "solving the normal case";
        stages.At = model.Supplies[0].Line;
        stages.Study = Study.Run(stages.Syntax, model, network, diagnostics, budget, progress, plan, sweepPoint);
        return Finish(path, stages);
    }

    private static Evaluation Finish(string path, Stages stages)
    {
        var ordered = stages.Diagnostics.Select(d => AsTheFileSays(d, stages.Model)).OrderBy(d => d.Span.Start).ThenBy(d => d.Severity).ToImmutableArray();
        var checks = stages.Study.Cases.IsEmpty ? NotEvaluated(stages.Syntax, stages.Model) : stages.Study.Checks;
        return new Evaluation(path, stages.Syntax, stages.Model, stages.Network, stages.Study.Cases, checks, ordered) { Thermal = stages.Study.Thermal, SequenceImpedances = stages.Study.SequenceImpedances, Parallel = stages.Study.Parallel, SweepColumns = stages.Study.SweepColumns };
    }

    /// <summary>A rating warning the file fails on becomes an error; a caution it acknowledges is marked so.</summary>
    private static Diagnostic AsTheFileSays(Diagnostic d, Model.Model model)
    {
        if (d.Severity == Severity.Warning && model.FailOn.TryGetValue(d.Code, out var failOn))
            return d with { Severity = Severity.Error, Related = [.. d.Related, new RelatedSpan($"an error by 'fail-on {d.Code}'", failOn)] };
        return model.Acknowledged.ContainsKey(d.Code) ? d with { Acknowledged = true } : d;
    }

    /// <summary>Every expect line of a file that was not solved, whether it bound or not.</summary>
    private static ImmutableArray<CheckResult> NotEvaluated(SyntaxTree syntax, Model.Model model)
    {
        var bound = model.Expects.ToDictionary(e => e.Line.Start);
        return [.. syntax.Statements.Where(s => s.Kind == StatementKind.Expect).Select(s => CheckResult.NotEvaluated(
            bound.GetValueOrDefault(s.Span.Start) ?? new ExpectModel(s.Span, syntax.Text[s.Span], default, [], default, double.NaN, double.NaN, "")))];
    }
}

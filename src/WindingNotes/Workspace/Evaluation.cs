using System.Collections.Immutable;
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
}

/// <summary>
/// The pipeline: text → syntax → model → network → the study (normal case, faults, sweep points,
/// tolerance bands) → results, checks, ratings and cautions.
/// </summary>
public static class Evaluator
{
    /// <summary>
    /// Never throws but for cancellation: a fault of the tool itself becomes an error diagnostic, so
    /// the editor and the command line stay up and say what happened.
    /// </summary>
    /// <param name="progress">Told how far a long run (sweeps, tolerance samples) has come; the front end decides how to show it.</param>
    public static Evaluation Evaluate(string text, string path = "", CancellationToken cancel = default, Action<StudyProgress>? progress = null)
    {
        try
        {
            return Run(text, path, cancel, progress);
        }
        catch (Exception e) when (e is not OperationCanceledException)
        {
            var syntax = SafeParse(text);
            var diagnostics = new DiagnosticBag();
            diagnostics.ReportInternalError(e);
            return Finish(path, syntax, new Model.Model(syntax, new SymbolTable(), []), null, [], [], diagnostics);
        }
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

    private static Evaluation Run(string text, string path, CancellationToken cancel, Action<StudyProgress>? progress)
    {
        var syntax = Parser.Parse(text);
        cancel.ThrowIfCancellationRequested();
        var model = Binder.Bind(syntax);
        cancel.ThrowIfCancellationRequested();
        var diagnostics = new DiagnosticBag();
        diagnostics.AddRange(model.Diagnostics);
        if (model.Supplies.IsEmpty)
            return Finish(path, syntax, model, null, [], [], diagnostics);

        var network = NetworkBuilder.Build(model);
        diagnostics.AddRange(network.Diagnostics);
        // A network the builder could not make whole is not solved: its numbers would mislead.
        if (network.Diagnostics.Any(d => d.IsError))
            return Finish(path, syntax, model, network, [], [], diagnostics);

        var study = Study.Run(syntax, model, network, diagnostics, cancel, progress);
        return Finish(path, syntax, model, network, study.Cases, study.Checks, diagnostics);
    }

    private static Evaluation Finish(string path, SyntaxTree syntax, Model.Model model, Network? network,
        ImmutableArray<CaseResult> cases, ImmutableArray<CheckResult> checks, DiagnosticBag diagnostics)
    {
        var ordered = diagnostics.OrderBy(d => d.Span.Start).ThenBy(d => d.Severity).ToImmutableArray();
        return new Evaluation(path, syntax, model, network, cases, checks, ordered);
    }
}

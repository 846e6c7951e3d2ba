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

/// <summary>The pipeline: text → syntax → model → network → solutions → results and checks.</summary>
public static class Evaluator
{
    /// <summary>
    /// Never throws but for cancellation: a fault of the tool itself becomes an error diagnostic, so
    /// the editor and the command line stay up and say what happened.
    /// </summary>
    public static Evaluation Evaluate(string text, string path = "", CancellationToken cancel = default)
    {
        try
        {
            return Run(text, path, cancel);
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

    private static Evaluation Run(string text, string path, CancellationToken cancel)
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

        var normal = NetworkSolver.Solve(network, CaseSpec.Normal, cancel);
        diagnostics.AddRange(normal.Diagnostics);
        if (!normal.Solved)
            return Finish(path, syntax, model, network, [], [], diagnostics);
        Solution? noLoad = null;
        if (!model.Loads.IsEmpty)
        {
            noLoad = NetworkSolver.Solve(network, CaseSpec.NoLoad, cancel);
            diagnostics.AddRange(noLoad.Diagnostics);
        }
        var normalResult = Results.Compute(normal, noLoad?.Solved == true ? noLoad : null);
        var cases = ImmutableArray.CreateBuilder<CaseResult>();
        cases.Add(normalResult);
        foreach (var fault in model.Faults)
        {
            var solved = NetworkSolver.Solve(network, CaseSpec.ForFault(fault), cancel);
            diagnostics.AddRange(solved.Diagnostics);
            if (solved.Solved) cases.Add(Results.Compute(solved, null));
        }
        foreach (var sweep in model.Sweeps) diagnostics.ReportNotEvaluated(sweep.Line, "a sweep");
        var checks = Checks.Evaluate(model, normalResult, diagnostics);
        return Finish(path, syntax, model, network, cases.ToImmutable(), checks, diagnostics);
    }

    private static Evaluation Finish(string path, SyntaxTree syntax, Model.Model model, Network? network,
        ImmutableArray<CaseResult> cases, ImmutableArray<CheckResult> checks, DiagnosticBag diagnostics)
    {
        var ordered = diagnostics.OrderBy(d => d.Span.Start).ThenBy(d => d.Severity).ToImmutableArray();
        return new Evaluation(path, syntax, model, network, cases, checks, ordered);
    }
}

using System.CommandLine;
using WindingNotes.Report.Diagrams;
using WindingNotes.Solve;
using WindingNotes.Workspace;

namespace WindingNotes.Cli;

/// <summary>
/// <c>windingnotes diagram FILE --kind network|one-line|phasors|phase-sets|sweep [-o OUT.svg]</c>: an SVG
/// drawing of the network (phase by phase, or its three-phase part one-line with each unit's clock
/// diagram), of the phasors of a case (by voltage level, or a grid a three-phase set), or of results
/// over a sweep (<c>--result PATH</c>, repeatable).
/// Exit 1 when there is nothing to draw.
/// </summary>
internal static class DiagramCommand
{
    public static Command Create(ConsoleIo io)
    {
        var file = new Argument<string>("file") { Description = "a calculation file ('-' reads standard input)" };
        var kind = new Option<string>("--kind", "-k") { Description = "network, one-line, phasors, phase-sets or sweep", DefaultValueFactory = _ => "network" };
        kind.AcceptOnlyFromAmong("network", "one-line", "phasors", "phase-sets", "sweep");
        var output = new Option<string?>("--output", "-o") { Description = "the SVG file to write (standard output when left out)" };
        var @case = new Option<string>("--case", "-c") { Description = "for phasors and phase-sets: the case to draw, such as 'normal', 'fault F1' or a sweep point 'sweep BR=25 %'", DefaultValueFactory = _ => "normal" };
        var results = new Option<string[]>("--result", "-r")
        {
            Description = "for a sweep: a result to plot, by its path in the JSON report with '*' for any name (repeat for more); load voltages and winding loadings when left out",
        };
        var command = new Command("diagram", "Draw the network (or its three-phase part one-line), the phasors of a case (or of each three-phase set), or results over a sweep, as SVG.") { file, kind, output, @case, results };
        command.SetAction(parsed => Run(io, parsed.GetValue(file)!, parsed.GetValue(kind)!, parsed.GetValue(output), parsed.GetValue(@case)!, parsed.GetValue(results) ?? []));
        return command;
    }

    private static int Run(ConsoleIo io, string path, string kind, string? output, string caseName, string[] results)
    {
        var text = io.Read(path);
        if (text is null) return Cli.Usage;
        // An evaluation keeps a sweep's points only in columns: a point to draw is taken as it is solved.
        CaseResult? point = null;
        Action<CaseResult>? take = kind is "phasors" or "phase-sets" ? c => point ??= c.Case.Name == caseName ? c : null : null;
        HeapPages.Before(text);
        var evaluation = Evaluator.Evaluate(text, ConsoleIo.DisplayName(path), sweepPoint: take);
        string svg;
        switch (kind)
        {
            case "phasors" or "phase-sets":
                if ((evaluation.Cases.FirstOrDefault(c => c.Case.Name == caseName) ?? point) is not { } chosen)
                {
                    var known = evaluation.Cases.IsEmpty ? "the network was not solved" : "cases: " + string.Join(", ", evaluation.Cases.Select(c => $"'{c.Case.Name}'"));
                    io.Error.WriteLine($"windingnotes: no case '{caseName}' to draw ({known})");
                    return Cli.Failed;
                }
                svg = kind == "phasors" ? PhasorDiagram.Draw(evaluation, chosen).Svg : PhaseSetDiagram.Draw(evaluation, chosen).Svg;
                break;
            case "one-line":
                svg = OneLineDiagram.Draw(evaluation).Svg;
                break;
            case "sweep":
                if (SweepPlot.Draw(evaluation, results, out var problem) is not { } plot)
                {
                    io.Error.WriteLine($"windingnotes: nothing to plot: {problem}");
                    return Cli.Failed;
                }
                svg = plot.Svg;
                break;
            default:
                svg = NetworkDiagram.Draw(evaluation).Svg;
                break;
        }
        if (output is null)
        {
            io.Output.Write(svg);
            return Cli.Ok;
        }
        return io.Replace(output, svg) ? Cli.Ok : Cli.Usage;
    }
}

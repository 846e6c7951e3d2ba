using System.CommandLine;
using WindingNotes.Report.Diagrams;
using WindingNotes.Workspace;

namespace WindingNotes.Cli;

/// <summary>
/// <c>windingnotes diagram FILE --kind network|phasors|sweep [-o OUT.svg]</c>: an SVG drawing of the
/// network, of the phasors of a case, or of results over a sweep (<c>--result PATH</c>, repeatable).
/// Exit 1 when there is nothing to draw.
/// </summary>
internal static class DiagramCommand
{
    public static Command Create(ConsoleIo io)
    {
        var file = new Argument<string>("file") { Description = "a calculation file ('-' reads standard input)" };
        var kind = new Option<string>("--kind", "-k") { Description = "network, phasors or sweep", DefaultValueFactory = _ => "network" };
        kind.AcceptOnlyFromAmong("network", "phasors", "sweep");
        var output = new Option<string?>("--output", "-o") { Description = "the SVG file to write (standard output when left out)" };
        var @case = new Option<string>("--case", "-c") { Description = "for phasors: the case to draw, such as 'normal' or 'fault F1'", DefaultValueFactory = _ => "normal" };
        var results = new Option<string[]>("--result", "-r")
        {
            Description = "for a sweep: a result to plot, by its path in the JSON report with '*' for any name (repeat for more); load voltages and winding loadings when left out",
        };
        var command = new Command("diagram", "Draw the network, the phasors of a case, or results over a sweep, as SVG.") { file, kind, output, @case, results };
        command.SetAction(parsed => Run(io, parsed.GetValue(file)!, parsed.GetValue(kind)!, parsed.GetValue(output), parsed.GetValue(@case)!, parsed.GetValue(results) ?? []));
        return command;
    }

    private static int Run(ConsoleIo io, string path, string kind, string? output, string caseName, string[] results)
    {
        var text = io.Read(path);
        if (text is null) return Cli.Usage;
        var evaluation = Evaluator.Evaluate(text, ConsoleIo.DisplayName(path));
        string svg;
        switch (kind)
        {
            case "phasors":
                if (evaluation.Cases.FirstOrDefault(c => c.Case.Name == caseName) is not { } chosen)
                {
                    var known = evaluation.Cases.IsEmpty ? "the network was not solved" : "cases: " + string.Join(", ", evaluation.Cases.Select(c => $"'{c.Case.Name}'"));
                    io.Error.WriteLine($"windingnotes: no case '{caseName}' to draw ({known})");
                    return Cli.Failed;
                }
                svg = PhasorDiagram.Draw(evaluation, chosen).Svg;
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

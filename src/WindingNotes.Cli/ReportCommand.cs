using System.CommandLine;
using WindingNotes.Report;
using WindingNotes.Workspace;

namespace WindingNotes.Cli;

/// <summary><c>windingnotes report FILE [--format text|md|json]</c>: the full results.</summary>
internal static class ReportCommand
{
    public static Command Create(ConsoleIo io)
    {
        var file = new Argument<string>("file") { Description = "a calculation file ('-' reads standard input)" };
        var format = new Option<string>("--format", "-f") { Description = "text, md (Markdown) or json", DefaultValueFactory = _ => "text" };
        format.AcceptOnlyFromAmong("text", "md", "json");
        var command = new Command("report", "Evaluate a file and print every result.") { file, format };
        command.SetAction(parsed => Run(io, parsed.GetValue(file)!, parsed.GetValue(format)!));
        return command;
    }

    private static int Run(ConsoleIo io, string path, string format)
    {
        var text = io.Read(path);
        if (text is null) return Cli.Usage;
        var evaluation = ProgressDisplay.Evaluate(io, text, ConsoleIo.DisplayName(path));
        // The plain report goes out as it is made: a large file's is never one string.
        if (format == "text") TextReport.Write(evaluation, io.Output);
        else io.Output.Write(format == "json" ? JsonReport.Write(evaluation) : MarkdownReport.Write(evaluation));
        return evaluation.HasErrors || !evaluation.AllChecksPass ? Cli.Failed : Cli.Ok;
    }
}

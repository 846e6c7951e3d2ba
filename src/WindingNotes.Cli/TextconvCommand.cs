using System.CommandLine;
using WindingNotes.Report;
using WindingNotes.Workspace;

namespace WindingNotes.Cli;

/// <summary>
/// <c>windingnotes textconv FILE</c>: what git shows in place of a calculation file's bytes when the file
/// has <c>diff=windingnotes</c>: the file as written, then its plain report, so <c>git diff</c> shows both
/// the edit and how the results moved. Exits 0 even when checks fail, else git would refuse the diff.
/// </summary>
internal static class TextconvCommand
{
    public const string Divider = "=== results ===";

    public static Command Create(ConsoleIo io)
    {
        var file = new Argument<string>("file") { Description = "a calculation file (git passes a temporary copy)" };
        var command = new Command("textconv", "Print a file followed by its results, for git's textconv (see the README).") { file };
        command.SetAction(parsed =>
        {
            var path = parsed.GetValue(file)!;
            var text = io.Read(path);
            if (text is null) return Cli.Usage;
            io.Output.Write(text);
            if (text.Length > 0 && !text.EndsWith('\n')) io.Output.WriteLine();
            io.Output.WriteLine();
            io.Output.WriteLine(Divider);
            // The path is left out: git hands over a temporary copy whose name changes each time.
            HeapPages.Before(text);
            TextReport.Write(Evaluator.Evaluate(text, ConsoleIo.DisplayName(path)), io.Output, title: false);
            return Cli.Ok;
        });
        return command;
    }
}

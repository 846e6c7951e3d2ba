using System.CommandLine;
using WindingNotes.Syntax;

namespace WindingNotes.Cli;

/// <summary>
/// <c>windingnotes fmt FILE... [--check]</c>: rewrites each file in the canonical layout, replacing it
/// atomically, or with <c>--check</c> only says which files would change and exits 1 if any would.
/// '-' formats standard input to standard output.
/// </summary>
internal static class FmtCommand
{
    public static Command Create(ConsoleIo io)
    {
        var files = new Argument<string[]>("files") { Description = "calculation files ('-' formats standard input to standard output)", Arity = ArgumentArity.OneOrMore };
        var check = new Option<bool>("--check") { Description = "change nothing; exit 1 when a file is not in the canonical layout" };
        var command = new Command("fmt", "Rewrite files in the canonical layout (comments, blank lines and line breaks kept).") { files, check };
        command.SetAction(parsed => Run(io, parsed.GetValue(files)!, parsed.GetValue(check)));
        return command;
    }

    private static int Run(ConsoleIo io, string[] files, bool check)
    {
        var status = Cli.Ok;
        foreach (var path in files)
        {
            var text = io.Read(path);
            if (text is null)
            {
                status = Cli.Usage;
                continue;
            }
            var formatted = Formatter.Format(Parser.Parse(text));
            if (path == "-")
            {
                if (!check) io.Output.Write(formatted);
                else if (formatted != text) status = Math.Max(status, Cli.Failed);
                continue;
            }
            if (formatted == text) continue;
            if (check)
            {
                io.Output.WriteLine($"would change: {path}");
                status = Math.Max(status, Cli.Failed);
            }
            else if (io.Replace(path, formatted)) io.Output.WriteLine($"formatted: {path}");
            else status = Cli.Usage;
        }
        return status;
    }
}

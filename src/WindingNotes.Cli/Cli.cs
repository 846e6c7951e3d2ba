using System.CommandLine;
using System.CommandLine.Help;

namespace WindingNotes.Cli;

/// <summary>
/// The <c>windingnotes</c> command. Thin: it reads files, calls the Workspace and the Report, writes
/// what they return. Exit codes: 0 all well, 1 an error or a failed check, 2 bad usage or an unreadable file.
/// </summary>
public static class Cli
{
    public const int Ok = 0, Failed = 1, Usage = 2;

    public static int Run(string[] args, TextWriter output, TextWriter error, Stream input)
    {
        var io = new ConsoleIo(output, error, input);
        // A command named here rather than a RootCommand, which reads the executable's name through
        // reflection at every start (4 % of a ten-line check's native start); help and version as a root's.
        var root = new Command("windingnotes", "Evaluate tapped-winding calculation files (*.wn): voltages, currents, losses, ratings and checks.")
        {
            new HelpOption(),
            new VersionOption(),
        };
        root.Subcommands.Add(CheckCommand.Create(io));
        root.Subcommands.Add(ReportCommand.Create(io));
        root.Subcommands.Add(FmtCommand.Create(io));
        root.Subcommands.Add(DiffCommand.Create(io));
        root.Subcommands.Add(TextconvCommand.Create(io));
        root.Subcommands.Add(DiagramCommand.Create(io));
        root.Subcommands.Add(LspCommand.Create(io));
        var parsed = root.Parse(DiffCommand.JoinPercent(args));
        if (parsed.Errors.Count > 0)
        {
            foreach (var e in parsed.Errors) error.WriteLine($"windingnotes: {e.Message}");
            error.WriteLine("try 'windingnotes --help'");
            return Usage;
        }
        try
        {
            return parsed.Invoke(new InvocationConfiguration { Output = output, Error = error, EnableDefaultExceptionHandler = false });
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            error.WriteLine($"windingnotes: internal error: {e.Message}");
            return Usage;
        }
    }
}

/// <summary>Where a command reads and writes; tests pass their own.</summary>
public sealed partial record ConsoleIo(TextWriter Output, TextWriter Error, Stream Input)
{
    public static string DisplayName(string path) => path == "-" ? "<stdin>" : path;
}

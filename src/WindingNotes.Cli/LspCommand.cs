using System.CommandLine;
using WindingNotes.LanguageServer;

namespace WindingNotes.Cli;

/// <summary>
/// <c>windingnotes lsp</c>: the language server on standard input and output. Editors start it;
/// its trace goes to standard error. Exit code 0 after the client's 'shutdown', 1 without.
/// </summary>
internal static class LspCommand
{
    public static Command Create(ConsoleIo io)
    {
        // Editors' clients add --stdio when they talk over standard input and output; it is the only transport.
        var stdio = new Option<bool>("--stdio") { Description = "talk over standard input and output (the default and only transport)" };
        var debounce = new Option<int>("--debounce") { Description = "milliseconds to wait after a change before evaluating (default 0: changes are coalesced)", DefaultValueFactory = _ => 0 };
        var command = new Command("lsp", "Run the language server over standard input and output, for editors.") { stdio, debounce };
        command.SetAction(parsed => Run(io, Math.Max(0, parsed.GetValue(debounce))));
        return command;
    }

    private static int Run(ConsoleIo io, int debounce)
    {
        using var input = Console.OpenStandardInput();
        using var output = Console.OpenStandardOutput();
        var options = new ServerOptions { Debounce = TimeSpan.FromMilliseconds(debounce), Log = io.Error };
        return Server.RunAsync(input, output, options).GetAwaiter().GetResult();
    }
}

using Spectre.Console;
using WindingNotes.Workspace;

namespace WindingNotes.Cli;

/// <summary>
/// Evaluates a file, showing a progress bar on standard error while a long run (many sweep points
/// or tolerance samples) goes on, but only when standard error is this process's terminal: in a
/// pipe, a file or a test nothing is written.
/// </summary>
internal static class ProgressDisplay
{
    /// <summary>Runs shorter than this many solves finish before a bar would be worth drawing.</summary>
    private const long Worthwhile = 500;

    public static Evaluation Evaluate(ConsoleIo io, string text, string path)
    {
        if (!ReferenceEquals(io.Error, Console.Error) || Console.IsErrorRedirected) return Evaluator.Evaluate(text, path);
        var console = AnsiConsole.Create(new AnsiConsoleSettings { Out = new AnsiConsoleOutput(Console.Error) });
        Evaluation? evaluation = null;
        console.Progress().AutoClear(true).HideCompleted(true).Start(context =>
        {
            ProgressTask? task = null;
            evaluation = Evaluator.Evaluate(text, path, default, p =>
            {
                if (p.Total < Worthwhile) return;
                task ??= context.AddTask(Markup.Escape(path), maxValue: p.Total);
                task.Value = p.Done;
            });
        });
        return evaluation!;
    }
}

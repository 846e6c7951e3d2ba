using System.Diagnostics;
using WindingNotes.Workspace;

namespace WindingNotes.Cli;

/// <summary>
/// Evaluates a file, showing a progress line on standard error while a long run (many sweep points
/// or tolerance samples) goes on, but only when standard error is this process's terminal: in a
/// pipe, a file or a test nothing is written. The line is drawn here (the file, a bar, the share done
/// and the time left, redrawn in place at most ten times a second and erased at the end) rather than
/// by a console library, whose types and tables the native command would write out at every start.
/// </summary>
internal static class ProgressDisplay
{
    /// <summary>Runs shorter than this many solves finish before a bar would be worth drawing.</summary>
    private const long Worthwhile = 500;

    private const int BarWidth = 30;

    public static Evaluation Evaluate(ConsoleIo io, string text, string path)
    {
        HeapPages.Before(text);
        if (!ReferenceEquals(io.Error, Console.Error) || Console.IsErrorRedirected) return Evaluator.Evaluate(text, path);
        var clock = Stopwatch.StartNew();
        var drawnAt = -1L;
        try
        {
            return Evaluator.Evaluate(text, path, default, p =>
            {
                var now = clock.ElapsedMilliseconds;
                if (p.Total < Worthwhile || (drawnAt >= 0 && now - drawnAt < 100 && p.Done < p.Total)) return;
                drawnAt = now;
                io.Error.Write(Line(path, p.Done, p.Total, now));
            });
        }
        finally
        {
            // Erase the line: the command's own output follows on standard output.
            if (drawnAt >= 0) io.Error.Write("\r\e[2K");
        }
    }

    private static string Line(string path, long done, long total, long elapsedMs)
    {
        var filled = (int)(BarWidth * done / total);
        var left = done == 0 ? "" : $"  {TimeSpan.FromMilliseconds((double)elapsedMs * (total - done) / done):hh\\:mm\\:ss} left";
        return $"\r{path} [{new string('#', filled)}{new string('-', BarWidth - filled)}] {100 * done / total,3}%{left}\e[K";
    }
}

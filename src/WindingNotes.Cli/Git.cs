using System.Diagnostics;

namespace WindingNotes.Cli;

/// <summary>A file as it was at a git revision, read with the git command.</summary>
internal static class Git
{
    /// <summary>
    /// The text of <paramref name="path"/> at <paramref name="revision"/>, or null after a message.
    /// A file that did not exist at that revision reads as empty, so all its results show as new.
    /// </summary>
    public static string? Show(ConsoleIo io, string revision, string path)
    {
        var full = Path.GetFullPath(path);
        var start = new ProcessStartInfo("git")
        {
            WorkingDirectory = Path.GetDirectoryName(full)!,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            StandardOutputEncoding = System.Text.Encoding.UTF8,
        };
        // "REV:./NAME" names the file relative to the working directory, wherever the repository's root is.
        foreach (var a in new[] { "show", "--no-textconv", $"{revision}:./{Path.GetFileName(full)}" }) start.ArgumentList.Add(a);
        try
        {
            using var git = Process.Start(start)!;
            var error = git.StandardError.ReadToEndAsync();
            var text = git.StandardOutput.ReadToEnd();
            git.WaitForExit();
            if (git.ExitCode == 0) return text;
            var message = error.Result.Trim();
            if (message.Contains("exists on disk, but not in") || message.Contains("does not exist in")) return "";
            io.Error.WriteLine($"windingnotes: cannot read '{path}' at revision '{revision}': {message}");
            return null;
        }
        catch (Exception e) when (e is System.ComponentModel.Win32Exception or InvalidOperationException or IOException)
        {
            io.Error.WriteLine($"windingnotes: cannot run git to read '{path}' at revision '{revision}': {e.Message}");
            return null;
        }
    }
}

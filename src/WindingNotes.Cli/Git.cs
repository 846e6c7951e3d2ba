using System.Diagnostics;

namespace WindingNotes.Cli;

/// <summary>
/// A file as it was at a git revision, read with the git command. Nothing the user typed reaches git
/// as an option: a revision that begins with '-' is refused, the revision is resolved to a commit with
/// <c>rev-parse --verify --end-of-options</c> and only that commit's hash is passed on, and the file
/// is named by git's own path of its directory inside the working tree.
/// </summary>
internal static class Git
{
    /// <summary>
    /// The text of <paramref name="path"/> at <paramref name="revision"/>, or null after a message.
    /// A file that did not exist at that revision reads as empty, so all its results show as new.
    /// </summary>
    public static string? Show(ConsoleIo io, string revision, string path)
    {
        string? Refuse(string why)
        {
            io.Error.WriteLine($"windingnotes: cannot read '{path}' at revision '{revision}': {why}");
            return null;
        }
        if (revision.Length == 0 || revision.StartsWith('-')) return Refuse("a revision cannot be empty or begin with '-'");
        var full = Path.GetFullPath(path);
        var directory = Path.GetDirectoryName(full)!;
        var name = Path.GetFileName(full);
        if (name.Length == 0 || !Directory.Exists(directory)) return Refuse("no such file");
        try
        {
            // Inside the working tree (not outside it, not inside .git), with the directory's path in the repository.
            var (whereOk, where, whereError) = Run(directory, "rev-parse", "--is-inside-work-tree", "--show-prefix");
            if (!whereOk) return Refuse(whereError);
            var lines = where.Split('\n');
            if (lines[0] != "true" || lines.Length < 2) return Refuse("the file is not inside a git working tree");
            var prefix = lines[1];
            if (prefix.StartsWith('/') || prefix.Split('/').Contains("..")) return Refuse("the file is not inside the repository");

            var (commitOk, commit, commitError) = Run(directory, "rev-parse", "--verify", "--quiet", "--end-of-options", revision + "^{commit}");
            commit = commit.Trim();
            if (!commitOk || commit.Length == 0 || !commit.All(char.IsAsciiHexDigit)) return Refuse(commitError.Length > 0 ? commitError : "no such revision");

            var (ok, text, error) = Run(directory, "show", "--no-textconv", $"{commit}:{prefix}{name}");
            if (ok) return text;
            if (error.Contains("exists on disk, but not in") || error.Contains("does not exist in")) return "";
            return Refuse(error);
        }
        catch (Exception e) when (e is System.ComponentModel.Win32Exception or InvalidOperationException or IOException)
        {
            io.Error.WriteLine($"windingnotes: cannot run git to read '{path}' at revision '{revision}': {e.Message}");
            return null;
        }
    }

    /// <summary>Runs git without a shell, each argument passed as one.</summary>
    private static (bool Ok, string Output, string Error) Run(string directory, params string[] args)
    {
        var start = new ProcessStartInfo("git")
        {
            WorkingDirectory = directory,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            StandardOutputEncoding = System.Text.Encoding.UTF8,
        };
        foreach (var a in args) start.ArgumentList.Add(a);
        using var git = Process.Start(start)!;
        var error = git.StandardError.ReadToEndAsync();
        var output = git.StandardOutput.ReadToEnd();
        git.WaitForExit();
        return (git.ExitCode == 0, output, error.Result.Trim());
    }
}

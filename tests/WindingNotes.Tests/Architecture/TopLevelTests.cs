using System.Diagnostics;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Architecture;

/// <summary>
/// The repository's top level holds exactly the project's own entries: what a run leaves behind
/// (a benchmark's logs, a build's output) is never committed beside them.
/// </summary>
public class TopLevelTests
{
    private static readonly string[] Allowed =
        [".ci", "DEVELOPERS.md", "LICENSE", "README.md", "WindingNotes.sln", "editors", "examples", "grammar", "src", "tests"];

    [Fact]
    public void The_committed_top_level_is_the_projects_own()
    {
        var git = Process.Start(new ProcessStartInfo("git", "ls-files")
        {
            WorkingDirectory = Snapshot.RepositoryRoot,
            RedirectStandardOutput = true,
            UseShellExecute = false,
        })!;
        var files = git.StandardOutput.ReadToEnd();
        git.WaitForExit();
        Assert.Equal(0, git.ExitCode);
        var top = files.Split('\n', StringSplitOptions.RemoveEmptyEntries).Select(f => f.Split('/')[0]).Distinct().Order(StringComparer.Ordinal);
        Assert.Equal(Allowed.Order(StringComparer.Ordinal), top);
    }
}

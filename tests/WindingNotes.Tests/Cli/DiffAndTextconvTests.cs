using System.Diagnostics;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Cli;

/// <summary>The diff and textconv commands, and the git set-up the README shows, in a temporary repository.</summary>
public class DiffAndTextconvTests
{
    private static readonly string Alder = File.ReadAllText(Command.Example("alder-creek-boost.wn"));

    private static string Git(string directory, params string[] args)
    {
        var start = new ProcessStartInfo("git") { WorkingDirectory = directory, RedirectStandardOutput = true, RedirectStandardError = true };
        // A repository of its own: no user or system configuration leaks in.
        start.Environment["GIT_CONFIG_GLOBAL"] = "/dev/null";
        start.Environment["GIT_CONFIG_NOSYSTEM"] = "1";
        foreach (var a in new[] { "-c", "user.name=Test", "-c", "user.email=test@example.invalid", "-c", "init.defaultBranch=main" }.Concat(args)) start.ArgumentList.Add(a);
        using var git = Process.Start(start)!;
        var error = git.StandardError.ReadToEndAsync();
        var output = git.StandardOutput.ReadToEnd();
        git.WaitForExit();
        Assert.True(git.ExitCode == 0, $"git {string.Join(' ', args)}: {error.Result}");
        return output;
    }

    /// <summary>The command line that runs the built tool, as the README's git config line would name it.</summary>
    private static string Tool => $"dotnet \"{typeof(WindingNotes.Cli.Cli).Assembly.Location}\"";

    [Fact]
    public void Diff_of_two_files_exits_1_when_an_expectation_now_fails_and_0_otherwise()
    {
        using var dir = new TemporaryDirectory();
        File.WriteAllText(dir.File("old.wn"), Alder);
        File.WriteAllText(dir.File("new.wn"), Alder.Replace("208 V", "200 V"));
        var (code, output, _) = Command.Run("", "diff", dir.File("old.wn"), dir.File("new.wn"));
        Assert.Equal(1, code);
        Assert.Contains("now FAIL (was pass)  line 14: expect voltage X1 H2 between 225 V and 235 V: 228.1 V -> ", output);
        Assert.Contains("  node H1\n    voltage: 208.0 V -> 200.0 V (-3.846 %)\n", output);

        Assert.Equal(0, Command.Run("", "diff", dir.File("new.wn"), dir.File("old.wn")).Code);
        Assert.Equal(0, Command.Run("", "diff", dir.File("old.wn"), dir.File("old.wn")).Code);
    }

    [Theory]
    [InlineData("5", "a")]
    [InlineData("5 %", "b")]
    [InlineData("5%", "c")]
    public void The_threshold_is_read_in_percent_with_or_without_its_sign(string threshold, string _)
    {
        using var dir = new TemporaryDirectory();
        File.WriteAllText(dir.File("old.wn"), Alder);
        File.WriteAllText(dir.File("new.wn"), Alder.Replace("208 V", "200 V").Replace("3.2 kW", "3.6 kW"));
        var args = new[] { "diff", dir.File("old.wn"), dir.File("new.wn"), "--threshold" }.Concat(threshold.Split(' ')).ToArray();
        var (code, output, error) = Command.Run("", args);
        Assert.True(code == 1, error);
        Assert.Contains("(changes above 5 %)", output);
        Assert.DoesNotContain("node H1", output);
        Assert.Contains("  section LV\n    current: ", output);
    }

    [Fact]
    public void Help_and_the_readme_give_the_same_threshold_default_in_percent()
    {
        var readme = string.Join(' ', File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "README.md")).Split((char[])[' ', '\n'], StringSplitOptions.RemoveEmptyEntries));
        var stated = System.Text.RegularExpressions.Regex.Match(readme, @"`--threshold` \(default `([0-9.]+) %`");
        Assert.True(stated.Success, "the README states the threshold's default as `N %`");
        Assert.Equal(WindingNotes.Report.ResultDiff.DefaultThreshold * 100, double.Parse(stated.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture), 12);
        var (code, help, _) = Command.Run("", "diff", "--help");
        Assert.Equal(0, code);
        var line = help.Split('\n').Single(l => l.Contains("--threshold"));
        Assert.Contains("--threshold <percent>", line);
        Assert.EndsWith($"[default: {stated.Groups[1].Value}]", line.TrimEnd());
    }

    [Fact]
    public void Bad_diff_usage_exits_2()
    {
        Assert.Equal(2, Command.Run("", "diff", "one.wn").Code);
        Assert.Equal(2, Command.Run("", "diff", "a.wn", "b.wn", "--threshold", "lots").Code);
        Assert.Equal(2, Command.Run("", "diff", "/no/such/a.wn", "/no/such/b.wn").Code);
        Assert.Equal(2, Command.Run("", "diff", "a.wn", "b.wn", "--format", "pdf").Code);
    }

    [Fact]
    public void Textconv_prints_the_file_then_its_results_without_the_path_and_exits_0_on_a_failed_check()
    {
        var failing = Alder.Replace("between 225 V and 235 V", "between 230 V and 235 V");
        var (code, output, _) = Command.Run(failing, "textconv", "-");
        Assert.Equal(0, code);
        Assert.StartsWith(failing + "\n" + "=== results ===" + "\n", output);
        Assert.Contains("FAIL  line 14: expect voltage X1 H2 between 230 V and 235 V (228.1 V)", output);
        Assert.DoesNotContain("Results for", output);
        Assert.Equal(2, Command.Run("", "textconv", "/no/such/file.wn").Code);
    }

    [Fact]
    public void In_a_git_repository_git_diff_shows_the_results_that_moved_and_diff_rev_compares_with_a_revision()
    {
        using var dir = new TemporaryDirectory();
        var file = dir.File("feed.wn");
        Git(dir.Path, "init", "-q");
        // The two lines the README shows.
        File.WriteAllText(dir.File(".gitattributes"), "*.wn diff=windingnotes\n");
        Git(dir.Path, "config", "diff.windingnotes.textconv", $"{Tool} textconv");
        File.WriteAllText(file, Alder);
        Git(dir.Path, "add", ".");
        Git(dir.Path, "commit", "-q", "-m", "first");
        File.WriteAllText(file, Alder.Replace("208 V", "200 V"));

        var diff = Git(dir.Path, "diff");
        Assert.Contains("-supply mains H1 H2 208 V\n+supply mains H1 H2 200 V\n", diff);
        Assert.Contains("-    X1           228.1 V angle -0.04 deg\n", diff);
        Assert.Contains("\n-  pass  line 14: expect voltage X1 H2 between 225 V and 235 V (228.1 V)\n", diff);
        Assert.Contains("\n+  FAIL  line 14: expect voltage X1 H2 between 225 V and 235 V (219.3 V)\n", diff);
        // Results that did not move stay out of the diff: only changed lines and their context show.
        Assert.DoesNotContain("+    H2 ", diff);

        var (code, output, error) = Command.Run("", "diff", "--rev", "HEAD", file, "--format", "md");
        Assert.True(code == 1, error);
        Assert.Contains($"### Results of `{file}` against `{file} at HEAD`", output);
        Assert.Contains("<details><summary>node H1: 1 result, the most: voltage -3.846 %</summary>\n\n| result | old | new | change |\n|---|--:|--:|--:|\n| voltage | 208.0 V | 200.0 V | -3.846 % |\n", output);

        Git(dir.Path, "commit", "-q", "-am", "second");
        (code, output, _) = Command.Run("", "diff", "--rev", "HEAD~1", file);
        Assert.Equal(1, code);
        (code, output, _) = Command.Run("", "diff", "--rev", "HEAD", file);
        Assert.Equal(0, code);
        Assert.Contains("no result moved", output);

        // A file new since the revision shows every result as new; an unknown revision is bad usage.
        File.WriteAllText(dir.File("new.wn"), Alder);
        (code, output, _) = Command.Run("", "diff", "--rev", "HEAD", dir.File("new.wn"));
        Assert.Equal(0, code);
        Assert.Contains("case normal: new", output);
        (code, _, error) = Command.Run("", "diff", "--rev", "no-such-revision", file);
        Assert.Equal(2, code);
        Assert.Contains("cannot read", error);
    }

    [Fact]
    public void A_revision_or_a_path_never_reaches_git_as_an_option_or_outside_the_repository()
    {
        using var dir = new TemporaryDirectory();
        var file = dir.File("feed.wn");
        Git(dir.Path, "init", "-q");
        File.WriteAllText(file, Alder);
        Git(dir.Path, "add", ".");
        Git(dir.Path, "commit", "-q", "-m", "first");
        var written = dir.File("written-by-git");
        // Reproductions: git once took these for its own options, writing or reading a file.
        foreach (var revision in new[] { $"--output={written}", "-O/etc/passwd", "-", "HEAD:feed.wn", "HEAD --output=x" })
        {
            var (code, output, error) = Command.Run("", "diff", $"--rev={revision}", file);
            Assert.True(code == 2 && error.Contains("cannot read"), $"{revision}: {code} {output} {error}");
        }
        Assert.False(File.Exists(written));
        // A file outside the working tree, or inside the repository's own folder, is refused by its place.
        using var outside = new TemporaryDirectory();
        File.WriteAllText(outside.File("feed.wn"), Alder);
        var (outsideCode, _, outsideError) = Command.Run("", "diff", "--rev", "HEAD", outside.File("feed.wn"));
        Assert.Equal(2, outsideCode);
        Assert.Contains("cannot read", outsideError);
        var (gitCode, _, gitError) = Command.Run("", "diff", "--rev", "HEAD", Path.Combine(dir.Path, ".git", "HEAD"));
        Assert.Equal(2, gitCode);
        Assert.Contains("not inside a git working tree", gitError);
        // A file in a folder of the repository is named by its path there; the revision is any commit-ish.
        Directory.CreateDirectory(dir.File("sub"));
        File.Move(file, dir.File("sub/feed.wn"));
        Git(dir.Path, "add", "-A");
        Git(dir.Path, "commit", "-q", "-m", "moved");
        var (subCode, subOutput, subError) = Command.Run("", "diff", "--rev", "main", dir.File("sub/feed.wn"));
        Assert.True(subCode == 0, subError);
        Assert.Contains("no result moved", subOutput);
    }
}

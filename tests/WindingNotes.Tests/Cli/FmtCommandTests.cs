using System.Text;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Cli;

public class FmtCommandTests
{
    private const string Messy = "core  K1   rating 0.5 kVA\t# the core\nwinding HV on K1 from H1 to H2 turns 240\n";
    private const string Tidy = "core K1 rating 0.5 kVA # the core\nwinding HV on K1 turns 240 from H1 to H2\n";

    [Fact]
    public void Check_exits_1_on_a_file_that_would_change_then_fmt_rewrites_it_and_check_passes()
    {
        using var dir = new TemporaryDirectory();
        var file = dir.File("a.wn");
        File.WriteAllText(file, Messy);

        var (code, output, _) = Command.Run("", "fmt", "--check", file);
        Assert.Equal(1, code);
        Assert.Contains($"would change: {file}", output);
        Assert.Equal(Messy, File.ReadAllText(file));

        (code, output, _) = Command.Run("", "fmt", file);
        Assert.Equal(0, code);
        Assert.Contains($"formatted: {file}", output);
        Assert.Equal(Tidy, File.ReadAllText(file));
        Assert.Equal(["a.wn"], Directory.GetFiles(dir.Path).Select(Path.GetFileName));

        (code, output, _) = Command.Run("", "fmt", "--check", file);
        Assert.Equal(0, code);
        Assert.Equal("", output);
    }

    [Fact]
    public void Standard_input_is_formatted_to_standard_output()
    {
        Assert.Equal((0, Tidy, ""), Command.Run(Messy, "fmt", "-"));
        Assert.Equal(1, Command.Run(Messy, "fmt", "--check", "-").Code);
        Assert.Equal((0, "", ""), Command.Run(Tidy, "fmt", "--check", "-"));
    }

    [Fact]
    public void The_byte_order_mark_the_permissions_and_a_symbolic_link_are_kept()
    {
        using var dir = new TemporaryDirectory();
        var file = dir.File("b.wn");
        File.WriteAllBytes(file, [0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes(Messy)]);
        var link = dir.File("link.wn");
        File.CreateSymbolicLink(link, file);
        var mode = UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.GroupRead;
        if (!OperatingSystem.IsWindows()) File.SetUnixFileMode(file, mode);

        Assert.Equal(0, Command.Run("", "fmt", link).Code);

        Assert.Equal([0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes(Tidy)], File.ReadAllBytes(file));
        Assert.NotNull(new FileInfo(link).LinkTarget);
        if (!OperatingSystem.IsWindows()) Assert.Equal(mode, File.GetUnixFileMode(file));
    }

    [Fact]
    public void A_file_that_is_not_utf8_is_left_as_it_is_and_the_others_are_still_formatted()
    {
        using var dir = new TemporaryDirectory();
        var latin1 = dir.File("latin1.wn");
        byte[] bytes = [.. Encoding.ASCII.GetBytes("let r = 5 ohm  # "), 0xB5, 0x0A];
        File.WriteAllBytes(latin1, bytes);
        var good = dir.File("good.wn");
        File.WriteAllText(good, Messy);

        var (code, _, error) = Command.Run("", "fmt", latin1, good, dir.File("missing.wn"));

        Assert.Equal(2, code);
        Assert.Contains("is not UTF-8 text", error);
        Assert.Contains("cannot read", error);
        Assert.Equal(bytes, File.ReadAllBytes(latin1));
        Assert.Equal(Tidy, File.ReadAllText(good));
    }

    [Fact]
    public void A_line_that_does_not_parse_is_kept_exactly()
    {
        const string broken = "core K1 rating (  broken  \nground   N\n";
        Assert.Equal((0, "core K1 rating (  broken  \nground N\n", ""), Command.Run(broken, "fmt", "-"));
    }

    [Fact]
    public void Owner_group_and_mode_are_kept_and_a_killed_run_leaves_nothing_behind()
    {
        if (!OperatingSystem.IsLinux()) return;
        using var dir = new TemporaryDirectory();
        var file = dir.File("a.wn");
        File.WriteAllText(file, Messy);
        File.SetUnixFileMode(file, UnixFileMode.UserRead | UnixFileMode.UserWrite);
        // Only root may give a file away; elsewhere the owner is the user's own and kept as well.
        var root = Environment.UserName == "root";
        if (root)
        {
            using var chown = System.Diagnostics.Process.Start("chown", ["1234:5678", file])!;
            chown.WaitForExit();
        }
        var before = Owner(file);
        var leftover = dir.File(".a.wn.windingnotes-fmt.2147483646.tmp");
        File.WriteAllText(leftover, "left by a run that was killed");

        Assert.Equal(0, Command.Run("", "fmt", file).Code);

        Assert.Equal(Tidy, File.ReadAllText(file));
        Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite, File.GetUnixFileMode(file));
        Assert.Equal(before, Owner(file));
        if (root) Assert.Equal("1234:5678", before);
        Assert.False(File.Exists(leftover));
        Assert.Equal(["a.wn"], Directory.GetFiles(dir.Path).Select(Path.GetFileName));
    }

    private static string Owner(string path)
    {
        var stat = System.Diagnostics.Process.Start(new System.Diagnostics.ProcessStartInfo("stat", ["-c", "%u:%g", path]) { RedirectStandardOutput = true })!;
        var text = stat.StandardOutput.ReadToEnd().Trim();
        stat.WaitForExit();
        return text;
    }

    [Fact]
    public void Hard_links_read_only_files_and_links_out_of_their_folder_are_refused_and_left_as_they_were()
    {
        if (!OperatingSystem.IsLinux()) return;
        using var dir = new TemporaryDirectory();
        using var elsewhere = new TemporaryDirectory();
        var linked = dir.File("linked.wn");
        File.WriteAllText(linked, Messy);
        System.Diagnostics.Process.Start("ln", [linked, dir.File("other-name.wn")])!.WaitForExit();
        var readOnly = dir.File("read-only.wn");
        File.WriteAllText(readOnly, Messy);
        File.SetUnixFileMode(readOnly, UnixFileMode.UserRead | UnixFileMode.GroupRead);
        var outside = elsewhere.File("outside.wn");
        File.WriteAllText(outside, Messy);
        File.CreateSymbolicLink(dir.File("to-outside.wn"), outside);
        Directory.CreateDirectory(dir.File("sub"));
        File.WriteAllText(dir.File("sub/inside.wn"), Messy);
        File.CreateSymbolicLink(dir.File("to-inside.wn"), dir.File("sub/inside.wn"));

        var (code, _, error) = Command.Run("", "fmt", linked, readOnly, dir.File("to-outside.wn"), dir.File("to-inside.wn"));

        Assert.Equal(2, code);
        Assert.Contains("has 2 names (hard links)", error);
        Assert.Contains("it is read-only", error);
        Assert.Contains("outside the folder it was named from", error);
        foreach (var f in new[] { linked, dir.File("other-name.wn"), readOnly, outside }) Assert.Equal(Messy, File.ReadAllText(f));
        Assert.Equal(Tidy, File.ReadAllText(dir.File("sub/inside.wn")));
    }
}

using System.Diagnostics;
using Xunit;

namespace WindingNotes.Tests.Support;

/// <summary>
/// Renders SVG to PNG with rsvg-convert (Debian's librsvg2-bin), as a browser would draw it. Where
/// the program is missing the test is skipped, except under CI (CI=true), which installs it and so
/// must run the check.
/// </summary>
public static class Renderer
{
    public const string Program = "rsvg-convert";

    public static bool Available { get; } = Find() is not null;

    private static string? Find() =>
        (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator)
            .Select(d => Path.Combine(d, Program)).FirstOrDefault(File.Exists);

    /// <summary>Skips the test when there is no renderer, or fails it under CI.</summary>
    public static void Require()
    {
        if (Available) return;
        Assert.False(Environment.GetEnvironmentVariable("CI") == "true", $"{Program} is missing: .ci/run installs librsvg2-bin");
        Skip.If(true, $"{Program} is not installed (apt-get install librsvg2-bin)");
    }

    /// <summary>The PNG's width and height, after rendering; fails with the renderer's message when it cannot draw the file.</summary>
    public static (int Width, int Height, long Bytes) Render(string svg, string png)
    {
        var source = Path.ChangeExtension(png, ".svg");
        File.WriteAllText(source, svg);
        var start = new ProcessStartInfo(Program) { RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (var a in new[] { "--format=png", "-o", png, source }) start.ArgumentList.Add(a);
        using var process = Process.Start(start)!;
        var error = process.StandardError.ReadToEndAsync();
        process.StandardOutput.ReadToEnd();
        process.WaitForExit();
        Assert.True(process.ExitCode == 0, $"{Program} could not draw {source}: {error.Result}");
        var bytes = File.ReadAllBytes(png);
        Assert.True(bytes.Length > 24 && bytes[1] == 'P' && bytes[2] == 'N' && bytes[3] == 'G', "not a PNG");
        // IHDR: width and height as big-endian integers at bytes 16 and 20.
        int Int(int at) => (bytes[at] << 24) | (bytes[at + 1] << 16) | (bytes[at + 2] << 8) | bytes[at + 3];
        return (Int(16), Int(20), bytes.Length);
    }
}

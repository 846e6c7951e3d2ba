using System.Runtime.CompilerServices;
using Xunit;

namespace WindingNotes.Tests.Support;

/// <summary>
/// Expected outputs kept as files beside the tests. A missing file fails; with UPDATE_EXPECTED=1 the
/// files are rewritten instead, and the diff is reviewed like any other change.
/// </summary>
public static class Snapshot
{
    public static bool Updating => Environment.GetEnvironmentVariable("UPDATE_EXPECTED") == "1";

    /// <summary>The tests folder in the source tree (not the build output), found from this file's path.</summary>
    public static string TestsRoot([CallerFilePath] string here = "") => Path.GetDirectoryName(Path.GetDirectoryName(here))!;

    public static string RepositoryRoot => Path.GetFullPath(Path.Combine(TestsRoot(), "..", ".."));

    public static void Match(string actual, string relativePath)
    {
        var path = Path.Combine(TestsRoot(), relativePath);
        actual = actual.Replace("\r\n", "\n");
        if (Updating)
        {
            Directory.CreateDirectory(Path.GetDirectoryName(path)!);
            File.WriteAllText(path, actual);
            return;
        }
        Assert.True(File.Exists(path), $"expected file {relativePath} is missing: run the tests with UPDATE_EXPECTED=1 and review it");
        var expected = File.ReadAllText(path).Replace("\r\n", "\n");
        if (expected != actual)
        {
            var e = expected.Split('\n');
            var a = actual.Split('\n');
            var line = Enumerable.Range(0, Math.Min(e.Length, a.Length)).FirstOrDefault(i => e[i] != a[i], Math.Min(e.Length, a.Length));
            Assert.Fail($"{relativePath} differs at line {line + 1}:\n expected: {e.ElementAtOrDefault(line)}\n   actual: {a.ElementAtOrDefault(line)}\n(UPDATE_EXPECTED=1 rewrites it)");
        }
    }
}

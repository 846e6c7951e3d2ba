using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// Inputs the fuzzer found that broke something, kept exactly: as <c>Data/fuzz/input-N.wn</c> (the
/// seed replays the same positions and renames), or here as C# strings where the text holds what no
/// UTF-8 file can (a lone surrogate). <c>Data/fuzz/README.md</c> says what each one broke.
/// </summary>
public static class FuzzRegressions
{
    private static readonly Dictionary<string, (int Seed, string Text)> Strings = new()
    {
        ["a lone surrogate in a unit"] = (0, "frequency 50 \uD800Hz\nlet x = 1 \uDC00V\n"),
    };

    private static string Folder => Path.Combine(Snapshot.TestsRoot(), "Data", "fuzz");

    public static TheoryData<string> Names() =>
        [.. Directory.GetFiles(Folder, "*.wn").Select(Path.GetFileName).Order(StringComparer.Ordinal).OfType<string>(), .. Strings.Keys];

    public static (int Seed, string Text) Input(string name) =>
        Strings.TryGetValue(name, out var input)
            ? input
            : (int.Parse(Path.GetFileNameWithoutExtension(name)["input-".Length..]), File.ReadAllText(Path.Combine(Folder, name)));
}

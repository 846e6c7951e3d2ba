using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using CsCheck;
using WindingNotes.Report;
using WindingNotes.Syntax;
using WindingNotes.Tests.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Syntax;

/// <summary>
/// The formatter changes layout, never meaning: the formatted file evaluates to the same results,
/// diagnostics and checks as the original, and formatting it again changes nothing.
/// </summary>
public partial class FormatKeepsMeaningTests
{
    [Theory]
    [MemberData(nameof(Report.ExampleSnapshotTests.Examples), MemberType = typeof(Report.ExampleSnapshotTests))]
    public void Formatting_an_example_keeps_its_results(string name)
    {
        AssertKeepsMeaning(File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "examples", name)));
    }

    [Fact]
    public void Formatting_a_random_layout_of_an_example_keeps_its_results()
    {
        var examples = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").OrderBy(f => f).Select(File.ReadAllText).ToArray();
        Gen.Int[0, int.MaxValue].Sample(seed => AssertKeepsMeaning(Relayout.Write(examples[seed % examples.Length], seed)), iter: 60);
    }

    [Fact]
    public void Formatting_a_random_layout_of_a_random_network_keeps_its_results()
    {
        Gen.Int[0, int.MaxValue].Sample(seed => AssertKeepsMeaning(Relayout.Write(RandomNetworks.Write(seed) + Extras(seed), seed)), iter: 60);
    }

    /// <summary>Lines the random networks do not write: expressions, polar and toleranced values, checks, a broken line.</summary>
    private static readonly string[] ExtraLines =
    [
        "let vx = 2 * (100 V + 20 V) / sqrt(4)",
        "let zx = 5 ohm angle 53.13 deg",
        "let zy = -3 + j4 ohm",
        "let kx = 1.5 kVA +- 10 %",
        "temperature 75 degC",
        "expect voltage P0a P0b near 300 V within 50 %",
        "expect current mains below 1 kA",
        "expect efficiency above 50 %",
        "expect power mains between 0 W and 1 MW",
        "core KB rating ( broken",
        "winding WB on",
    ];

    private static string Extras(int seed)
    {
        var random = new Random(seed);
        return string.Concat(ExtraLines.Where(_ => random.Next(3) == 0).Select(l => l + "\n"));
    }

    private static void AssertKeepsMeaning(string text)
    {
        var formatted = Formatter.Format(Parser.Parse(text));
        Assert.Equal(formatted, Formatter.Format(Parser.Parse(formatted)));
        var before = Meaning(Evaluator.Evaluate(text, "f.wn"));
        var after = Meaning(Evaluator.Evaluate(formatted, "f.wn"));
        Assert.True(before == after, $"formatting changed the results of\n{text}\n--- formatted ---\n{formatted}\n--- before ---\n{before}\n--- after ---\n{after}");
    }

    /// <summary>A statement quoted from the source, in the canonical layout.</summary>
    private static string Canonical(string statement) => Formatter.Format(Parser.Parse(statement)).Trim();

    /// <summary>The JSON report without what layout alone moves: columns, spacing in messages, the layout of quoted statements.</summary>
    private static string Meaning(Evaluation evaluation)
    {
        var json = JsonNode.Parse(JsonReport.Write(evaluation))!;
        foreach (var d in json["diagnostics"]!.AsArray())
        {
            d!["range"]!["start"]!.AsObject().Remove("character");
            d["range"]!["end"]!.AsObject().Remove("character");
            d["message"] = Spaces().Replace(d["message"]!.GetValue<string>(), " ");
        }
        foreach (var c in json["cases"]!.AsArray())
            foreach (var check in c!["checks"]?.AsArray() ?? [])
                check!["text"] = Canonical(check["text"]!.GetValue<string>());
        foreach (var check in json["notEvaluated"]?.AsArray() ?? [])
            check!["text"] = Canonical(check["text"]!.GetValue<string>());
        return json.ToJsonString();
    }

    [GeneratedRegex(@"(\s|\\)+")]
    private static partial Regex Spaces();
}

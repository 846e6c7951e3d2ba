using System.Text.Json.Nodes;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.LanguageServer;

/// <summary>Each feature once over the wire, in the shapes the protocol gives them.</summary>
public class FeatureTests
{
    private const string Uri = "file:///work/alder-creek-boost.wn";

    private static string Doc => "{\"textDocument\":{\"uri\":\"" + Uri + "\"}}";

    private static string Range(int fromLine, int toLine) =>
        "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"range\":{\"start\":{\"line\":" + fromLine + ",\"character\":0},\"end\":{\"line\":" + toLine + ",\"character\":0}}}";

    private static string With(string at, string extra) => at[..^1] + "," + extra + "}";

    [Fact]
    public async Task Every_feature_answers_in_protocol_shape()
    {
        await using var pipe = await LspPipe.Initialized("""{"textDocument":{"rename":{"prepareSupport":true}}}""");
        var text = Cursor.Example("alder-creek-boost.wn");
        await pipe.Open(Uri, text.Replace("join H1 X2 ", "join  H1 X2"));
        await pipe.Diagnostics(Uri, 1);

        var hints = (await pipe.Request("textDocument/inlayHint", Range(0, 15)))!.AsArray();
        var load = hints.Single(h => (int?)h!["position"]!["line"] == 11)!;
        Assert.Equal("228.1 V, 17.11 A, P 3.200 kW, pf 0.8200 lagging", (string?)load["label"]);
        Assert.True((bool?)load["paddingLeft"]);
        Assert.Equal(46, (int?)load["position"]!["character"]);

        var hover = (await pipe.Request("textDocument/hover", LspPipe.At(Uri, 5, 9)))!;
        Assert.Equal("markdown", (string?)hover["contents"]!["kind"]);
        Assert.Contains("17.11 A", (string?)hover["contents"]!["value"]);
        Assert.Null(await pipe.Request("textDocument/hover", LspPipe.At(Uri, 0, 10)));

        var completion = (await pipe.Request("textDocument/completion", LspPipe.At(Uri, 2, 0)))!;
        Assert.False((bool?)completion["isIncomplete"]);
        Assert.Contains(completion["items"]!.AsArray(), i => (string?)i!["label"] == "winding" && (int?)i["kind"] == 14);

        var definition = (await pipe.Request("textDocument/definition", LspPipe.At(Uri, 10, 9)))!;
        Assert.Equal(Uri, (string?)definition["uri"]);
        Assert.Equal(5, (int?)definition["range"]!["start"]!["line"]);

        var references = (await pipe.Request("textDocument/references", With(LspPipe.At(Uri, 9, 8), "\"context\":{\"includeDeclaration\":true}")))!.AsArray();
        Assert.Equal(5, references.Count);

        var prepared = (await pipe.Request("textDocument/prepareRename", LspPipe.At(Uri, 4, 9)))!;
        Assert.Equal("HV", (string?)prepared["placeholder"]);
        var rename = (await pipe.Request("textDocument/rename", With(LspPipe.At(Uri, 4, 9), "\"newName\":\"PRI\"")))!;
        Assert.Equal(2, rename["changes"]![Uri]!.AsArray().Count);
        var refused = await pipe.Call("textDocument/rename", With(LspPipe.At(Uri, 4, 9), "\"newName\":\"LV\""));
        Assert.Equal(-32803, (int?)refused["error"]!["code"]);

        var symbols = (await pipe.Request("textDocument/documentSymbol", Doc))!.AsArray();
        Assert.Equal(["K1", "mains", "planer"], symbols.Select(s => (string?)s!["name"]));
        Assert.Equal(["HV", "LV"], symbols[0]!["children"]!.AsArray().Select(s => (string?)s!["name"]));

        var tokens = (await pipe.Request("textDocument/semanticTokens/full", Doc))!["data"]!.AsArray().Select(n => (int)n!).ToArray();
        Assert.Equal(0, tokens.Length % 5);
        Assert.Equal([0, 0, 77], tokens[..3]); // the heading comment, 77 UTF-16 units long

        var formatting = (await pipe.Request("textDocument/formatting", With(Doc, "\"options\":{\"tabSize\":4,\"insertSpaces\":true}")))!.AsArray();
        Assert.Equal(10, (int?)formatting.Single()!["range"]!["start"]!["line"]);

        var actions = (await pipe.Request("textDocument/codeAction", With(Range(0, 1), "\"context\":{\"diagnostics\":[]}")))!.AsArray();
        Assert.Empty(actions);
        Assert.Equal(0, await pipe.ShutDown());
    }
}

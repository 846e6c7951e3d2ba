using System.Text;
using System.Text.Json.Nodes;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.LanguageServer;

/// <summary>The server over a pipe pair, in this process: lifecycle, errors and robustness.</summary>
public class ProtocolTests
{
    private const string Uri = "file:///work/alder-creek-boost.wn";

    private static int? Code(JsonObject response) => (int?)response["error"]?["code"];

    private static string Document(string uri) => "{\"textDocument\":{\"uri\":\"" + uri + "\"}}";

    [Fact]
    public async Task Initialize_announces_the_features_and_exit_after_shutdown_is_code_0()
    {
        await using var pipe = new LspPipe();
        var result = await pipe.Request("initialize", """{"processId":null,"capabilities":{"textDocument":{"rename":{"prepareSupport":true}}}}""");
        var capabilities = result!["capabilities"]!;
        Assert.Equal("utf-16", (string?)capabilities["positionEncoding"]);
        Assert.Equal(1, (int?)capabilities["textDocumentSync"]!["change"]);
        Assert.True((bool?)capabilities["renameProvider"]!["prepareProvider"]);
        foreach (var feature in new[] { "hoverProvider", "inlayHintProvider", "definitionProvider", "referencesProvider", "documentSymbolProvider", "documentFormattingProvider" })
            Assert.True((bool?)capabilities[feature], feature);
        Assert.Contains("keyword", capabilities["semanticTokensProvider"]!["legend"]!["tokenTypes"]!.AsArray().Select(t => (string?)t));
        Assert.Equal("windingnotes", (string?)result["serverInfo"]!["name"]);
        // Nulls are left out of every message but where the protocol needs them: shutdown's result is null.
        var shutdown = await pipe.Call("shutdown", "null");
        Assert.True(shutdown.ContainsKey("result"));
        Assert.Null(shutdown["result"]);
        await pipe.Notify("exit", "null");
        Assert.Equal(0, await pipe.Server);
    }

    [Fact]
    public async Task Exit_without_shutdown_is_code_1_and_requests_before_initialize_are_refused()
    {
        await using var pipe = new LspPipe();
        Assert.Equal(-32002, Code(await pipe.Call("textDocument/hover", LspPipe.At(Uri, 0, 0))));
        Assert.Equal(-32002, Code(await pipe.Call("shutdown", "null")));
        await pipe.Notify("exit", "null");
        Assert.Equal(1, await pipe.Server);
    }

    [Fact]
    public async Task Unknown_methods_malformed_json_and_bad_parameters_are_answered_and_the_server_stays_up()
    {
        await using var pipe = await LspPipe.Initialized();
        Assert.Equal(-32601, Code(await pipe.Call("textDocument/noSuchThing", "{}")));
        await pipe.Notify("$/noSuchNotification", "{}");
        await pipe.SendRaw("{\"jsonrpc\":\"2.0\",\"id\":99,\"method\":");
        var parseError = await pipe.Next(null, m => (int?)m["error"]?["code"] == -32700);
        Assert.True(parseError.ContainsKey("id"));
        Assert.Null(parseError["id"]);
        // A large malformed body is read whole too, so the next message still starts cleanly.
        await pipe.SendRaw("{\"jsonrpc\":\"2.0\",\"id\":98,\"method\":\"x\",\"params\":{\"text\":\"" + new string('a', 2_000_000) + "\"");
        await pipe.Next(null, m => (int?)m["error"]?["code"] == -32700);
        Assert.Equal(-32602, Code(await pipe.Call("textDocument/hover", """{"textDocument":{"uri":"x"},"position":"nowhere"}""")));
        Assert.Equal(-32803, Code(await pipe.Call("textDocument/hover", LspPipe.At("file:///not-open.wn", 0, 0))));
        Assert.Equal(-32600, Code(await pipe.Call("initialize", """{"processId":null,"capabilities":{}}""")));
        Assert.Equal(0, await pipe.ShutDown());
        Assert.Contains("not JSON-RPC", pipe.Log.ToString());
    }

    [Fact]
    public async Task A_mistyped_core_is_underlined_then_cleared_by_the_edit_that_fixes_it()
    {
        await using var pipe = await LspPipe.Initialized();
        var good = Cursor.Example("alder-creek-boost.wn");
        await pipe.Open(Uri, good.Replace("winding HV on K1", "winding HV on K9"));
        var diagnostics = await pipe.Diagnostics(Uri, 1);
        var k9 = diagnostics.Single(d => (string?)d!["code"] == "unknown-name")!;
        Assert.Equal("""{"start":{"line":4,"character":14},"end":{"line":4,"character":16}}""", k9["range"]!.ToJsonString());
        Assert.Equal(1, (int?)k9["severity"]);
        Assert.Equal("unknown core 'K9' (did you mean 'K1'?)", (string?)k9["message"]);

        var fixes = (await pipe.Request("textDocument/codeAction", "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"range\":{\"start\":{\"line\":4,\"character\":14},\"end\":{\"line\":4,\"character\":16}},\"context\":{\"diagnostics\":[]}}"))!.AsArray();
        var fix = fixes.Single()!;
        Assert.Equal("quickfix", (string?)fix["kind"]);
        Assert.Equal("K1", (string?)fix["edit"]!["changes"]![Uri]![0]!["newText"]);

        await pipe.Change(Uri, good, 2);
        Assert.DoesNotContain((await pipe.Diagnostics(Uri, 2)), d => (int?)d!["severity"] == 1);
        await pipe.Notify("textDocument/didClose", Document(Uri));
        var cleared = await pipe.Next("textDocument/publishDiagnostics", m => (string?)m["params"]!["uri"] == Uri && m["params"]!["version"] is null);
        Assert.Empty(cleared["params"]!["diagnostics"]!.AsArray());
        Assert.Equal(0, await pipe.ShutDown());
    }

    [Fact]
    public async Task Diagnostics_of_several_lines_carry_related_information()
    {
        await using var pipe = await LspPipe.Initialized();
        await pipe.Open(Uri, "frequency 60 Hz\ncore K1 rating 1 kVA\ncore K1 rating 2 kVA\n");
        var duplicate = (await pipe.Diagnostics(Uri, 1)).Single(d => (string?)d!["code"] == "duplicate-name")!;
        var related = duplicate["relatedInformation"]!.AsArray().Single()!;
        Assert.Equal(Uri, (string?)related["location"]!["uri"]);
        Assert.Equal(1, (int?)related["location"]!["range"]!["start"]!["line"]);
        Assert.Equal("first defined here", (string?)related["message"]);
        Assert.Equal(0, await pipe.ShutDown());
    }

    [Fact]
    public async Task A_burst_of_1000_changes_ends_with_the_latest_version_published_and_never_an_older_one_after_a_newer()
    {
        await using var pipe = await LspPipe.Initialized();
        var text = Cursor.Example("alder-creek-boost.wn");
        await pipe.Open(Uri, text);
        for (var version = 2; version <= 1001; version++)
            await pipe.Change(Uri, text.Replace("3.2 kW", $"{1 + version % 3}.{version % 10} kW"), version);
        var hover = await pipe.Request("textDocument/hover", LspPipe.At(Uri, 5, 9));
        Assert.Contains("LV", (string?)hover!["contents"]!["value"]);
        var versions = new List<int>();
        while (versions.LastOrDefault() != 1001)
            versions.Add((int)(await pipe.Next("textDocument/publishDiagnostics"))["params"]!["version"]!);
        Assert.Equal(versions.Order(), versions);
        Assert.True(versions.Count < 1001, "stale versions are skipped, not all published");
        Assert.Equal(0, await pipe.ShutDown());
    }

    [Fact]
    public async Task A_5_MB_document_is_evaluated_and_answered()
    {
        // The size is in the notes (long comment lines): the test is about the message and the mapping, not the solver.
        var text = new StringBuilder(Cursor.Example("alder-creek-boost.wn"));
        var note = "# field note: " + new string('~', 120) + " Ω ° ² ±\n";
        while (text.Length < 5_000_000) text.Append(note);
        text.Append("let tail = 2 * 3 V\n");
        await using var pipe = await LspPipe.Initialized();
        await pipe.Open(Uri, text.ToString());
        var hover = await pipe.Request("textDocument/hover", LspPipe.At(Uri, 5, 9));
        Assert.Contains("17.11 A", (string?)hover!["contents"]!["value"]);
        await pipe.Diagnostics(Uri, 1);
        var lastLine = text.ToString().Count(c => c == '\n') - 1;
        var hints = await pipe.Request("textDocument/inlayHint", "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"range\":{\"start\":{\"line\":" + lastLine + ",\"character\":0},\"end\":{\"line\":" + (lastLine + 1) + ",\"character\":0}}}");
        Assert.Equal("= 6.000 V", (string?)hints![0]!["label"]);
        Assert.Equal(0, await pipe.ShutDown());
    }

    [Fact]
    public async Task A_request_waiting_for_a_long_evaluation_can_be_cancelled_and_the_next_one_is_served()
    {
        await using var pipe = await LspPipe.Initialized();
        var text = new StringBuilder(Cursor.Example("alder-creek-boost.wn"));
        for (var i = 0; i < 5_000; i++) text.Append($"let value_{i} = {i} V\n");
        await pipe.Open(Uri, text.ToString());
        // The hover waits for the evaluation (a few hundred milliseconds); the cancellation comes at once.
        await pipe.SendRaw("{\"jsonrpc\":\"2.0\",\"id\":1000,\"method\":\"textDocument/hover\",\"params\":" + LspPipe.At(Uri, 5, 9) + "}");
        await pipe.Notify("$/cancelRequest", """{"id":1000}""");
        // A cancellation that reaches the server before it has taken up the request may find nothing to
        // cancel; the protocol allows the answer then.
        var answer = await pipe.Next(null, m => (long?)m["id"] == 1000);
        Assert.True(Code(answer) == -32800 || answer["result"] is not null, answer.ToJsonString());
        Assert.NotNull(await pipe.Request("textDocument/hover", LspPipe.At(Uri, 5, 9)));
        Assert.Equal(0, await pipe.ShutDown());
    }
}

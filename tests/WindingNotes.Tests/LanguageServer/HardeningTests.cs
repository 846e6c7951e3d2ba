using System.Text;
using System.Text.Json.Nodes;
using WindingNotes.LanguageServer;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.LanguageServer;

/// <summary>
/// The server attacked as a careless or hostile client would: faults of the framing, parameters of the
/// wrong shape, and a slow document beside a quick one. Each case is a reproduction of a failure the
/// server once had (it closed the connection, answered under no id, or made a hover wait for another
/// document's study).
/// </summary>
public class HardeningTests
{
    private const string Uri = "file:///work/alder-creek-boost.wn";

    private static int? Code(JsonObject response) => (int?)response["error"]?["code"];

    private static string Hover(int id) => "{\"jsonrpc\":\"2.0\",\"id\":" + id + ",\"method\":\"textDocument/hover\",\"params\":" + LspPipe.At("file:///not-open.wn", 0, 0) + "}";

    public static TheoryData<string, string> FramingFaults() => new()
    {
        // name, bytes sent before a good message (the body of a skipped frame is itself a request that must not be answered twice)
        { "missing length", "Content-Type: application/vscode-jsonrpc; charset=utf-8\r\n\r\n" + Hover(901) },
        { "negative length", "Content-Length: -5\r\n\r\n" + Hover(902) },
        { "non-numeric length", "Content-Length: twelve\r\n\r\n" + Hover(903) },
        { "fractional length", "Content-Length: 1.5\r\n\r\n" + Hover(904) },
        { "overflowing length", "Content-Length: 99999999999999999999999\r\n\r\n" + Hover(905) },
        { "a header without a colon", "Content-Length 12\r\n\r\n" + Hover(906) },
        { "length shorter than the body", "Content-Length: 10\r\n\r\n" + Hover(907) },
        { "garbage before a header", "\u0000\u0001garbage line\r\n" },
        { "a response to an id never sent", "Content-Length: 37\r\n\r\n{\"jsonrpc\":\"2.0\",\"id\":777,\"result\":1}" },
        { "an error response to an id never sent", "Content-Length: 73\r\n\r\n{\"jsonrpc\":\"2.0\",\"id\":778,\"error\":{\"code\":-32600,\"message\":\"no\"}}xxxxxxxx" },
    };

    [Theory]
    [MemberData(nameof(FramingFaults))]
    public async Task A_framing_fault_is_skipped_and_the_next_message_is_answered(string name, string fault)
    {
        await using var pipe = await LspPipe.Initialized();
        await pipe.SendFramed(fault);
        var answer = await pipe.Call("textDocument/hover", LspPipe.At("file:///not-open.wn", 0, 0));
        Assert.True(Code(answer) == -32803, $"{name}: {answer.ToJsonString()}");
        Assert.Equal(0, await pipe.ShutDown());
    }

    [Fact]
    public async Task Unknown_charsets_and_lf_only_headers_are_read_as_utf8_and_answered_once()
    {
        await using var pipe = await LspPipe.Initialized();
        var body = Hover(950);
        await pipe.SendFramed($"Content-Type: application/vscode-jsonrpc; charset=klingon\r\nContent-Length: {Encoding.UTF8.GetByteCount(body)}\r\n\r\n{body}");
        Assert.Equal(-32803, Code(await pipe.Next(null, m => (long?)m["id"] == 950)));
        body = Hover(951);
        await pipe.SendFramed($"Content-Length: {Encoding.UTF8.GetByteCount(body)}\n\n{body}");
        Assert.Equal(-32803, Code(await pipe.Next(null, m => (long?)m["id"] == 951)));
        Assert.Equal(0, await pipe.ShutDown());
        // Once each, not a loop of parse errors.
        Assert.DoesNotContain("not JSON-RPC", pipe.Log.ToString());
    }

    public static TheoryData<string, string> BadParameters() => new()
    {
        { "textDocument/hover", "\"x\"" },
        { "textDocument/hover", "42" },
        { "textDocument/hover", "true" },
        { "textDocument/hover", "{}" },
        { "textDocument/hover", "{\"position\":{\"line\":0,\"character\":0}}" },
        { "textDocument/hover", "{\"textDocument\":null,\"position\":{\"line\":0,\"character\":0}}" },
        { "textDocument/hover", "{\"textDocument\":{\"uri\":null},\"position\":{\"line\":0,\"character\":0}}" },
        { "textDocument/hover", "{\"textDocument\":{\"uri\":\"" + Uri + "\"}}" },
        { "textDocument/hover", "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"position\":{\"line\":\"0\",\"character\":0}}" },
        { "textDocument/inlayHint", "{\"textDocument\":{\"uri\":\"" + Uri + "\"}}" },
        { "textDocument/inlayHint", "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"range\":{\"start\":null,\"end\":{\"line\":1,\"character\":0}}}" },
        { "textDocument/rename", "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"position\":{\"line\":0,\"character\":0}}" },
        { "textDocument/rename", "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"position\":{\"line\":0,\"character\":0},\"newName\":null}" },
        { "textDocument/references", "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"position\":{\"line\":0,\"character\":0},\"context\":null}" },
        { "textDocument/codeAction", "{\"textDocument\":{\"uri\":\"" + Uri + "\"}}" },
        { "textDocument/documentSymbol", "{\"textDocument\":{}}" },
        { "textDocument/semanticTokens/full", "[]" },
        { "textDocument/formatting", "{\"textDocument\":7}" },
        { "textDocument/completion", "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"position\":null}" },
        { "textDocument/definition", "null" },
    };

    [Theory]
    [MemberData(nameof(BadParameters))]
    public async Task Parameters_of_the_wrong_shape_are_invalid_params_under_the_request_id(string method, string parameters)
    {
        await using var pipe = await LspPipe.Initialized();
        await pipe.Open(Uri, Cursor.Example("alder-creek-boost.wn"));
        var answer = await pipe.Call(method, parameters);
        Assert.True(Code(answer) == -32602, answer.ToJsonString());
        Assert.Equal(0, await pipe.ShutDown());
        Assert.DoesNotContain("NullReferenceException", pipe.Log.ToString());
    }

    [Fact]
    public async Task A_change_with_a_null_text_is_refused_and_leaves_the_document_as_it_was()
    {
        await using var pipe = await LspPipe.Initialized();
        var text = Cursor.Example("alder-creek-boost.wn");
        await pipe.Open(Uri, text);
        await pipe.Diagnostics(Uri, 1);
        await pipe.Notify("textDocument/didChange", "{\"textDocument\":{\"uri\":\"" + Uri + "\",\"version\":2},\"contentChanges\":[{\"text\":null}]}");
        await pipe.Notify("textDocument/didChange", "{\"textDocument\":{\"uri\":\"" + Uri + "\",\"version\":3},\"contentChanges\":[{}]}");
        var hover = await pipe.Request("textDocument/hover", LspPipe.At(Uri, 5, 9));
        Assert.Contains("17.11 A", (string?)hover!["contents"]!["value"]);
        await pipe.Change(Uri, text.Replace("208 V", "200 V"), 4);
        await pipe.Diagnostics(Uri, 4);
        Assert.Equal(0, await pipe.ShutDown());
    }

    [Fact]
    public async Task A_slow_document_holds_up_no_request_on_another_and_its_own_are_answered_from_the_last_evaluation()
    {
        await using var pipe = new LspPipe(new ServerOptions { RequestBudget = TimeSpan.FromMilliseconds(300) });
        await pipe.Request("initialize", "{\"processId\":null,\"capabilities\":{}}");
        await pipe.Notify("initialized", "{}");
        const string Slow = "file:///work/slow.wn";
        var text = Cursor.Example("alder-creek-boost.wn");
        await pipe.Open(Slow, text);
        await pipe.Diagnostics(Slow, 1);
        // Version 2 sweeps a million points: minutes of work on this machine.
        await pipe.Change(Slow, text.Replace("supply mains H1 H2 208 V", "let vs = 208 V\nsupply mains H1 H2 vs") + "sweep vs from 200 V to 216 V points 1000000\n", 2);
        await pipe.Open(Uri, text);
        var hover = await pipe.Request("textDocument/hover", LspPipe.At(Uri, 5, 9));
        Assert.Contains("17.11 A", (string?)hover!["contents"]!["value"]);
        // Its own requests are answered from version 1, and a diagnostic says version 2 is still running.
        var own = await pipe.Request("textDocument/hover", LspPipe.At(Slow, 5, 9));
        Assert.Contains("17.11 A", (string?)own!["contents"]!["value"]);
        var running = await pipe.Diagnostics(Slow, 1);
        Assert.Contains(running, d => (string?)d!["code"] == "evaluation-running" && ((string?)d["message"])!.Contains("version 2 is still running"));
        // Closing it cancels the study; the server answers and shuts down at once.
        await pipe.Notify("textDocument/didClose", "{\"textDocument\":{\"uri\":\"" + Slow + "\"}}");
        Assert.Equal(0, await pipe.ShutDown());
    }

    [Fact]
    public async Task A_request_that_reuses_the_id_of_one_still_being_answered_gets_an_error_and_the_connection_stays()
    {
        // Found by the server stream fuzzer run on one connection: StreamJsonRpc's dispatcher threw on
        // the second request of one id, and no request after it was answered.
        await using var pipe = await LspPipe.Initialized();
        const string Slow = "file:///work/slow.wn";
        var text = Cursor.Example("alder-creek-boost.wn");
        // A million points, each a bind and a solve: the hover on it waits for that evaluation.
        await pipe.Open(Slow, text.Replace("supply mains H1 H2 208 V", "let vs = 208 V\nsupply mains H1 H2 vs") + "sweep vs from 200 V to 216 V points 1000000\n");
        await pipe.SendRaw($"{{\"jsonrpc\":\"2.0\",\"id\":900001,\"method\":\"textDocument/hover\",\"params\":{LspPipe.At(Slow, 5, 9)}}}");
        await pipe.SendRaw($"{{\"jsonrpc\":\"2.0\",\"id\":900001,\"method\":\"textDocument/hover\",\"params\":{LspPipe.At(Slow, 5, 9)}}}");
        var refused = await pipe.Next(null, m => (long?)m["id"] == 900001);
        Assert.Equal(-32600, Code(refused));
        Assert.Equal("a request with the id 900001 is still being answered", (string?)refused["error"]!["message"]);
        await pipe.Open(Uri, text);
        var hover = await pipe.Request("textDocument/hover", LspPipe.At(Uri, 5, 9));
        Assert.Contains("17.11 A", (string?)hover!["contents"]!["value"]);
        // Closing the slow document cancels its study: the first request is answered, and its id may be used again.
        await pipe.Notify("textDocument/didClose", "{\"textDocument\":{\"uri\":\"" + Slow + "\"}}");
        await pipe.Next(null, m => (long?)m["id"] == 900001);
        await pipe.SendRaw($"{{\"jsonrpc\":\"2.0\",\"id\":900001,\"method\":\"textDocument/hover\",\"params\":{LspPipe.At(Uri, 5, 9)}}}");
        var again = await pipe.Next(null, m => (long?)m["id"] == 900001);
        Assert.Contains("17.11 A", (string?)again["result"]!["contents"]!["value"]);
        Assert.Equal(0, await pipe.ShutDown());
        Assert.DoesNotContain("same key", pipe.Log.ToString());
    }
}

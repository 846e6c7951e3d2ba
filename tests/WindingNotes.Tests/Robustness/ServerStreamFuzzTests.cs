using System.Text;
using System.Text.Json.Nodes;
using WindingNotes.Tests.LanguageServer;
using WindingNotes.Tests.Support;
using Xunit;
using Xunit.Abstractions;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// The server's message stream fuzzed: seeded sequences of frames drawn from the classes that once
/// closed the connection or lost an answer (bad Content-Length values, LF-only and colon-less headers,
/// garbage between frames, bodies shorter or longer than said, responses to ids never sent,
/// parameters of the wrong shape, null texts in changes), mixed with good requests and edits. After
/// each sequence a good request must be answered and the trace hold no fault of the server.
/// CI runs 40 sequences; <c>WN_SERVER_FUZZ=N</c> runs N, from seed <c>WN_FUZZ_SEED</c> (0).
/// </summary>
public class ServerStreamFuzzTests(ITestOutputHelper output)
{
    private const string Uri = "file:///fuzz/stream.wn";

    private static readonly string[] Methods =
        ["textDocument/hover", "textDocument/inlayHint", "textDocument/completion", "textDocument/definition", "textDocument/references",
         "textDocument/rename", "textDocument/documentSymbol", "textDocument/semanticTokens/full", "textDocument/formatting", "textDocument/codeAction"];

    private static readonly string[] Parameters =
        ["\"x\"", "42", "true", "null", "[]", "{}", "{\"textDocument\":null}", "{\"textDocument\":{\"uri\":null}}", "{\"textDocument\":{\"uri\":\"" + Uri + "\"}}",
         LspPipe.At(Uri, 3, 4), LspPipe.At(Uri, -1, -1), LspPipe.At(Uri, 100000, 7), "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"position\":{\"line\":\"a\",\"character\":0}}",
         "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"range\":{\"start\":{\"line\":0,\"character\":0},\"end\":{\"line\":9,\"character\":0}},\"context\":{\"diagnostics\":[]}}",
         "{\"textDocument\":{\"uri\":\"" + Uri + "\"},\"position\":{\"line\":5,\"character\":9},\"newName\":\"Zq9\"}"];

    private static string Frame(string body) => $"Content-Length: {Encoding.UTF8.GetByteCount(body)}\r\n\r\n{body}";

    private static string Piece(Random r, ref int id, ref int version, string text) => r.Next(14) switch
    {
        0 => Frame($"{{\"jsonrpc\":\"2.0\",\"id\":{++id},\"method\":\"{Methods[r.Next(Methods.Length)]}\",\"params\":{Parameters[r.Next(Parameters.Length)]}}}"),
        1 => $"Content-Length: {r.Next(-5, 40)}\r\n\r\n{{\"jsonrpc\":\"2.0\",\"id\":{++id},\"method\":\"textDocument/hover\"}}",
        2 => $"Content-Length: {Pick(r, ["1.5", "abc", "", "99999999999999999999", "+7", "0x10"])}\r\n\r\n{{}}",
        3 => Pick(r, ["garbage\r\n", "\u0000\u0001\u0002", "Content-Type: text/plain\r\n\r\n", "Content-Length 5\r\n\r\nhello", "\r\n\r\n", "Content-Length: 2\n\n{}"]),
        4 => Frame($"{{\"jsonrpc\":\"2.0\",\"id\":{r.Next(1000, 2000)},\"result\":{Pick(r, ["null", "1", "{}"])}}}"),
        5 => Frame($"{{\"jsonrpc\":\"2.0\",\"method\":\"textDocument/didChange\",\"params\":{{\"textDocument\":{{\"uri\":\"{Uri}\",\"version\":{++version}}},\"contentChanges\":[{Pick(r, ["{\"text\":null}", "{}", "{\"text\":7}"])}]}}}}"),
        6 => Frame($"{{\"jsonrpc\":\"2.0\",\"method\":\"textDocument/didChange\",\"params\":{{\"textDocument\":{{\"uri\":\"{Uri}\",\"version\":{++version}}},\"contentChanges\":[{{\"text\":{System.Text.Json.JsonSerializer.Serialize(Mutate(r, text))}}}]}}}}"),
        7 => Frame(Pick(r, ["{", "[]", "null", "{\"jsonrpc\":\"2.0\"}", "{\"id\":{},\"method\":\"x\"}", "\"text\""])),
        8 => $"Content-Type: application/vscode-jsonrpc; charset={Pick(r, ["latin-9", "utf-16", "klingon", ""])}\r\n" + Frame($"{{\"jsonrpc\":\"2.0\",\"id\":{++id},\"method\":\"textDocument/hover\",\"params\":{LspPipe.At(Uri, 1, 1)}}}"),
        _ => Frame($"{{\"jsonrpc\":\"2.0\",\"id\":{++id},\"method\":\"{Methods[r.Next(Methods.Length)]}\",\"params\":{LspPipe.At(Uri, r.Next(20), r.Next(40))}}}"),
    };

    private static string Mutate(Random r, string text)
    {
        var at = r.Next(text.Length + 1);
        return text[..at] + Pick(r, ["", "\\\n", "+ -", "\u001B", "(", "1e-400", "±", "\r"]) + text[Math.Min(text.Length, at + r.Next(5))..];
    }

    private static string Pick(Random r, string[] items) => items[r.Next(items.Length)];

    // A fuzzer: in the category CI always runs and the quick loop leaves out (30 s of it on two cores).
    [Trait("Category", "Long")]
    [Fact]
    public async Task Fuzzed_message_streams_never_close_the_connection_or_lose_the_next_answer()
    {
        var count = int.TryParse(Environment.GetEnvironmentVariable("WN_SERVER_FUZZ"), out var n) ? n : 40;
        var first = int.TryParse(Environment.GetEnvironmentVariable("WN_FUZZ_SEED"), out var s) ? s : 0;
        var text = Cursor.Example("alder-creek-boost.wn");
        var messages = 0;
        // One server serves a run of sequences (starting one, initialising it and shutting it down
        // cost more than the thirty messages of a sequence); each sequence opens the document afresh.
        const int PerServer = 20;
        for (var from = first; from < first + count; from += PerServer)
        {
            await using var pipe = await LspPipe.Initialized();
            for (var seed = from; seed < Math.Min(first + count, from + PerServer); seed++)
            {
                var random = new Random(seed);
                await pipe.Notify("textDocument/didClose", "{\"textDocument\":{\"uri\":\"" + Uri + "\"}}");
                await pipe.Open(Uri, text);
                var (id, version) = (100_000, 1);
                for (var i = 0; i < 30; i++, messages++) await pipe.SendFramed(Piece(random, ref id, ref version, text));
                // Whatever came before, a well-framed request is answered.
                JsonObject answer;
                try
                {
                    answer = await pipe.Call("textDocument/documentSymbol", "{\"textDocument\":{\"uri\":\"" + Uri + "\"}}");
                }
                catch (TimeoutException)
                {
                    throw new Xunit.Sdk.XunitException($"seed {seed}: no answer; the trace:\n{pipe.Log}");
                }
                Assert.True(answer.ContainsKey("result") || answer.ContainsKey("error"), $"seed {seed}: {answer.ToJsonString()}");
            }
            Assert.Equal(0, await pipe.ShutDown());
            var log = pipe.Log.ToString();
            Assert.False(log.Contains("NullReferenceException") || log.Contains("failed:"), $"seeds {from} to {Math.Min(first + count, from + PerServer) - 1}: {log}");
        }
        output.WriteLine($"{count} streams from seed {first}, {messages} fuzzed messages");
    }
}

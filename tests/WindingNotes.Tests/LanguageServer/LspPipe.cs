using System.Collections.Concurrent;
using System.Text;
using System.Text.Json.Nodes;
using System.Threading.Channels;
using Nerdbank.Streams;
using WindingNotes.LanguageServer;

namespace WindingNotes.Tests.LanguageServer;

/// <summary>
/// A client written against the wire format, not against the server's code: frames with
/// Content-Length headers, JSON built by hand, responses matched by id. The server runs in this
/// process on the other end of a pipe pair.
/// </summary>
public sealed class LspPipe : IAsyncDisposable
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(20);
    private readonly Stream stream;
    private readonly ConcurrentDictionary<long, TaskCompletionSource<JsonObject>> pending = new();
    private readonly Channel<JsonObject> notifications = Channel.CreateUnbounded<JsonObject>();
    private readonly Task reader;
    private readonly SemaphoreSlim sending = new(1, 1);
    private long nextId;

    public Task<int> Server { get; }

    public StringWriter Log { get; } = new();

    public LspPipe(ServerOptions? options = null)
    {
        var (client, server) = FullDuplexStream.CreatePair();
        stream = client;
        Server = Task.Run(() => WindingNotes.LanguageServer.Server.RunAsync(server, server, (options ?? new ServerOptions()) with { Log = TextWriter.Synchronized(Log) }));
        reader = Task.Run(ReadLoop);
    }

    public static async Task<LspPipe> Initialized(string capabilities = "{}")
    {
        var pipe = new LspPipe();
        await pipe.Request("initialize", "{\"processId\":null,\"rootUri\":null,\"capabilities\":" + capabilities + "}");
        await pipe.Notify("initialized", "{}");
        return pipe;
    }

    public async Task SendRaw(string body)
    {
        var bytes = Encoding.UTF8.GetBytes(body);
        await sending.WaitAsync();
        try
        {
            await stream.WriteAsync(Encoding.ASCII.GetBytes($"Content-Length: {bytes.Length}\r\n\r\n"));
            await stream.WriteAsync(bytes);
            await stream.FlushAsync();
        }
        finally
        {
            sending.Release();
        }
    }

    /// <summary>Bytes as given, framing and all: for faults of the framing.</summary>
    public async Task SendFramed(string raw)
    {
        await sending.WaitAsync();
        try
        {
            await stream.WriteAsync(Encoding.UTF8.GetBytes(raw));
            await stream.FlushAsync();
        }
        finally
        {
            sending.Release();
        }
    }

    /// <summary>The whole response: its "result" or its "error".</summary>
    public async Task<JsonObject> Call(string method, string parameters)
    {
        var id = Interlocked.Increment(ref nextId);
        var answer = new TaskCompletionSource<JsonObject>(TaskCreationOptions.RunContinuationsAsynchronously);
        pending[id] = answer;
        await SendRaw($"{{\"jsonrpc\":\"2.0\",\"id\":{id},\"method\":\"{method}\",\"params\":{parameters}}}");
        return await answer.Task.WaitAsync(Patience);
    }

    /// <summary>The result of a request that must succeed.</summary>
    public async Task<JsonNode?> Request(string method, string parameters)
    {
        var response = await Call(method, parameters);
        if (response["error"] is { } error) throw new InvalidOperationException($"{method} failed: {error.ToJsonString()}");
        if (!response.ContainsKey("result")) throw new InvalidOperationException($"{method}: the response has no result: {response.ToJsonString()}");
        return response["result"];
    }

    public Task Notify(string method, string parameters) => SendRaw($"{{\"jsonrpc\":\"2.0\",\"method\":\"{method}\",\"params\":{parameters}}}");

    /// <summary>The next notification of the method (null: a response to no request of ours) that satisfies the condition; others are skipped.</summary>
    public async Task<JsonObject> Next(string? method, Func<JsonObject, bool>? condition = null)
    {
        using var timeout = new CancellationTokenSource(Patience);
        while (true)
        {
            var message = await notifications.Reader.ReadAsync(timeout.Token);
            if ((string?)message["method"] == method && (condition?.Invoke(message) ?? true)) return message;
        }
    }

    /// <summary>The diagnostics published for a version of a document.</summary>
    public async Task<JsonArray> Diagnostics(string uri, int version)
    {
        var message = await Next("textDocument/publishDiagnostics", m => (string?)m["params"]!["uri"] == uri && (int?)m["params"]!["version"] == version);
        return message["params"]!["diagnostics"]!.AsArray();
    }

    public Task Open(string uri, string text, int version = 1) =>
        Notify("textDocument/didOpen", new JsonObject
        {
            ["textDocument"] = new JsonObject { ["uri"] = uri, ["languageId"] = "windingnotes", ["version"] = version, ["text"] = text },
        }.ToJsonString());

    public Task Change(string uri, string text, int version) =>
        Notify("textDocument/didChange", new JsonObject
        {
            ["textDocument"] = new JsonObject { ["uri"] = uri, ["version"] = version },
            ["contentChanges"] = new JsonArray(new JsonObject { ["text"] = text }),
        }.ToJsonString());

    public static string At(string uri, int line, int character) =>
        $"{{\"textDocument\":{{\"uri\":\"{uri}\"}},\"position\":{{\"line\":{line},\"character\":{character}}}}}";

    public async Task<int> ShutDown()
    {
        await Request("shutdown", "null");
        await Notify("exit", "null");
        return await Server.WaitAsync(Patience);
    }

    private async Task ReadLoop()
    {
        try
        {
            while (await ReadFrame() is { } body)
            {
                var message = JsonNode.Parse(body)!.AsObject();
                if (message["id"] is JsonValue id && id.TryGetValue<long>(out var number) && !message.ContainsKey("method") && pending.TryRemove(number, out var answer))
                    answer.TrySetResult(message);
                else
                    await notifications.Writer.WriteAsync(message);
            }
        }
        catch (Exception)
        {
            // The pipe closed: nothing more to read.
        }
        notifications.Writer.TryComplete();
    }

    private async Task<string?> ReadFrame()
    {
        var length = -1;
        while (true)
        {
            var line = await ReadHeaderLine();
            if (line is null) return null;
            if (line.Length == 0) break;
            if (line.StartsWith("Content-Length:", StringComparison.OrdinalIgnoreCase)) length = int.Parse(line["Content-Length:".Length..].Trim());
        }
        var buffer = new byte[length];
        await stream.ReadExactlyAsync(buffer);
        return Encoding.UTF8.GetString(buffer);
    }

    private async Task<string?> ReadHeaderLine()
    {
        var bytes = new List<byte>();
        var one = new byte[1];
        while (true)
        {
            if (await stream.ReadAsync(one) == 0) return null;
            if (one[0] == '\n') return Encoding.ASCII.GetString(bytes.ToArray()).TrimEnd('\r');
            bytes.Add(one[0]);
        }
    }

    public async ValueTask DisposeAsync()
    {
        stream.Dispose();
        try
        {
            await Server.WaitAsync(Patience);
        }
        catch (Exception)
        {
            // A server that failed is reported by the test that drove it.
        }
        await reader.WaitAsync(Patience);
    }
}

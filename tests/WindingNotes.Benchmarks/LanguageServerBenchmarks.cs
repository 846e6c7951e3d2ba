using System.Collections.Concurrent;
using System.Text;
using System.Text.Json;
using BenchmarkDotNet.Attributes;
using Nerdbank.Streams;
using WindingNotes.LanguageServer;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Editor latency through the whole server, in this process over a pipe pair: a change to the
/// published diagnostics of that version, and a change to the answered inlay hints, for a 50-line
/// and a 1,000-line file. <see cref="Evaluate"/> is the library's evaluation of the same text alone,
/// so the difference is what the protocol costs.
/// </summary>
[MemoryDiagnoser]
[MedianColumn]
[SimpleJob(warmupCount: 10, iterationCount: 20)]
public class LanguageServerBenchmarks
{
    [Params(50, 1000)]
    public int Lines { get; set; }

    private const string Uri = "file:///bench/units.wn";
    private string[] texts = [];
    private Stream client = Stream.Null;
    private Task<int> server = Task.FromResult(0);
    private readonly ConcurrentDictionary<int, TaskCompletionSource> diagnostics = new();
    private readonly ConcurrentDictionary<int, TaskCompletionSource> answers = new();
    private int version = 1;
    private int id;

    /// <summary>Ten lines a unit: a boost connection like the notation's example, with its load and check.</summary>
    public static string Units(int lines)
    {
        var o = new StringBuilder("frequency 60 Hz\n");
        var units = lines / 10;
        for (var i = 0; i < units; i++)
        {
            o.Append($"core K{i} rating 0.5 kVA area 26 cm2 flux-limit 1.6 T\n");
            o.Append($"winding HV{i} on K{i} turns 240 rated 240 V from H1_{i} to H2_{i} resistance 1.4 ohm\n");
            o.Append($"winding LV{i} on K{i} turns 24 rated 24 V from X1_{i} to X2_{i} resistance 0.014 ohm\n");
            o.Append($"impedance HV{i} LV{i} 3.6 % xr 1.1\n");
            o.Append($"supply mains{i} H1_{i} H2_{i} 208 V\n");
            o.Append($"ground H2_{i}\n");
            o.Append($"join H1_{i} X2_{i}\n");
            o.Append($"load planer{i} X1_{i} H2_{i} power 3.2 kW pf 0.82 lagging\n");
            o.Append($"expect voltage X1_{i} H2_{i} between 225 V and 235 V\n");
            if (i < units - 1) o.Append($"# unit {i + 1}\n");
        }
        return o.ToString();
    }

    [GlobalSetup]
    public void Setup()
    {
        var text = Units(Lines);
        // Two texts that differ in one number, so each change is a real edit.
        texts = [text, text.Replace("power 3.2 kW", "power 3.3 kW")];
        var (near, far) = FullDuplexStream.CreatePair();
        client = near;
        server = Task.Run(() => Server.RunAsync(far, far));
        _ = Task.Run(Read);
        Call("initialize", """{"processId":null,"capabilities":{}}""");
        Send("""{"jsonrpc":"2.0","method":"initialized","params":{}}""");
        var open = JsonSerializer.Serialize(new { textDocument = new { uri = Uri, languageId = "windingnotes", version, text } });
        var first = diagnostics.GetOrAdd(version, _ => new());
        Send($$"""{"jsonrpc":"2.0","method":"textDocument/didOpen","params":{{open}}}""");
        first.Task.Wait();
    }

    [GlobalCleanup]
    public void Cleanup()
    {
        Call("shutdown", "null");
        Send("""{"jsonrpc":"2.0","method":"exit"}""");
        server.Wait();
    }

    [Benchmark(Baseline = true)]
    public Evaluation Evaluate() => Evaluator.Evaluate(texts[version % 2], "units.wn");

    [Benchmark]
    public void ChangeToPublishedDiagnostics()
    {
        var published = Change();
        published.Wait();
    }

    [Benchmark]
    public void ChangeToAnsweredInlayHints()
    {
        Change();
        var range = JsonSerializer.Serialize(new { textDocument = new { uri = Uri }, range = new { start = new { line = 0, character = 0 }, end = new { line = Lines, character = 0 } } });
        Call("textDocument/inlayHint", range);
    }

    /// <summary>Sends the next version; the task completes when its diagnostics are published.</summary>
    private Task Change()
    {
        version++;
        var published = diagnostics.GetOrAdd(version, _ => new()).Task;
        var change = JsonSerializer.Serialize(new { textDocument = new { uri = Uri, version }, contentChanges = new[] { new { text = texts[version % 2] } } });
        Send($$"""{"jsonrpc":"2.0","method":"textDocument/didChange","params":{{change}}}""");
        return published;
    }

    private void Call(string method, string parameters)
    {
        var n = Interlocked.Increment(ref id);
        var answered = answers.GetOrAdd(n, _ => new()).Task;
        Send($$"""{"jsonrpc":"2.0","id":{{n}},"method":"{{method}}","params":{{parameters}}}""");
        answered.Wait();
    }

    private void Send(string body)
    {
        var bytes = Encoding.UTF8.GetBytes(body);
        lock (client)
        {
            client.Write(Encoding.ASCII.GetBytes($"Content-Length: {bytes.Length}\r\n\r\n"));
            client.Write(bytes);
            client.Flush();
        }
    }

    /// <summary>Reads frames; completes the waiter of each response and of each version's diagnostics.</summary>
    private async Task Read()
    {
        var header = new List<byte>();
        var one = new byte[1];
        var length = 0;
        while (await client.ReadAsync(one) == 1)
        {
            if (one[0] != '\n')
            {
                header.Add(one[0]);
                continue;
            }
            var line = Encoding.ASCII.GetString(header.ToArray()).TrimEnd('\r');
            header.Clear();
            if (line.StartsWith("Content-Length:")) length = int.Parse(line[15..]);
            if (line.Length > 0) continue;
            var body = new byte[length];
            await client.ReadExactlyAsync(body);
            using var message = JsonDocument.Parse(body);
            var root = message.RootElement;
            if (root.TryGetProperty("id", out var n) && n.ValueKind == JsonValueKind.Number)
                answers.GetOrAdd(n.GetInt32(), _ => new()).TrySetResult();
            else if (root.GetProperty("method").GetString() == "textDocument/publishDiagnostics" && root.GetProperty("params").TryGetProperty("version", out var v) && v.ValueKind == JsonValueKind.Number)
                diagnostics.GetOrAdd(v.GetInt32(), _ => new()).TrySetResult();
        }
    }
}

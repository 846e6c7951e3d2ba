using System.Diagnostics;
using System.Text;
using System.Text.Json;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Start-up of the command as a user runs it, a process at a time (BenchmarkDotNet measures in its
/// own process). <c>startup files DIR</c> writes the documents hyperfine runs the command on;
/// <c>startup lsp RUNS COMMAND...</c> starts the language server RUNS times (after three to warm the
/// disk cache) and times each from starting the process to the first publishDiagnostics of a
/// 50-line file, as an editor opening it would (hyperfine times whole processes and cannot stop at a
/// message), with the server's processor time by then. The figures go to RESULTS.md.
/// </summary>
public static class Startup
{
    public static void Run(string[] args)
    {
        switch (args)
        {
            case ["files", var folder]:
                Directory.CreateDirectory(folder);
                File.WriteAllText(Path.Combine(folder, "ten-lines.wn"), LanguageServerBenchmarks.Units(10));
                File.WriteAllText(Path.Combine(folder, "fifty-lines.wn"), LanguageServerBenchmarks.Units(50));
                File.WriteAllText(Path.Combine(folder, "thousand-lines.wn"), Documents.ThousandLines);
                break;
            case ["lsp", var runs, .. var command] when int.TryParse(runs, out var count) && command.Length > 0:
                var results = Enumerable.Range(0, count + 3).Select(_ => FirstDiagnostics(command)).Skip(3).ToArray();
                var times = results.Select(r => r.Wall).Order().ToArray();
                var cpu = results.Select(r => r.Cpu).Order().ToArray();
                Console.WriteLine($"{string.Join(' ', command)} lsp: first publishDiagnostics of 50 lines, {count} runs: " +
                    $"median {times[count / 2]:F1} ms, mean {times.Average():F1} ms, min {times[0]:F1} ms, max {times[^1]:F1} ms; " +
                    $"processor time of the server by then (user and system, in the kernel's 10 ms ticks) median {cpu[count / 2]:F0} ms");
                break;
            default:
                Console.Error.WriteLine("usage: startup files DIR | startup lsp RUNS COMMAND [ARGS...]");
                break;
        }
    }

    private static (double Wall, double Cpu) FirstDiagnostics(string[] command)
    {
        var start = new ProcessStartInfo(command[0]) { RedirectStandardInput = true, RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var a in command[1..]) start.ArgumentList.Add(a);
        start.ArgumentList.Add("lsp");
        var clock = Stopwatch.StartNew();
        using var server = Process.Start(start)!;
        server.ErrorDataReceived += (_, _) => { };
        server.BeginErrorReadLine();
        var input = server.StandardInput.BaseStream;
        var output = server.StandardOutput.BaseStream;
        const string uri = "file:///bench/fifty-lines.wn";
        Send(input, new { jsonrpc = "2.0", id = 1, method = "initialize", @params = new { processId = Environment.ProcessId, capabilities = new { } } });
        while (Read(output).TryGetProperty("id", out _) is false) { }
        Send(input, new { jsonrpc = "2.0", method = "initialized", @params = new { } });
        Send(input, new { jsonrpc = "2.0", method = "textDocument/didOpen", @params = new { textDocument = new { uri, languageId = "windingnotes", version = 1, text = LanguageServerBenchmarks.Units(50) } } });
        while (!(Read(output).TryGetProperty("method", out var m) && m.GetString() == "textDocument/publishDiagnostics")) { }
        var elapsed = clock.Elapsed.TotalMilliseconds;
        // On a loaded machine the wall time is mostly waiting for a core; the processor time is not.
        server.Refresh();
        var cpu = server.TotalProcessorTime.TotalMilliseconds;
        Send(input, new { jsonrpc = "2.0", id = 2, method = "shutdown" });
        Send(input, new { jsonrpc = "2.0", method = "exit" });
        server.WaitForExit();
        return (elapsed, cpu);
    }

    private static void Send(Stream input, object message)
    {
        var body = JsonSerializer.SerializeToUtf8Bytes(message);
        input.Write(Encoding.ASCII.GetBytes($"Content-Length: {body.Length}\r\n\r\n"));
        input.Write(body);
        input.Flush();
    }

    private static JsonElement Read(Stream output)
    {
        var length = 0;
        for (var header = ReadLine(output); header.Length > 0; header = ReadLine(output))
            if (header.StartsWith("Content-Length:", StringComparison.OrdinalIgnoreCase)) length = int.Parse(header[15..].Trim());
        var body = new byte[length];
        output.ReadExactly(body);
        return JsonDocument.Parse(body).RootElement;
    }

    private static string ReadLine(Stream output)
    {
        var line = new StringBuilder();
        for (var b = output.ReadByte(); b != '\n'; b = output.ReadByte())
        {
            if (b < 0) throw new EndOfStreamException("the server closed its output");
            if (b != '\r') line.Append((char)b);
        }
        return line.ToString();
    }
}

using System.Buffers;
using System.Diagnostics.CodeAnalysis;
using System.Globalization;
using System.Text;
using System.Text.Json;
using StreamJsonRpc;
using StreamJsonRpc.Protocol;
using WindingNotes.LanguageServer.Protocol;

namespace WindingNotes.LanguageServer;

/// <summary>
/// The protocol's framing (Content-Length headers) with System.Text.Json, camelCase and nulls left
/// out. Reading is our own, because StreamJsonRpc's reader closes the connection on the first bad
/// header: here a bad header block (no, a negative, a fractional or an overflowing Content-Length, a
/// line without a colon, garbage before it) is skipped up to the next "Content-Length:", LF-only
/// line ends are accepted, the charset is not looked at (the protocol's content is UTF-8), and a body
/// that is not JSON-RPC is answered with an error under its id where it has one. Only the end of the
/// input ends the reading. Writing is StreamJsonRpc's.
/// </summary>
internal sealed class LspMessageHandler(Stream sending, Stream receiving, SystemTextJsonFormatter formatter, Action<string> report)
    : HeaderDelimitedMessageHandler(sending, receiving, formatter)
{
    /// <summary>The protocol's JSON: camelCase names, nulls left out, every shape from the generated <see cref="ProtocolJson"/>.</summary>
    public static readonly JsonSerializerOptions Options = new(ProtocolJson.Default.Options);

    /// <summary>
    /// Parameters as read: a field without a default that is missing, or null where the type says it
    /// cannot be, is invalid parameters (-32602) instead of a null that a handler trips over later.
    /// </summary>
    public static readonly JsonSerializerOptions ParameterOptions = new(Options)
    {
        RespectNullableAnnotations = true,
        RespectRequiredConstructorParameters = true,
    };

    /// <summary>A body longer than this is refused before it is read: it would only exhaust memory.</summary>
    public const int MaxBody = 64 << 20;

    /// <summary>A header block longer than this is garbage: it is dropped up to the next "Content-Length:".</summary>
    private const int MaxHeaders = 8 << 10;

    private static readonly byte[] LengthHeader = "content-length:"u8.ToArray();

    // Safe to suppress: the formatter is marked for its unhardened paths (marshalled IProgress,
    // IAsyncEnumerable and pipes, exceptions serialised with their type), none of which the server
    // uses: every route takes its parameters as JsonElement and answers with a shape of ProtocolJson,
    // and every fault is answered as a LocalRpcException with a code and a message. CI runs the real
    // clients against the NativeAOT tool, so a path that needed reflection would fail there.
    [UnconditionalSuppressMessage("Trimming", "IL2026", Justification = "The paths it marks are not used; see above.")]
    [UnconditionalSuppressMessage("AOT", "IL3050", Justification = "The paths it marks are not used; see above.")]
    public static SystemTextJsonFormatter CreateFormatter() => new() { JsonSerializerOptions = Options };

    private byte[] buffer = new byte[16 << 10];
    private int start, end;
    private bool ended;

    protected override async ValueTask<JsonRpcMessage?> ReadCoreAsync(CancellationToken cancellationToken)
    {
        while (await ReadBody(cancellationToken) is { } body)
        {
            JsonRpcMessage message;
            try
            {
                message = Formatter.Deserialize(new ReadOnlySequence<byte>(body));
            }
            catch (Exception e) when (e is JsonException or InvalidOperationException or NotSupportedException or FormatException or KeyNotFoundException or ArgumentException or InvalidCastException)
            {
                report($"skipped a message that is not JSON-RPC: {e.Message}");
                await Answer(ErrorFor(body, e), cancellationToken);
                continue;
            }
            // The server sends no requests, so a response from the client answers nothing: it is dropped.
            if (message is JsonRpcResult or JsonRpcError)
            {
                report("skipped a response to a request the server never sent");
                continue;
            }
            if (message is JsonRpcRequest { IsResponseExpected: true } request && !Answering(request.RequestId))
            {
                report($"skipped a request whose id {request.RequestId} is still being answered");
                await Answer(new JsonRpcError
                {
                    RequestId = request.RequestId,
                    Error = new JsonRpcError.ErrorDetail { Code = JsonRpcErrorCode.InvalidRequest, Message = $"a request with the id {request.RequestId} is still being answered" },
                }, cancellationToken);
                continue;
            }
            return message;
        }
        return null;
    }

    // The ids of the requests being answered. A request that reuses one (a fault of the client) is
    // answered with an error here: StreamJsonRpc's dispatcher throws on it and the connection closes.
    // An answer this reader writes itself (to a message it skipped) does not end the request in flight.
    private readonly Lock ids = new();
    private readonly HashSet<RequestId> answering = [];
    private readonly HashSet<JsonRpcMessage> ownAnswers = new(ReferenceEqualityComparer.Instance);

    /// <summary>Marks the id as being answered; false when a request with it is already.</summary>
    private bool Answering(RequestId id)
    {
        lock (ids) return answering.Add(id);
    }

    private ValueTask Answer(JsonRpcError error, CancellationToken cancel)
    {
        lock (ids) ownAnswers.Add(error);
        return WriteAsync(error, cancel);
    }

    protected override void Write(JsonRpcMessage content, CancellationToken cancellationToken)
    {
        if (content is IJsonRpcMessageWithId { RequestId: var id } and (JsonRpcResult or JsonRpcError))
            lock (ids)
                if (!ownAnswers.Remove(content)) answering.Remove(id);
        base.Write(content, cancellationToken);
    }

    /// <summary>
    /// The answer to a body that did not read as a message: under its id where it has one, "invalid
    /// parameters" when it names a method and has parameters (their shape failed), "invalid request"
    /// otherwise; a parse error with a null id when it is not JSON at all.
    /// </summary>
    private static JsonRpcError ErrorFor(byte[] body, Exception e)
    {
        var (id, code, message) = (new RequestId(null), JsonRpcErrorCode.ParseError, $"the message is not JSON-RPC: {e.Message}");
        try
        {
            using var json = JsonDocument.Parse(body);
            if (json.RootElement is { ValueKind: JsonValueKind.Object } root)
            {
                if (root.TryGetProperty("id", out var given))
                    id = given.ValueKind switch
                    {
                        JsonValueKind.Number when given.TryGetInt64(out var n) => new RequestId(n),
                        JsonValueKind.String => new RequestId(given.GetString()),
                        _ => id,
                    };
                (code, message) = root.TryGetProperty("method", out var method) && method.ValueKind == JsonValueKind.String && root.TryGetProperty("params", out _)
                    ? (JsonRpcErrorCode.InvalidParams, $"invalid parameters: 'params' must be an object or an array ({e.Message})")
                    : (JsonRpcErrorCode.InvalidRequest, $"the message is not a JSON-RPC request: {e.Message}");
            }
        }
        catch (JsonException)
        {
            // Not JSON: the parse error stands.
        }
        return new JsonRpcError { RequestId = id, Error = new JsonRpcError.ErrorDetail { Code = code, Message = message } };
    }

    /// <summary>The next body of a well-formed header block, each a fresh array (parameters are read from it later); null at the end of the input.</summary>
    private async ValueTask<byte[]?> ReadBody(CancellationToken cancel)
    {
        while (true)
        {
            var headerEnd = HeaderEnd(out var bodyStart);
            if (headerEnd < 0)
            {
                if (end - start > MaxHeaders) Resync();
                else if (!await Fill(cancel)) return null;
                continue;
            }
            var length = (int)ContentLength(buffer.AsSpan(start, headerEnd - start));
            if (length < 0)
            {
                report($"skipped a malformed header: {Printable(buffer.AsSpan(start, Math.Min(headerEnd - start, 200)))}");
                start += 1;
                Resync();
                continue;
            }
            if (end - bodyStart < length)
            {
                // Filling moves the buffer's contents: the header block is found again after it.
                if (!await Fill(cancel, bodyStart + length - start)) return null;
                continue;
            }
            var body = buffer.AsSpan(bodyStart, length).ToArray();
            start = bodyStart + length;
            return body;
        }
    }

    /// <summary>Where the header block ends (its blank line, CRLF or LF), or -1 while it has not ended.</summary>
    private int HeaderEnd(out int bodyStart)
    {
        var span = buffer.AsSpan(start, end - start);
        for (var i = 0; i < span.Length; i++)
        {
            if (span[i] != '\n') continue;
            var next = i + 1;
            if (next < span.Length && span[next] == '\n') { bodyStart = start + next + 1; return start + i; }
            if (next + 1 < span.Length && span[next] == '\r' && span[next + 1] == '\n') { bodyStart = start + next + 2; return start + i; }
        }
        bodyStart = -1;
        return -1;
    }

    /// <summary>The Content-Length of a header block, or -1 when the block is malformed: every line a name and a colon, the length a whole number within bounds.</summary>
    private static long ContentLength(ReadOnlySpan<byte> headers)
    {
        long length = -1;
        foreach (var range in headers.Split((byte)'\n'))
        {
            var line = headers[range].TrimEnd((byte)'\r');
            if (line.IsEmpty) continue;
            var colon = line.IndexOf((byte)':');
            if (colon <= 0) return -1;
            if (!Ascii.EqualsIgnoreCase(line[..(colon + 1)], LengthHeader)) continue;
            if (length >= 0 || !long.TryParse(Encoding.ASCII.GetString(line[(colon + 1)..]).Trim(), NumberStyles.None, CultureInfo.InvariantCulture, out length) || length > MaxBody) return -1;
        }
        return length;
    }

    /// <summary>Drops what precedes the next "Content-Length:" (keeping a tail that may be its beginning).</summary>
    private void Resync()
    {
        var span = buffer.AsSpan(start, end - start);
        for (var i = 0; i + LengthHeader.Length <= span.Length; i++)
            if (Ascii.EqualsIgnoreCase(span.Slice(i, LengthHeader.Length), LengthHeader))
            {
                start += i;
                return;
            }
        start = Math.Max(start, end - (LengthHeader.Length - 1));
    }

    /// <summary>Reads more of the input into the buffer (room for <paramref name="needed"/> bytes from the start); false at its end.</summary>
    private async ValueTask<bool> Fill(CancellationToken cancel, long needed = 0)
    {
        if (ended) return false;
        if (start > 0)
        {
            Buffer.BlockCopy(buffer, start, buffer, 0, end - start);
            (end, start) = (end - start, 0);
        }
        var result = await Reader!.ReadAsync(cancel);
        var size = (int)Math.Max(needed, end + result.Buffer.Length);
        if (size > buffer.Length) Array.Resize(ref buffer, Math.Max(size, buffer.Length * 2));
        var copied = (int)Math.Min(result.Buffer.Length, buffer.Length - end);
        result.Buffer.Slice(0, copied).CopyTo(buffer.AsSpan(end));
        end += copied;
        Reader.AdvanceTo(result.Buffer.GetPosition(copied));
        if (copied == 0 && result.IsCompleted) ended = true;
        return !ended;
    }

    private static string Printable(ReadOnlySpan<byte> bytes) =>
        string.Concat(Encoding.UTF8.GetString(bytes).Select(c => char.IsControl(c) ? $"\\u{(int)c:X4}" : c.ToString()));
}

using System.Diagnostics.CodeAnalysis;
using System.Text.Json;
using StreamJsonRpc;
using StreamJsonRpc.Protocol;
using WindingNotes.LanguageServer.Protocol;

namespace WindingNotes.LanguageServer;

/// <summary>
/// The protocol's framing (Content-Length headers) with System.Text.Json, camelCase and nulls left
/// out. A message whose body is not JSON-RPC is answered with a parse error and skipped: by
/// default the connection would close on it, and the editor would lose its server over one bad message.
/// </summary>
internal sealed class LspMessageHandler(Stream sending, Stream receiving, SystemTextJsonFormatter formatter, Action<Exception> report)
    : HeaderDelimitedMessageHandler(sending, receiving, formatter)
{
    /// <summary>The protocol's JSON: camelCase names, nulls left out, every shape from the generated <see cref="ProtocolJson"/>.</summary>
    public static readonly JsonSerializerOptions Options = new(ProtocolJson.Default.Options);

    // Safe to suppress: the formatter is marked for its unhardened paths (marshalled IProgress,
    // IAsyncEnumerable and pipes, exceptions serialised with their type), none of which the server
    // uses: every route takes its parameters as JsonElement and answers with a shape of ProtocolJson,
    // and every fault is answered as a LocalRpcException with a code and a message. CI runs the real
    // clients against the NativeAOT tool, so a path that needed reflection would fail there.
    [UnconditionalSuppressMessage("Trimming", "IL2026", Justification = "The paths it marks are not used; see above.")]
    [UnconditionalSuppressMessage("AOT", "IL3050", Justification = "The paths it marks are not used; see above.")]
    public static SystemTextJsonFormatter CreateFormatter() => new() { JsonSerializerOptions = Options };

    protected override async ValueTask<JsonRpcMessage?> ReadCoreAsync(CancellationToken cancellationToken)
    {
        while (true)
        {
            try
            {
                return await base.ReadCoreAsync(cancellationToken);
            }
            // The body was read whole before it failed to parse, so the next message starts cleanly.
            catch (Exception e) when (e is JsonException or InvalidOperationException or NotSupportedException or FormatException or KeyNotFoundException or ArgumentException)
            {
                report(e);
                var error = new JsonRpcError
                {
                    RequestId = new RequestId(null),
                    Error = new JsonRpcError.ErrorDetail { Code = JsonRpcErrorCode.ParseError, Message = $"the message is not JSON-RPC: {e.Message}" },
                };
                await WriteAsync(error, cancellationToken);
            }
        }
    }
}

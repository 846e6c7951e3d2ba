using System.Text.Json;
using System.Text.Json.Serialization;
using StreamJsonRpc;
using StreamJsonRpc.Protocol;

namespace WindingNotes.LanguageServer;

/// <summary>
/// The protocol's framing (Content-Length headers) with System.Text.Json, camelCase and nulls left
/// out. A message whose body is not JSON-RPC is answered with a parse error and skipped: by
/// default the connection would close on it, and the editor would lose its server over one bad message.
/// </summary>
internal sealed class LspMessageHandler(Stream sending, Stream receiving, SystemTextJsonFormatter formatter, Action<Exception> report)
    : HeaderDelimitedMessageHandler(sending, receiving, formatter)
{
    /// <summary>The protocol's JSON: camelCase names, nulls left out.</summary>
    public static readonly JsonSerializerOptions Options = new()
    {
        PropertyNamingPolicy = JsonNamingPolicy.CamelCase,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
    };

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

using System.Diagnostics;
using System.Reflection;
using System.Text.Json;
using System.Text.Json.Serialization.Metadata;
using StreamJsonRpc;
using WindingNotes.LanguageServer.Protocol;

namespace WindingNotes.LanguageServer;

/// <summary>
/// One entry of the route table, registered with StreamJsonRpc as a method that takes the raw
/// parameters. Reading them is part of the guarded call, so bad parameters are "invalid params"
/// and a fault of a handler is "internal error": no exception leaves a handler unanswered.
/// </summary>
internal abstract class Route(string method)
{
    public string Method { get; } = method;

    public abstract MethodInfo Target { get; }

    protected static T Read<T>(JsonElement? parameters, JsonSerializerOptions options)
    {
        // Outside the guard: a shape missing from ProtocolJson is the server's fault, not the client's.
        var shape = (JsonTypeInfo<T>)options.GetTypeInfo(typeof(T));
        try
        {
            if (typeof(T) == typeof(JsonElement?)) return (T)(object?)parameters!;
            if (parameters is not { ValueKind: JsonValueKind.Object } given) throw new JsonException("the parameters are missing");
            return given.Deserialize(shape) ?? throw new JsonException("the parameters are null");
        }
        catch (Exception e) when (e is JsonException or NotSupportedException or InvalidOperationException)
        {
            throw new LocalRpcException($"invalid parameters: {e.Message}") { ErrorCode = (int)StreamJsonRpc.Protocol.JsonRpcErrorCode.InvalidParams };
        }
    }
}

/// <summary>
/// A request: refused before 'initialize' (unless it is 'initialize') and after 'shutdown'. A
/// lifecycle request runs in its turn among the messages; any other runs off that order, so a
/// request that waits for one document's evaluation holds up no message after it.
/// </summary>
internal sealed class RequestRoute<TParams, TResult>(string method, Server server, Func<TParams, CancellationToken, TResult> handler, bool beforeInitialize, JsonSerializerOptions options)
    : Route(method)
{
    public override MethodInfo Target => typeof(RequestRoute<TParams, TResult>).GetMethod(nameof(Invoke))!;

    public Task<TResult> Invoke(JsonElement? parameters = null, CancellationToken cancel = default) =>
        server.Guarded(Method, beforeInitialize, cancel, () => handler(Read<TParams>(parameters, options), cancel));
}

/// <summary>A notification: ignored before 'initialize'; a fault is traced, never answered (there is no one to answer).</summary>
internal sealed class NotificationRoute<TParams>(string method, Server server, Action<TParams> handler, bool beforeInitialize, JsonSerializerOptions options)
    : Route(method)
{
    public override MethodInfo Target => typeof(NotificationRoute<TParams>).GetMethod(nameof(Invoke))!;

    public void Invoke(JsonElement? parameters = null) =>
        server.Guarded(Method, beforeInitialize, () => handler(Read<TParams>(parameters, options)));
}

using System.Diagnostics;
using System.Diagnostics.CodeAnalysis;
using System.Text.Json;
using Microsoft.VisualStudio.Threading;
using StreamJsonRpc;
using WindingNotes.LanguageServer.Protocol;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.LanguageServer;

/// <summary>How the server behaves; the defaults are what the command uses.</summary>
public sealed record ServerOptions
{
    /// <summary>A wait after a change before evaluating. Zero: changes that come while an evaluation runs are coalesced instead.</summary>
    public TimeSpan Debounce { get; init; } = TimeSpan.Zero;

    /// <summary>
    /// How long a request waits for its document's current evaluation before it is answered from the
    /// last one that finished (when there is one), so a long study never leaves the editor without answers.
    /// </summary>
    public TimeSpan RequestBudget { get; init; } = TimeSpan.FromSeconds(2);

    /// <summary>Where the trace of the connection goes (handler faults included); standard error for the command.</summary>
    public TextWriter? Log { get; init; }
}

/// <summary>
/// Leaves out of the trace the errors a handler meant to answer with (a refused rename, a request
/// before 'initialize'): StreamJsonRpc traces every exception a method throws, these included.
/// Faults of the server itself are traced by the guard, with their stack.
/// </summary>
internal sealed class AnsweredErrors : TraceFilter
{
    public override bool ShouldTrace(TraceEventCache? cache, string source, TraceEventType eventType, int id, string? formatOrMessage, object?[]? args, object? data1, object?[]? data) =>
        !new[] { formatOrMessage, data1 }.Concat(args ?? []).Concat(data ?? []).Any(x => x?.ToString()?.Contains(nameof(LocalRpcException)) == true);
}

/// <summary>
/// The language server over one connection: its lifecycle (initialize, shutdown, exit), the open
/// documents, and the handlers of the route table (Routes.cs). Thin: protocol types in, Workspace and
/// Editing calls, protocol types out. Every handler catches its own exceptions and answers with a
/// protocol error; the server leaves only on 'exit' (or when the client's end of the pipe closes).
/// </summary>
public sealed partial class Server
{
    private readonly DocumentWorkspace workspace = new();
    private readonly TraceSource trace;
    private readonly TaskCompletionSource<int> exited = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private readonly Publisher publisher;
    private readonly ServerOptions options;
    private JsonRpc? rpc;
    private volatile bool initialized;
    private volatile bool shuttingDown;
    private bool prepareRename;

    private Server(ServerOptions options)
    {
        this.options = options;
        trace = new TraceSource("windingnotes-lsp", SourceLevels.Warning);
        trace.Listeners.Clear();
        if (options.Log is { } log) trace.Listeners.Add(new TextWriterTraceListener(log) { TraceOutputOptions = TraceOptions.None, Filter = new AnsweredErrors() });
        publisher = new Publisher(workspace, Publish, options.Debounce, trace);
    }

    // Safe to suppress: the formatter writes the parameter object whole through the options' resolver,
    // which ProtocolJson generates (PublishDiagnosticsParams is in it); nothing reflects over it.
    [UnconditionalSuppressMessage("Trimming", "IL2026", Justification = "Serialised by ProtocolJson; see above.")]
    private Task Publish(PublishDiagnosticsParams p) => rpc!.NotifyWithParameterObjectAsync("textDocument/publishDiagnostics", p);

    /// <summary>Serves one client until 'exit' or until its end closes; the exit code is 0 after 'shutdown', else 1.</summary>
    public static async Task<int> RunAsync(Stream input, Stream output, ServerOptions? options = null)
    {
        // A request that needs an evaluation in progress waits for it on its pool thread; spare
        // threads keep the pipe and the publisher moving meanwhile, on two cores as on twenty.
        ThreadPool.GetMinThreads(out var workers, out var completions);
        ThreadPool.SetMinThreads(Math.Max(workers, 8), completions);
        var server = new Server(options ?? new ServerOptions());
        var handler = new LspMessageHandler(output, input, LspMessageHandler.CreateFormatter(),
            message => server.trace.TraceEvent(TraceEventType.Warning, 0, message));
        using var rpc = new JsonRpc(handler)
        {
            // One handler at a time, in the order the messages came: a didChange is never overtaken by the request after it.
            SynchronizationContext = new NonConcurrentSynchronizationContext(sticky: false),
            TraceSource = server.trace,
            CancelLocallyInvokedMethodsWhenConnectionIsClosed = true,
        };
        server.rpc = rpc;
        // Each route takes the raw parameters and reads them itself, inside its guard.
        foreach (var route in server.Routes())
            rpc.AddLocalRpcMethod(route.Target, route, new JsonRpcMethodAttribute(route.Method) { UseSingleObjectParameterDeserialization = true });
        rpc.StartListening();
        var ended = await Task.WhenAny(server.exited.Task, rpc.Completion.ContinueWith(_ => 0, TaskScheduler.Default));
        // Before the connection is disposed: a publish still on its way then ends quietly.
        server.publisher.Close();
        if (ended != server.exited.Task) return server.shuttingDown ? 0 : 1;
        return await server.exited.Task;
    }

    // ---- guards ----

    private RequestRoute<TParams, TResult> Request<TParams, TResult>(string method, Func<TParams, CancellationToken, TResult> handler, bool beforeInitialize = false) =>
        new(method, this, handler, beforeInitialize, LspMessageHandler.ParameterOptions);

    private NotificationRoute<TParams> Notification<TParams>(string method, Action<TParams> handler, bool beforeInitialize = false) =>
        new(method, this, handler, beforeInitialize, LspMessageHandler.ParameterOptions);

    /// <summary>
    /// Runs a request: refused before 'initialize' and after 'shutdown' (checked in its turn); a
    /// lifecycle request (one allowed before 'initialize') runs in its turn, any other on the thread
    /// pool; a document changed under it answers "content modified"; any fault of the server becomes
    /// an internal error with its message.
    /// </summary>
    internal async Task<T> Guarded<T>(string method, bool beforeInitialize, CancellationToken cancel, Func<T> body)
    {
        if (!initialized && !beforeInitialize) throw Error(ErrorCodes.ServerNotInitialized, "the server is not initialized yet");
        if (shuttingDown && method != "shutdown") throw Error(ErrorCodes.InvalidRequest, "the server is shutting down");
        try
        {
            cancel.ThrowIfCancellationRequested();
            return beforeInitialize ? body() : await Task.Run(body, CancellationToken.None).ConfigureAwait(false);
        }
        catch (OperationCanceledException) when (cancel.IsCancellationRequested)
        {
            throw;
        }
        catch (OperationCanceledException)
        {
            throw Error(ErrorCodes.ContentModified, "the document changed while the request was answered");
        }
        catch (LocalRpcException)
        {
            throw;
        }
        catch (Exception e)
        {
            trace.TraceEvent(TraceEventType.Error, 0, $"{method} failed: {e}");
            throw Error(ErrorCodes.InternalError, $"{method} failed: {e.GetType().Name}: {e.Message}");
        }
    }

    /// <summary>Runs a notification: ignored before 'initialize'; a fault is traced, never thrown.</summary>
    internal void Guarded(string method, bool beforeInitialize, Action body)
    {
        if (!initialized && !beforeInitialize) return;
        try
        {
            body();
        }
        catch (Exception e)
        {
            trace.TraceEvent(TraceEventType.Error, 0, $"{method} failed: {e}");
        }
    }

    internal static LocalRpcException Error(int code, string message) => new(message) { ErrorCode = code };

    /// <summary>
    /// The evaluation of an open document's current version, or a request failure naming the
    /// document. Past the request budget, while an earlier version's evaluation is at hand, that one
    /// answers, with a diagnostic (published too) that the current one is still running.
    /// </summary>
    private Evaluation Evaluation(string uri, CancellationToken cancel)
    {
        var current = Task.Run(() => workspace.Evaluate(uri, cancel), CancellationToken.None);
        try
        {
            return current.WaitAsync(options.RequestBudget, cancel).GetAwaiter().GetResult() ?? throw NotOpen(uri);
        }
        catch (TimeoutException) when (workspace.LastComplete(uri) is var (last, version) && workspace.Find(uri) is { } document && document.Version != version)
        {
            var shown = last with { Diagnostics = [.. last.Diagnostics, DocumentWorkspace.StillRunning(version, document.Version)] };
            _ = publisher.Stale(uri, shown, version);
            return shown;
        }
        catch (TimeoutException)
        {
            return current.WaitAsync(cancel).GetAwaiter().GetResult() ?? throw NotOpen(uri);
        }
    }

    private static LocalRpcException NotOpen(string uri) => Error(ErrorCodes.RequestFailed, $"the document {uri} is not open");

    // ---- lifecycle ----

    private InitializeResult Initialize(InitializeParams p)
    {
        if (initialized) throw Error(ErrorCodes.InvalidRequest, "the server is already initialized");
        prepareRename = Capability(p.Capabilities, "textDocument", "rename", "prepareSupport") is { ValueKind: JsonValueKind.True };
        initialized = true;
        var version = typeof(Server).Assembly.GetName().Version?.ToString(3) ?? "0";
        return new InitializeResult(
            new ServerCapabilities(
                PositionEncoding: "utf-16",
                TextDocumentSync: new TextDocumentSyncOptions(OpenClose: true, Change: 1),
                HoverProvider: true,
                CompletionProvider: new CompletionOptions(ResolveProvider: false),
                DefinitionProvider: true,
                ReferencesProvider: true,
                RenameProvider: prepareRename ? new RenameOptions(PrepareProvider: true) : true,
                DocumentSymbolProvider: true,
                SemanticTokensProvider: new SemanticTokensOptions(Conversion.Legend, Full: true),
                DocumentFormattingProvider: true,
                CodeActionProvider: new CodeActionOptions(["quickfix"]),
                InlayHintProvider: true),
            new ServerInfo("windingnotes", version));
    }

    private static JsonElement? Capability(JsonElement? root, params string[] path)
    {
        var node = root;
        foreach (var name in path)
        {
            if (node is not { ValueKind: JsonValueKind.Object } o || !o.TryGetProperty(name, out var child)) return null;
            node = child;
        }
        return node;
    }

    private object? Shutdown()
    {
        if (!initialized) throw Error(ErrorCodes.ServerNotInitialized, "the server is not initialized yet");
        shuttingDown = true;
        return null;
    }

    private void Exit() => exited.TrySetResult(shuttingDown ? 0 : 1);

    // ---- documents ----

    private void DidOpen(DidOpenTextDocumentParams p)
    {
        var d = p.TextDocument;
        workspace.Open(d.Uri, Conversion.PathOf(d.Uri), d.Version, d.Text);
        _ = publisher.Changed(d.Uri);
    }

    private void DidChange(DidChangeTextDocumentParams p)
    {
        var uri = p.TextDocument.Uri;
        if (workspace.Find(uri) is not { } document) return;
        var text = document.Text;
        foreach (var change in p.ContentChanges)
        {
            if (change.Range is not { } range)
            {
                text = change.Text;
                continue;
            }
            // Full synchronisation is announced; a client that sends ranges anyway is served too.
            var source = new SourceText(text);
            var start = source.GetOffset(Conversion.FromLsp(range.Start));
            var end = Math.Max(start, source.GetOffset(Conversion.FromLsp(range.End)));
            text = string.Concat(text.AsSpan(0, start), change.Text, text.AsSpan(end));
        }
        workspace.Update(uri, p.TextDocument.Version, text);
        _ = publisher.Changed(uri);
    }

    private void DidClose(DidCloseTextDocumentParams p)
    {
        workspace.Close(p.TextDocument.Uri);
        _ = publisher.Changed(p.TextDocument.Uri);
    }
}

using System.Diagnostics;
using StreamJsonRpc;
using WindingNotes.LanguageServer.Protocol;
using WindingNotes.Workspace;

namespace WindingNotes.LanguageServer;

/// <summary>
/// Publishes each document's diagnostics after it changes. One worker a document evaluates its
/// latest version; changes that arrive meanwhile cancel the stale evaluation (the workspace does)
/// and are coalesced into one more pass, so a burst of a thousand changes costs a few evaluations
/// and the latest version always wins. Publishes for a document come from its one worker, in order;
/// a closed document gets its diagnostics cleared. Once the connection is <see cref="Close">closed</see>
/// nothing more is sent, and a send that the close overtook (its connection disposed under it) ends
/// quietly: the client has gone, there is no one to tell.
/// </summary>
internal sealed class Publisher(DocumentWorkspace workspace, Func<PublishDiagnosticsParams, Task> publish, TimeSpan debounce, TraceSource trace)
{
    private readonly Lock gate = new();
    private readonly HashSet<string> busy = [];
    private readonly HashSet<string> dirty = [];

    // As many documents evaluated at once as there are cores, and at most four: more only share the
    // cores and hold their half-built evaluations in memory together (50 opened at once would
    // otherwise all run), and the memory the server needs must not grow with the machine's cores.
    private readonly SemaphoreSlim evaluating = new(Math.Min(Environment.ProcessorCount, 4));

    // Large documents one at a time besides: an evaluation of a 1 MB document holds about 50 MB when
    // done and allocates several times that on the way, so two at once set the server's peak (50 open
    // documents of 1 MB: samples to 1.59 GB with two, RESULTS.md). Small ones still share the cores.
    private readonly SemaphoreSlim evaluatingLarge = new(1, 1);

    /// <summary>Characters of text from which a document counts as large: a few hundred kilobytes, well above any hand-written calculation.</summary>
    public const int LargeDocument = 250_000;

    // Publishing one at a time, with the version each document was last published at: results shown
    // from an earlier version while a long evaluation runs never follow the current version's.
    private readonly SemaphoreSlim sending = new(1, 1);
    private readonly Dictionary<string, int> published = [];
    private volatile bool closed;

    /// <summary>Marks the document for publishing; the task is its worker's (already done when a worker runs and will pass again).</summary>
    public Task Changed(string uri)
    {
        lock (gate)
        {
            if (!busy.Add(uri))
            {
                dirty.Add(uri);
                return Task.CompletedTask;
            }
        }
        return Task.Run(() => Work(uri));
    }

    /// <summary>The connection has ended (or is about to be disposed): from now on sending is a no-op.</summary>
    public void Close() => closed = true;

    private async Task Work(string uri)
    {
        while (true)
        {
            try
            {
                if (debounce > TimeSpan.Zero) await Task.Delay(debounce);
                await PublishLatest(uri);
            }
            catch (Exception e)
            {
                trace.TraceEvent(TraceEventType.Error, 0, $"publishing diagnostics of {uri} failed: {e}");
            }
            lock (gate)
            {
                if (!dirty.Remove(uri))
                {
                    busy.Remove(uri);
                    return;
                }
            }
        }
    }

    private async Task PublishLatest(string uri)
    {
        if (workspace.Find(uri) is not { } document)
        {
            await Send(uri, int.MinValue, () => new PublishDiagnosticsParams(uri, null, []));
            return;
        }
        var large = document.Text.Length >= LargeDocument ? evaluatingLarge : null;
        if (large is not null) await large.WaitAsync();
        await evaluating.WaitAsync();
        PublishDiagnosticsParams? diagnostics;
        try
        {
            diagnostics = Diagnostics(uri, document.Version);
        }
        catch (OperationCanceledException)
        {
            return; // overtaken: the change that overtook it has marked the document for another pass
        }
        finally
        {
            evaluating.Release();
            large?.Release();
        }
        if (diagnostics is not null)
            await Send(uri, document.Version, () => workspace.Find(uri)?.Version == document.Version ? diagnostics : null);
    }

    // Converted as soon as evaluated, in a method of its own so that no state machine keeps the
    // evaluation: a publication waiting for its turn (a client slow to read holds up every send) holds
    // its diagnostics only, not an evaluation of about 50 MB for a 1 MB document beside those the
    // workspace keeps. (With 50 documents of 1 MB the test's client kept up: the peak was the same.)
    private PublishDiagnosticsParams? Diagnostics(string uri, int version) =>
        workspace.Evaluate(uri, version) is { } evaluation && workspace.Find(uri)?.Version == version
            ? Conversion.ToLsp(evaluation, uri, version)
            : null;

    /// <summary>Publishes an earlier version's evaluation (with its "still running" diagnostic) unless the current one is out.</summary>
    public Task Stale(string uri, Evaluation shown, int version) =>
        Send(uri, version, () => workspace.Find(uri) is { } d && published.GetValueOrDefault(uri, int.MinValue) < d.Version ? Conversion.ToLsp(shown, uri, version) : null);

    /// <summary>Never throws: a fault is traced, and after <see cref="Close"/> nothing is sent or traced.</summary>
    private async Task Send(string uri, int version, Func<PublishDiagnosticsParams?> message)
    {
        await sending.WaitAsync();
        try
        {
            if (closed || message() is not { } p) return;
            published[uri] = version;
            await publish(p);
        }
        catch (Exception e) when (closed || e is ObjectDisposedException or ConnectionLostException)
        {
            // The connection closed while this was being sent (its stream or JsonRpc disposed, or the
            // client's end gone before the server noticed): nothing more will reach the client.
            closed = true;
        }
        catch (Exception e)
        {
            trace.TraceEvent(TraceEventType.Error, 0, $"publishing diagnostics of {uri} failed: {e}");
        }
        finally
        {
            sending.Release();
        }
    }
}

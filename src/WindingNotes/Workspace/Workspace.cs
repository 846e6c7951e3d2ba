using System.Collections.Concurrent;

namespace WindingNotes.Workspace;

/// <summary>A document the workspace holds: its text at a version.</summary>
public sealed record Document(string Uri, string Path, int Version, string Text);

/// <summary>
/// The open documents and their evaluations, cached by version. Both front ends call this: the
/// CLI for files on disk, the language server for what the editor holds. An evaluation that a newer
/// version has overtaken is cancelled; the latest version wins.
/// </summary>
public sealed class DocumentWorkspace
{
    /// <summary>
    /// A version and its one evaluation, shared by every caller that asks for it (the publisher of
    /// diagnostics and a request for hints evaluate once between them). Its token is cancelled
    /// when the version is overtaken or closed, so the evaluation of a stale version stops early.
    /// </summary>
    private sealed class Entry(Document document, Entry? previous)
    {
        private readonly CancellationTokenSource stale = new();

        /// <summary>The last finished evaluation of an earlier version, kept until this one finishes.</summary>
        private (Evaluation, int)? earlier = previous?.LastComplete;

        /// <summary>The last earlier version that was solved, shown while this one is not.</summary>
        private readonly SolvedVersion? lastSolved = previous?.LatestSolved;
        private readonly TaskCompletionSource<Evaluation> done = new(TaskCreationOptions.RunContinuationsAsynchronously);
        private int started;

        public Document Document { get; } = document;

        /// <summary>
        /// The first caller evaluates on its own thread; the others wait for it, each as long as its
        /// own token lets it, and a caller that gives up leaves the evaluation running for the rest.
        /// </summary>
        public Evaluation Evaluate(CancellationToken cancel)
        {
            if (Interlocked.Exchange(ref started, 1) == 0)
            {
                try
                {
                    var evaluation = Evaluator.Evaluate(Document.Text, Document.Path, stale.Token);
                    done.SetResult(evaluation.Solved ? evaluation : evaluation with { LastSolved = lastSolved });
                    earlier = null;
                }
                catch (Exception e)
                {
                    done.SetException(e);
                }
            }
            var task = done.Task;
            if (!task.IsCompleted) task.WaitAsync(cancel).GetAwaiter().GetResult();
            return task.GetAwaiter().GetResult();
        }

        /// <summary>This version's evaluation when it has finished, else the last finished one of an earlier version.</summary>
        public (Evaluation Evaluation, int Version)? LastComplete =>
            done.Task.IsCompletedSuccessfully ? (done.Task.Result, Document.Version) : earlier;

        /// <summary>This version where it was solved, else the one before it that was: one evaluation is kept, never a chain.</summary>
        public SolvedVersion? LatestSolved =>
            done.Task.IsCompletedSuccessfully && done.Task.Result.Solved ? new SolvedVersion(Document.Version, done.Task.Result) : lastSolved;

        // Never disposed: a token source without timers holds nothing, and disposing it would race with Cancel.
        public void Overtake() => stale.Cancel();
    }

    private readonly ConcurrentDictionary<string, Entry> entries = new();

    public IEnumerable<Document> Documents => entries.Values.Select(e => e.Document);

    public Document? Find(string uri) => entries.GetValueOrDefault(uri)?.Document;

    public void Open(string uri, string path, int version, string text) => Update(uri, version, text, path);

    public void Update(string uri, int version, string text, string? path = null)
    {
        Entry? previous = null;
        entries.AddOrUpdate(uri,
            _ => new Entry(new Document(uri, path ?? uri, version, text), null),
            (_, old) =>
            {
                previous = old;
                return new Entry(new Document(uri, path ?? old.Document.Path, version, text), old);
            });
        previous?.Overtake();
    }

    public void Close(string uri)
    {
        if (entries.TryRemove(uri, out var entry)) entry.Overtake();
    }

    /// <summary>
    /// The evaluation of the document's current version, computed once per version; null when the
    /// document is not open. Throws <see cref="OperationCanceledException"/> when the version is
    /// overtaken while it is evaluated, or when <paramref name="cancel"/> is cancelled before it is done.
    /// </summary>
    public Evaluation? Evaluate(string uri, CancellationToken cancel = default)
    {
        cancel.ThrowIfCancellationRequested();
        return entries.TryGetValue(uri, out var entry) ? entry.Evaluate(cancel) : null;
    }

    /// <summary>
    /// The last evaluation of the document that finished, with its version: the current version's
    /// when it is done, else an earlier one's (what an editor shows while a long study runs); null
    /// when the document is not open or none has finished.
    /// </summary>
    public (Evaluation Evaluation, int Version)? LastComplete(string uri) => entries.GetValueOrDefault(uri)?.LastComplete;

    /// <summary>Said beside results shown from an earlier version while the current one is still evaluated.</summary>
    public static Text.Diagnostic StillRunning(int shown, int running) =>
        new(Text.Severity.Information, "evaluation-running",
            $"results are from version {shown}: the evaluation of version {running} is still running", default);

    /// <summary>The evaluation of one version, or null when that version is no longer the current one.</summary>
    public Evaluation? Evaluate(string uri, int version, CancellationToken cancel = default)
    {
        cancel.ThrowIfCancellationRequested();
        return entries.TryGetValue(uri, out var entry) && entry.Document.Version == version ? entry.Evaluate(cancel) : null;
    }
}

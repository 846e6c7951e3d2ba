using System.Collections.Concurrent;

namespace WindingNotes.Workspace;

/// <summary>A document the workspace holds: its text at a version.</summary>
public sealed record Document(string Uri, string Path, int Version, string Text);

/// <summary>
/// The open documents and their evaluations, cached by version. Both front ends call this: the
/// CLI for files on disk, the language server for what the editor holds. An evaluation that a newer
/// version has overtaken is cancelled; the latest version wins. Evaluations are kept for the
/// documents used last, up to <paramref name="keptText"/> characters of their texts together; an
/// older one is dropped and evaluated again when next asked for, so the memory of many large open
/// documents stays bounded (an evaluation holds about fifty times its text: tokens, tree, model, results).
/// </summary>
/// <param name="keptText">How many characters of text, over the documents used last, keep their evaluations; the one just evaluated always does.</param>
public sealed class DocumentWorkspace(long keptText = DocumentWorkspace.DefaultKeptText)
{
    /// <summary>
    /// Three or four documents of a megabyte, or all of about a hundred of a thousand lines: a 1 MB
    /// document's evaluation held about 52 MB (RESULTS.md), so this keeps about 210 MB of evaluations.
    /// Eight (420 MB) took the server of 50 open 1 MB documents to 1.47 GB: what the collector lets
    /// the heap reach grows with what stays live.
    /// </summary>
    public const long DefaultKeptText = 4_000_000;

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
        private SolvedVersion? lastSolved = previous?.LatestSolved;

        /// <summary>One evaluation of this version; <see cref="Drop"/> puts a fresh one in its place.</summary>
        private sealed class Run
        {
            public readonly TaskCompletionSource<Evaluation> Done = new(TaskCreationOptions.RunContinuationsAsynchronously);
            public int Started;
        }

        private Run run = new();

        public Document Document { get; } = document;

        /// <summary>When the document was last asked for, by the workspace's count of requests.</summary>
        public long LastUsed;

        /// <summary>
        /// The first caller evaluates on its own thread; the others wait for it, each as long as its
        /// own token lets it, and a caller that gives up leaves the evaluation running for the rest.
        /// </summary>
        public Evaluation Evaluate(CancellationToken cancel)
        {
            var r = Volatile.Read(ref run);
            if (Interlocked.Exchange(ref r.Started, 1) == 0)
            {
                try
                {
                    var evaluation = Evaluator.Evaluate(Document.Text, Document.Path, stale.Token);
                    r.Done.SetResult(evaluation.Solved ? evaluation : evaluation with { LastSolved = lastSolved });
                    earlier = null;
                }
                catch (Exception e)
                {
                    r.Done.SetException(e);
                }
            }
            var task = r.Done.Task;
            if (!task.IsCompleted) task.WaitAsync(cancel).GetAwaiter().GetResult();
            return task.GetAwaiter().GetResult();
        }

        /// <summary>Whether this version's evaluation has finished and is kept.</summary>
        public bool Holds => Volatile.Read(ref run).Done.Task.IsCompletedSuccessfully;

        /// <summary>
        /// Forgets this version's finished evaluation, and the earlier versions' kept beside it; the
        /// next caller evaluates again. An evaluation still running is left to finish.
        /// </summary>
        public void Drop()
        {
            var r = Volatile.Read(ref run);
            if (!r.Done.Task.IsCompletedSuccessfully) return;
            Interlocked.CompareExchange(ref run, new Run(), r);
            (earlier, lastSolved) = (null, null);
        }

        /// <summary>This version's evaluation when it has finished, else the last finished one of an earlier version.</summary>
        public (Evaluation Evaluation, int Version)? LastComplete =>
            Volatile.Read(ref run).Done.Task is { IsCompletedSuccessfully: true } t ? (t.Result, Document.Version) : earlier;

        /// <summary>This version where it was solved, else the one before it that was: one evaluation is kept, never a chain.</summary>
        public SolvedVersion? LatestSolved =>
            Volatile.Read(ref run).Done.Task is { IsCompletedSuccessfully: true } t && t.Result.Solved ? new SolvedVersion(Document.Version, t.Result) : lastSolved;

        // Never disposed: a token source without timers holds nothing, and disposing it would race with Cancel.
        public void Overtake() => stale.Cancel();
    }

    private readonly ConcurrentDictionary<string, Entry> entries = new();
    private readonly Lock trimming = new();
    private long uses;

    /// <summary>Marks the entry used, evaluates it (or waits for its evaluation), then drops the evaluations past the budget.</summary>
    private Evaluation Use(Entry entry, CancellationToken cancel)
    {
        entry.LastUsed = Interlocked.Increment(ref uses);
        var evaluation = entry.Evaluate(cancel);
        Trim(entry);
        return evaluation;
    }

    /// <summary>Keeps the evaluations of the documents used last, up to the budget of text; <paramref name="keep"/>'s always.</summary>
    private void Trim(Entry keep)
    {
        lock (trimming)
        {
            long text = 0;
            foreach (var entry in entries.Values.Where(e => e.Holds).OrderByDescending(e => e.LastUsed))
            {
                text += entry.Document.Text.Length;
                if (text > keptText && entry != keep) entry.Drop();
            }
        }
    }

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
        return entries.TryGetValue(uri, out var entry) ? Use(entry, cancel) : null;
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
        return entries.TryGetValue(uri, out var entry) && entry.Document.Version == version ? Use(entry, cancel) : null;
    }
}

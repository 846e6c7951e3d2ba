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
    private readonly ConcurrentDictionary<string, Document> documents = new();
    private readonly ConcurrentDictionary<string, (int Version, Lazy<Evaluation> Evaluation)> cache = new();
    private readonly ConcurrentDictionary<string, CancellationTokenSource> running = new();

    public IEnumerable<Document> Documents => documents.Values;

    public Document? Find(string uri) => documents.GetValueOrDefault(uri);

    public void Open(string uri, string path, int version, string text) => Update(uri, version, text, path);

    public void Update(string uri, int version, string text, string? path = null)
    {
        var previous = documents.GetValueOrDefault(uri);
        documents[uri] = new Document(uri, path ?? previous?.Path ?? uri, version, text);
        if (running.TryRemove(uri, out var stale)) stale.Cancel();
    }

    public void Close(string uri)
    {
        documents.TryRemove(uri, out _);
        cache.TryRemove(uri, out _);
        if (running.TryRemove(uri, out var stale)) stale.Cancel();
    }

    /// <summary>The evaluation of the document's current version, computed once per version.</summary>
    public Evaluation? Evaluate(string uri, CancellationToken cancel = default)
    {
        if (!documents.TryGetValue(uri, out var document)) return null;
        if (cache.TryGetValue(uri, out var cached) && cached.Version == document.Version && cached.Evaluation.IsValueCreated)
            return cached.Evaluation.Value;
        using var source = CancellationTokenSource.CreateLinkedTokenSource(cancel);
        running[uri] = source;
        var evaluation = Evaluator.Evaluate(document.Text, document.Path, source.Token);
        running.TryRemove(new KeyValuePair<string, CancellationTokenSource>(uri, source));
        cache[uri] = (document.Version, new Lazy<Evaluation>(evaluation));
        return evaluation;
    }
}

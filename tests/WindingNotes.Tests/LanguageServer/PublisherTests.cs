using System.Diagnostics;
using WindingNotes.LanguageServer;
using WindingNotes.LanguageServer.Protocol;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.LanguageServer;

/// <summary>
/// The publisher at the end of a connection, driven step by step (no waits on time): a publish that
/// the close overtakes ends quietly, nothing is sent after the close, and a publish that fails for
/// another reason is traced and the next change still published. The first case is the race
/// <c>ServerStreamFuzzTests</c> met under load: an ObjectDisposedException traced as a failure after
/// 'exit'.
/// </summary>
public class PublisherTests
{
    private const string Uri = "file:///work/alder-creek-boost.wn";

    private static (DocumentWorkspace, TraceSource, StringWriter) Setup()
    {
        var workspace = new DocumentWorkspace();
        workspace.Open(Uri, "/work/alder-creek-boost.wn", 1, Cursor.Example("alder-creek-boost.wn"));
        var log = new StringWriter();
        var trace = new TraceSource("publisher-test", SourceLevels.Warning);
        trace.Listeners.Clear();
        trace.Listeners.Add(new TextWriterTraceListener(TextWriter.Synchronized(log)));
        return (workspace, trace, log);
    }

    [Fact]
    public async Task A_publish_overtaken_by_the_close_ends_quietly()
    {
        var (workspace, trace, log) = Setup();
        var entered = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        var release = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        var publisher = new Publisher(workspace, async p =>
        {
            entered.SetResult();
            await release.Task;
            throw new ObjectDisposedException("JsonRpc"); // what a disposed connection throws
        }, TimeSpan.Zero, trace);
        var worker = publisher.Changed(Uri);
        await entered.Task;
        publisher.Close();
        release.SetResult();
        await worker;
        trace.Flush();
        Assert.Equal("", log.ToString());
    }

    [Fact]
    public async Task Nothing_is_sent_after_the_close()
    {
        var (workspace, trace, log) = Setup();
        var sent = 0;
        var publisher = new Publisher(workspace, p => { Interlocked.Increment(ref sent); return Task.CompletedTask; }, TimeSpan.Zero, trace);
        await publisher.Changed(Uri);
        Assert.Equal(1, sent);
        publisher.Close();
        await publisher.Changed(Uri);
        await publisher.Stale(Uri, workspace.Evaluate(Uri, CancellationToken.None)!, 1);
        Assert.Equal(1, sent);
        trace.Flush();
        Assert.Equal("", log.ToString());
    }

    [Fact]
    public async Task A_publish_that_fails_while_connected_is_traced_and_the_next_change_still_published()
    {
        var (workspace, trace, log) = Setup();
        var versions = new List<int?>();
        var publisher = new Publisher(workspace, p =>
        {
            lock (versions) versions.Add(p.Version);
            return versions.Count == 1 ? throw new InvalidOperationException("the writer broke") : Task.CompletedTask;
        }, TimeSpan.Zero, trace);
        await publisher.Changed(Uri);
        workspace.Update(Uri, 2, Cursor.Example("alder-creek-boost.wn") + "\n");
        await publisher.Changed(Uri);
        Assert.Equal([1, 2], versions);
        trace.Flush();
        Assert.Contains($"publishing diagnostics of {Uri} failed: System.InvalidOperationException: the writer broke", log.ToString());
    }
}

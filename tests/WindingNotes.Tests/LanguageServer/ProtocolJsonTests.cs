using Xunit;

namespace WindingNotes.Tests.LanguageServer;

/// <summary>
/// The protocol's JSON is generated (ProtocolJson) and has no reflection fallback, so a shape it
/// lacks fails in this build as in the native one. The features' shapes are read and written by
/// every feature test; these are the messages no feature test looks inside.
/// </summary>
public class ProtocolJsonTests
{
    [Fact]
    public async Task A_cancellation_is_read_by_the_server()
    {
        await using var pipe = await LspPipe.Initialized();
        await pipe.Notify("$/cancelRequest", """{"id":1000}""");
        await pipe.Notify("$/cancelRequest", """{"id":"a-string-id"}""");
        Assert.Equal(0, await pipe.ShutDown());
        Assert.DoesNotContain("cancelRequest", pipe.Log.ToString());
    }
}

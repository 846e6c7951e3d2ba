namespace WindingNotes.LanguageServer.Protocol;

// The parts of the Language Server Protocol 3.17 this server speaks, as JSON shapes (camelCase,
// nulls left out). Nothing outside this project sees them; Conversion turns them to and from the
// library's plain data.

public sealed record LspPosition(int Line, int Character);

public sealed record LspRange(LspPosition Start, LspPosition End);

public sealed record Location(string Uri, LspRange Range);

public sealed record TextDocumentIdentifier(string Uri);

public sealed record VersionedTextDocumentIdentifier(string Uri, int Version);

public sealed record TextDocumentItem(string Uri, string LanguageId, int Version, string Text);

public record TextDocumentPositionParams(TextDocumentIdentifier TextDocument, LspPosition Position);

public sealed record LspTextEdit(LspRange Range, string NewText);

public sealed record WorkspaceEdit(Dictionary<string, LspTextEdit[]> Changes);

public sealed record MarkupContent(string Kind, string Value)
{
    public static MarkupContent Markdown(string value) => new("markdown", value);
}

/// <summary>Error codes the protocol adds to JSON-RPC's.</summary>
public static class ErrorCodes
{
    public const int InvalidRequest = -32600;
    public const int InternalError = -32603;
    public const int ServerNotInitialized = -32002;
    public const int RequestFailed = -32803;
    public const int ContentModified = -32801;
}

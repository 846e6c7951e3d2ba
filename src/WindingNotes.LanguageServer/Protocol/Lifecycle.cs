using System.Text.Json;

namespace WindingNotes.LanguageServer.Protocol;

/// <summary>Only the capabilities the server looks at are read; the rest of the client's are kept as JSON.</summary>
public sealed record InitializeParams(int? ProcessId = null, JsonElement? Capabilities = null);

public sealed record InitializeResult(ServerCapabilities Capabilities, ServerInfo ServerInfo);

public sealed record ServerInfo(string Name, string Version);

public sealed record ServerCapabilities(
    string PositionEncoding,
    TextDocumentSyncOptions TextDocumentSync,
    bool HoverProvider,
    CompletionOptions CompletionProvider,
    bool DefinitionProvider,
    bool ReferencesProvider,
    object RenameProvider,
    bool DocumentSymbolProvider,
    SemanticTokensOptions SemanticTokensProvider,
    bool DocumentFormattingProvider,
    CodeActionOptions CodeActionProvider,
    bool InlayHintProvider);

/// <summary>Change 1 is full synchronisation: every change sends the whole text.</summary>
public sealed record TextDocumentSyncOptions(bool OpenClose, int Change);

public sealed record CompletionOptions(bool ResolveProvider);

public sealed record RenameOptions(bool PrepareProvider);

public sealed record SemanticTokensLegend(string[] TokenTypes, string[] TokenModifiers);

public sealed record SemanticTokensOptions(SemanticTokensLegend Legend, bool Full);

public sealed record CodeActionOptions(string[] CodeActionKinds);

public sealed record DidOpenTextDocumentParams(TextDocumentItem TextDocument);

public sealed record TextDocumentContentChangeEvent(string Text, LspRange? Range = null);

public sealed record DidChangeTextDocumentParams(VersionedTextDocumentIdentifier TextDocument, TextDocumentContentChangeEvent[] ContentChanges);

public sealed record DidCloseTextDocumentParams(TextDocumentIdentifier TextDocument);

public sealed record DidSaveTextDocumentParams(TextDocumentIdentifier TextDocument);

namespace WindingNotes.LanguageServer.Protocol;

public sealed record DiagnosticRelatedInformation(Location Location, string Message);

public sealed record LspDiagnostic(LspRange Range, int Severity, string Code, string Source, string Message, DiagnosticRelatedInformation[]? RelatedInformation);

public sealed record PublishDiagnosticsParams(string Uri, int? Version, LspDiagnostic[] Diagnostics);

public sealed record Hover(MarkupContent Contents, LspRange Range);

public sealed record InlayHintParams(TextDocumentIdentifier TextDocument, LspRange Range);

public sealed record LspInlayHint(LspPosition Position, string Label, bool PaddingLeft, MarkupContent? Tooltip);

public sealed record CompletionParams(TextDocumentIdentifier TextDocument, LspPosition Position) : TextDocumentPositionParams(TextDocument, Position);

public sealed record CompletionItem(string Label, int Kind, string? Detail, MarkupContent? Documentation, LspTextEdit TextEdit, string SortText);

public sealed record CompletionList(bool IsIncomplete, CompletionItem[] Items);

public sealed record ReferenceContext(bool IncludeDeclaration);

public sealed record ReferenceParams(TextDocumentIdentifier TextDocument, LspPosition Position, ReferenceContext Context) : TextDocumentPositionParams(TextDocument, Position);

public sealed record RenameParams(TextDocumentIdentifier TextDocument, LspPosition Position, string NewName) : TextDocumentPositionParams(TextDocument, Position);

public sealed record PrepareRenameResult(LspRange Range, string Placeholder);

public sealed record DocumentSymbolParams(TextDocumentIdentifier TextDocument);

public sealed record DocumentSymbol(string Name, string? Detail, int Kind, LspRange Range, LspRange SelectionRange, DocumentSymbol[] Children);

public sealed record SemanticTokensParams(TextDocumentIdentifier TextDocument);

public sealed record LspSemanticTokens(int[] Data);

public sealed record DocumentFormattingParams(TextDocumentIdentifier TextDocument);

/// <summary>The client's context (its diagnostics) is not read: the fixes come from the server's own evaluation of the range.</summary>
public sealed record CodeActionParams(TextDocumentIdentifier TextDocument, LspRange Range);

public sealed record CodeAction(string Title, string Kind, LspDiagnostic[] Diagnostics, bool IsPreferred, WorkspaceEdit Edit);

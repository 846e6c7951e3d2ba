using System.Text.Json;
using WindingNotes.LanguageServer.Protocol;

namespace WindingNotes.LanguageServer;

public sealed partial class Server
{
    /// <summary>The route table: every method the server answers, and its handler. Nothing else is registered.</summary>
    private IEnumerable<Route> Routes() =>
    [
        Request<InitializeParams, InitializeResult>("initialize", (p, _) => Initialize(p), beforeInitialize: true),
        Notification<JsonElement?>("initialized", _ => { }),
        Request<JsonElement?, object?>("shutdown", (_, _) => Shutdown(), beforeInitialize: true),
        Notification<JsonElement?>("exit", _ => Exit(), beforeInitialize: true),
        Notification<DidOpenTextDocumentParams>("textDocument/didOpen", DidOpen),
        Notification<DidChangeTextDocumentParams>("textDocument/didChange", DidChange),
        Notification<DidCloseTextDocumentParams>("textDocument/didClose", DidClose),
        Notification<JsonElement?>("textDocument/didSave", _ => { }),
        Request<TextDocumentPositionParams, Hover?>("textDocument/hover", Hover),
        Request<InlayHintParams, LspInlayHint[]>("textDocument/inlayHint", InlayHint),
        Request<CompletionParams, CompletionList>("textDocument/completion", Completion),
        Request<TextDocumentPositionParams, Location?>("textDocument/definition", Definition),
        Request<ReferenceParams, Location[]>("textDocument/references", References),
        Request<TextDocumentPositionParams, PrepareRenameResult?>("textDocument/prepareRename", PrepareRename),
        Request<RenameParams, WorkspaceEdit>("textDocument/rename", Rename),
        Request<DocumentSymbolParams, DocumentSymbol[]>("textDocument/documentSymbol", DocumentSymbol),
        Request<SemanticTokensParams, LspSemanticTokens>("textDocument/semanticTokens/full", SemanticTokens),
        Request<DocumentFormattingParams, LspTextEdit[]>("textDocument/formatting", Formatting),
        Request<CodeActionParams, CodeAction[]>("textDocument/codeAction", CodeAction),
    ];
}

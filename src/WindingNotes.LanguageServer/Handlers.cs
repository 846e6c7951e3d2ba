using WindingNotes.Editing;
using WindingNotes.LanguageServer.Protocol;
using static WindingNotes.LanguageServer.Conversion;

namespace WindingNotes.LanguageServer;

// The feature requests: each asks the Editing layer about the document's evaluation and converts
// the answer. Their guard (Route.cs) reads the parameters and turns every fault into an answer.
public sealed partial class Server
{
    private Hover? Hover(TextDocumentPositionParams p, CancellationToken cancel) =>
        Hovers.At(Evaluation(p.TextDocument.Uri, cancel), FromLsp(p.Position)) is { } hover ? ToLsp(hover) : null;

    private LspInlayHint[] InlayHint(InlayHintParams p, CancellationToken cancel) =>
        InlayHints.For(Evaluation(p.TextDocument.Uri, cancel), FromLsp(p.Range)).Select(ToLsp).ToArray();

    private CompletionList Completion(CompletionParams p, CancellationToken cancel) =>
        ToLsp(Editing.Completion.At(Evaluation(p.TextDocument.Uri, cancel), FromLsp(p.Position)));

    private Location? Definition(TextDocumentPositionParams p, CancellationToken cancel) =>
        Navigation.Definition(Evaluation(p.TextDocument.Uri, cancel), FromLsp(p.Position)) is { } range ? new Location(p.TextDocument.Uri, ToLsp(range)) : null;

    private Location[] References(ReferenceParams p, CancellationToken cancel) =>
        Navigation.References(Evaluation(p.TextDocument.Uri, cancel), FromLsp(p.Position), p.Context?.IncludeDeclaration ?? true)
            .Select(r => new Location(p.TextDocument.Uri, ToLsp(r))).ToArray();

    private PrepareRenameResult? PrepareRename(TextDocumentPositionParams p, CancellationToken cancel) =>
        Navigation.PrepareRename(Evaluation(p.TextDocument.Uri, cancel), FromLsp(p.Position)) is { } target ? new PrepareRenameResult(ToLsp(target.Range), target.Placeholder) : null;

    private WorkspaceEdit Rename(RenameParams p, CancellationToken cancel)
    {
        var result = Navigation.Rename(Evaluation(p.TextDocument.Uri, cancel), FromLsp(p.Position), p.NewName);
        if (result.Error is { } error) throw Error(ErrorCodes.RequestFailed, error);
        return ToLsp(p.TextDocument.Uri, result.Edits);
    }

    private DocumentSymbol[] DocumentSymbol(DocumentSymbolParams p, CancellationToken cancel) =>
        DocumentSymbols.For(Evaluation(p.TextDocument.Uri, cancel)).Select(ToLsp).ToArray();

    private LspSemanticTokens SemanticTokens(SemanticTokensParams p, CancellationToken cancel) =>
        ToLsp(Editing.SemanticTokens.For(Evaluation(p.TextDocument.Uri, cancel)));

    private LspTextEdit[] Formatting(DocumentFormattingParams p, CancellationToken cancel) =>
        Editing.Formatting.Edits(Evaluation(p.TextDocument.Uri, cancel)).Select(ToLsp).ToArray();

    private CodeAction[] CodeAction(CodeActionParams p, CancellationToken cancel)
    {
        var evaluation = Evaluation(p.TextDocument.Uri, cancel);
        return QuickFixes.For(evaluation, FromLsp(p.Range)).Select(f => ToLsp(f, p.TextDocument.Uri, evaluation.Text)).ToArray();
    }
}

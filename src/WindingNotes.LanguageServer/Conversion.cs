using WindingNotes.Editing;
using WindingNotes.LanguageServer.Protocol;
using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.LanguageServer;

/// <summary>
/// The one place where the library's plain data becomes protocol types and back. Positions are
/// zero-based lines and UTF-16 characters on both sides, so they pass through unchanged.
/// </summary>
internal static class Conversion
{
    public static Position FromLsp(LspPosition p) => new(p.Line, p.Character);

    public static TextRange FromLsp(LspRange r) => new(FromLsp(r.Start), FromLsp(r.End));

    public static LspPosition ToLsp(Position p) => new(p.Line, p.Character);

    public static LspRange ToLsp(TextRange r) => new(ToLsp(r.Start), ToLsp(r.End));

    public static LspTextEdit ToLsp(TextEdit e) => new(ToLsp(e.Range), e.NewText);

    public static WorkspaceEdit ToLsp(string uri, IEnumerable<TextEdit> edits) => new(new() { [uri] = edits.Select(ToLsp).ToArray() });

    /// <summary>Hints go into the message as the command line prints them; related spans become related information.</summary>
    public static LspDiagnostic ToLsp(Diagnostic d, string uri, SourceText text)
    {
        var message = d.Shown + string.Concat(d.Hints.Select(h => $" ({h.Message})"));
        var related = d.Related.IsEmpty
            ? null
            : d.Related.Select(r => new DiagnosticRelatedInformation(new Location(uri, ToLsp(text.GetRange(r.Span))), r.Message)).ToArray();
        var severity = d.Severity switch { Severity.Error => 1, Severity.Warning => 2, Severity.Information => 3, _ => 4 };
        return new LspDiagnostic(ToLsp(text.GetRange(d.Span)), severity, d.Code, "windingnotes", message, related);
    }

    public static PublishDiagnosticsParams ToLsp(Evaluation evaluation, string uri, int version) =>
        new(uri, version, evaluation.Diagnostics.Select(d => ToLsp(d, uri, evaluation.Text)).ToArray());

    public static Hover ToLsp(HoverInfo h) => new(MarkupContent.Markdown(h.Markdown), ToLsp(h.Range));

    public static LspInlayHint ToLsp(InlayHint h) => new(ToLsp(h.Position), h.Label, true, h.Tooltip is null ? null : MarkupContent.Markdown(h.Tooltip));

    public static CompletionList ToLsp(IReadOnlyList<CompletionEntry> entries) =>
        new(false, entries.Select((e, i) => new CompletionItem(
            e.Label, CompletionKind(e), e.Detail.Length == 0 ? null : e.Detail,
            e.Documentation is null ? null : MarkupContent.Markdown(e.Documentation),
            new LspTextEdit(ToLsp(e.Range), e.Label), i.ToString("D4"))).ToArray());

    // CompletionItemKind of the protocol.
    private static int CompletionKind(CompletionEntry e) => e.Kind switch
    {
        Editing.CompletionKind.Statement => 14,
        Editing.CompletionKind.Clause => 10,
        Editing.CompletionKind.Word => 20,
        Editing.CompletionKind.Unit => 11,
        _ => e.Symbol switch
        {
            SymbolKind.Let => 21,
            SymbolKind.Core => 9,
            SymbolKind.Winding => 7,
            SymbolKind.Supply => 3,
            SymbolKind.Load => 2,
            SymbolKind.Fault => 23,
            _ => 5,
        },
    };

    public static DocumentSymbol ToLsp(OutlineSymbol s) =>
        new(s.Name, s.Detail, OutlineKind(s.Kind), ToLsp(s.Range), ToLsp(s.SelectionRange), s.Children.Select(ToLsp).ToArray());

    // SymbolKind of the protocol.
    private static int OutlineKind(OutlineKind kind) => kind switch
    {
        Editing.OutlineKind.Core => 2,
        Editing.OutlineKind.Winding => 5,
        Editing.OutlineKind.Tap => 8,
        Editing.OutlineKind.Brush => 7,
        Editing.OutlineKind.Supply => 12,
        Editing.OutlineKind.Load => 6,
        Editing.OutlineKind.Fault => 24,
        Editing.OutlineKind.Sweep => 18,
        _ => 14,
    };

    /// <summary>The token types, in the legend's order, one for each <see cref="TokenClass"/>.</summary>
    public static readonly SemanticTokensLegend Legend = new(
        Enum.GetValues<TokenClass>().Select(TokenType).Distinct().ToArray(),
        ["declaration"]);

    private static string TokenType(TokenClass c) => c switch
    {
        TokenClass.Statement or TokenClass.Word => "keyword",
        TokenClass.Clause => "property",
        TokenClass.Choice => "enumMember",
        TokenClass.Number => "number",
        TokenClass.Unit => "type",
        TokenClass.Operator => "operator",
        TokenClass.Comment => "comment",
        TokenClass.Let => "variable",
        TokenClass.Core => "namespace",
        TokenClass.Winding => "class",
        TokenClass.Point => "parameter",
        TokenClass.Supply => "function",
        TokenClass.Load => "method",
        _ => "event",
    };

    /// <summary>The protocol's relative encoding: line delta, start delta (within a line), length, type, modifiers.</summary>
    public static LspSemanticTokens ToLsp(IReadOnlyList<SemanticToken> tokens)
    {
        var data = new int[tokens.Count * 5];
        int line = 0, character = 0;
        for (var i = 0; i < tokens.Count; i++)
        {
            var t = tokens[i];
            data[5 * i] = t.Line - line;
            data[5 * i + 1] = t.Line == line ? t.Character - character : t.Character;
            data[5 * i + 2] = t.Length;
            data[5 * i + 3] = Array.IndexOf(Legend.TokenTypes, TokenType(t.Class));
            data[5 * i + 4] = t.Defines ? 1 : 0;
            (line, character) = (t.Line, t.Character);
        }
        return new LspSemanticTokens(data);
    }

    public static CodeAction ToLsp(QuickFix f, string uri, SourceText text) =>
        new(f.Title, "quickfix", [ToLsp(f.Diagnostic, uri, text)], f.Preferred, ToLsp(uri, f.Edits));

    /// <summary>A file URI's path for messages; other schemes keep the URI. The server never opens it.</summary>
    public static string PathOf(string uri) =>
        Uri.TryCreate(uri, UriKind.Absolute, out var u) && u.IsFile ? u.LocalPath : uri;
}

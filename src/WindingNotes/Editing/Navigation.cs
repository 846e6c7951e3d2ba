using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

/// <summary>The name a rename would change, and its text as the editor's placeholder.</summary>
public sealed record RenameTarget(TextRange Range, string Placeholder);

/// <summary>The edits of a rename, or why it cannot be done.</summary>
public sealed record RenameResult(IReadOnlyList<TextEdit> Edits, string? Error = null);

/// <summary>Go to definition, find references and rename, over the symbol table every name occurrence is in.</summary>
public static class Navigation
{
    public static TextRange? Definition(Evaluation evaluation, Position position) =>
        SymbolAt(evaluation, position) is { } symbol ? evaluation.Text.GetRange(symbol.Span) : null;

    public static IReadOnlyList<TextRange> References(Evaluation evaluation, Position position, bool includeDefinition)
    {
        if (SymbolAt(evaluation, position) is not { } symbol) return [];
        return evaluation.Model.Symbols.ReferencesTo(symbol)
            .Where(r => includeDefinition || !r.IsDefinition)
            .Select(r => evaluation.Text.GetRange(r.Span))
            .ToList();
    }

    public static RenameTarget? PrepareRename(Evaluation evaluation, Position position)
    {
        var reference = evaluation.Model.Symbols.At(evaluation.Text.GetOffset(position));
        return reference is null ? null : new RenameTarget(evaluation.Text.GetRange(reference.Span), reference.Symbol.Name);
    }

    public static RenameResult Rename(Evaluation evaluation, Position position, string newName)
    {
        if (SymbolAt(evaluation, position) is not { } symbol) return new RenameResult([], "there is no name here to rename");
        if (newName == symbol.Name) return new RenameResult([]);
        if (symbol.Derived) return new RenameResult([], $"'{symbol.Name}' is a phase element of '{symbol.Owner}': rename '{symbol.Owner}'");
        if (!IsName(newName)) return new RenameResult([], $"'{newName}' is not a name: a letter or '_', then letters, digits or '_', and no keyword");
        // A name spelt as a unit (V, kVA, ohm) reads as that unit after a number, so a line that
        // writes the old name where a unit may stand would change its meaning.
        if (Units.Find(newName) is not null)
            return new RenameResult([], $"'{newName}' is a unit symbol: after a number it reads as the unit, not as a name");
        if (evaluation.Model.Symbols.Find(newName) is { } taken)
            return new RenameResult([], $"'{newName}' is already {taken.Describe()}");
        // A word the document writes that names nothing yet (a use not bound, a word on a line with an
        // error, which hides errors about that name) would come to name the renamed symbol (fuzz seed 6022889).
        if (evaluation.Syntax.Lines.Any(l => l.Tokens.Any(t => t.Kind == TokenKind.Word && t.Text == newName)))
            return new RenameResult([], $"'{newName}' is already used in the document, where it names nothing yet");
        // A three-phase element's phase elements (HV_a of HV) are renamed with it wherever they are written.
        var phases = evaluation.Model.Symbols.Symbols.Where(s => s.Derived && s.Owner == symbol.Name).ToList();
        // Uses of its phases that a line with an error excuses (LV_a where the line making LV three-phase is broken) follow it too.
        var excused = evaluation.Model.Symbols.PhaseUsesOf(symbol.Name).Select(span => (Span: span, Text: evaluation.Text[span])).ToList();
        if (phases.Select(p => p.Name).Concat(excused.Select(u => u.Text))
                .Select(n => newName + n[symbol.Name.Length..]).FirstOrDefault(n => evaluation.Model.Symbols.Find(n) is not null) is { } clash)
            return new RenameResult([], $"'{clash}' is already defined, and '{newName}' would name a phase element so");
        var edits = evaluation.Model.Symbols.ReferencesTo(symbol)
            .Select(r => new TextEdit(evaluation.Text.GetRange(r.Span), newName))
            .Concat(phases.SelectMany(p => evaluation.Model.Symbols.ReferencesTo(p)
                .Where(r => !r.IsDefinition)
                .Select(r => new TextEdit(evaluation.Text.GetRange(r.Span), newName + p.Name[symbol.Name.Length..]))))
            .Concat(excused.Select(u => new TextEdit(evaluation.Text.GetRange(u.Span), newName + u.Text[symbol.Name.Length..])))
            .OrderBy(e => e.Range.Start.Line).ThenBy(e => e.Range.Start.Character)
            .ToList();
        return new RenameResult(edits);
    }

    /// <summary>A word the lexer reads as one word and the parser takes as a name: ASCII, and no keyword.</summary>
    public static bool IsName(string text) =>
        Lexer.Lex(text) is [{ Kind: TokenKind.Word } token] && token.Text == text && ValueParser.IsName(token);

    private static Symbol? SymbolAt(Evaluation evaluation, Position position) =>
        evaluation.Model.Symbols.At(evaluation.Text.GetOffset(position))?.Symbol;
}

using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

public enum CompletionKind { Statement, Clause, Word, Name, Unit }

/// <summary>A completion: the text, what it is, a line of detail, and the range it replaces (the word being typed).</summary>
public sealed record CompletionEntry(string Label, CompletionKind Kind, string Detail, TextRange Range, string? Documentation = null, SymbolKind? Symbol = null);

/// <summary>
/// Completion from the grammar table: statement keywords where a statement starts, the clauses a
/// statement has not used yet after its parts, the words of a choice, names in scope of the kind
/// the place asks for, let names inside values, and units after a number.
/// </summary>
public static class Completion
{
    public static IReadOnlyList<CompletionEntry> At(Evaluation evaluation, Position position)
    {
        var text = evaluation.Text;
        var offset = text.GetOffset(position);
        var line = evaluation.Syntax.Lines.FirstOrDefault(l => l.Span.Touches(offset))
            ?? evaluation.Syntax.Lines.LastOrDefault(l => l.Span.Start <= offset);
        if (line is null) return [];
        // Inside a comment, or right after a number still being typed: nothing to offer.
        if (line.Tokens.Any(t => t.Kind == TokenKind.Comment && t.Span.Start < offset)) return [];
        var typing = line.Tokens.FirstOrDefault(t => t.Kind == TokenKind.Word && t.Span.Start < offset && offset <= t.Span.End);
        if (line.Tokens.Any(t => t.Kind is TokenKind.Number or TokenKind.Imaginary && t.Span.End == offset)) return [];
        var before = line.Tokens.Where(t => !t.IsTrivia && t.Span.End <= offset && t != typing).ToList();
        var range = text.GetRange(typing is null ? new TextSpan(offset, 0) : TextSpan.FromBounds(typing.Span.Start, offset));

        var expected = StatementReader.ExpectedAfter(before);
        if (expected is null) return [];
        // In the order an editor should list them: what the place asks for first, clauses after.
        var entries = new List<CompletionEntry>();
        if (expected.Statements)
            entries.AddRange(Grammar.Statements.Select(s => new CompletionEntry(s.Keyword, CompletionKind.Statement, s.Summary, range, $"`{s.Example}`")));
        foreach (var word in expected.Words.Distinct())
            entries.Add(new CompletionEntry(word, CompletionKind.Word, "", range));
        // Where a name of the trade stands (a cooling mode), its words.
        foreach (var word in expected.Names.SelectMany(r => r.Suggestions).Distinct())
            entries.Add(new CompletionEntry(word, CompletionKind.Word, "", range));
        // A name the line being typed defines is not offered on it (its unfinished line declares it).
        bool Elsewhere(Symbol s) => !line.Span.Touches(s.Span.Start);
        foreach (var role in expected.Names.Where(r => !r.Defines).DistinctBy(r => r.Label))
            entries.AddRange(NamesFor(evaluation.Model.Symbols, role).Where(Elsewhere).Select(s => new CompletionEntry(s.Name, CompletionKind.Name, s.Describe(), range, Symbol: s.Kind)));
        if (expected.ValueNames)
            entries.AddRange(evaluation.Model.Symbols.Symbols.Where(s => s.Kind == SymbolKind.Let && Elsewhere(s)).Select(s => new CompletionEntry(s.Name, CompletionKind.Name, s.Describe(), range, Symbol: s.Kind)));
        if (expected.Units)
            entries.AddRange(Units.Common.Select(u => new CompletionEntry(u, CompletionKind.Unit, Units.Find(u)?.Dimension.Describe() ?? "", range)));
        foreach (var clause in expected.Clauses)
            entries.Add(new CompletionEntry(clause.Keyword, CompletionKind.Clause, clause.Summary, range));
        return entries.DistinctBy(e => (e.Label, e.Kind)).ToList();
    }

    /// <summary>Names of the kinds a place asks for; where a terminal or node may stand, every connection point.</summary>
    private static IEnumerable<Symbol> NamesFor(SymbolTable symbols, NameRole role)
    {
        var points = role.Kinds.Contains(SymbolKind.Node) || role.Kinds.Contains(SymbolKind.Terminal);
        return symbols.Symbols.Where(s => role.Kinds.Contains(s.Kind) || points && s.IsConnectionPoint).OrderBy(s => s.Span.Start);
    }
}

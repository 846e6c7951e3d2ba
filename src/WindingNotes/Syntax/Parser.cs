using System.Collections.Immutable;
using System.Runtime.InteropServices;
using WindingNotes.Text;

namespace WindingNotes.Syntax;

/// <summary>
/// Parses a document one logical line at a time. A line that fails becomes an error with its
/// range and what was expected, and parsing goes on with the next line: one mistake spoils one line.
/// </summary>
public static class Parser
{
    /// <summary>Deeper nesting is refused before parsing: the parser and the tree recurse, and a stack overflow cannot be caught.</summary>
    public const int MaxNesting = 64;

    /// <summary>A statement longer than this is refused for the same reason.</summary>
    public const int MaxTokens = 2000;

    public static SyntaxTree Parse(string text)
    {
        var source = new SourceText(text);
        var diagnostics = new DiagnosticBag();
        var lines = ImmutableArray.CreateBuilder<LineSyntax>();
        // A line's tokens at a time (the lexer's list of a whole document would be a large array made and cleared per parse).
        var reader = new Lexer.Reader(text);
        var line = new List<Token>(64);
        while (reader.Next() is { } token)
        {
            line.Add(token);
            if (token.Kind != TokenKind.Newline) continue;
            lines.Add(ParseLine(lines.Count, CollectionsMarshal.AsSpan(line), diagnostics));
            line.Clear();
        }
        // The last line without its line break; an empty text is one empty line; after a final line break, an empty line at the end.
        if (line.Count > 0 || lines.Count == 0) lines.Add(ParseLine(lines.Count, CollectionsMarshal.AsSpan(line), diagnostics));
        else lines.Add(ParseLine(lines.Count, [], diagnostics, text.Length));
        return new SyntaxTree(source, lines.ToImmutable(), diagnostics.ToImmutable());
    }

    private static LineSyntax ParseLine(int index, ReadOnlySpan<Token> tokens, DiagnosticBag diagnostics, int? emptyAt = null)
    {
        Token? first = null, last = null;
        var count = 0;
        foreach (var t in tokens)
        {
            if (t.Kind != TokenKind.Newline) (first, last) = (first ?? t, t);
            if (!t.IsTrivia) count++;
        }
        var span = first is null
            ? new TextSpan(emptyAt ?? (tokens.IsEmpty ? 0 : tokens[0].Span.Start), 0)
            : TextSpan.FromBounds(first.Span.Start, last!.Span.End);
        var significant = new Token[count];
        count = 0;
        foreach (var t in tokens)
            if (!t.IsTrivia) significant[count++] = t;
        var all = ImmutableArray.Create(tokens);
        if (significant.Length == 0) return new LineSyntax(index, span, all, null, null);

        var keyword = significant[0];
        if (!(keyword.Kind == TokenKind.Word && Grammar.ByKeyword.TryGetValue(keyword.Text, out var form)))
        {
            var error = diagnostics.ReportUnknownStatement(keyword);
            return new LineSyntax(index, span, all, null, error);
        }

        if (TooComplex(significant, diagnostics) is { } refused) return new LineSyntax(index, span, all, null, refused);

        var (head, clauses, stop) = StatementReader.Read(form, significant);
        var statement = new StatementSyntax(form, keyword, head, clauses);
        if (stop is not null)
            return new LineSyntax(index, span, all, null, ReportStop(diagnostics, stop, significant, statement), statement);
        CheckClauses(statement, diagnostics);
        return new LineSyntax(index, span, all, statement, null);
    }

    /// <summary>The error of a line that stops fitting its form: the token there (or the line's end) and what was expected.</summary>
    private static Diagnostic ReportStop(DiagnosticBag diagnostics, Stop stop, Token[] tokens, StatementSyntax partial)
    {
        var fitting = StillNeeded(partial);
        var expected = stop.Expected
            .Where(label => label.Length > 0)
            .Distinct()
            .OrderBy(label => fitting.Contains(label) ? 0 : 1)
            .ToList();
        if (stop.At < tokens.Length)
        {
            var found = tokens[stop.At];
            var words = expected.Where(e => e.StartsWith('\'')).Select(e => e.Trim('\''));
            var suggestion = found.Kind == TokenKind.Word ? Spelling.Nearest(found.Text, words) : null;
            return diagnostics.ReportUnexpected(found, expected, suggestion);
        }
        return diagnostics.ReportUnexpectedEnd(tokens[^1], expected);
    }

    /// <summary>
    /// The keywords, quoted as the expected lists quote them, of the clauses the statement still
    /// needs (a required clause, or any of a required group, not yet given): where they are
    /// expected they are the words that fit, so they come first ("after a measure, 'between' …").
    /// </summary>
    private static HashSet<string> StillNeeded(StatementSyntax partial)
    {
        var given = partial.Clauses.Select(c => c.Form!).ToList();
        var groups = (partial.Form.RequiredGroups ?? []).Where(g => !given.Exists(c => c.Group == g)).ToHashSet();
        return partial.Form.Clauses
            .Where(c => (c.Required && !given.Contains(c)) || (c.Group is { } g && groups.Contains(g)))
            .Select(c => $"'{c.Keyword}'")
            .ToHashSet();
    }

    private static Diagnostic? TooComplex(Token[] tokens, DiagnosticBag diagnostics) =>
        TooComplex(tokens) is not { } refused ? null
        : refused.Nesting ? diagnostics.ReportNestingTooDeep(tokens[refused.At], MaxNesting)
        : diagnostics.ReportStatementTooLong(tokens[refused.At], MaxTokens);

    /// <summary>
    /// Where a statement's tokens are more than <see cref="MaxTokens"/> or nest deeper than
    /// <see cref="MaxNesting"/>: the token it is refused at. Whatever reads a statement checks this first.
    /// </summary>
    internal static (int At, bool Nesting)? TooComplex(IReadOnlyList<Token> tokens)
    {
        if (tokens.Count > MaxTokens) return (MaxTokens, false);
        var depth = 0;
        for (var i = 0; i < tokens.Count; i++)
        {
            var t = tokens[i];
            if (t.Kind != TokenKind.Symbol) continue;
            if (t.Text == "(" && ++depth > MaxNesting) return (i, true);
            if (t.Text == ")") depth--;
        }
        return null;
    }

    /// <summary>Clauses once each, groups exclusive, required clauses and groups present.</summary>
    /// <remarks>A statement has a handful of clauses: they are compared in place, not put in tables (this runs for every line).</remarks>
    private static void CheckClauses(StatementSyntax statement, DiagnosticBag diagnostics)
    {
        var given = statement.Clauses;
        for (var c = 0; c < given.Length; c++)
        {
            var form = given[c].Form!;
            if (First(given, c, form.Keyword, null) is { } first)
                diagnostics.ReportDuplicateClause(given[c].Keyword!, first.Keyword!);
            else if (form.Group is not null && First(given, c, null, form.Group) is { } other)
                diagnostics.ReportExclusiveClauses(given[c].Keyword!, other.Keyword!);
        }
        List<string>? clauses = null;
        List<IReadOnlyList<string>>? missingGroups = null;
        foreach (var c in statement.Form.Clauses)
            if (c.Required && First(given, given.Length, c.Keyword, null) is null) (clauses ??= []).Add(c.Keyword);
        foreach (var g in statement.Form.RequiredGroups ?? [])
            if (First(given, given.Length, null, g) is null) (missingGroups ??= []).Add([.. statement.Form.Clauses.Where(c => c.Group == g).Select(c => c.Keyword)]);
        // One mistake, one message: every clause and group the line lacks, said together.
        var (clauseCount, groupCount) = (clauses?.Count ?? 0, missingGroups?.Count ?? 0);
        if (clauseCount + groupCount > 1) diagnostics.ReportMissingClauses(statement, clauses ?? [], missingGroups ?? []);
        else if (clauseCount == 1) diagnostics.ReportMissingClause(statement, clauses![0]);
        else if (groupCount == 1) diagnostics.ReportMissingGroup(statement, "", missingGroups![0]);

        // The first clause before the one at `before` of that keyword, or else of that group.
        static ClauseSyntax? First(ImmutableArray<ClauseSyntax> clauses, int before, string? keyword, string? group)
        {
            for (var i = 0; i < before; i++)
                if (keyword is not null ? clauses[i].Form!.Keyword == keyword : clauses[i].Form!.Group == group) return clauses[i];
            return null;
        }
    }
}

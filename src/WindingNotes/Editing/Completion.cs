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

        var expected = StatementCursor.Expect(before);
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

/// <summary>What may come next in a statement, given the tokens before the cursor.</summary>
internal sealed class Expected
{
    public bool Statements { get; set; }
    public List<ClauseForm> Clauses { get; } = [];
    public List<string> Words { get; } = [];
    public List<NameRole> Names { get; } = [];
    public bool ValueNames { get; set; }
    public bool Units { get; set; }

    public Expected With(Expected other)
    {
        Statements |= other.Statements;
        Clauses.AddRange(other.Clauses);
        Words.AddRange(other.Words);
        Names.AddRange(other.Names);
        ValueNames |= other.ValueNames;
        Units |= other.Units;
        return this;
    }
}

/// <summary>
/// Walks a statement's form (the grammar table) over the tokens of an unfinished line, without the
/// parser: the line is usually incomplete while it is typed. Values are skipped up to the next word
/// the form knows. Returns null where the tokens leave the form.
/// </summary>
internal sealed class StatementCursor
{
    private readonly List<Token> tokens;
    private readonly StatementForm form;
    private readonly HashSet<string> clauseWords;
    private readonly HashSet<ClauseForm> used = [];
    private int i = 1;

    private StatementCursor(List<Token> tokens, StatementForm form)
    {
        this.tokens = tokens;
        this.form = form;
        clauseWords = form.Clauses.Select(c => c.Keyword).ToHashSet();
    }

    public static Expected? Expect(List<Token> tokens)
    {
        if (tokens.Count == 0) return new Expected { Statements = true };
        if (tokens[0].Kind != TokenKind.Word || !Grammar.ByKeyword.TryGetValue(tokens[0].Text, out var form)) return null;
        return new StatementCursor(tokens, form).Walk();
    }

    private bool AtEnd => i >= tokens.Count;

    private Token Current => tokens[i];

    private Expected? Walk()
    {
        var head = Parts(form.Head, 0, ClausesLeft);
        if (head.Ended is not null || head.Failed) return head.Ended;
        while (true)
        {
            if (AtEnd) return ClausesLeft();
            var clause = form.FindClause(Current.Text);
            if (Current.Kind != TokenKind.Word || clause is null) return null;
            used.Add(clause);
            i++;
            var result = Parts(clause.Parts, 0, ClausesLeft);
            if (result.Ended is not null || result.Failed) return result.Ended;
        }
    }

    private Expected ClausesLeft()
    {
        var groups = used.Select(c => c.Group).OfType<string>().ToHashSet();
        var e = new Expected();
        e.Clauses.AddRange(form.Clauses.Where(c => !used.Contains(c) && (c.Group is null || !groups.Contains(c.Group))));
        return e;
    }

    /// <summary>Ended: the tokens ran out inside the parts, with what may come next. Failed: a token the form has no place for.</summary>
    private readonly record struct Step(Expected? Ended, bool Failed = false)
    {
        public static readonly Step Matched = new(null);
        public static readonly Step Fail = new(null, true);
    }

    private Step Parts(IReadOnlyList<Part> parts, int k, Func<Expected> after)
    {
        for (; k < parts.Count; k++)
        {
            var next = k + 1;
            Expected Rest() => First(parts, next, after);
            switch (parts[k])
            {
                case NamePart n:
                    if (AtEnd) return new Step(Name(n.Role));
                    if (Current.Kind != TokenKind.Word) return Step.Fail;
                    i++;
                    if (n.Role.AllowsSection && !AtEnd && Current.Text == ":") i = Math.Min(tokens.Count, i + 4);
                    break;
                case NameListPart n:
                    if (AtEnd) return new Step(Name(n.Role));
                    while (!AtEnd && Current.Kind == TokenKind.Word && !clauseWords.Contains(Current.Text)) i++;
                    if (AtEnd) return new Step(Name(n.Role).With(Rest()));
                    break;
                case ValuePart:
                    if (AtEnd) return new Step(new Expected { ValueNames = true });
                    var stops = StopWords(parts, next);
                    while (!AtEnd && !(Current.Kind == TokenKind.Word && stops.Contains(Current.Text))) i++;
                    if (AtEnd) return new Step(AfterValue(tokens[^1], Rest));
                    break;
                case WordPart w:
                    if (AtEnd) return new Step(Word(w.Word));
                    if (Current.Text != w.Word) return Step.Fail;
                    i++;
                    break;
                case ChoicePart c:
                    if (AtEnd) return new Step(Word(c.Words));
                    if (!c.Words.Contains(Current.Text)) return Step.Fail;
                    i++;
                    break;
                case OptionalPart o:
                    if (AtEnd) return new Step(First(o.Parts, 0, Rest).With(Rest()));
                    if (!Starts(o.Parts[0], Current)) break;
                    var inner = Parts(o.Parts, 0, Rest);
                    if (inner.Ended is not null || inner.Failed) return inner;
                    break;
            }
        }
        return Step.Matched;
    }

    /// <summary>After a number a unit may come; after an operator, another operand; after a unit or a name, what follows the value.</summary>
    private static Expected AfterValue(Token last, Func<Expected> rest) => last.Kind switch
    {
        TokenKind.Number or TokenKind.Imaginary => new Expected { Units = true }.With(rest()),
        TokenKind.Symbol when last.Text != ")" => new Expected { ValueNames = true },
        TokenKind.PlusMinus => new Expected(),
        TokenKind.Word when last.Text == "angle" => new Expected(),
        _ => rest(),
    };

    /// <summary>What may start the parts from k on, and what follows them where they may all be left out.</summary>
    private Expected First(IReadOnlyList<Part> parts, int k, Func<Expected> after)
    {
        if (k >= parts.Count) return after();
        return parts[k] switch
        {
            NamePart n => Name(n.Role),
            NameListPart n => Name(n.Role),
            ValuePart => new Expected { ValueNames = true },
            WordPart w => Word(w.Word),
            ChoicePart c => Word(c.Words),
            OptionalPart o => First(o.Parts, 0, () => new Expected()).With(First(parts, k + 1, after)),
            _ => new Expected(),
        };
    }

    private bool Starts(Part part, Token token) => part switch
    {
        WordPart w => token.Text == w.Word,
        ChoicePart c => c.Words.Contains(token.Text),
        NamePart or NameListPart => token.Kind == TokenKind.Word && !clauseWords.Contains(token.Text),
        ValuePart => token.Kind is TokenKind.Number or TokenKind.Imaginary or TokenKind.Symbol || token.Kind == TokenKind.Word && !clauseWords.Contains(token.Text),
        OptionalPart o => Starts(o.Parts[0], token),
        _ => false,
    };

    /// <summary>The words that end a value: the form's clause keywords and the fixed words of the parts after it.</summary>
    private HashSet<string> StopWords(IReadOnlyList<Part> parts, int k)
    {
        var stops = new HashSet<string>(clauseWords);
        foreach (var part in parts.Skip(k))
            foreach (var word in Words(part)) stops.Add(word);
        return stops;
    }

    private static IEnumerable<string> Words(Part part) => part switch
    {
        WordPart w => [w.Word],
        ChoicePart c => c.Words,
        OptionalPart o => o.Parts.SelectMany(Words),
        _ => [],
    };

    private static Expected Name(NameRole role)
    {
        var e = new Expected();
        e.Names.Add(role);
        return e;
    }

    private static Expected Word(params string[] words)
    {
        var e = new Expected();
        e.Words.AddRange(words);
        return e;
    }
}

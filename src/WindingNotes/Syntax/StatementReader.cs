using System.Collections.Immutable;
using System.Runtime.InteropServices;
using WindingNotes.Text;

namespace WindingNotes.Syntax;

/// <summary>Where a line stops fitting its form (an index into its significant tokens, the keyword 0) and what was expected there, in the table's words.</summary>
internal sealed record Stop(int At, IReadOnlyList<string> Expected);

/// <summary>
/// What a statement's tokens say: the head and clauses read, and where the line stopped fitting
/// its form (null when it is whole). A line that stops keeps a partial statement: the parts read
/// up to the stop, a <see cref="MissingSyntax"/> there, and the clauses from the next clause keyword on.
/// </summary>
internal readonly record struct Reading(ClauseSyntax Head, ImmutableArray<ClauseSyntax> Clauses, Stop? Stop);

/// <summary>What may come next at the end of an unfinished statement: what completion offers.</summary>
internal sealed class ExpectedNext
{
    public bool Statements { get; init; }
    public List<ClauseForm> Clauses { get; } = [];
    public List<string> Words { get; } = [];
    public List<NameRole> Names { get; } = [];
    public bool ValueNames { get; set; }
    public bool Units { get; set; }
}

/// <summary>
/// The one reader of the <see cref="Grammar"/> table: one token of look-ahead, no backtracking
/// (every clause starts with its own keyword, an optional part is decided by its first token).
/// It reads a well-formed statement without recording anything on the way; where a part does not
/// fit it records what the table expected there (the error's wording), marks the part missing and
/// goes on from the next clause keyword (the partial statement). Where the tokens end (the cursor of
/// an unfinished line), each place that finds no token says what it would have taken (completion).
/// Errors inside a value are worded by <see cref="ValueParser"/> (Pidgin), the value grammar written
/// as an operator table; the reader's own value reading builds the same tree without its cost.
/// </summary>
internal sealed class StatementReader
{
    private readonly StatementForm form;
    private readonly Token[] tokens;
    private readonly ExpectedNext? collect;
    private int at;
    private Stop? failure;

    private StatementReader(StatementForm form, Token[] tokens, ExpectedNext? collect) => (this.form, this.tokens, this.collect, at) = (form, tokens, collect, 1);

    /// <summary>The statement of <paramref name="tokens"/> (significant tokens, the keyword first).</summary>
    public static Reading Read(StatementForm form, Token[] tokens) => new StatementReader(form, tokens, null).Statement(form);

    /// <summary>
    /// What may come after <paramref name="tokens"/> (the significant tokens of a line before the
    /// cursor): statement keywords on an empty line, nothing after an unknown statement keyword.
    /// A mistake earlier on the line is read past as the partial statement is, from the next clause keyword.
    /// </summary>
    public static ExpectedNext? ExpectedAfter(IReadOnlyList<Token> tokens)
    {
        if (tokens.Count == 0) return new ExpectedNext { Statements = true };
        if (tokens[0].Kind != TokenKind.Word || !Grammar.ByKeyword.TryGetValue(tokens[0].Text, out var form)) return null;
        // The reader recurses: a statement the parser refuses as too deep or too long offers nothing.
        if (Parser.TooComplex(tokens) is not null) return null;
        var reader = new StatementReader(form, [.. tokens], new ExpectedNext());
        reader.Statement(form);
        return reader.collect;
    }

    /// <summary>
    /// The head, then clauses until the end. After a part that does not fit (the first is the
    /// stop), reading goes on from the next clause keyword; tokens that begin no clause are passed
    /// over. Where the tokens end inside a part, nothing more is read (nor offered).
    /// </summary>
    private Reading Statement(StatementForm form)
    {
        // One list of elements and one of clauses a thread, reused: each head and clause then costs one array of its own size.
        var elements = scratchElements ??= new List<ElementSyntax>(16);
        var clauses = scratchClauses ??= new List<ClauseSyntax>(16);
        elements.Clear();
        clauses.Clear();
        Stop? stop = null;
        if (!Sequence(form.Head, elements))
        {
            stop = failure;
            if (Current is null) return new Reading(Clause(null, null, elements), [], stop);
        }
        var head = Clause(null, null, elements);
        while (true)
        {
            if (Current is not { } keyword)
            {
                if (collect is not null) Unused(form, clauses);
                break;
            }
            var clauseForm = keyword.Kind == TokenKind.Word ? form.FindClause(keyword.Text) : null;
            if (clauseForm is null)
            {
                stop ??= new Stop(at, [.. form.Clauses.Select(c => $"'{c.Keyword}'"), "end of line"]);
                at++;
                continue;
            }
            at++;
            elements.Clear();
            var whole = Sequence(clauseForm.Parts, elements);
            clauses.Add(Clause(clauseForm, keyword, elements));
            if (whole) continue;
            stop ??= failure;
            if (Current is null) break;
        }
        return new Reading(head, ImmutableArray.Create(CollectionsMarshal.AsSpan(clauses)), stop);
    }

    [ThreadStatic] private static List<ElementSyntax>? scratchElements;
    [ThreadStatic] private static List<ClauseSyntax>? scratchClauses;

    private static ClauseSyntax Clause(ClauseForm? form, Token? keyword, List<ElementSyntax> elements) =>
        new(form, keyword, ImmutableArray.Create(CollectionsMarshal.AsSpan(elements)));

    /// <summary>The clauses not yet given and not excluded by a given one of their group, where the tokens end.</summary>
    private void Unused(StatementForm form, List<ClauseSyntax> given)
    {
        foreach (var c in form.Clauses)
            if (!given.Any(g => g.Form == c || (c.Group is not null && g.Form!.Group == c.Group)))
                collect!.Clauses.Add(c);
    }

    /// <summary>
    /// The parts of a head or a clause in order. At the first that does not fit, a
    /// <see cref="MissingSyntax"/> is added (what the partial statement shows) and the reader stands
    /// where it stopped, with <see cref="failure"/> saying what was expected.
    /// </summary>
    private bool Sequence(Part[] parts, List<ElementSyntax> into)
    {
        foreach (var part in parts)
        {
            if (Part(part, into)) continue;
            var where = Current is { } t ? new TextSpan(t.Span.Start, 0) : new TextSpan(tokens[^1].Span.End, 0);
            var role = part switch { NamePart n => n.Role, NameListPart n => n.Role, _ => null };
            into.Add(new MissingSyntax(Label(part), where, role));
            return false;
        }
        return true;
    }

    private bool Parts(Part[] parts, List<ElementSyntax> into)
    {
        foreach (var part in parts)
            if (!Part(part, into)) return false;
        return true;
    }

    /// <summary>How a part is named where it is missing, as the grammar table labels it.</summary>
    internal static string Label(Part part) => part switch
    {
        NamePart n => n.Role.Label,
        NameListPart n => n.Role.Label,
        ValuePart v => v.Label,
        WordPart w => $"'{w.Word}'",
        ChoicePart c => c.Label,
        OptionalPart o => Label(o.Parts[0]),
        _ => "",
    };

    private Token? Current => at < tokens.Length ? tokens[at] : null;

    private Token? Next => at + 1 < tokens.Length ? tokens[at + 1] : null;

    private Token? Take(Func<Token, bool> fits)
    {
        if (Current is not { } t || !fits(t)) return null;
        at++;
        return t;
    }

    private Token? TakeSymbol(string symbol)
    {
        if (Current is not { Kind: TokenKind.Symbol } t || t.Text != symbol) return null;
        at++;
        return t;
    }

    /// <summary>A part that does not fit: what was expected there. Always false.</summary>
    private bool Expected(string label)
    {
        failure = new Stop(at, [label]);
        return false;
    }

    private bool Part(Part part, List<ElementSyntax> into)
    {
        switch (part)
        {
            case NamePart n:
                return Name(n.Role, into);
            case NameListPart n:
                if (!Name(n.Role, into)) return false;
                while (Current is { } t && ValueParser.IsName(t))
                    if (!Name(n.Role, into)) return false;
                if (Current is null) collect?.Names.Add(n.Role);
                return true;
            case ValuePart v:
                var start = at;
                if (Current is not { } first || !ValueParser.CanStartValue(first))
                {
                    if (Current is null && collect is not null) collect.ValueNames = true;
                    return Expected(v.Label);
                }
                if (Value() is not { } value)
                {
                    failure = collect is null ? ValueParser.Explain(v.Label, tokens, start) ?? new Stop(at, [v.Label]) : new Stop(at, []);
                    return false;
                }
                into.Add(value);
                return true;
            case WordPart w:
                if (Word(w.Word, null, into)) return true;
                if (Current is null) collect?.Words.Add(w.Word);
                return Expected($"'{w.Word}'");
            case ChoicePart c:
                if (Word(null, c.Words, into)) return true;
                if (Current is null) collect?.Words.AddRange(c.Words);
                return Expected(c.Label);
            case OptionalPart o:
                // Left out unless its first part can start here; once begun it must be whole.
                if (Current is not { } next)
                {
                    if (collect is not null) First(o.Parts[0]);
                    return true;
                }
                return !CanStart(o.Parts[0], next) || Parts(o.Parts, into);
            default:
                return false;
        }
    }

    /// <summary>Where the tokens end before an optional part: what may start it.</summary>
    private void First(Part part)
    {
        switch (part)
        {
            case NamePart n: collect!.Names.Add(n.Role); break;
            case NameListPart n: collect!.Names.Add(n.Role); break;
            case ValuePart: collect!.ValueNames = true; break;
            case WordPart w: collect!.Words.Add(w.Word); break;
            case ChoicePart c: collect!.Words.AddRange(c.Words); break;
            case OptionalPart o: First(o.Parts[0]); break;
        }
    }

    private static bool CanStart(Part part, Token t) => part switch
    {
        NamePart or NameListPart => ValueParser.IsName(t),
        ValuePart => ValueParser.CanStartValue(t),
        WordPart w => IsFixedWord(t) && t.Text == w.Word,
        ChoicePart c => IsFixedWord(t) && Array.IndexOf(c.Words, t.Text) >= 0,
        OptionalPart o => CanStart(o.Parts[0], t),
        _ => true,
    };

    private static bool IsFixedWord(Token t) => t.Kind is TokenKind.Word or TokenKind.Symbol;

    /// <summary>The fixed word <paramref name="word"/>, or one of <paramref name="words"/>.</summary>
    private bool Word(string? word, string[]? words, List<ElementSyntax> into)
    {
        if (Current is not { } t || !IsFixedWord(t) || (word is not null ? t.Text != word : Array.IndexOf(words!, t.Text) < 0)) return false;
        at++;
        into.Add(new WordSyntax(t));
        return true;
    }

    private bool Name(NameRole role, List<ElementSyntax> into)
    {
        if (Take(ValueParser.IsName) is not { } name)
        {
            if (Current is null) collect?.Names.Add(role);
            return Expected(role.Label);
        }
        if (!role.AllowsSection || TakeSymbol(":") is null)
        {
            into.Add(new NameSyntax(name, role));
            return true;
        }
        if (Take(ValueParser.IsName) is not { } from) return Expected("a terminal name");
        if (TakeSymbol("-") is null) return Expected("'-'");
        if (Take(ValueParser.IsName) is not { } to) return Expected("a terminal name");
        into.Add(new NameSyntax(name, role, from, to));
        return true;
    }

    private ValueSyntax? Value()
    {
        if (Expression() is not { } expression) return null;
        ExpressionSyntax? angle = null;
        if (Current is { } a && a.IsWord("angle"))
        {
            at++;
            if ((angle = Expression()) is null) return null;
        }
        Token? plusMinus = null;
        ExpressionSyntax? tolerance = null;
        if ((plusMinus = Take(t => t.Kind == TokenKind.PlusMinus)) is not null && (tolerance = Expression()) is null) return null;
        return new ValueSyntax(expression, angle, plusMinus, tolerance);
    }

    /// <summary>Sums of products of signed terms, left to right, as the operator table of <see cref="ValueParser.Expression"/>.</summary>
    private ExpressionSyntax? Expression()
    {
        if (Product() is not { } left) return null;
        while (Take(t => t.Kind == TokenKind.Symbol && t.Text is "+" or "-") is { } op)
        {
            if (Product() is not { } right) return null;
            left = ValueParser.Add(left, op, right);
        }
        return left;
    }

    private ExpressionSyntax? Product()
    {
        if (Signed() is not { } left) return null;
        while (Take(t => t.Kind == TokenKind.Symbol && t.Text is "*" or "/") is { } op)
        {
            if (Signed() is not { } right) return null;
            left = new BinarySyntax(left, op, right);
        }
        return left;
    }

    private ExpressionSyntax? Signed()
    {
        if (Take(t => t.Kind == TokenKind.Symbol && t.Text is "+" or "-") is not { } sign) return Atom();
        return Signed() is { } operand ? new UnarySyntax(sign, operand) : null;
    }

    private ExpressionSyntax? Atom()
    {
        if (Current is not { } t || !ValueParser.CanStartValue(t))
        {
            // Where the tokens end after an operator or an opening parenthesis, a let name may come.
            if (Current is null && collect is not null) collect.ValueNames = true;
            return null;
        }
        at++;
        switch (t.Kind)
        {
            case TokenKind.Number:
                return Unit(out var unit) ? new NumberSyntax(t, unit) : null;
            case TokenKind.Imaginary:
                return Unit(out var imaginaryUnit) ? new ImaginarySyntax(t, imaginaryUnit) : null;
        }
        if (t.IsWord("sqrt"))
            return TakeSymbol("(") is not null && Expression() is { } argument && TakeSymbol(")") is { } end
                ? new CallSyntax(t, argument, t.Span.Cover(end.Span)) : null;
        if (ValueParser.IsName(t)) return new NameSyntaxExpression(t);
        if (t.Kind == TokenKind.Symbol && t.Text == "(")
            return Expression() is { } inner && TakeSymbol(")") is { } close
                ? new ParenthesisedSyntax(inner, t.Span.Cover(close.Span)) : null;
        return null;
    }

    /// <summary>The unit after a number, as <see cref="ValueParser"/>'s unit or what may stand where there is none.</summary>
    private bool Unit(out Token? unit)
    {
        unit = null;
        if (Current is not { } t)
        {
            if (collect is not null) collect.Units = true;
            return true;
        }
        if ((t.Kind == TokenKind.Word && !Grammar.Keywords.Contains(t.Text)) || (t.IsWord("turns") && Next is not { Kind: TokenKind.Number }))
        {
            // 'turns' last before the cursor may yet be the clause, if a number follows: its value may come.
            if (Next is null && collect is not null && t.IsWord("turns") && form.FindClause("turns") is { } turns && !scratchClauses!.Exists(c => c.Form == turns))
                collect.ValueNames = true;
            unit = t;
            at++;
            return true;
        }
        return (t.Kind == TokenKind.Symbol && t.Text is "+" or "-" or "*" or "/" or ")")
            || t.Kind == TokenKind.PlusMinus
            || (t.Kind == TokenKind.Word && Grammar.Keywords.Contains(t.Text));
    }
}

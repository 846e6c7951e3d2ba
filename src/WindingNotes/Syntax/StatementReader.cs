using System.Collections.Immutable;
using WindingNotes.Text;

namespace WindingNotes.Syntax;

/// <summary>
/// Reads a well-formed statement straight from the <see cref="Grammar"/> table, one token of
/// look-ahead, no backtracking. The Pidgin parsers (<see cref="StatementParsers"/>) record at every
/// step what each alternative expected, which only an error needs, and that is most of their time;
/// this reader gives up (null) at the first token that does not fit, and the Pidgin parsers then
/// read the line again and word the error. Where it succeeds it builds the very tree they build
/// (a test compares the two over fuzzed documents), so the notation still has one grammar.
/// </summary>
internal sealed class StatementReader
{
    private readonly Token[] tokens;
    private int at;

    private StatementReader(Token[] tokens, int at) => (this.tokens, this.at) = (tokens, at);

    /// <summary>The head and clauses of <paramref name="tokens"/> (significant tokens, the keyword first), or null.</summary>
    public static (ClauseSyntax Head, ImmutableArray<ClauseSyntax> Clauses)? Read(StatementForm form, Token[] tokens)
    {
        var reader = new StatementReader(tokens, 1);
        var head = ImmutableArray.CreateBuilder<ElementSyntax>();
        if (!reader.Parts(form.Head, head)) return null;
        var clauses = ImmutableArray.CreateBuilder<ClauseSyntax>();
        while (reader.Current is { } keyword)
        {
            var clause = keyword.Kind == TokenKind.Word ? form.FindClause(keyword.Text) : null;
            if (clause is null) return null;
            reader.at++;
            var elements = ImmutableArray.CreateBuilder<ElementSyntax>(clause.Parts.Length);
            if (!reader.Parts(clause.Parts, elements)) return null;
            clauses.Add(new ClauseSyntax(clause, keyword, elements.DrainToImmutable()));
        }
        return (new ClauseSyntax(null, null, head.DrainToImmutable()), clauses.DrainToImmutable());
    }

    /// <summary>
    /// What a line that does not parse still says: the parts read up to the first that does not
    /// fit, a <see cref="MissingSyntax"/> there, and then, from the next keyword of one of the form's
    /// clauses on, each clause read the same way; tokens that begin no clause are passed over. The
    /// binder declares the names of the result and binds nothing of it.
    /// </summary>
    public static (ClauseSyntax Head, ImmutableArray<ClauseSyntax> Clauses) ReadPartial(StatementForm form, Token[] tokens)
    {
        var reader = new StatementReader(tokens, 1);
        var head = ImmutableArray.CreateBuilder<ElementSyntax>();
        reader.Recovering(form.Head, head);
        var clauses = ImmutableArray.CreateBuilder<ClauseSyntax>();
        while (reader.Current is { } keyword)
        {
            reader.at++;
            if (keyword.Kind != TokenKind.Word || form.FindClause(keyword.Text) is not { } clause) continue;
            var elements = ImmutableArray.CreateBuilder<ElementSyntax>(clause.Parts.Length);
            reader.Recovering(clause.Parts, elements);
            clauses.Add(new ClauseSyntax(clause, keyword, elements.DrainToImmutable()));
        }
        return (new ClauseSyntax(null, null, head.DrainToImmutable()), clauses.DrainToImmutable());
    }

    /// <summary>The parts in order up to the first that does not fit, which is marked missing; the reader then stands where it stopped.</summary>
    private void Recovering(Part[] parts, ImmutableArray<ElementSyntax>.Builder into)
    {
        foreach (var part in parts)
        {
            if (Part(part, into)) continue;
            var where = Current is { } t ? new TextSpan(t.Span.Start, 0) : new TextSpan(tokens[^1].Span.End, 0);
            var role = part switch { NamePart n => n.Role, NameListPart n => n.Role, _ => null };
            into.Add(new MissingSyntax(Label(part), where, role));
            return;
        }
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

    private Token? TakeSymbol(string symbol) => Take(t => t.Kind == TokenKind.Symbol && t.Text == symbol);

    private bool Parts(Part[] parts, ImmutableArray<ElementSyntax>.Builder into)
    {
        foreach (var part in parts)
            if (!Part(part, into)) return false;
        return true;
    }

    private bool Part(Part part, ImmutableArray<ElementSyntax>.Builder into)
    {
        switch (part)
        {
            case NamePart n:
                return Name(n.Role, into);
            case NameListPart n:
                if (!Name(n.Role, into)) return false;
                while (Current is { } t && ValueParser.IsName(t))
                    if (!Name(n.Role, into)) return false;
                return true;
            case ValuePart:
                if (Current is not { } first || !ValueParser.CanStartValue(first) || Value() is not { } value) return false;
                into.Add(value);
                return true;
            case WordPart w:
                return Word(t => t.Text == w.Word, into);
            case ChoicePart c:
                return Word(t => Array.IndexOf(c.Words, t.Text) >= 0, into);
            case OptionalPart o:
                // Left out unless its first part can start here; once begun it must be whole.
                return Current is not { } next || !CanStart(o.Parts[0], next) || Parts(o.Parts, into);
            default:
                return false;
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

    private bool Word(Func<Token, bool> fits, ImmutableArray<ElementSyntax>.Builder into)
    {
        if (Take(t => IsFixedWord(t) && fits(t)) is not { } word) return false;
        into.Add(new WordSyntax(word));
        return true;
    }

    private bool Name(NameRole role, ImmutableArray<ElementSyntax>.Builder into)
    {
        if (Take(ValueParser.IsName) is not { } name) return false;
        if (!role.AllowsSection || TakeSymbol(":") is null)
        {
            into.Add(new NameSyntax(name, role));
            return true;
        }
        if (Take(ValueParser.IsName) is not { } from || TakeSymbol("-") is null || Take(ValueParser.IsName) is not { } to) return false;
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
        if (Current is not { } t || !ValueParser.CanStartValue(t)) return null;
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
        if (Current is not { } t) return true;
        if ((t.Kind == TokenKind.Word && !Grammar.Keywords.Contains(t.Text)) || (t.IsWord("turns") && Next is not { Kind: TokenKind.Number }))
        {
            unit = t;
            at++;
            return true;
        }
        return (t.Kind == TokenKind.Symbol && t.Text is "+" or "-" or "*" or "/" or ")")
            || t.Kind == TokenKind.PlusMinus
            || (t.Kind == TokenKind.Word && Grammar.Keywords.Contains(t.Text));
    }
}

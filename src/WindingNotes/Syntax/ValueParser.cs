using Pidgin;
using Pidgin.Expression;
using static Pidgin.Parser;

namespace WindingNotes.Syntax;

/// <summary>
/// Pidgin parsers for values: numbers with units, complex literals, names, <c>sqrt</c>, the four
/// operators, a polar <c>angle</c> and a tolerance. Every parser is labelled so an error says what
/// was expected in words.
/// </summary>
internal static class ValueParser
{
    public static Parser<Token, Token> Symbol(string symbol) =>
        Parser<Token>.Token(t => t.Kind == TokenKind.Symbol && t.Text == symbol).Labelled($"'{symbol}'");

    public static Parser<Token, Token> Keyword(string word) =>
        Parser<Token>.Token(t => t.IsWord(word)).Labelled($"'{word}'");

    public static bool IsIdentifier(string text)
    {
        if (text.Length == 0 || !(char.IsAsciiLetter(text[0]) || text[0] == '_')) return false;
        foreach (var c in text)
            if (!(char.IsAsciiLetterOrDigit(c) || c == '_')) return false;
        return true;
    }

    /// <summary>A name: an identifier that is not a keyword. The lexer reads <c>j4</c> as imaginary, so it is a name too.</summary>
    public static bool IsName(Token t) =>
        (t.Kind == TokenKind.Word && IsIdentifier(t.Text) && !Grammar.Keywords.Contains(t.Text))
        || (t.Kind == TokenKind.Imaginary && IsIdentifier(t.Text));

    public static readonly Parser<Token, Token> Name = Parser<Token>.Token(IsName).Labelled("a name");

    private static readonly Parser<Token, Token> NumberToken =
        Parser<Token>.Token(t => t.Kind == TokenKind.Number).Labelled("a number");

    /// <summary>
    /// A unit: any word after a number that is not a keyword; the model knows which units exist
    /// and says so with a hint. <c>turns</c> is a unit unless a number follows (then it is the clause).
    /// </summary>
    private static readonly Parser<Token, Token> Unit = OneOf(
        Parser<Token>.Token(t => t.Kind == TokenKind.Word && !Grammar.Keywords.Contains(t.Text)),
        Try(Keyword("turns").Before(Not(NumberToken)))).Labelled("a unit");

    /// <summary>
    /// What may follow a number that has no unit. Written as an alternative to the unit, not as an
    /// optional unit, so that a stray token is reported as "expected a unit, …" and not as a character.
    /// </summary>
    private static readonly Parser<Token, Unit> NoUnit = Lookahead(OneOf(
        Parser<Token>.Token(t => t.Kind == TokenKind.Symbol && t.Text is "+" or "-" or "*" or "/" or ")").Labelled("an operator"),
        Parser<Token>.Token(t => t.Kind == TokenKind.PlusMinus).Labelled("'+-'"),
        Parser<Token>.Token(t => t.Kind == TokenKind.Word && Grammar.Keywords.Contains(t.Text)).Labelled("a keyword"),
        Parser<Token>.End.Select(_ => (Token)null!).Labelled("end of line"))).Select(_ => Pidgin.Unit.Value);

    private static Parser<Token, Token?> UnitOrNothing =>
        OneOf(Unit.Select(t => (Token?)t), NoUnit.Select(_ => (Token?)null));

    private static readonly Parser<Token, ExpressionSyntax> NumberLiteral =
        Map((n, u) => (ExpressionSyntax)new NumberSyntax(n, u), NumberToken, UnitOrNothing);

    private static readonly Parser<Token, ImaginarySyntax> ImaginaryLiteral =
        Map((n, u) => new ImaginarySyntax(n, u),
            Parser<Token>.Token(t => t.Kind == TokenKind.Imaginary).Labelled("an imaginary number"), UnitOrNothing);

    public static readonly Parser<Token, ExpressionSyntax> Expression = ExpressionParser.Build<Token, ExpressionSyntax>(
        expression => (
            // Labelled by a look at the first token only: a label on the whole would also replace
            // what a half-read literal expected ("a unit") with "a value".
            Lookahead(Parser<Token>.Token(CanStartValue)).Labelled("a value").Then(OneOf(
                NumberLiteral,
                ImaginaryLiteral.Cast<ExpressionSyntax>(),
                Map((f, open, arg, close) => (ExpressionSyntax)new CallSyntax(f, arg, f.Span.Cover(close.Span)),
                    Keyword("sqrt"), Symbol("("), expression, Symbol(")")),
                Name.Select(n => (ExpressionSyntax)new NameSyntaxExpression(n)),
                Map((open, inner, close) => (ExpressionSyntax)new ParenthesisedSyntax(inner, open.Span.Cover(close.Span)),
                    Symbol("("), expression, Symbol(")")))),
            [
                Operator.PrefixChainable(
                    Symbol("-").Select<Func<ExpressionSyntax, ExpressionSyntax>>(op => e => new UnarySyntax(op, e)),
                    Symbol("+").Select<Func<ExpressionSyntax, ExpressionSyntax>>(op => e => new UnarySyntax(op, e))),
                Operator.InfixL(OneOf(Binary("*"), Binary("/"))),
                Operator.InfixL(OneOf(Additive("+"), Additive("-"))),
            ]));

    /// <summary>
    /// A value described by its place ("expected a frequency") when nothing of it is there; once it
    /// has begun, errors inside it say what the value itself expected ("expected a unit").
    /// </summary>
    public static Parser<Token, ValueSyntax> LabelledValue(string label) =>
        Lookahead(Parser<Token>.Token(CanStartValue)).Labelled(label).Then(Value);

    /// <summary>
    /// Why the value from <paramref name="start"/> does not read: where Pidgin stops in it and what it
    /// expected there, in its labels (null if it reads, which the reader's agreement rules out).
    /// </summary>
    internal static Stop? Explain(string label, Token[] tokens, int start)
    {
        var result = LabelledValue(label).Parse(tokens.AsSpan(start));
        if (result.Success) return null;
        var error = result.Error!;
        return new Stop(start + error.ErrorOffset,
            [.. error.Expected.Select(e => e.IsEof ? "end of line" : e.Label ?? string.Join(" ", e.Tokens.Select(t => $"'{t.Text}'")))]);
    }

    internal static bool CanStartValue(Token t) =>
        t.Kind is TokenKind.Number or TokenKind.Imaginary
        || (t.Kind == TokenKind.Symbol && t.Text is "(" or "-" or "+")
        || t.IsWord("sqrt") || IsName(t);

    public static readonly Parser<Token, ValueSyntax> Value = Map(
        (e, angle, tolerance) => new ValueSyntax(
            e, angle.GetValueOrDefault(),
            tolerance.HasValue ? tolerance.Value.Item1 : null,
            tolerance.HasValue ? tolerance.Value.Item2 : null),
        Expression,
        Keyword("angle").Then(Expression).Optional(),
        Map((pm, t) => (pm, t), Parser<Token>.Token(t => t.Kind == TokenKind.PlusMinus).Labelled("'+-'"), Expression).Optional());

    private static Parser<Token, Func<ExpressionSyntax, ExpressionSyntax, ExpressionSyntax>> Binary(string op) =>
        Symbol(op).Select<Func<ExpressionSyntax, ExpressionSyntax, ExpressionSyntax>>(t => (l, r) => new BinarySyntax(l, t, r));

    /// <summary><c>3 + j4 ohm</c> folds into one rectangular literal so the unit covers both parts.</summary>
    private static Parser<Token, Func<ExpressionSyntax, ExpressionSyntax, ExpressionSyntax>> Additive(string op) =>
        Symbol(op).Select<Func<ExpressionSyntax, ExpressionSyntax, ExpressionSyntax>>(t => (l, r) => Add(l, t, r));

    internal static ExpressionSyntax Add(ExpressionSyntax left, Token op, ExpressionSyntax right) =>
        right is ImaginarySyntax imaginary && IsBareNumber(left) ? new ComplexSyntax(left, op, imaginary) : new BinarySyntax(left, op, right);

    private static bool IsBareNumber(ExpressionSyntax e) => e switch
    {
        NumberSyntax { Unit: null } => true,
        UnarySyntax { Operand: NumberSyntax { Unit: null } } => true,
        _ => false,
    };
}

using WindingNotes.Text;

namespace WindingNotes.Syntax;

/// <summary>An expression inside a value. Immutable; every node knows its span.</summary>
public abstract record ExpressionSyntax
{
    public abstract TextSpan Span { get; }
}

/// <summary>A number with an optional unit word: <c>13.8 kV</c>.</summary>
public sealed record NumberSyntax(Token Number, Token? Unit) : ExpressionSyntax
{
    public override TextSpan Span => Unit is null ? Number.Span : Number.Span.Cover(Unit.Span);
}

/// <summary>An imaginary number with an optional unit: <c>j4 ohm</c>.</summary>
public sealed record ImaginarySyntax(Token Number, Token? Unit) : ExpressionSyntax
{
    public override TextSpan Span => Unit is null ? Number.Span : Number.Span.Cover(Unit.Span);
}

/// <summary>
/// A rectangular literal <c>3 + j4 ohm</c>: the unit after the imaginary part applies to both parts.
/// The real part is a bare number, or a negated one.
/// </summary>
public sealed record ComplexSyntax(ExpressionSyntax Real, Token Operator, ImaginarySyntax Imaginary) : ExpressionSyntax
{
    public override TextSpan Span => Real.Span.Cover(Imaginary.Span);
}

public sealed record NameSyntaxExpression(Token Name) : ExpressionSyntax
{
    public override TextSpan Span => Name.Span;
}

public sealed record CallSyntax(Token Function, ExpressionSyntax Argument, TextSpan FullSpan) : ExpressionSyntax
{
    public override TextSpan Span => FullSpan;
}

public sealed record ParenthesisedSyntax(ExpressionSyntax Inner, TextSpan FullSpan) : ExpressionSyntax
{
    public override TextSpan Span => FullSpan;
}

public sealed record UnarySyntax(Token Operator, ExpressionSyntax Operand) : ExpressionSyntax
{
    public override TextSpan Span => Operator.Span.Cover(Operand.Span);
}

public sealed record BinarySyntax(ExpressionSyntax Left, Token Operator, ExpressionSyntax Right) : ExpressionSyntax
{
    public override TextSpan Span => Left.Span.Cover(Right.Span);
}

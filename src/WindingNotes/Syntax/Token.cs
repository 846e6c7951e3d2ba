using WindingNotes.Text;

namespace WindingNotes.Syntax;

public enum TokenKind
{
    /// <summary>A name, keyword or unit: letters, digits, '_' and the unit signs Ω ° ² ³ µ and %.</summary>
    Word,
    Number,
    /// <summary>An imaginary number such as <c>j4</c>.</summary>
    Imaginary,
    /// <summary>One of + - * / ( ) = : ,</summary>
    Symbol,
    /// <summary><c>+-</c> or <c>±</c>.</summary>
    PlusMinus,
    Comment,
    /// <summary>A <c>\</c> at the end of a line with the line break after it.</summary>
    Continuation,
    Whitespace,
    Newline,
    /// <summary>A character the notation has no use for.</summary>
    Bad,
}

/// <summary>A token with its span in the document. Numbers carry their value.</summary>
public sealed record Token(TokenKind Kind, TextSpan Span, string Text)
{
    public double Number { get; init; }

    public bool IsTrivia => Kind is TokenKind.Comment or TokenKind.Continuation or TokenKind.Whitespace or TokenKind.Newline;

    public bool IsWord(string word) => Kind == TokenKind.Word && Text == word;

    public override string ToString() => $"{Kind} '{Text}' {Span}";
}

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
/// <remarks>
/// A document's tokens live as long as its tree (an open document's, a whole evaluation's), so a
/// token is kept to 32 bytes: its kind packed with its length, the number read from the text when
/// asked for (the lexer's reading of it, so the value is the same).
/// </remarks>
public sealed record Token(TokenKind Kind, TextSpan Span, string Text)
{
    /// <summary>The longest text one token holds; the lexer splits a longer run (a 256 MB comment) into several.</summary>
    public const int MaxLength = (1 << LengthBits) - 1;

    private const int LengthBits = 28;

    private readonly int start = Span.Start;
    private readonly int kindAndLength = (int)Kind << LengthBits | (Span.Length is >= 0 and <= MaxLength ? Span.Length : throw new ArgumentOutOfRangeException(nameof(Span), "a token's text is at most Token.MaxLength long"));

    public TokenKind Kind => (TokenKind)(kindAndLength >>> LengthBits);

    public TextSpan Span => new(start, kindAndLength & MaxLength);

    public string Text { get; } = Text;

    /// <summary>The value of a number, or of an imaginary number without its j; zero for other tokens, NaN where the digits do not read.</summary>
    public double Number => Kind switch
    {
        TokenKind.Number => Lexer.ReadNumber(Text),
        TokenKind.Imaginary => Lexer.ReadNumber(Text.AsSpan(1)),
        _ => 0,
    };

    public bool IsTrivia => Kind is TokenKind.Comment or TokenKind.Continuation or TokenKind.Whitespace or TokenKind.Newline;

    public bool IsWord(string word) => Kind == TokenKind.Word && Text == word;

    public override string ToString() => $"{Kind} '{Text}' {Span}";
}

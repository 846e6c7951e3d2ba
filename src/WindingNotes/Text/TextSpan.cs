namespace WindingNotes.Text;

/// <summary>A run of UTF-16 code units in a document, by offset. Every node and diagnostic has one.</summary>
public readonly record struct TextSpan(int Start, int Length)
{
    public int End => Start + Length;

    public static TextSpan FromBounds(int start, int end) => new(start, end - start);

    /// <summary>True when the offset lies inside the span or touches its end (a cursor after a name is on it).</summary>
    public bool Touches(int offset) => offset >= Start && offset <= End;

    public TextSpan Cover(TextSpan other) => FromBounds(Math.Min(Start, other.Start), Math.Max(End, other.End));

    public override string ToString() => $"[{Start}..{End})";
}

/// <summary>A zero-based line and UTF-16 character, as the language server protocol counts them.</summary>
public readonly record struct Position(int Line, int Character)
{
    public override string ToString() => $"{Line}:{Character}";
}

public readonly record struct TextRange(Position Start, Position End)
{
    public override string ToString() => $"{Start}-{End}";
}

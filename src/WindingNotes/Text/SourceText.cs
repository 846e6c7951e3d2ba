namespace WindingNotes.Text;

/// <summary>
/// A document's text with its line starts: the one position mapper between offsets and
/// zero-based line/character positions. Characters are UTF-16 code units, so 'Ω', '°' and '²'
/// count as one each, as the protocol expects.
/// </summary>
public sealed class SourceText
{
    private readonly int[] lineStarts;

    public SourceText(string text)
    {
        Text = text;
        var starts = new List<int> { 0 };
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (c == '\r' && i + 1 < text.Length && text[i + 1] == '\n') i++;
            if (c is '\r' or '\n') starts.Add(i + 1);
        }
        lineStarts = starts.ToArray();
    }

    public string Text { get; }

    public int Length => Text.Length;

    public int LineCount => lineStarts.Length;

    public string this[TextSpan span] => Text.Substring(span.Start, span.Length);

    public Position GetPosition(int offset)
    {
        offset = Math.Clamp(offset, 0, Text.Length);
        var line = Array.BinarySearch(lineStarts, offset);
        if (line < 0) line = ~line - 1;
        return new Position(line, offset - lineStarts[line]);
    }

    public TextRange GetRange(TextSpan span) => new(GetPosition(span.Start), GetPosition(span.End));

    /// <summary>The offset of a position; positions past a line's end clamp to it, as the protocol asks.</summary>
    public int GetOffset(Position position)
    {
        if (position.Line < 0) return 0;
        if (position.Line >= lineStarts.Length) return Text.Length;
        var line = GetLineSpan(position.Line);
        return line.Start + Math.Clamp(position.Character, 0, line.Length);
    }

    /// <summary>The span of a line without its line break.</summary>
    public TextSpan GetLineSpan(int line)
    {
        var start = lineStarts[line];
        var end = line + 1 < lineStarts.Length ? lineStarts[line + 1] : Text.Length;
        while (end > start && Text[end - 1] is '\n' or '\r') end--;
        return TextSpan.FromBounds(start, end);
    }

    public string GetLineText(int line) => this[GetLineSpan(line)];
}

using System.Text;
using WindingNotes.Syntax;

namespace WindingNotes.Tests.Syntax;

/// <summary>
/// Rewrites a document in a random layout that means the same: runs of spaces and tabs for single
/// spaces, clauses in a shuffled order, continuation breaks before clauses, indentation, trailing
/// whitespace, comments and blank lines. Lines that do not parse are left as they are.
/// </summary>
public static class Relayout
{
    public static string Write(string text, int seed)
    {
        var random = new Random(seed);
        var tree = Parser.Parse(text);
        var o = new StringBuilder();
        string Space() => random.Next(4) switch { 0 => "  ", 1 => "\t", 2 => " \t ", _ => " " };
        foreach (var line in tree.Lines)
        {
            if (random.Next(6) == 0) o.Append(random.Next(2) == 0 ? "\n" : $"{Space()}# note {random.Next(100)}\n");
            if (line.Statement is not { } s || line.Error is not null)
            {
                o.Append(tree.Text[line.Span].TrimEnd('\r', '\n')).Append('\n');
                continue;
            }
            if (random.Next(4) == 0) o.Append(Space());
            o.Append(Respace(tree.Text[s.Head.Elements.IsEmpty ? s.Keyword.Span : s.Keyword.Span.Cover(s.Head.Span)], Space));
            foreach (var clause in s.Clauses.OrderBy(_ => random.Next()))
                o.Append(random.Next(5) == 0 ? $"{Space()}\\\n{Space()}" : Space()).Append(Respace(tree.Text[clause.Span], Space));
            if (random.Next(5) == 0) o.Append(Space());
            if (line.Comment is { } comment) o.Append(Space()).Append(comment.Text.TrimEnd());
            else if (random.Next(5) == 0) o.Append(Space()).Append("# why ").Append(random.Next(100));
            o.Append('\n');
        }
        return o.ToString();
    }

    /// <summary>The text with each run of whitespace and continuations inside it replaced by a random run.</summary>
    private static string Respace(string text, Func<string> space)
    {
        var o = new StringBuilder();
        foreach (var token in Lexer.Lex(text))
            o.Append(token.Kind is TokenKind.Whitespace or TokenKind.Continuation or TokenKind.Newline ? space() : token.Text);
        return o.ToString();
    }
}

using System.Text;

namespace WindingNotes.Syntax;

/// <summary>
/// The canonical layout: single spaces, clauses in the grammar's order, one space before a comment,
/// no alignment to other lines (so one change never rewrites another line). Comments, blank lines,
/// line breaks and continuation breaks are kept where they are.
/// Meaning is never changed: only a line that parses without a diagnostic is formatted, and only when
/// its formatted text parses back to the same statement with every token on the same physical line
/// (so every later stage's diagnostics keep their lines); any other line is kept byte for byte.
/// Formatting twice gives what formatting once gave.
/// </summary>
public static class Formatter
{
    public const string ContinuationIndent = "    ";

    public static string Format(SyntaxTree tree)
    {
        var o = new StringBuilder(tree.Text.Length + 16);
        var reported = LinesWithDiagnostics(tree);
        foreach (var line in tree.Lines)
        {
            var newline = line.Tokens is [.., { Kind: TokenKind.Newline } last] ? last.Text : "";
            var text = line switch
            {
                { Statement: { } statement } when !reported.Contains(line.Index) && Statement(statement, line) is { } formatted =>
                    WithComment(formatted, line.Comment) + newline,
                { Statement: null, Error: null } when !line.Tokens.Any(t => t.Kind == TokenKind.Continuation) => (line.Comment?.Text.TrimEnd() ?? "") + newline,
                _ => AsWritten(line),
            };
            // A blank line after a line kept with a lone CR keeps its spaces: without them that CR and
            // the blank line's LF would read as one CRLF, and the line, with every line after it, would move up.
            if (text.StartsWith('\n') && o.Length > 0 && o[^1] == '\r') text = AsWritten(line);
            o.Append(text);
            // The last line gets a line break unless it ends in one, or in a continuation kept as
            // written, which would take the break and move what is said of the file's end to a new line.
            var broken = text.EndsWith('\n') || text.EndsWith('\r') || (line.Comment is null && text.TrimEnd(' ', '\t').EndsWith('\\'));
            if (line.Index == tree.Lines.Length - 1 && text.Length > 0 && !broken) o.Append(tree.Text.Text.Contains("\r\n") ? "\r\n" : "\n");
        }
        return o.ToString();
    }

    private static string AsWritten(LineSyntax line) => string.Concat(line.Tokens.Select(t => t.Text));

    /// <summary>The lines on which parsing reported something: they are not fully understood, so they are kept as written.</summary>
    private static HashSet<int> LinesWithDiagnostics(SyntaxTree tree)
    {
        var result = new HashSet<int>();
        var starts = tree.Lines.Select(l => l.Span.Start).ToArray();
        foreach (var d in tree.Diagnostics)
        {
            var at = Array.BinarySearch(starts, d.Span.Start);
            result.Add(at >= 0 ? at : Math.Max(0, ~at - 1));
        }
        return result;
    }

    private static string WithComment(string statement, Token? comment) =>
        comment is null ? statement : $"{statement} {comment.Text.TrimEnd()}";

    /// <summary>The statement in canonical layout, or null where that could change what the line means or where it says it.</summary>
    private static string? Statement(StatementSyntax s, LineSyntax line)
    {
        if (Breaks(s, line) is not { } breaks) return null;
        var o = new StringBuilder(s.Keyword.Text);
        void Put(object part, string text) => o.Append(breaks.TryGetValue(part, out var b) ? $" \\{b}{ContinuationIndent}" : " ").Append(text);
        foreach (var element in s.Head.Elements) Put(element, Element(element));
        // Clauses are put in the grammar's order only on a line of one physical line: moving a clause
        // across a break would move its diagnostics to another line.
        var ordered = breaks.Count > 0
            ? s.Clauses.AsEnumerable()
            : s.Clauses.Select((c, i) => (c, i)).OrderBy(x => Array.IndexOf(s.Form.Clauses, x.c.Form)).ThenBy(x => x.i).Select(x => x.c);
        foreach (var clause in ordered)
        {
            Put(clause, clause.Keyword!.Text);
            foreach (var element in clause.Elements) Put(element, Element(element));
        }
        var text = o.ToString();
        var reordered = !s.Clauses.SequenceEqual(ordered);
        return SameMeaning(line, text, reordered) ? text : null;
    }

    /// <summary>
    /// Each continuation break by the clause or element it comes before, with the line break as written;
    /// null where a break stands elsewhere (inside an expression, before a comment or a blank line).
    /// </summary>
    private static Dictionary<object, string>? Breaks(StatementSyntax s, LineSyntax line)
    {
        var result = new Dictionary<object, string>();
        var tokens = line.Tokens;
        for (var i = 0; i < tokens.Length; i++)
        {
            if (tokens[i].Kind != TokenKind.Continuation) continue;
            var lineBreak = tokens[i].Text.TrimStart('\\', ' ', '\t');
            var next = tokens.Skip(i + 1).FirstOrDefault(t => t.Kind is not (TokenKind.Whitespace or TokenKind.Continuation));
            if (next is null or { Kind: TokenKind.Newline or TokenKind.Comment })
            {
                // A continuation at the very end of the file joins nothing and may go.
                if (lineBreak.Length == 0 && next is null) continue;
                return null;
            }
            object? part = s.Clauses.FirstOrDefault(c => c.Keyword == next)
                ?? (object?)s.Head.Elements.Concat(s.Clauses.SelectMany(c => c.Elements)).FirstOrDefault(e => e.Span.Start == next.Span.Start);
            if (part is null || !result.TryAdd(part, lineBreak)) return null;
        }
        return result;
    }

    /// <summary>
    /// The formatted text reads as the same statement, without a diagnostic, each token on the
    /// physical line it had. The parser sees only a line's significant tokens, so where the clauses
    /// kept their order the same tokens are the same statement and lexing suffices; where they moved,
    /// the text is parsed again.
    /// </summary>
    private static bool SameMeaning(LineSyntax line, string formatted, bool reordered)
    {
        var tokens = Lexer.Lex(formatted);
        if (tokens.Exists(t => t.Kind == TokenKind.Newline) || !PhysicalLines(tokens).Order().SequenceEqual(PhysicalLines(line.Tokens).Order())) return false;
        if (!reordered)
            return tokens.Where(t => !t.IsTrivia).Select(t => (t.Kind, t.Text)).SequenceEqual(line.Significant.Select(t => (t.Kind, t.Text)));
        var again = Parser.Parse(formatted);
        return again.Diagnostics.IsEmpty && again.Lines is [{ Statement: { } statement }] && Shape(statement) == Shape(line.Statement!);
    }

    /// <summary>The significant tokens with the physical line each is on.</summary>
    private static List<(string, int)> PhysicalLines(IEnumerable<Token> tokens)
    {
        var result = new List<(string, int)>();
        var physical = 0;
        foreach (var t in tokens)
        {
            if (t.Kind is TokenKind.Continuation && t.Text.AsSpan().IndexOfAny('\r', '\n') >= 0) physical++;
            else if (!t.IsTrivia) result.Add((t.Text, physical));
        }
        return result;
    }

    /// <summary>A statement as structure: clauses in the grammar's order, values as trees.</summary>
    private static string Shape(StatementSyntax s)
    {
        var o = new StringBuilder(s.Keyword.Text);
        foreach (var e in s.Head.Elements) o.Append(' ').Append(Shape(e));
        foreach (var c in s.Clauses.OrderBy(c => Array.IndexOf(s.Form.Clauses, c.Form)))
        {
            o.Append(" [").Append(c.Keyword?.Text);
            foreach (var e in c.Elements) o.Append(' ').Append(Shape(e));
            o.Append(']');
        }
        return o.ToString();
    }

    private static string Shape(ElementSyntax e) => e switch
    {
        ValueSyntax v => $"<{Shape(v.Expression)} angle {(v.Angle is null ? "" : Shape(v.Angle))} {v.PlusMinus?.Text} {(v.Tolerance is null ? "" : Shape(v.Tolerance))}>",
        _ => Element(e),
    };

    private static string Shape(ExpressionSyntax e) => e switch
    {
        ComplexSyntax c => $"(complex {Shape(c.Real)} {c.Operator.Text} {Shape(c.Imaginary)})",
        CallSyntax c => $"({c.Function.Text} {Shape(c.Argument)})",
        ParenthesisedSyntax p => $"(paren {Shape(p.Inner)})",
        UnarySyntax u => $"({u.Operator.Text} {Shape(u.Operand)})",
        BinarySyntax b => $"({b.Operator.Text} {Shape(b.Left)} {Shape(b.Right)})",
        _ => Expression(e),
    };

    private static string Element(ElementSyntax e) => e switch
    {
        NameSyntax { SectionFrom: { } from, SectionTo: { } to } n => $"{n.Name.Text}:{from.Text}-{to.Text}",
        NameSyntax n => n.Name.Text,
        WordSyntax w => w.Text,
        ValueSyntax v => Value(v),
        _ => "",
    };

    private static string Value(ValueSyntax v)
    {
        var text = Expression(v.Expression);
        if (v.Angle is not null) text += " angle " + Expression(v.Angle);
        if (v.Tolerance is not null) text += $" {v.PlusMinus!.Text} " + Expression(v.Tolerance);
        return text;
    }

    public static string Expression(ExpressionSyntax e) => e switch
    {
        NumberSyntax n => n.Unit is null ? n.Number.Text : $"{n.Number.Text} {n.Unit.Text}",
        ImaginarySyntax i => i.Unit is null ? i.Number.Text : $"{i.Number.Text} {i.Unit.Text}",
        ComplexSyntax c => $"{Expression(c.Real)} {c.Operator.Text} {Expression(c.Imaginary)}",
        NameSyntaxExpression n => n.Name.Text,
        CallSyntax c => $"{c.Function.Text}({Expression(c.Argument)})",
        ParenthesisedSyntax p => $"({Expression(p.Inner)})",
        UnarySyntax u => Unary(u.Operator.Text, Expression(u.Operand)),
        BinarySyntax b => $"{Expression(b.Left)} {b.Operator.Text} {Expression(b.Right)}",
        _ => "",
    };

    /// <summary>A sign before a signed operand keeps a space: <c>+ -1</c> written together is the tolerance sign <c>+-</c>.</summary>
    private static string Unary(string sign, string operand) => operand is ['+' or '-', ..] ? $"{sign} {operand}" : sign + operand;
}

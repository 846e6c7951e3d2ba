using System.Text;

namespace WindingNotes.Syntax;

/// <summary>
/// The canonical layout: single spaces, clauses in the grammar's order, one space before a comment,
/// no alignment to other lines (so one change never rewrites another line). Comments, blank lines
/// and continuation breaks are kept; a line that does not parse is kept as written. Formatting twice
/// gives what formatting once gave, and the formatted text parses to the same statements.
/// </summary>
public static class Formatter
{
    public const string ContinuationIndent = "    ";

    public static string Format(SyntaxTree tree)
    {
        var newline = tree.Text.Text.Contains("\r\n") ? "\r\n" : "\n";
        var o = new StringBuilder(tree.Text.Length + 16);
        foreach (var line in tree.Lines)
        {
            var hasNewline = line.Tokens is [.., { Kind: TokenKind.Newline }];
            var text = line switch
            {
                { Error: not null } => tree.Text[line.Span],
                { Statement: { } statement } => WithComment(Statement(statement, line, newline), line.Comment),
                _ => line.Comment?.Text.TrimEnd() ?? "",
            };
            o.Append(text);
            // A line kept as written may end in a continuation that took the line break with it.
            var broken = text.EndsWith('\n') || text.EndsWith('\r');
            if (hasNewline || (line.Index == tree.Lines.Length - 1 && text.Length > 0 && !broken)) o.Append(newline);
        }
        return o.ToString();
    }

    private static string WithComment(string statement, Token? comment) =>
        comment is null ? statement : $"{statement} {comment.Text.TrimEnd()}";

    private static string Statement(StatementSyntax s, LineSyntax line, string newline)
    {
        var breaks = BrokenClauses(s, line);
        var o = new StringBuilder(s.Keyword.Text);
        foreach (var element in s.Head.Elements) o.Append(' ').Append(Element(element));
        var ordered = s.Clauses
            .Select((c, i) => (c, i))
            .OrderBy(x => Array.IndexOf(s.Form.Clauses, x.c.Form))
            .ThenBy(x => x.i)
            .Select(x => x.c);
        foreach (var clause in ordered)
        {
            o.Append(breaks.Contains(clause) ? $" \\{newline}{ContinuationIndent}" : " ");
            o.Append(clause.Keyword!.Text);
            foreach (var element in clause.Elements) o.Append(' ').Append(Element(element));
        }
        return o.ToString();
    }

    /// <summary>The clauses the author began on a new physical line; the break moves with its clause.</summary>
    private static HashSet<ClauseSyntax> BrokenClauses(StatementSyntax s, LineSyntax line)
    {
        var result = new HashSet<ClauseSyntax>();
        var tokens = line.Tokens;
        for (var i = 0; i < tokens.Length; i++)
        {
            if (tokens[i].Kind != TokenKind.Continuation) continue;
            var next = tokens.Skip(i + 1).FirstOrDefault(t => !t.IsTrivia);
            if (next is null) continue;
            var clause = s.Clauses.LastOrDefault(c => c.Span.Start <= next.Span.Start);
            if (clause is not null) result.Add(clause);
        }
        return result;
    }

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
        // "+ -2" written together would read as "+-", the tolerance sign.
        UnarySyntax u => u.Operand is UnarySyntax ? $"{u.Operator.Text} {Expression(u.Operand)}" : u.Operator.Text + Expression(u.Operand),
        BinarySyntax b => $"{Expression(b.Left)} {b.Operator.Text} {Expression(b.Right)}",
        _ => "",
    };
}

using System.Text;
using WindingNotes.Model;
using WindingNotes.Syntax;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// What the formatter must keep, as one check: formatting is idempotent, the formatted text parses to
/// the same statements (clauses in the grammar's order, values as trees) and the same error lines,
/// and every diagnostic of parsing and binding keeps its code and its lines.
/// </summary>
public static class FormatProperty
{
    /// <summary>Null when the formatter kept the meaning of the text, else what it changed.</summary>
    public static string? Problem(string text)
    {
        var tree = Parser.Parse(text);
        return Problem(tree, Formatter.Format(tree));
    }

    /// <summary>The same for a text already parsed and formatted; <paramref name="bind"/> false compares the diagnostics of parsing alone (for five-megabyte inputs, whose binding the fuzzer has done once already).</summary>
    public static string? Problem(SyntaxTree tree, string formatted, bool bind = true)
    {
        var again = Parser.Parse(formatted);
        if (Formatter.Format(again) != formatted) return $"formatting is not idempotent:\n{Quote(formatted)}\n--- formatted again ---\n{Quote(Formatter.Format(again))}";
        var (before, after) = (Statements(tree), Statements(again));
        if (before != after) return $"formatting changed the statements:\n{First(before, after)}\n--- formatted ---\n{Quote(formatted)}";
        var (linesBefore, linesAfter) = (Diagnostics(tree, bind), Diagnostics(again, bind));
        if (linesBefore != linesAfter) return $"formatting moved or changed diagnostics:\n{First(linesBefore, linesAfter)}\n--- formatted ---\n{Quote(formatted)}";
        return null;
    }

    /// <summary>Each diagnostic of parsing and binding as its code and its first and last line, in order.</summary>
    private static string Diagnostics(SyntaxTree tree, bool bind)
    {
        var diagnostics = bind ? Binder.Bind(tree).Diagnostics : tree.Diagnostics;
        var lines = diagnostics.Select(d => $"{d.Code} {tree.Text.GetPosition(d.Span.Start).Line}-{tree.Text.GetPosition(d.Span.End).Line}");
        return string.Join('\n', lines.Order(StringComparer.Ordinal));
    }

    /// <summary>The statements and error lines in order, as structure: clauses in the grammar's order, values as trees.</summary>
    public static string Statements(SyntaxTree tree)
    {
        var o = new StringBuilder();
        foreach (var line in tree.Lines)
        {
            if (line.Error is not null) o.Append("error ").AppendJoin(' ', line.Tokens.Where(t => !t.IsTrivia).Select(t => t.Text)).Append('\n');
            else if (line.Statement is { } s)
            {
                o.Append(s.Keyword.Text);
                Elements(o, s.Head.Elements);
                foreach (var c in s.Clauses.Select((c, i) => (c, i)).OrderBy(x => Array.IndexOf(s.Form.Clauses, x.c.Form)).ThenBy(x => x.i).Select(x => x.c))
                {
                    o.Append(" [").Append(c.Keyword?.Text);
                    Elements(o, c.Elements);
                    o.Append(']');
                }
                o.Append('\n');
            }
        }
        return o.ToString();
    }

    private static void Elements(StringBuilder o, IEnumerable<ElementSyntax> elements)
    {
        foreach (var element in elements)
            o.Append(' ').Append(element switch
            {
                NameSyntax n => $"name:{n.Name.Text}{(n.SectionFrom is null ? "" : $":{n.SectionFrom.Text}-{n.SectionTo?.Text}")}",
                WordSyntax w => $"word:{w.Text}",
                ValueSyntax v => $"value:{Tree(v.Expression)}{(v.Angle is null ? "" : $"∠{Tree(v.Angle)}")}{(v.Tolerance is null ? "" : $"±{v.PlusMinus?.Text}{Tree(v.Tolerance)}")}",
                _ => element.GetType().Name,
            });
    }

    private static string Tree(ExpressionSyntax e) => e switch
    {
        NumberSyntax n => $"{n.Number.Text}{(n.Unit is null ? "" : "_" + n.Unit.Text)}",
        ImaginarySyntax i => $"j{i.Number.Text}{(i.Unit is null ? "" : "_" + i.Unit.Text)}",
        ComplexSyntax c => $"(cx {Tree(c.Real)} {c.Operator.Text} {Tree(c.Imaginary)})",
        NameSyntaxExpression n => n.Name.Text,
        CallSyntax c => $"({c.Function.Text} {Tree(c.Argument)})",
        ParenthesisedSyntax p => $"(paren {Tree(p.Inner)})",
        UnarySyntax u => $"({u.Operator.Text}u {Tree(u.Operand)})",
        BinarySyntax b => $"({b.Operator.Text} {Tree(b.Left)} {Tree(b.Right)})",
        _ => e.GetType().Name,
    };

    public static string Quote(string text) => text.Length <= 2000 ? text : text[..2000] + "…";

    public static string First(string a, string b)
    {
        var (x, y) = (a.Split('\n'), b.Split('\n'));
        for (var i = 0; i < Math.Max(x.Length, y.Length); i++)
            if (x.ElementAtOrDefault(i) != y.ElementAtOrDefault(i)) return $"  before: {x.ElementAtOrDefault(i)}\n  after:  {y.ElementAtOrDefault(i)}";
        return "";
    }
}

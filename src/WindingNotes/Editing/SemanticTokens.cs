using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Editing;

/// <summary>What a token is, for colouring. Names are coloured by what they stand for.</summary>
public enum TokenClass { Statement, Clause, Word, Choice, Number, Unit, Operator, Comment, Let, Core, Winding, Point, Supply, Load, Fault }

/// <summary>A coloured token: zero-based line and UTF-16 character, length, class, and whether it defines its name.</summary>
public sealed record SemanticToken(int Line, int Character, int Length, TokenClass Class, bool Defines = false);

/// <summary>
/// Colours every token of the document from its place in the statement's form (the grammar table),
/// names from the symbol table. A line that does not parse is coloured by its words alone.
/// </summary>
public static class SemanticTokens
{
    public static IReadOnlyList<SemanticToken> For(Evaluation evaluation)
    {
        var classes = new Dictionary<int, (TokenClass Class, bool Defines)>();
        foreach (var statement in evaluation.Syntax.Statements) Classify(statement, classes);
        foreach (var reference in evaluation.Model.Symbols.References)
            classes[reference.Span.Start] = (ForSymbol(reference.Symbol.Kind), reference.IsDefinition);

        var result = new List<SemanticToken>();
        foreach (var line in evaluation.Syntax.Lines)
        {
            var first = line.Tokens.FirstOrDefault(t => !t.IsTrivia);
            foreach (var token in line.Tokens)
            {
                TokenClass? c = classes.TryGetValue(token.Span.Start, out var known) ? known.Class : Lexical(token, ReferenceEquals(token, first));
                if (c is null || token.Span.Length == 0) continue;
                var p = evaluation.Text.GetPosition(token.Span.Start);
                result.Add(new SemanticToken(p.Line, p.Character, token.Span.Length, c.Value, known.Defines));
            }
        }
        return result;
    }

    private static TokenClass? Lexical(Token token, bool startsLine) => token.Kind switch
    {
        TokenKind.Comment => TokenClass.Comment,
        TokenKind.Number or TokenKind.Imaginary => TokenClass.Number,
        TokenKind.Symbol or TokenKind.PlusMinus => TokenClass.Operator,
        TokenKind.Word when startsLine && Grammar.ByKeyword.ContainsKey(token.Text) => TokenClass.Statement,
        TokenKind.Word when Grammar.Keywords.Contains(token.Text) => TokenClass.Clause,
        _ => null,
    };

    public static TokenClass ForSymbol(SymbolKind kind) => kind switch
    {
        SymbolKind.Let => TokenClass.Let,
        SymbolKind.Core => TokenClass.Core,
        SymbolKind.Winding => TokenClass.Winding,
        SymbolKind.Supply => TokenClass.Supply,
        SymbolKind.Load => TokenClass.Load,
        SymbolKind.Fault => TokenClass.Fault,
        _ => TokenClass.Point,
    };

    private static void Classify(StatementSyntax s, Dictionary<int, (TokenClass, bool)> classes)
    {
        classes[s.Keyword.Span.Start] = (TokenClass.Statement, false);
        foreach (var clause in s.Clauses.Prepend(s.Head))
        {
            if (clause.Keyword is { } keyword) classes[keyword.Span.Start] = (TokenClass.Clause, false);
            foreach (var element in clause.Elements)
            {
                switch (element)
                {
                    case NameSyntax n:
                        // Unresolved names keep the colour of the kind their place asks for.
                        // A name no symbol can stand for (a connection symbol such as Dyn11) is a fixed word.
                        classes[n.Name.Span.Start] = n.Role.Kinds.Length == 0 ? (TokenClass.Choice, false) : (ForSymbol(n.Role.Kinds[0]), n.Role.Defines);
                        if (n.SectionFrom is { } from) classes[from.Span.Start] = (TokenClass.Point, false);
                        if (n.SectionTo is { } to) classes[to.Span.Start] = (TokenClass.Point, false);
                        break;
                    case WordSyntax w:
                        var isChoice = (clause.Form?.Parts ?? s.Form.Head).Any(p => IsChoice(p, w.Text));
                        classes[w.Word.Span.Start] = (isChoice ? TokenClass.Choice : TokenClass.Word, false);
                        break;
                    case ValueSyntax v:
                        Expression(v.Expression, classes);
                        if (v.Angle is { } angle) Expression(angle, classes);
                        if (v.Tolerance is { } tolerance) Expression(tolerance, classes);
                        break;
                }
            }
        }
    }

    private static bool IsChoice(Part part, string word) => part switch
    {
        ChoicePart c => c.Words.Contains(word),
        OptionalPart o => o.Parts.Any(p => IsChoice(p, word)),
        _ => false,
    };

    /// <summary>Units after numbers; names in values are lets (the symbol table corrects the rest).</summary>
    private static void Expression(ExpressionSyntax e, Dictionary<int, (TokenClass, bool)> classes)
    {
        switch (e)
        {
            case NumberSyntax { Unit: { } unit }: classes[unit.Span.Start] = (TokenClass.Unit, false); break;
            case ImaginarySyntax { Unit: { } unit }: classes[unit.Span.Start] = (TokenClass.Unit, false); break;
            case ComplexSyntax c: Expression(c.Real, classes); Expression(c.Imaginary, classes); break;
            case NameSyntaxExpression n: classes[n.Name.Span.Start] = (TokenClass.Let, false); break;
            case CallSyntax c: classes[c.Function.Span.Start] = (TokenClass.Word, false); Expression(c.Argument, classes); break;
            case ParenthesisedSyntax p: Expression(p.Inner, classes); break;
            case UnarySyntax u: Expression(u.Operand, classes); break;
            case BinarySyntax b: Expression(b.Left, classes); Expression(b.Right, classes); break;
        }
    }
}

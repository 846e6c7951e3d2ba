using System.Collections.Immutable;
using WindingNotes.Text;

namespace WindingNotes.Syntax;

/// <summary>One element of a clause, as the statement's form laid it out.</summary>
public abstract record ElementSyntax
{
    public abstract TextSpan Span { get; }
}

/// <summary>A name. Where a section may stand, <c>HV:H1-T60</c> names the part of HV between H1 and T60.</summary>
public sealed record NameSyntax(Token Name, NameRole Role, Token? SectionFrom = null, Token? SectionTo = null) : ElementSyntax
{
    public override TextSpan Span => SectionTo is null ? Name.Span : Name.Span.Cover(SectionTo.Span);

    public string Text => Name.Text;
}

/// <summary>A fixed word of the form, or one of a choice.</summary>
public sealed record WordSyntax(Token Word) : ElementSyntax
{
    public override TextSpan Span => Word.Span;

    public string Text => Word.Text;
}

/// <summary>A value: an expression, an optional polar angle, an optional tolerance.</summary>
public sealed record ValueSyntax(ExpressionSyntax Expression, ExpressionSyntax? Angle, Token? PlusMinus, ExpressionSyntax? Tolerance) : ElementSyntax
{
    public override TextSpan Span => (Tolerance ?? Angle ?? Expression).Span.Cover(Expression.Span);

    /// <summary>The value without its tolerance.</summary>
    public TextSpan NominalSpan => (Angle ?? Expression).Span.Cover(Expression.Span);
}

/// <summary>
/// A placeholder for a part a broken line does not have: where the reader stopped, and what it
/// expected there. Only partial statements (<see cref="LineSyntax.Partial"/>) hold one.
/// </summary>
public sealed record MissingSyntax(string Expected, TextSpan At, NameRole? Role = null) : ElementSyntax
{
    public override TextSpan Span => At;
}

/// <summary>A clause: its keyword (none for a statement's head) and its elements in order.</summary>
public sealed record ClauseSyntax(ClauseForm? Form, Token? Keyword, ImmutableArray<ElementSyntax> Elements)
{
    public TextSpan Span
    {
        get
        {
            var span = Keyword?.Span ?? (Elements.IsEmpty ? default : Elements[0].Span);
            return Elements.IsEmpty ? span : span.Cover(Elements[^1].Span);
        }
    }

    public IEnumerable<NameSyntax> Names => Elements.OfType<NameSyntax>();

    public IEnumerable<ValueSyntax> Values => Elements.OfType<ValueSyntax>();

    // The look-ups below run for every statement the binder reads: loops, not chains of iterators.
    public NameSyntax? Name(int index)
    {
        foreach (var e in Elements)
            if (e is NameSyntax n && index-- == 0) return n;
        return null;
    }

    public ValueSyntax? Value(int index = 0)
    {
        foreach (var e in Elements)
            if (e is ValueSyntax v && index-- == 0) return v;
        return null;
    }

    /// <summary>The word chosen where the form offers a choice or an optional word.</summary>
    public WordSyntax? Word(Func<string, bool> predicate)
    {
        foreach (var e in Elements)
            if (e is WordSyntax w && predicate(w.Text)) return w;
        return null;
    }
}

/// <summary>A parsed statement: its form, its keyword, its head and its clauses in the order written.</summary>
public sealed record StatementSyntax(StatementForm Form, Token Keyword, ClauseSyntax Head, ImmutableArray<ClauseSyntax> Clauses)
{
    public StatementKind Kind => Form.Kind;

    // An empty head has no place in the text (its span is the default, at offset 0): a bare keyword's
    // statement is the keyword alone, not everything from the file's start to it.
    public TextSpan Span => !Clauses.IsEmpty ? Keyword.Span.Cover(Clauses[^1].Span) : Head.Elements.IsEmpty && Head.Keyword is null ? Keyword.Span : Keyword.Span.Cover(Head.Span);

    public ClauseSyntax? Clause(string keyword)
    {
        foreach (var c in Clauses)
            if (c.Keyword?.Text == keyword) return c;
        return null;
    }

    public ValueSyntax? Value(string keyword) => Clause(keyword)?.Value();

    /// <summary>Every name in the statement, in the order written.</summary>
    /// <remarks>A struct the binder's loops read without an iterator object (it reads every statement's names twice); LINQ reads it as any sequence.</remarks>
    public StatementNames AllNames => new(this);
}

/// <summary>The names of a statement in the order written (<see cref="StatementSyntax.AllNames"/>).</summary>
public readonly struct StatementNames(StatementSyntax statement) : IEnumerable<NameSyntax>
{
    public Enumerator GetEnumerator() => new(statement);

    IEnumerator<NameSyntax> IEnumerable<NameSyntax>.GetEnumerator() => Names(statement).GetEnumerator();

    System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => Names(statement).GetEnumerator();

    private static IEnumerable<NameSyntax> Names(StatementSyntax statement)
    {
        var names = new Enumerator(statement);
        while (names.MoveNext()) yield return names.Current;
    }

    /// <summary>Clause −1 is the head; the next name after element <see cref="element"/> of clause <see cref="clause"/>.</summary>
    public struct Enumerator(StatementSyntax statement)
    {
        private int clause = -1, element = -1;

        public NameSyntax Current { get; private set; } = null!;

        public bool MoveNext()
        {
            while (clause < statement.Clauses.Length)
            {
                var elements = clause < 0 ? statement.Head.Elements : statement.Clauses[clause].Elements;
                while (++element < elements.Length)
                    if (elements[element] is NameSyntax n)
                    {
                        Current = n;
                        return true;
                    }
                (clause, element) = (clause + 1, -1);
            }
            return false;
        }
    }
}

/// <summary>
/// A logical line: physical lines joined by continuations. It holds every token, trivia
/// included, so the line prints back to its exact text, and either a statement, or an error,
/// or nothing (a blank or comment-only line). A line with an error may keep what it says as a
/// <see cref="Partial"/> statement: the parts read up to the error and after it from the next
/// clause keyword on, with a <see cref="MissingSyntax"/> where a part is missing. The binder
/// declares its names and adds no element, so other lines that use them report nothing more.
/// </summary>
public sealed record LineSyntax(int Index, TextSpan Span, ImmutableArray<Token> Tokens, StatementSyntax? Statement, Diagnostic? Error, StatementSyntax? Partial = null)
{
    public Token? Comment => Tokens.FirstOrDefault(t => t.Kind == TokenKind.Comment);

    public IEnumerable<Token> Significant => Tokens.Where(t => !t.IsTrivia);

    public bool IsBlank => Statement is null && Error is null && Comment is null;
}

/// <summary>A parsed document: its text and its logical lines. Parsing never fails.</summary>
public sealed record SyntaxTree(SourceText Text, ImmutableArray<LineSyntax> Lines, ImmutableArray<Diagnostic> Diagnostics)
{
    public IEnumerable<StatementSyntax> Statements => Lines.Select(l => l.Statement).OfType<StatementSyntax>();

    /// <summary>What the lines that failed to parse still say.</summary>
    public IEnumerable<StatementSyntax> PartialStatements => Lines.Select(l => l.Partial).OfType<StatementSyntax>();

    /// <summary>The tokens printed back; equal to the text it was parsed from.</summary>
    public string ToFullString() => string.Concat(Lines.SelectMany(l => l.Tokens).Select(t => t.Text));
}

using System.Collections.Frozen;
using System.Collections.Immutable;
using Pidgin;
using static Pidgin.Parser;

namespace WindingNotes.Syntax;

/// <summary>
/// Builds one Pidgin parser per statement form of the <see cref="Grammar"/>: the head's parts in
/// order, then clauses in any order (each starts with its own keyword, so no backtracking), then the
/// end of the line. A statement's keyword has been read before its parser runs.
/// </summary>
internal static class StatementParsers
{
    public static readonly FrozenDictionary<StatementKind, Parser<Token, (ClauseSyntax Head, ImmutableArray<ClauseSyntax> Clauses)>> ByKind =
        Grammar.Statements.ToFrozenDictionary(s => s.Kind, Build);

    private static Parser<Token, (ClauseSyntax, ImmutableArray<ClauseSyntax>)> Build(StatementForm form)
    {
        var head = Sequence(form.Head).Select(elements => new ClauseSyntax(null, null, elements));
        return Map((h, c) => (h, c), head, ClausesToEnd(form));
    }

    /// <summary>
    /// Clauses until the end of the line, each step one alternative among the clauses and the end,
    /// so that a stray word is reported against all of them ("expected 'turns', 'rated' … or end of line").
    /// </summary>
    private static Parser<Token, ImmutableArray<ClauseSyntax>> ClausesToEnd(StatementForm form)
    {
        var end = Parser<Token>.End.Labelled("end of line").Select(_ => (ClauseSyntax?)null);
        var step = OneOf(form.Clauses.Select(c => BuildClause(c).Select(x => (ClauseSyntax?)x)).Append(end));
        Parser<Token, ImmutableArray<ClauseSyntax>>? list = null;
        list = step.Then(clause => clause is null
            ? Parser<Token>.Return(ImmutableArray<ClauseSyntax>.Empty)
            : Rec(() => list!).Select(rest => rest.Insert(0, clause)));
        return list;
    }

    private static Parser<Token, ClauseSyntax> BuildClause(ClauseForm form) =>
        Map((keyword, elements) => new ClauseSyntax(form, keyword, elements), ValueParser.Keyword(form.Keyword), Sequence(form.Parts));

    private static Parser<Token, ImmutableArray<ElementSyntax>> Sequence(IEnumerable<Part> parts)
    {
        var result = Parser<Token>.Return(ImmutableArray<ElementSyntax>.Empty);
        foreach (var part in parts)
            result = Map((a, b) => a.AddRange(b), result, BuildPart(part));
        return result;
    }

    private static Parser<Token, IEnumerable<ElementSyntax>> BuildPart(Part part) => part switch
    {
        NamePart n => NameParser(n.Role).Select(e => (IEnumerable<ElementSyntax>)[e]),
        NameListPart n => NameParser(n.Role).AtLeastOnce().Select(e => e.Cast<ElementSyntax>()),
        ValuePart v => ValueParser.LabelledValue(v.Label).Select(e => (IEnumerable<ElementSyntax>)[e]),
        WordPart w => WordParser(w.Word, $"'{w.Word}'").Select(e => (IEnumerable<ElementSyntax>)[e]),
        ChoicePart c => OneOf(c.Words.Select(w => WordParser(w, c.Label))).Labelled(c.Label).Select(e => (IEnumerable<ElementSyntax>)[e]),
        OptionalPart o => Sequence(o.Parts).Optional().Select(e => e.HasValue ? (IEnumerable<ElementSyntax>)e.Value : []),
        _ => throw new InvalidOperationException($"unknown part {part}"),
    };

    private static Parser<Token, ElementSyntax> WordParser(string word, string label) =>
        Parser<Token>.Token(t => t.Text == word && t.Kind is TokenKind.Word or TokenKind.Symbol)
            .Labelled(label).Select(t => (ElementSyntax)new WordSyntax(t));

    private static Parser<Token, ElementSyntax> NameParser(NameRole role)
    {
        var name = ValueParser.Name.Labelled(role.Label);
        if (!role.AllowsSection) return name.Select(t => (ElementSyntax)new NameSyntax(t, role));
        var section = Map((_, from, _, to) => (from, to),
            ValueParser.Symbol(":"), ValueParser.Name.Labelled("a terminal name"), ValueParser.Symbol("-"), ValueParser.Name.Labelled("a terminal name"));
        return Map((n, s) => (ElementSyntax)new NameSyntax(n, role, s.HasValue ? s.Value.from : null, s.HasValue ? s.Value.to : null),
            name, section.Optional());
    }
}

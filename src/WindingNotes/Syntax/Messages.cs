using WindingNotes.Text;

namespace WindingNotes.Syntax;

// Messages of the syntax stage, as members of the diagnostic bag: each stage words its own.
public static partial class SyntaxMessages
{
    extension(DiagnosticBag bag)
    {
        public Diagnostic ReportUnknownStatement(Token token)
        {
            if (token.Kind != TokenKind.Word)
                return bag.Error("expected-statement", token.Span, $"expected a statement keyword, found '{token.Text}'");
            var d = bag.Error("unknown-statement", token.Span, $"unknown statement '{token.Text}'");
            return bag.WithSuggestion(d, Spelling.Nearest(token.Text, Grammar.ByKeyword.Keys), token.Span);
        }

        public Diagnostic ReportUnexpected(Token found, IReadOnlyList<string> expected, string? suggestion)
        {
            var what = found.Kind switch
            {
                TokenKind.Bad => $"unexpected character '{found.Text}'",
                _ => $"expected {Alternatives(expected)}, found '{found.Text}'",
            };
            if (found.Kind == TokenKind.Bad && expected.Count > 0) what += $": expected {Alternatives(expected)}";
            return bag.WithSuggestion(bag.Error("syntax", found.Span, what), suggestion, found.Span);
        }

        public Diagnostic ReportUnexpectedEnd(Token last, IReadOnlyList<string> expected) =>
            bag.Error("syntax", last.Span, $"expected {Alternatives(expected)} after '{last.Text}'");

        public Diagnostic ReportStatementTooLong(Token at, int limit) =>
            bag.Error("statement-too-long", at.Span, $"a statement may have at most {limit} tokens; split the value with 'let'");

        public Diagnostic ReportNestingTooDeep(Token at, int limit) =>
            bag.Error("nesting-too-deep", at.Span, $"parentheses nest deeper than {limit} levels");

        public Diagnostic ReportDuplicateClause(Token second, Token first) =>
            bag.Amend(bag.Error("duplicate-clause", second.Span, $"'{second.Text}' is given twice"),
                d => d with { Related = [new RelatedSpan("first given here", first.Span)] });

        public Diagnostic ReportExclusiveClauses(Token second, Token first) =>
            bag.Amend(bag.Error("exclusive-clauses", second.Span, $"'{second.Text}' and '{first.Text}' cannot both be given"),
                d => d with { Related = [new RelatedSpan($"'{first.Text}' given here", first.Span)] });

        public Diagnostic ReportMissingClause(StatementSyntax statement, string keyword) =>
            bag.Error("missing-clause", statement.Keyword.Span, $"a {statement.Keyword.Text} needs '{keyword}'");

        public Diagnostic ReportMissingGroup(StatementSyntax statement, string group, IReadOnlyList<string> choices) =>
            bag.Error("missing-clause", statement.Keyword.Span,
                $"a {statement.Keyword.Text} needs one of {Alternatives(choices.Select(c => $"'{c}'").ToList())}");

        public Diagnostic ReportMissingClauses(StatementSyntax statement, IReadOnlyList<string> clauses, IReadOnlyList<IReadOnlyList<string>> groups)
        {
            var needs = clauses.Select(c => $"'{c}'").Concat(groups.Select(g => $"one of {Alternatives(g.Select(c => $"'{c}'").ToList())}")).ToList();
            return bag.Error("missing-clause", statement.Keyword.Span,
                $"a {statement.Keyword.Text} needs {string.Join(", ", needs.Take(needs.Count - 1))} and {needs[^1]}");
        }

        /// <summary>"a, b or c"; long lists are cut so the message stays readable.</summary>
        private static string Alternatives(IReadOnlyList<string> items)
        {
            if (items.Count == 0) return "something else";
            var shown = items.Count > 8 ? [.. items.Take(7), "…"] : items.ToList();
            return shown.Count == 1 ? shown[0] : string.Join(", ", shown.Take(shown.Count - 1)) + " or " + shown[^1];
        }
    }
}

using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using WindingNotes.Text;
using Xunit;

namespace WindingNotes.Tests.Syntax;

public class ParserTests
{
    [Fact]
    public void A_bare_keyword_spans_its_own_word_not_the_text_before_it()
    {
        // Fuzz seed 5007049: the second of two bare 'expect' lines covered offsets 0 to 14 (its empty
        // head has the default span), so two checks stood at one offset and the hints keyed by it threw.
        const string text = "expect \nexpect \nfrequency 50 Hz\n";
        var tree = Parser.Parse(text);
        var expects = tree.Statements.Where(s => s.Kind == StatementKind.Expect).ToList();
        Assert.Equal([new TextSpan(0, 6), new TextSpan(8, 6)], expects.Select(s => s.Span));
        var evaluation = WindingNotes.Workspace.Evaluator.Evaluate(text, "bare.wn");
        Assert.Equal([1, 2], evaluation.Checks.Select(c => evaluation.Text.GetPosition(c.Expect.Line.Start).Line + 1));
        Assert.Equal(["expect", "expect"], evaluation.Checks.Select(c => c.Expect.Text));
    }

    [Fact]
    public void Every_statement_of_the_notation_parses()
    {
        foreach (var form in Grammar.Statements)
        {
            var tree = Parser.Parse(form.Example);
            Assert.True(tree.Diagnostics.IsEmpty, $"{form.Example}: {string.Join("; ", tree.Diagnostics.Select(d => d.Message))}");
            Assert.Equal(form.Kind, Assert.Single(tree.Statements).Kind);
        }
    }

    [Theory]
    [InlineData("winding HV on K1 turns 240 rated 240 V from H1 to H2 resistance 1.4 ohm\n# c\n\n  load L X1 N impedance 3 + j4 ohm # z\r\nfrequency 60 Hz")]
    [InlineData("core K1 \\\n   rating 0.5 kVA\nwinding ? broken ± line\n")]
    [InlineData("")]
    [InlineData("\n\n")]
    [InlineData("let z = 5 Ω angle 53.13 ° # polar\nlet a = 2.5 mm² ±0.1 mm2")]
    public void The_tree_prints_back_to_the_exact_text(string text)
    {
        Assert.Equal(text, Parser.Parse(text).ToFullString());
    }

    [Fact]
    public void A_broken_line_is_an_error_and_the_others_still_parse()
    {
        var tree = Parser.Parse("frequency 60 Hz\ncore K1 rating\nground N\n");
        var error = Assert.Single(tree.Diagnostics);
        Assert.Equal(1, tree.Text.GetPosition(error.Span.Start).Line);
        Assert.Contains("expected a value", error.Message);
        Assert.Equal([StatementKind.Frequency, StatementKind.Ground], tree.Statements.Select(s => s.Kind));
        Assert.NotNull(tree.Lines[1].Error);
    }

    [Fact]
    public void Errors_are_in_words_not_characters()
    {
        var tree = Parser.Parse("core K1 rating 0.5 ( area 2 cm2");
        var error = Assert.Single(tree.Diagnostics);
        Assert.Contains("expected a unit", error.Message);
        Assert.Equal("(", tree.Text[error.Span]);
    }

    [Fact]
    public void A_misspelt_clause_gets_a_suggestion()
    {
        var tree = Parser.Parse("winding HV on K1 tunrs 240 from H1 to H2");
        var error = Assert.Single(tree.Diagnostics);
        Assert.Equal("tunrs", tree.Text[error.Span]);
        Assert.Equal("turns", Assert.Single(error.Hints).Replacement);
    }

    [Fact]
    public void A_misspelt_statement_gets_a_suggestion()
    {
        var tree = Parser.Parse("windng HV on K1 turns 240 from H1 to H2");
        var error = Assert.Single(tree.Diagnostics);
        Assert.Equal("unknown-statement", error.Code);
        Assert.Equal("winding", Assert.Single(error.Hints).Replacement);
    }

    [Fact]
    public void A_continued_line_is_one_statement_with_ranges_on_each_physical_line()
    {
        var tree = Parser.Parse("winding HV on K1 \\\n    turns 240 rated 240 V \\\n    from H1 to H2\n");
        var statement = Assert.Single(tree.Statements);
        Assert.Empty(tree.Diagnostics);
        var to = statement.Clause("from")!.Name(1)!;
        Assert.Equal(new Position(2, 15), tree.Text.GetPosition(to.Span.Start));
    }

    [Fact]
    public void Comments_are_kept_in_the_tree()
    {
        var tree = Parser.Parse("ground N # the neutral\n# alone\n");
        Assert.Equal("# the neutral", tree.Lines[0].Comment!.Text);
        Assert.Equal("# alone", tree.Lines[1].Comment!.Text);
        Assert.Null(tree.Lines[1].Statement);
    }

    [Fact]
    public void Positions_count_utf16_code_units()
    {
        var text = "let r = 5 Ω ± 2 %\nlet a = 2 mm² # ²\nlet t = 20 °C\nlet x = nope";
        var tree = Parser.Parse(text);
        var e = Wn.Eval(text);
        var unknown = e.Single("unknown-name");
        Assert.Equal(new TextRange(new Position(3, 8), new Position(3, 12)), e.Text.GetRange(unknown.Span));
        var omega = tree.Statements.First().Head.Value()!.Expression as NumberSyntax;
        Assert.Equal(new Position(0, 10), tree.Text.GetPosition(omega!.Unit!.Span.Start));
        Assert.Equal(new Position(2, 11), tree.Text.GetPosition(((NumberSyntax)tree.Statements.ElementAt(2).Head.Value()!.Expression).Unit!.Span.Start));
    }

    [Fact]
    public void Numbers_accept_underscores_exponents_and_leading_points()
    {
        var numbers = Lexer.Lex("1_000 1.5e3 .5 2E-3 0.62").Where(t => t.Kind == TokenKind.Number).Select(t => t.Number);
        Assert.Equal([1000, 1500, 0.5, 0.002, 0.62], numbers);
    }

    [Fact]
    public void A_rectangular_literal_keeps_its_unit_on_both_parts()
    {
        var value = Parser.Parse("let z = -3 + j4 ohm").Statements.Single().Head.Value()!;
        var complex = Assert.IsType<ComplexSyntax>(value.Expression);
        Assert.Equal("ohm", complex.Imaginary.Unit!.Text);
    }

    [Fact]
    public void Clause_rules_are_checked()
    {
        var tree = Parser.Parse("winding HV on K1 turns 2 turns 3 from A to B\nload L A B power 1 W apparent 2 VA\nload M A B pf 0.9\ntap T on HV");
        Assert.Equal(["duplicate-clause", "exclusive-clauses", "missing-clause", "missing-clause"], tree.Diagnostics.Select(d => d.Code));
    }

    [Fact]
    public void Hyphenated_keywords_are_one_word_and_minus_stays_an_operator()
    {
        var words = Lexer.Lex("flux-limit 1.6 T let d = a-b").Where(t => !t.IsTrivia).Select(t => t.Text);
        Assert.Equal(["flux-limit", "1.6", "T", "let", "d", "=", "a", "-", "b"], words);
    }

    [Fact]
    public void The_ebnf_in_grammar_is_the_parser_grammar()
    {
        // The grammar file lives at the top of the repository, not under tests/.
        var path = Path.Combine(Snapshot.RepositoryRoot, "grammar", "windingnotes.ebnf");
        if (Snapshot.Updating) File.WriteAllText(path, GrammarText.Ebnf());
        Assert.Equal(GrammarText.Ebnf(), File.ReadAllText(path));
        foreach (var form in Grammar.Statements)
            Assert.Contains(form.Example, File.ReadAllText(path));
    }

    [Fact]
    public void Deep_nesting_and_huge_statements_are_refused_with_a_diagnostic_not_a_crash()
    {
        var deep = Parser.Parse("let x = " + new string('(', 500) + "1" + new string(')', 500) + "\nground N");
        Assert.Equal("nesting-too-deep", Assert.Single(deep.Diagnostics).Code);
        Assert.Single(deep.Statements);
        var huge = Parser.Parse("let x = 1" + string.Concat(Enumerable.Repeat(" + 1", 100_000)));
        Assert.Equal("statement-too-long", Assert.Single(huge.Diagnostics).Code);
        var nested = WindingNotes.Workspace.Evaluator.Evaluate("let x = " + new string('(', 60) + "1 V" + new string(')', 60) + "\n");
        Assert.DoesNotContain(nested.Diagnostics, d => d.IsError);
    }
}

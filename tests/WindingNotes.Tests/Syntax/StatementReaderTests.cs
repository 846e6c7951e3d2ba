using System.Collections;
using System.Reflection;
using System.Runtime.CompilerServices;
using Pidgin;
using Parser = WindingNotes.Syntax.Parser;
using WindingNotes.Syntax;
using WindingNotes.Tests.Robustness;
using Xunit;

namespace WindingNotes.Tests.Syntax;

/// <summary>
/// The reader reads values itself (fast) and leaves the wording of an error inside a value to
/// Pidgin's value grammar (<see cref="ValueParser"/>): the two must read the same values to the same
/// trees, so that which one read a value never shows. The messages below are those the Pidgin
/// statement parsers gave before the one reader took their place, byte for byte.
/// </summary>
public class StatementReaderTests
{
    [Theory]
    [InlineData("let a = - + 3 V * -2 / (4 - j5 ohm) + 3 - j4")]
    [InlineData("let b = sqrt(2) * 5 turns angle -30 deg ±2 %")]
    [InlineData("winding W on K turns 5 turns from A to B resistance 0.3 ohm at 75 degC conductor copper AWG 14 mean-turn 0.3 m")]
    [InlineData("impedance HV:H1-T60 LV 3 + j4 % xr 2 base 5 kVA")]
    [InlineData("expect current HV X1 N near 3 A within 2 %")]
    [InlineData("load L A B current 2 A pf 0.9 leading model constant-power at 230 V")]
    [InlineData("let c = 3 -")]
    [InlineData("let d = 3 j4")]
    [InlineData("let e = (3 V")]
    [InlineData("let f = sqrt 3")]
    [InlineData("winding W on K turns 5 = from A to B")]
    public void Values_read_alike(string line) => AssertAlike(line);

    [Theory]
    [InlineData("winding W on K turns 5 =", "23-24 expected a unit, an operator, '+-', a keyword or end of line, found '='")]
    [InlineData("winding W on K turns (5 V =", "26-27 expected ')', found '='")]
    [InlineData("winding W on K turns sqrt 5", "26-27 expected '(', found '5'")]
    [InlineData("winding W on K turns sqrt(5 V", "28-29 expected ')' after 'V'")]
    [InlineData("winding W on K turns 5 V +- =", "28-29 expected a value, found '='")]
    [InlineData("winding W on K turns 5 V angle =", "31-32 expected a value, found '='")]
    [InlineData("winding W on K turns -", "21-22 expected a value after '-'")]
    [InlineData("winding W on K turns 5 @", "23-24 unexpected character '@': expected a unit, an operator, '+-', a keyword or end of line")]
    [InlineData("winding W on K turns 5 V foo", "25-28 expected 'from', 'wye', 'delta', 'zigzag', 'series', 'ends', 'on' or …, found 'foo'")]
    [InlineData("winding W on K wye A B C =", "25-26 expected 'on', 'turns', 'rated', 'rating', 'rated-current', 'from', 'resistance' or …, found '='")]
    [InlineData("winding W on K from A =", "22-23 expected 'to', found '='")]
    [InlineData("winding W on K conductor copper AWG =", "36-37 expected a conductor size, found '='")]
    [InlineData("expect voltage A B =", "19-20 expected 'between', 'below', 'above', 'near', 'is', 'clear-of-limits', 'voltage' or …, found '='")]
    [InlineData("impedance HV: 3 %", "14-15 expected a terminal name, found '3'")]
    [InlineData("impedance HV:a 3 %", "15-16 expected '-', found '3'")]
    [InlineData("join A B =", "9-10 expected end of line, found '='")]
    [InlineData("join", "0-4 expected a terminal or node after 'join'")]
    [InlineData("three-phase-load m A B C power 3 kW 4 kW =", "41-42 expected a value, found '='")]
    [InlineData("bus-fault F A B C maximum", "18-25 expected a fault kind, found 'maximum'")]
    [InlineData("winding @", "8-9 unexpected character '@': expected a new winding name")]
    public void Errors_are_worded_as_before(string line, string expected)
    {
        var d = Assert.Single(Parser.Parse(line).Diagnostics);
        Assert.Equal(expected, $"{d.Span.Start}-{d.Span.End} {d.Message}");
    }

    [Fact]
    public void A_different_tree_shows()
    {
        var a = Parser.Parse("let a = - - 3").Statements.Single();
        var b = Parser.Parse("let a = -(-3)").Statements.Single();
        Assert.NotEqual(Dump(a.Head), Dump(b.Head));
    }

    [Trait("Category", "Long")]
    [Fact]
    public void Every_value_of_fuzzed_documents_reads_alike()
    {
        var read = 0;
        for (var seed = 0; seed < 1000; seed++)
            read += AssertAlike(FuzzInputs.Make(seed, huge: false).Text, $"seed {seed}");
        Assert.True(read > 10_000, $"only {read} values read");
    }

    /// <summary>
    /// Every value the reader read, read again by Pidgin from its first token: the same tree and
    /// the same tokens. Every line the reader stopped inside a value: Pidgin refuses that value too.
    /// Returns how many values both read.
    /// </summary>
    private static int AssertAlike(string text, string what = "")
    {
        var read = 0;
        foreach (var line in Parser.Parse(text).Lines)
        {
            var tokens = line.Significant.ToArray();
            var shown = $"{what} line {line.Index}: {string.Join(" ", tokens.Select(t => t.Text))}";
            var statement = line.Statement ?? line.Partial;
            if (statement is null) continue;
            foreach (var value in statement.Head.Values.Concat(statement.Clauses.SelectMany(c => c.Values)))
            {
                var first = Array.FindIndex(tokens, t => t.Span.Start == value.Span.Start);
                var count = tokens.Skip(first).TakeWhile(t => t.Span.End <= value.Span.End).Count();
                var pidgin = ValueParser.Value.Parse(tokens.AsSpan(first, count));
                Assert.True(pidgin.Success, $"{shown}: Pidgin refuses the value the reader read at {value.Span}");
                Assert.True(Dump(pidgin.Value) == Dump(value), $"{shown}:\n{Dump(pidgin.Value)}\n{Dump(value)}");
                read++;
            }
        }
        return read;
    }

    /// <summary>A tree as text: node types, tokens and spans, arrays by their items.</summary>
    private static string Dump(object? node) => node switch
    {
        null => "null",
        string s => s,
        Token t => $"{t} {t.Number}",
        ClauseForm f => f.Keyword,
        NameRole r => r.Label,
        IEnumerable items => "[" + string.Join(", ", items.Cast<object?>().Select(Dump)) + "]",
        ElementSyntax or ExpressionSyntax or ClauseSyntax => node.GetType().Name + "(" + string.Join(", ",
            node.GetType().GetProperties(BindingFlags.Public | BindingFlags.Instance).Select(p => $"{p.Name}={Dump(p.GetValue(node))}")) + ")",
        ITuple tuple => "(" + string.Join(", ", Enumerable.Range(0, tuple.Length).Select(i => Dump(tuple[i]))) + ")",
        _ => node.ToString() ?? "",
    };
}

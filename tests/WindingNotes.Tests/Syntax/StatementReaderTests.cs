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
/// The direct reader and the Pidgin parsers must agree: the reader takes exactly the lines the
/// Pidgin parsers take and builds the same tree, so which one read a line never shows.
/// </summary>
public class StatementReaderTests
{
    [Theory]
    [InlineData("let a = - + 3 V * -2 / (4 - j5 ohm) + 3 - j4")]
    [InlineData("let b = sqrt(2) * 5 turns angle -30 deg ±2 %")]
    [InlineData("winding W on K turns 5 turns from A to B resistance 0.3 ohm at 75 degC conductor copper AWG 14 mean-turn 0.3 m")]
    [InlineData("impedance HV:H1-T60 LV 3 + j4 % xr 2 base 5 kVA")]
    [InlineData("expect current HV X1 N near 3 A within 2 %")]
    [InlineData("join A B C D")]
    [InlineData("load L A B current 2 A pf 0.9 leading model constant-power at 230 V")]
    [InlineData("let c = 3 -")]
    [InlineData("let d = 3 j4")]
    [InlineData("impedance HV:H1 LV 3 %")]
    [InlineData("load L A B pf 0.9 lagging lagging")]
    public void Lines_read_alike(string line) => AssertAlike(line);

    [Fact]
    public void A_different_tree_shows()
    {
        var a = Parser.Parse("let a = - - 3").Statements.Single();
        var b = Parser.Parse("let a = -(-3)").Statements.Single();
        Assert.NotEqual(Dump(a.Head), Dump(b.Head));
    }

    [Trait("Category", "Long")]
    [Fact]
    public void Every_line_of_fuzzed_documents_reads_alike()
    {
        var read = 0;
        for (var seed = 0; seed < 1000; seed++)
            read += AssertAlike(FuzzInputs.Make(seed, huge: false).Text, $"seed {seed}");
        Assert.True(read > 10_000, $"only {read} lines read");
    }

    /// <summary>How many statements both read.</summary>
    private static int AssertAlike(string text, string what = "")
    {
        var read = 0;
        foreach (var line in Parser.Parse(text).Lines)
        {
            var tokens = line.Significant.ToArray();
            if (tokens.Length is 0 or > Parser.MaxTokens || tokens.Count(t => t.Text == "(") > Parser.MaxNesting) continue;
            if (!(tokens[0].Kind == TokenKind.Word && Grammar.ByKeyword.TryGetValue(tokens[0].Text, out var form))) continue;
            var pidgin = StatementParsers.ByKind[form.Kind].Parse(tokens.AsSpan(1));
            var direct = StatementReader.Read(form, tokens);
            var shown = $"{what} line {line.Index}: {string.Join(" ", tokens.Select(t => t.Text))}";
            Assert.True(pidgin.Success == direct.HasValue, $"{shown}: Pidgin {(pidgin.Success ? "reads" : "refuses")} it, the reader {(direct.HasValue ? "reads" : "refuses")} it");
            if (direct is not { } d) continue;
            Assert.True(Dump(pidgin.Value) == Dump(d), $"{shown}:\n{Dump(pidgin.Value)}\n{Dump(d)}");
            read++;
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

using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Editors;

/// <summary>
/// The TextMate grammar in grammar/ is written by hand; these checks tie it to the parser's
/// keyword table and statement forms, so adding a keyword or a statement without colouring fails here.
/// </summary>
public class TextMateGrammarTests
{
    private static readonly string GrammarFolder = Path.Combine(Snapshot.RepositoryRoot, "grammar");

    private static readonly JsonNode TextMate =
        JsonNode.Parse(File.ReadAllText(Path.Combine(GrammarFolder, "windingnotes.tmLanguage.json")))!;

    private static IEnumerable<JsonNode> Rules(string name) => TextMate["repository"]![name]!["patterns"]!.AsArray()!.Select(r => r!);

    /// <summary>The keyword rule's regular expressions; the grammar keeps to constructs .NET reads the same way.</summary>
    private static readonly Regex[] KeywordRules = Rules("keywords").Select(r => new Regex((string)r["match"]!)).ToArray();

    [Fact]
    public void The_keyword_rule_lists_exactly_the_grammar_keywords()
    {
        var listed = Rules("keywords")
            .SelectMany(r => Regex.Matches((string)r["match"]!, @"\(\?:([A-Za-z0-9|-]+)\)").Select(m => m.Groups[1].Value))
            .SelectMany(alternation => alternation.Split('|'))
            .ToList();
        Assert.Equal(listed.Count, listed.Distinct().Count());
        Assert.Equal(Grammar.Keywords.Order(), listed.Order());
    }

    [Fact]
    public void Every_keyword_is_matched_whole_by_the_keyword_rule()
    {
        foreach (var keyword in Grammar.Keywords)
        {
            var text = $"x {keyword} 1";
            var first = KeywordRules.Select(r => r.Match(text)).Where(m => m.Success).MinBy(m => m.Index);
            Assert.True(first is { Index: 2 } && first.Length == keyword.Length, $"the keyword rule does not match '{keyword}' whole");
        }
    }

    [Theory]
    [InlineData("HV")]
    [InlineData("ratings")]
    [InlineData("rating2")]
    [InlineData("tonnage")]
    [InlineData("flux_limit")]
    [InlineData("_to")]
    public void A_name_that_contains_a_keyword_is_not_one(string name)
    {
        Assert.DoesNotContain(KeywordRules, r => r.IsMatch(name));
    }

    [Fact]
    public void Every_statement_has_a_rule_that_starts_at_its_keyword()
    {
        var rules = Rules("statements").ToList();
        Assert.Equal(Grammar.Statements.Length, rules.Count);
        foreach (var form in Grammar.Statements)
        {
            var rule = Assert.Single(rules, r => (string)r["name"]! == $"meta.statement.{form.Keyword}.windingnotes");
            var begin = new Regex((string)rule["begin"]!).Match("  " + form.Example);
            Assert.True(begin.Success && begin.Groups[1].Value == form.Keyword, $"the rule for {form.Keyword} does not start at '{form.Example}'");
            Assert.False(new Regex((string)rule["begin"]!).IsMatch($"{form.Keyword}x 1"), $"the rule for {form.Keyword} starts inside a longer word");
        }
    }

    [Fact]
    public void The_grammar_tests_cover_every_statement_kind_in_valid_notation()
    {
        var kinds = new HashSet<StatementKind>();
        foreach (var file in Directory.GetFiles(Path.Combine(GrammarFolder, "tests"), "*.wn"))
        {
            var tree = Parser.Parse(SourceOfGrammarTest(file));
            Assert.True(tree.Diagnostics.IsEmpty, $"{Path.GetFileName(file)}: {string.Join("; ", tree.Diagnostics.Select(d => d.Message))}");
            kinds.UnionWith(tree.Statements.Select(s => s.Kind));
        }
        foreach (var form in Grammar.Statements)
        {
            var file = Path.Combine(GrammarFolder, "tests", form.Keyword + ".wn");
            Assert.True(File.Exists(file), $"no grammar test for the {form.Keyword} statement");
            Assert.Contains(form.Kind, Parser.Parse(SourceOfGrammarTest(file)).Statements.Select(s => s.Kind));
        }
        Assert.Equal(Enum.GetValues<StatementKind>().Order(), kinds.Order());
    }

    /// <summary>The text a grammar test colours: vscode-tmgrammar-test leaves out its assertion lines (# ^^^ or # <---).</summary>
    private static string SourceOfGrammarTest(string file) =>
        string.Join("\n", File.ReadAllLines(file).Where(line => !Regex.IsMatch(line, @"^#\s*(\^|<[~-])")));

    [Fact]
    public void The_VS_Code_extension_contributes_this_grammar_for_wn_files()
    {
        var extension = Path.Combine(Snapshot.RepositoryRoot, "editors", "vscode");
        var contributes = JsonNode.Parse(File.ReadAllText(Path.Combine(extension, "package.json")))!["contributes"]!;
        var language = contributes["languages"]![0]!;
        Assert.Equal(".wn", (string)language["extensions"]![0]!);
        Assert.Equal((string)TextMate["scopeName"]!, (string)contributes["grammars"]![0]!["scopeName"]!);
        var configuration = JsonNode.Parse(File.ReadAllText(Path.Combine(extension, (string)language["configuration"]!)))!;
        Assert.Equal("#", (string)configuration["comments"]!["lineComment"]!);
    }
}

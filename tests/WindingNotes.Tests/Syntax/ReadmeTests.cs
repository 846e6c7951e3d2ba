using System.Text.RegularExpressions;
using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Syntax;

/// <summary>The README's tour of the notation keeps up with the grammar table.</summary>
public class ReadmeTests
{
    private static readonly string Readme = File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "README.md"));

    private static IEnumerable<string> Words(Part part) => part switch
    {
        WordPart w => [w.Word],
        ChoicePart c => c.Words,
        OptionalPart o => o.Parts.SelectMany(Words),
        _ => [],
    };

    public static TheoryData<string> Statements() => [.. Grammar.Statements.Select(s => s.Keyword)];

    [Theory]
    [MemberData(nameof(Statements))]
    public void Every_keyword_clause_and_choice_of_a_statement_is_in_the_readme(string keyword)
    {
        var form = Grammar.ByKeyword[keyword];
        var words = form.Head.SelectMany(Words).Concat(form.Clauses.SelectMany(c => c.Parts.SelectMany(Words).Prepend(c.Keyword))).Prepend(keyword).Distinct();
        Assert.All(words, w => Assert.Matches(@"(?<![\w-])" + Regex.Escape(w) + @"(?![\w-])", Readme));
    }

    [Fact]
    public void The_readme_states_the_load_models_and_how_an_impedance_line_meets_stated_resistances_as_the_code_does()
    {
        var readme = string.Join(' ', Readme.Split((char[])[' ', '\n'], StringSplitOptions.RemoveEmptyEntries));
        Assert.Contains("`model constant-impedance at 230 V` (or `constant-current`, `constant-power`)", readme);
        // LeakageTests.A_bare_magnitude_leaves_the_reactance_beside_the_stated_resistances holds the code to this.
        Assert.Contains("a bare magnitude (`3.6 %`, `0.8 ohm`) is |Z|, and X = √(|Z|² − R²)", readme);
        Assert.DoesNotContain("those give R and the line gives X", readme);
    }

    [Theory]
    [InlineData("power 1 kW model constant-impedance at 230 V", 250)]
    [InlineData("power 1 kW model constant-current at 230 V", 500)]
    [InlineData("impedance 52.9 ohm model constant-power at 230 V", 1000)]
    [InlineData("current 4.348 A model constant-impedance at 230 V", 250)]
    public void A_load_model_draws_its_demand_at_the_stated_voltage_and_responds_from_there(string demand, double watts)
    {
        // At 115 V, half the stated 230 V: constant impedance draws a quarter of 1 kW, constant current
        // half of it, constant power all of it. 52.9 ohm draws 1 kW at 230 V (230²/52.9); 4.348 A draws 1 kW at 230 V.
        var text = $"frequency 50 Hz\nsupply s A B 115 V\nground B\nload l A B {demand}\n";
        var e = Wn.Solved(text);
        Wn.Near(watts, e.Normal!.Load("l").Power.Real, 1e-3, demand);
    }

    [Fact]
    public void A_change_of_load_model_needs_the_voltage_it_is_stated_at()
    {
        var e = Wn.Eval("frequency 50 Hz\nsupply s A B 115 V\nground B\nload l A B power 1 kW model constant-impedance\n");
        Assert.Contains(e.Diagnostics, d => d.IsError && d.Message.Contains("given 'at' a voltage"));
    }
}

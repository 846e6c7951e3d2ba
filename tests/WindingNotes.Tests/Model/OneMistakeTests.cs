using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Model;

/// <summary>
/// One mistake, one message: a line that fails to parse keeps what it says (a partial statement),
/// declares its names and adds no element, and what follows only from it is not reported.
/// </summary>
public class OneMistakeTests
{
    private static string Example(string name) => Cursor.Example(name);

    private static string[] Errors(string text) =>
        [.. Wn.Eval(text).Errors().Select(d => $"{d.Code}: {d.Message}")];

    [Fact]
    public void An_unfinished_resistance_clause_on_a_winding_line_is_one_error()
    {
        // Before: four errors, among them "unknown winding 'HV'" on the impedance and expect lines.
        var text = Example("alder-creek-boost.wn").Replace("resistance 1.4 ohm", "resistance");
        var error = Assert.Single(Errors(text));
        Assert.StartsWith("syntax: expected", error);
    }

    [Fact]
    public void A_broken_line_declares_its_names_with_a_placeholder_where_it_stopped()
    {
        var tree = Parser.Parse("winding HV on K1 turns 240 rated from H1 to H2 resistance\n");
        var line = tree.Lines[0];
        Assert.Null(line.Statement);
        Assert.NotNull(line.Error);
        var partial = Assert.IsType<StatementSyntax>(line.Partial);
        Assert.Equal(["HV", "K1", "H1", "H2"], partial.AllNames.Select(n => n.Text));
        var missing = partial.Clauses.SelectMany(c => c.Elements).OfType<MissingSyntax>().Select(m => (m.Expected, m.At.Start)).ToList();
        // 'rated' lacks its voltage where 'from' stands; 'resistance' its value at the end of the line.
        Assert.Equal([("a value", 33), ("a value", 57)], missing);
    }

    [Fact]
    public void A_duplicate_name_does_not_hide_a_unit_error_on_the_same_line()
    {
        var text = Example("alder-creek-boost.wn").Replace("load planer X1 H2 power 3.2 kW pf 0.82 lagging",
            "load planer X1 H2 power 3.2 kW pf 0.82 lagging\nload planer X1 H2 power 3.2 pf 0.82 lagging");
        var errors = Errors(text);
        Assert.Equal(2, errors.Length);
        Assert.StartsWith("duplicate-name:", errors[0]);
        Assert.StartsWith("missing-unit:", errors[1]);
    }

    [Fact]
    public void A_mistyped_core_name_is_one_error_and_the_file_is_not_solved()
    {
        // Before the gate: no-source warnings and a failed expect at 0 V came with it.
        var e = Wn.Eval(Example("alder-creek-boost.wn").Replace("winding LV on K1", "winding LV on K2"));
        var d = Assert.Single(e.Diagnostics);
        Assert.Equal("unknown-name", d.Code);
        Assert.Empty(e.Cases);
    }

    [Fact]
    public void A_broken_core_line_leaves_its_windings_silent()
    {
        var text = Example("alder-creek-boost.wn").Replace("core K1 rating 0.5 kVA", "core K1 rating kVA");
        Assert.Single(Errors(text));
    }

    [Fact]
    public void A_core_line_without_its_name_leaves_unknown_cores_silent()
    {
        var text = Example("alder-creek-boost.wn").Replace("core K1 rating", "core rating");
        Assert.Single(Errors(text));
    }

    [Fact]
    public void After_a_measure_the_conditions_are_expected_first()
    {
        var error = Assert.Single(Errors(Example("alder-creek-boost.wn").Replace("expect voltage X1 H2 between", "expect voltage X1 H2")));
        Assert.StartsWith("syntax: expected 'between', 'below', 'above', 'near', 'is', ", error);
    }

    [Fact]
    public void A_whole_line_keeps_its_name_where_a_broken_line_also_writes_it()
    {
        // The broken line (it lacks 'on' and its ends) comes first; the whole line is not reported
        // as redefining HV, and the broken one is not bound ("needs 'turns', 'rated' or both").
        var text = Example("alder-creek-boost.wn").Replace("core K1 rating 0.5 kVA", "winding HV rating 0.5 kVA\ncore K1 rating 0.5 kVA");
        Assert.All(Errors(text), e => Assert.StartsWith("missing-clause:", e));
    }

    [Fact]
    public void A_winding_line_lacking_its_core_and_its_ends_is_one_error_naming_both()
    {
        // Before: two missing-clause errors at the same keyword, "needs 'on'" and "needs one of 'from' …".
        var error = Assert.Single(Errors("frequency 60 Hz\ncore K1 rating 1 kVA\nwinding HV rated 240 V\n"));
        Assert.Equal("missing-clause: a winding needs 'on' and one of 'from', 'wye', 'delta', 'zigzag', 'series' or 'ends'", error);
        // One of them missing is said as before.
        Assert.Equal("missing-clause: a winding needs 'on'", Assert.Single(Errors("frequency 60 Hz\ncore K1 rating 1 kVA\nwinding HV rated 240 V from H1 to H2\n")));
    }

    [Fact]
    public void A_three_phase_impedance_naming_one_winding_twice_is_one_error()
    {
        // Before: 'same-winding' once for each limb, three times at the same place.
        var text = WindingNotes.Tests.Solve.ThreePhaseTests.Unit("delta H1 H2 H3", "wye X1 X2 X3 neutral X0") + "impedance HV HV 5 %\n";
        Assert.Equal("same-winding: an impedance needs two different windings or sections", Assert.Single(Errors(text)));
    }
}

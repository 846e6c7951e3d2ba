using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Editing;

public class NavigationTests
{
    private static string Boost(string marked)
    {
        var text = Cursor.Example("alder-creek-boost.wn");
        var plain = marked.Replace(Cursor.Marker, "");
        Assert.Contains(plain, text);
        return text.Replace(plain, marked);
    }

    [Fact]
    public void Definition_of_a_terminal_is_where_its_winding_names_it()
    {
        var (evaluation, position) = Cursor.Parse(Boost("join H1 X$02"));
        var range = Navigation.Definition(evaluation, position);
        Assert.NotNull(range);
        Assert.Equal("winding LV on K1 turns 24 rated 24 V from X1 to [X2] resistance 0.014 ohm", Cursor.Mark(evaluation.Text.GetLineText(range.Value.Start.Line), [range.Value with { Start = range.Value.Start with { Line = 0 }, End = range.Value.End with { Line = 0 } }]));
    }

    [Fact]
    public void References_of_H2_are_every_place_it_is_named() =>
        Snapshot.Match(References(Boost("ground H$02"), includeDefinition: true), "Data/editing/navigation/references-H2.txt");

    [Fact]
    public void References_without_the_definition()
    {
        var (evaluation, position) = Cursor.Parse(Boost("winding HV on K$01"));
        Assert.Equal(2, Navigation.References(evaluation, position, includeDefinition: false).Count);
        Assert.Equal(3, Navigation.References(evaluation, position, includeDefinition: true).Count);
    }

    private static string References(string fixture, bool includeDefinition)
    {
        var (evaluation, position) = Cursor.Parse(fixture);
        return Cursor.Mark(evaluation.Text.Text, Navigation.References(evaluation, position, includeDefinition));
    }

    [Fact]
    public void Rename_changes_the_definition_and_every_reference_and_sections_too()
    {
        var (evaluation, position) = Cursor.Parse(Fixtures.Tapped.Replace("tap T50 on P", "tap T$050 on P"));
        var prepared = Navigation.PrepareRename(evaluation, position);
        Assert.Equal("T50", prepared?.Placeholder);
        var result = Navigation.Rename(evaluation, position, "T_mid");
        Assert.Null(result.Error);
        Snapshot.Match(Cursor.Apply(evaluation.Text.Text, result.Edits), "Data/editing/navigation/rename-tap.txt");
    }

    [Theory]
    [InlineData("LV", "'LV' is already a winding")]
    [InlineData("on", "'on' is not a name")]
    [InlineData("2x", "'2x' is not a name")]
    [InlineData("j4", "'j4' is not a name")]
    [InlineData("a-b", "'a-b' is not a name")]
    [InlineData("Ω", "'Ω' is not a name")]
    [InlineData("Kö", "'Kö' is not a name")]
    public void Rename_refuses_a_name_that_is_taken_or_no_name(string name, string error)
    {
        var (evaluation, position) = Cursor.Parse(Boost("winding H$0V"));
        var result = Navigation.Rename(evaluation, position, name);
        Assert.Empty(result.Edits);
        Assert.StartsWith(error, result.Error);
    }

    [Fact]
    public void Nothing_to_rename_on_a_keyword()
    {
        var (evaluation, position) = Cursor.Parse(Boost("win$0ding HV"));
        Assert.Null(Navigation.PrepareRename(evaluation, position));
        Assert.Null(Navigation.Definition(evaluation, position));
        Assert.NotNull(Navigation.Rename(evaluation, position, "X").Error);
    }

    [Fact]
    public void Rename_refuses_a_name_a_line_with_an_error_writes()
    {
        // 'T9' stands only on a broken line, which hides errors about that name; renaming K1 to it made
        // an error about the core disappear (fuzz seed 6022889).
        var (evaluation, position) = Cursor.Parse(Boost("core K$01") + "core core 3 + j4 T9 rating 5 kVA\n");
        Assert.Contains(evaluation.Diagnostics, d => d.Code == "syntax");
        var result = Navigation.Rename(evaluation, position, "T9");
        Assert.Empty(result.Edits);
        Assert.Equal("'T9' is already used in the document, where it names nothing yet", result.Error);
    }

    [Fact]
    public void Rename_refuses_a_name_used_where_it_names_nothing_yet()
    {
        // 'K9' is an unknown core in the last line; renaming K1 to it would bind that use too.
        var (evaluation, position) = Cursor.Parse(Boost("core K$01") + "winding W9 on K9 turns 10 from A9 to B9\n");
        var result = Navigation.Rename(evaluation, position, "K9");
        Assert.Empty(result.Edits);
        Assert.Equal("'K9' is already used in the document, where it names nothing yet", result.Error);
    }

    [Fact]
    public void A_use_of_a_name_as_the_wrong_kind_is_among_its_references_and_renamed_with_them()
    {
        // A sweep runs over a let or a brush; H1 is a terminal, so this line is an error, yet it names H1.
        var (evaluation, position) = Cursor.Parse(Boost("supply mains H$01") + "sweep H1 from 0 % to 1 % step 1 %\n");
        Assert.Contains(evaluation.Diagnostics, d => d.Code == "wrong-kind" && evaluation.Text[d.Span] == "H1");
        var references = Navigation.References(evaluation, position, includeDefinition: true);
        Assert.Contains(references, r => r.Start.Line == evaluation.Text.LineCount - 2);
        var renamed = Cursor.Apply(evaluation.Text.Text, Navigation.Rename(evaluation, position, "H9").Edits);
        Assert.DoesNotContain("H1", renamed.Split('\n').Where(l => !l.StartsWith('#')));
    }
}

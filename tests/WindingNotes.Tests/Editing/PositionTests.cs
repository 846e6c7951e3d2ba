using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using WindingNotes.Text;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Editing;

/// <summary>Positions are UTF-16 code units, as the protocol counts them, through the one mapper.</summary>
public class PositionTests
{
    [Theory]
    [InlineData("resistance 1 Ω ± 5 %  x", 0, 22)]
    [InlineData("area 40 cm²  x", 0, 13)]
    [InlineData("angle 30 °  x", 0, 12)]
    [InlineData("# 🔌 plug\nx", 1, 0)]
    [InlineData("a\r\nb\rc\nx", 3, 0)]
    public void Offsets_map_to_lines_and_utf16_characters_and_back(string text, int line, int character)
    {
        var source = new SourceText(text);
        var offset = text.LastIndexOf('x');
        Assert.Equal(new Position(line, character), source.GetPosition(offset));
        Assert.Equal(offset, source.GetOffset(new Position(line, character)));
    }

    [Fact]
    public void A_surrogate_pair_counts_two()
    {
        var source = new SourceText("# 🔌x");
        Assert.Equal(new Position(0, 4), source.GetPosition(4));
    }

    [Fact]
    public void Positions_past_a_line_end_clamp_to_it()
    {
        var source = new SourceText("ab\ncd");
        Assert.Equal(2, source.GetOffset(new Position(0, 99)));
        Assert.Equal(5, source.GetOffset(new Position(7, 0)));
    }

    [Fact]
    public void A_diagnostic_after_unit_signs_is_where_the_editor_shows_it()
    {
        const string text = "frequency 60 Hz\ncore K1 area 40 cm² flux-limit 1.5 T\nwinding W on K1 turns 10 from A to B resistance 1 Ω ± 5 % at 20 °C rated 1 V\nwinding X on K9 turns 10 from C to D\n";
        var evaluation = Evaluator.Evaluate(text, "test.wn");
        var error = evaluation.Diagnostics.First(d => d.Code == "unknown-name");
        Assert.Equal("3:13-3:15", Cursor.Show(evaluation.Text.GetRange(error.Span)));
        var (hovered, position) = Cursor.Parse(text.Replace("1 Ω ±", "1 Ω$0 ±"));
        var hover = Hovers.At(hovered, position);
        Assert.Equal("2:48-2:57", Cursor.Show(hover!.Range));
    }
}

using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Editing;

public class HoverTests
{
    private static string Check(string fixture)
    {
        var (evaluation, position) = Cursor.Parse(fixture);
        var hover = Hovers.At(evaluation, position);
        return hover is null ? "(no hover)\n" : $"{Cursor.Show(hover.Range)}\n{hover.Markdown}\n";
    }

    private static string Boost(string line, string word, int at = 0)
    {
        var text = Cursor.Example("alder-creek-boost.wn");
        var start = text.IndexOf(line, StringComparison.Ordinal);
        var index = text.IndexOf(word, start, StringComparison.Ordinal) + at;
        return text.Insert(index, Cursor.Marker);
    }

    [Theory]
    [InlineData("three-phase-load", "three-phase-load pumps", "pumps")]
    [InlineData("three-phase-core", "core T1", "T1")]
    public void Hover_on_a_three_phase_element_gives_its_sequence_components(string name, string line, string word)
    {
        var text = Cursor.Example("maple-ford-station-unit.wn");
        var index = text.IndexOf(word, text.IndexOf(line, StringComparison.Ordinal), StringComparison.Ordinal) + 1;
        var result = Check(text.Insert(index, Cursor.Marker));
        Assert.Contains(name == "three-phase-core" ? "vector group Dyn11" : "voltage unbalance |V2|/|V1| 0.2027 %", result);
        Snapshot.Match(result, $"Data/editing/hover/{name}.txt");
    }

    [Fact]
    public void Hover_on_LV_shows_its_17_1_amperes()
    {
        var result = Check(Boost("winding LV", "LV", 1));
        Assert.Contains("17.11 A", result);
        Snapshot.Match(result, "Data/editing/hover/winding.txt");
    }

    [Theory]
    [InlineData("core", "core K1", "K1")]
    [InlineData("terminal", "join H1 X2", "X2")]
    [InlineData("supply", "supply mains", "mains")]
    [InlineData("load", "load planer", "planer")]
    [InlineData("keyword", "winding LV", "winding")]
    [InlineData("clause", "core K1", "flux-limit")]
    [InlineData("value", "core K1", "26 cm2")]
    [InlineData("comment", "join H1", "# series")]
    public void Hover_on_the_boost_example(string name, string line, string word) =>
        Snapshot.Match(Check(Boost(line, word, 1)), $"Data/editing/hover/{name}.txt");

    [Theory]
    [InlineData("let", "winding P on K2 turns 460 rated v$0in")]
    [InlineData("tap", "load coil T5$00 P2")]
    [InlineData("fault", "fault F$01 S1")]
    [InlineData("angle", "supply line P1 P2 230 V angle 0 $0°")]
    [InlineData("tolerance", "impedance P S 4 % ± 1$00 %")]
    public void Hover_on_the_tapped_fixture(string name, string marked)
    {
        var plain = marked.Replace(Cursor.Marker, "");
        Assert.Contains(plain, Fixtures.Tapped);
        Snapshot.Match(Check(Fixtures.Tapped.Replace(plain, marked)), $"Data/editing/hover/{name}.txt");
    }
}

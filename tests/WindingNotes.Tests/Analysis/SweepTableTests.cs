using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>Sweep tables that stay consistent: sections of no turns, point counts, column names.</summary>
public class SweepTableTests
{
    // A variable autotransformer with the line across the whole winding (240 turns, rated 10 A) and a
    // 15 ohm heater on the brush: at 100 % travel the brush sits on the end B.
    private const string FullWinding = """
        frequency 60 Hz
        core VT rating 1.2 kVA
        winding W on VT turns 240 rated 120 V rated-current 10 A from A to B
        brush BR on W at 50 %
        supply line B A 120 V
        ground A
        load heater BR A impedance 15 ohm
        sweep BR from 80 % to 100 % step 10 %
        expect current heater below 10 A

        """;

    private static CaseResult At(Evaluation e, double position) =>
        Wn.Points(e).Single(c => Math.Abs(c.Case.Sweep.Single().Value - position) < 1e-9);

    [Fact]
    public void A_section_of_no_turns_carries_nothing_and_is_not_loaded()
    {
        // At 100 % the brush is on B: the section BR–B has no turns. The heater's 120/15 = 8 A goes from
        // the line at B through the brush contact, not through any turn; the winding (ideal) carries
        // nothing. Shown as a winding current it read 8 A, 80 % of the 10 A rating.
        var e = Wn.Solved(FullWinding);
        var top = At(e, 1.0);
        var end = top.Section("W:BR-B");
        Assert.Equal(0, end.Section.Turns);
        Assert.Equal(0, end.Current.Magnitude);
        Assert.Equal(0, end.Loading);
        Wn.Near(8, top.Load("heater").Current.Magnitude, 1e-9, "heater");
        // The brush still carries the heater's 8 A (Kirchhoff at the brush, from the solver's currents).
        Wn.Near(8, top.Taps.Single(t => t.Point == "BR").Current.Magnitude, 1e-9, "brush current");
        var text = TextReport.Write(e);
        Assert.Equal(["100 %", "0.000 A", "0.000 A"], Row(Table(text, "Sections, current"), "100 %"));
        Assert.Equal(["100 %", "0.000 %", "0.000 %"], Row(Table(text, "Sections, loading"), "100 %"));
        Assert.Equal(["100 %", "8.000 A"], Row(Table(text, "Taps, current out of the winding"), "100 %"));
    }

    /// <summary>The title line's rest, then the header and the rows of the last table with that title (the sweep's, after the normal case).</summary>
    private static string[] Table(string text, string title)
    {
        var lines = text.Split($"\n  {title}")[^1].Split('\n');
        return [lines[0], .. lines.Skip(1).TakeWhile(l => l.StartsWith("    "))];
    }

    private static string[] Row(string[] table, string first) =>
        table.Single(l => l.TrimStart().StartsWith(first)).Split("  ", StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);

    [Fact]
    public void The_sweep_heading_counts_the_points_the_checks_count()
    {
        // Three sweep points (80, 90, 100 %) and the file as written: the check is evaluated at 4.
        var e = Wn.Solved(FullWinding);
        var text = TextReport.Write(e);
        Assert.Contains("\nSweep BR (3 points; 4 with the file as written)\n", text);
        Assert.Contains("over 4 points", text);
        Assert.Equal(4, e.Checks.Single().Points);
    }

    [Fact]
    public void When_a_brush_passes_a_tap_the_section_columns_keep_their_names()
    {
        // The line on a tap at 100 of 117 turns; the brush swept from 50 % (58.5 turns, below the tap)
        // to 100 % (above it). Sections W:A-BR, W:BR-IN, W:IN-B become W:A-IN, W:IN-BR, W:BR-B; the
        // columns are named by the point each section ends at, the same three at every point.
        var e = Wn.Solved(SweepTests.Variable("sweep BR from 50 % to 100 % step 25 %"));
        var text = TextReport.Write(e);
        var lines = Table(text, "Sections, current");
        Assert.StartsWith(" (W by the point each section ends at)", lines[0]);
        Assert.Equal(["BR=", "W:..BR", "W:..IN", "W:..B"], lines[1].Split(' ', StringSplitOptions.RemoveEmptyEntries));
        Assert.All(lines.Skip(2), row => Assert.DoesNotContain(" -", row));
        // The values are the solver's: the section ending at the brush at 100 % is W:IN-BR.
        var top = At(e, 1.0);
        Assert.Contains(TextReport.Value(top.Section("W:IN-BR").Current.Magnitude, "A"), lines[^1]);
    }
}

using WindingNotes.Report;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>
/// The text report's name column (12 characters after an indent of 4) and the sweep tables' columns (13)
/// with names longer than they are: a section of a tapped winding with a long name, a long load name.
/// The texts of a block stay in one column and a sweep table's columns stay in line.
/// </summary>
public class TextColumnTests
{
    private const string File = """
        frequency 50 Hz
        let rl = 10 ohm
        core K1 rating 10 kVA
        winding PRIMARY_WINDING_OF_K1 on K1 turns 230 rated 230 V from A to B
        winding SECONDARY on K1 turns 115 rated 115 V from X1 to X2
        tap MIDDLE_TAP_POINT on SECONDARY at 50 %
        impedance PRIMARY_WINDING_OF_K1 SECONDARY 4 % xr 2
        supply mains A B 230 V
        ground B
        ground X2
        load north_yard_lighting X1 X2 impedance rl
        sweep rl from 10 ohm to 20 ohm step 5 ohm

        """;

    [Fact]
    public void A_blocks_name_column_widens_to_its_longest_name_of_up_to_24_and_a_longer_name_stands_on_its_own_line()
    {
        var text = TextReport.Write(Wn.Solved(File.Replace("north_yard_lighting", "north_yard_lighting_and_signs_circuit")));
        var lines = text.Split('\n');
        foreach (var heading in new[] { "  Nodes", "  Sections", "  Windings", "  Supplies", "  Loads", "  Taps, current out of the winding" })
        {
            var at = Array.IndexOf(lines, heading);
            Assert.True(at >= 0 || heading == "  Windings", heading);
            // Every text of the block begins at one column: after its name, or at the start of the next
            // line where the name stands alone.
            var starts = new List<int>();
            for (var i = at + 1; at >= 0 && i < lines.Length && lines[i].StartsWith("    "); i++)
            {
                var name = lines[i][4..].Split(' ')[0];
                if (lines[i].Length == 4 + name.Length)
                {
                    Assert.True(name.Length > 24, lines[i]);
                    i++;
                    starts.Add(lines[i].Length - lines[i].TrimStart().Length);
                }
                else
                {
                    var rest = lines[i][(4 + name.Length)..];
                    starts.Add(4 + name.Length + rest.Length - rest.TrimStart().Length);
                }
            }
            Assert.Single(starts.Distinct());
        }
        // Sections: the longest name of 24 or fewer is 'PRIMARY_WINDING_OF_K1' (21; 'SECONDARY:X1-MIDDLE_TAP_POINT'
        // is 29 and stands alone), so the texts begin at 4 + 21 + 1; nodes at 4 + 16 + 1 ('MIDDLE_TAP_POINT');
        // the one load's name is 37, so its block keeps 12; supplies keep 12. By hand: the secondary's halves
        // of 57.5 turns, tapped at its middle.
        Assert.Contains("\n    PRIMARY_WINDING_OF_K1 A to B, 230 turns: ", text);
        Assert.Contains("\n    SECONDARY:X1-MIDDLE_TAP_POINT\n" + new string(' ', 26) + "X1 to MIDDLE_TAP_POINT, 57.5 turns: ", text);
        Assert.Contains("\n    MIDDLE_TAP_POINT ", text);
        Assert.Contains("\n    A                ", text);
        Assert.Contains("\n    north_yard_lighting_and_signs_circuit\n" + new string(' ', 17), text);
        Assert.Contains("\n    mains        230.0 V", text);
        Assert.Contains("\n    copper loss  ", text);
    }

    [Fact]
    public void A_sweep_table_column_is_as_wide_as_its_longest_entry_where_that_is_longer_than_the_column()
    {
        var text = TextReport.Write(Wn.Solved(File));
        var lines = text.Split('\n');
        var title = Array.FindIndex(lines, l => l.StartsWith("  Sections, current"));
        Assert.True(title >= 0, text);
        var header = lines[title + 1];
        var rows = lines[(title + 2)..(title + 5)];
        Assert.All(rows, r => Assert.StartsWith("    ", r));
        // Each column's header begins where its values do in every row: after the header's column of
        // 'SECONDARY:X1-MIDDLE_TAP_POINT' (29 characters, wider than 13) the next column is in line.
        var names = new[] { "PRIMARY_WINDING_OF_K1", "SECONDARY:X1-MIDDLE_TAP_POINT", "SECONDARY:MIDDLE_TAP_POINT-X2" };
        foreach (var name in names)
        {
            var start = header.IndexOf(name, StringComparison.Ordinal);
            Assert.True(start > 0, header);
            Assert.Equal(' ', header[start - 1]);
            foreach (var row in rows)
            {
                Assert.Equal(' ', row[start - 1]);
                Assert.NotEqual(' ', row[start]);
            }
        }
        // The first two columns (rl= and a value) keep the width of 13.
        Assert.StartsWith("    rl=          PRIMARY_WINDING_OF_K1 ", header);
        Assert.Equal(4 + 13, header.IndexOf("PRIMARY", StringComparison.Ordinal));
    }
}

using WindingNotes.Report;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Report;

public class MarkdownReportTests
{
    private static string Example(string name) => File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "examples", name));

    [Theory]
    [MemberData(nameof(ExampleSnapshotTests.Examples), MemberType = typeof(ExampleSnapshotTests))]
    public void Every_table_row_has_as_many_cells_as_its_header(string name)
    {
        var markdown = MarkdownReport.Write(Wn.Eval(Example(name)));
        var rows = markdown.Split('\n');
        var columns = 0;
        foreach (var row in rows)
        {
            if (!row.StartsWith('|'))
            {
                columns = 0;
                continue;
            }
            var cells = row.Replace("\\|", "").Count(c => c == '|') - 1;
            if (columns == 0) columns = cells;
            Assert.True(cells == columns, $"{name}: '{row}' has {cells} cells, its header {columns}");
        }
        Assert.EndsWith("> " + Cautions.Judgement + "\n", markdown);
    }

    [Fact]
    public void A_failed_check_stands_out_and_the_summary_counts_it()
    {
        var text = Example("alder-creek-boost.wn").Replace("between 225 V and 235 V", "between 230 V and 235 V");
        var markdown = MarkdownReport.Write(Wn.Eval(text));
        Assert.Contains("**1 of 2 checks pass**; 1 error, 0 warnings", markdown);
        Assert.Contains("| **FAIL** | 14 | `expect voltage X1 H2 between 230 V and 235 V` | 228.1 V |", markdown);
        Assert.Contains("| 14:1 | error | `expect-failed` |", markdown);
    }

    [Fact]
    public void A_bar_in_a_message_does_not_split_its_cell()
    {
        Assert.Equal("a \\| b c", MarkdownReport.Cell("a | b\nc"));
    }
}

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

    [Theory]
    [MemberData(nameof(ExampleSnapshotTests.Examples), MemberType = typeof(ExampleSnapshotTests))]
    public void The_report_leads_with_its_summary_then_the_tables(string name)
    {
        var evaluation = Wn.Eval(Example(name));
        var markdown = MarkdownReport.Write(evaluation);
        Assert.Equal(MarkdownReport.Summary(evaluation), markdown.Split('\n')[2]);
        var order = new[] { "### Checks", "### Ratings crossed", "### Cautions", "### Case normal" }.Select(h => markdown.IndexOf("\n" + h + "\n")).ToList();
        Assert.All(order, i => Assert.True(i > 0, $"{name}: a heading is missing"));
        Assert.Equal(order.Order(), order);
        // Every caution is in the summary, before the first table of results.
        foreach (var caution in evaluation.Diagnostics.Where(d => d.Code.StartsWith("caution")))
            Assert.InRange(markdown.IndexOf(MarkdownReport.Cell(caution.Message)), order[2], order[3]);
    }

    [Fact]
    public void Ratings_crossed_are_in_the_summary_and_none_only_where_the_network_was_solved()
    {
        var bigger = Example("alder-creek-boost.wn").Replace("power 3.2 kW pf 0.82 lagging", "power 4.4 kW pf 0.85 lagging");
        var markdown = MarkdownReport.Write(Wn.Eval(bigger));
        Assert.Contains("### Ratings crossed\n\n- line 5:9: winding 'HV' carries 109.0 % of its rated current\n- line 6:9: winding 'LV' carries 109.0 % of its rated current\n", markdown);
        Assert.DoesNotContain("`loading-high`", markdown);
        Assert.Contains("### Ratings crossed\n\nNone: no rating the file gives is exceeded.\n", MarkdownReport.Write(Wn.Eval(Example("alder-creek-boost.wn"))));
        var unsolved = MarkdownReport.Write(Wn.Eval(Example("alder-creek-boost.wn").Replace("208 V", "208 A")));
        Assert.Contains("### Ratings crossed\n\nNot evaluated: the network was not solved.\n", unsolved);
    }

    [Fact]
    public void A_bar_in_a_message_does_not_split_its_cell()
    {
        Assert.Equal("a \\| b c", MarkdownReport.Cell("a | b\nc"));
    }
}

using System.Text;
using WindingNotes.Report;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>
/// The plain report written to a writer as it is made (what `report` and `textconv` do) is the string
/// report's text exactly, and a large one goes out in pieces rather than as one string.
/// </summary>
public class TextReportStreamTests
{
    /// <summary>A unit of a control-power station, the n-th: its report is some 4,000 characters.</summary>
    private static string Station(int n) => $"""
        core CT{n} rating 1.5 kVA area 17 cm2 flux-limit 1.55 T
        winding PRI{n} on CT{n} turns 800 rated 480 V from H1_{n} to H2_{n} resistance 1.5 ohm
        winding CTL{n} on CT{n} turns 200 rated 120 V from X1_{n} to X2_{n} resistance 0.085 ohm rating 1 kVA
        winding PLC{n} on CT{n} turns 40 rated 24 V from Y1_{n} to Y3_{n} resistance 0.0063 ohm rating 0.5 kVA
        tap Y2_{n} on PLC{n} at 50 %
        impedance PRI{n} CTL{n} 3.2 % xr 1.4
        supply feeder{n} H1_{n} H2_{n} 480 V fault-level 14 kA xr 6
        ground H2_{n}
        ground X2_{n}
        ground Y3_{n}
        load lights{n} X1_{n} X2_{n} power 180 W pf 0.9
        load plc{n} Y1_{n} Y3_{n} power 240 W pf 0.95
        fault short{n} X1_{n} X2_{n} impedance 0 ohm
        expect voltage X1_{n} X2_{n} between 110 V and 126 V

        """;

    /// <summary>Counts the writes that reach it.</summary>
    private sealed class CountingWriter : StringWriter
    {
        public int Writes { get; private set; }

        public override void Write(StringBuilder? value)
        {
            Writes++;
            base.Write(value);
        }
    }

    [Theory]
    [InlineData(1, true)]
    [InlineData(12, true)]
    [InlineData(12, false)]
    public void The_streamed_report_is_the_string_report_and_a_large_one_goes_out_in_pieces(int stations, bool title)
    {
        var e = Wn.Solved("frequency 60 Hz\n" + string.Concat(Enumerable.Range(1, stations).Select(Station)));
        var whole = TextReport.Write(e, title);
        var streamed = new CountingWriter();
        TextReport.Write(e, streamed, title);
        Assert.Equal(whole, streamed.ToString());
        // A report of more than 8,192 characters goes out in more than one write; a short one in one.
        Assert.True(whole.Length > 8192 == streamed.Writes > 1, $"{whole.Length} characters in {streamed.Writes} writes");
        Assert.True(stations == 1 || streamed.Writes > 1, $"twelve stations' report, {whole.Length} characters, in {streamed.Writes} writes");
    }

    [Fact]
    public void Every_example_streams_as_its_string_report()
    {
        foreach (var path in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn"))
        {
            var e = Workspace.Evaluator.Evaluate(File.ReadAllText(path).Replace("\r\n", "\n"), Path.GetFileName(path));
            var streamed = new StringWriter();
            TextReport.Write(e, streamed);
            Assert.Equal(TextReport.Write(e), streamed.ToString());
        }
    }
}

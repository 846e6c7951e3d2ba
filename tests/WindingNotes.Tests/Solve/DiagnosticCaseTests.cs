using System.Text.Json.Nodes;
using WindingNotes.Report;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The case a diagnostic belongs to is a field of it, not words inside its message: the message is
/// the same in every case, and each output names the case the one way (Diagnostic.Shown).
/// </summary>
public class DiagnosticCaseTests
{
    // An ideal supply shorted through ideal windings only by the fault: the fault case has no solution.
    private const string Shorted = """
        frequency 50 Hz
        core K rating 1 kVA
        winding P on K turns 200 rated 230 V from P1 to P2
        winding S on K turns 20 rated 23 V from S1 to S2
        supply mains P1 P2 230 V
        ground P2
        ground S2
        load lamp S1 S2 impedance 5 ohm
        fault F1 S1 S2

        """;

    [Fact]
    public void A_fault_case_message_carries_its_case_as_a_field()
    {
        var e = Wn.Eval(Shorted);
        var d = e.Single("supply-shorted");
        Assert.Equal("fault F1", d.Case);
        Assert.StartsWith("supply 'mains' is shorted", d.Message);
        Assert.Equal("in case 'fault F1': " + d.Message, d.Shown);
        Assert.All(e.Diagnostics.Where(x => x.Code == "core-loss-unknown"), x => Assert.Null(x.Case));
    }

    [Fact]
    public void Every_output_names_the_case_as_the_message_did()
    {
        var e = Wn.Eval(Shorted);
        var shown = e.Single("supply-shorted").Shown;
        Assert.Contains(shown, TextReport.Write(e));
        Assert.Contains(shown, MarkdownReport.Write(e));
        var json = JsonNode.Parse(JsonReport.Write(e))!["diagnostics"]!.AsArray().Single(x => (string)x!["code"]! == "supply-shorted")!;
        Assert.Equal(shown, (string)json["message"]!);
        Assert.Equal("fault F1", (string)json["case"]!);
    }
}

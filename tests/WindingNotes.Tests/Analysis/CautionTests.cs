using WindingNotes.Report;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>Each caution appears where it applies, at the line it concerns, with its source, and nowhere else.</summary>
public class CautionTests
{
    private static string[] Codes(Evaluation e) => [.. e.Diagnostics.Where(d => d.Code.StartsWith("caution-")).Select(d => d.Code).Order()];

    private const string Isolating = """
        frequency 60 Hz
        core T1 rating 25 kVA
        winding HV on T1 rated 2400 V from H1 to H2
        winding LV on T1 rated 240 V from X1 to X3
        tap X2 on LV at 50 %
        impedance HV LV 2.2 % xr 1.8
        supply line H1 H2 2400 V
        ground H2
        ground X2
        load a X1 X2 power 4.2 kW pf 0.92 lagging
        load oven X1 X3 impedance 6.4 ohm
        """;

    [Fact]
    public void An_isolating_transformer_grounded_on_both_sides_has_no_autotransformer_cautions()
    {
        var e = Wn.Solved(Isolating);
        Assert.Empty(Codes(e));
        Assert.Empty(e.Normal!.Connections);
        Assert.Contains(Cautions.Judgement, TextReport.Write(e));
    }

    private static string Boost(string join, string output, string ground = "ground H2") => $"""
        frequency 60 Hz
        core K rating 1 kVA
        winding P on K rated 240 V from H1 to H2
        winding S on K rated 24 V from X1 to X2
        supply mains H1 H2 208 V
        {ground}
        join {join}
        load motor {output} H2 power 2 kW pf 0.85

        """;

    [Fact]
    public void A_boost_connection_has_no_isolation_a_common_terminal_and_an_output_above_the_supply()
    {
        var e = Wn.Solved(Boost("H1 X2", "X1"));
        Assert.Equal(["caution-above-supply", "caution-common-terminal", "caution-no-isolation"], Codes(e));
        var isolation = e.Single("caution-no-isolation");
        Assert.Equal("motor", e.TextAt(isolation.Span));
        // No isolation, and an open common winding leaves the series winding in the line (published encyclopedic articles).
        Assert.EndsWith("an open common winding leaves the series winding in the line", isolation.Message);
        var common = e.Single("caution-common-terminal");
        Assert.Equal("H2", e.TextAt(common.Span));
        Assert.Equal(8, e.Text.GetPosition(common.Span.Start).Line + 1);
        // NEC 210.9, 215.11, 450.4 (from memory for edition details); the message states the rule, not its source.
        Assert.Equal("the common terminal 'H2' goes to the grounded conductor, and no overcurrent device goes in the common winding", common.Message);
        var above = e.Single("caution-above-supply");
        Assert.Equal("motor", e.TextAt(above.Span));
        // Common practice, no source: what the output feeds must be rated for it.
        Assert.EndsWith("what it feeds must be rated for that", above.Message);
    }

    [Fact]
    public void A_buck_connection_is_not_above_the_supply()
    {
        var e = Wn.Solved(Boost("H1 X1", "X2"));
        Assert.Equal(["caution-common-terminal", "caution-no-isolation"], Codes(e));
    }

    [Fact]
    public void An_ungrounded_common_terminal_is_said_to_be_so()
    {
        var e = Wn.Solved(Boost("H1 X2", "X1", ground: "ground H1"));
        Assert.StartsWith("the common terminal 'H2' is not grounded: it goes to the grounded conductor", e.Single("caution-common-terminal").Message);
    }

    [Fact]
    public void A_variable_autotransformer_asks_for_a_fused_output_and_warns_only_when_the_brush_is_beyond_the_supply_tap()
    {
        var below = Wn.Solved(SweepTests.Variable(""));
        Assert.Equal(["caution-common-terminal", "caution-fuse-output", "caution-no-isolation"], Codes(below));
        var fuse = below.Single("caution-fuse-output");
        Assert.Equal("BR", below.TextAt(fuse.Span));
        // Common practice, no source.
        Assert.EndsWith("does not protect the brush and winding", fuse.Message);

        var swept = Wn.Solved(SweepTests.Variable("sweep BR from 0 % to 100 % step 10 %"));
        var above = swept.Single("caution-above-supply");
        Assert.Equal("BR", swept.TextAt(above.Span));
        Assert.Equal("the output at load 'bench' reaches 140.4 V at BR=100 %, above the 120.0 V of supply 'line': the connection raises the output above the supply, and what it feeds must be rated for that", above.Message);
    }

    [Fact]
    public void Cautions_are_information_and_listed_under_cautions_in_the_text_report()
    {
        var e = Wn.Solved(Boost("H1 X2", "X1"));
        Assert.All(e.Diagnostics.Where(d => d.Code.StartsWith("caution-")), d => Assert.Equal(WindingNotes.Text.Severity.Information, d.Severity));
        var text = TextReport.Write(e);
        var cautions = text[text.IndexOf("\nCautions\n", StringComparison.Ordinal)..];
        Assert.Contains("no galvanic isolation", cautions);
        Assert.DoesNotContain("caution-", text);
        Assert.EndsWith(Cautions.Judgement + "\n", text);
        Assert.Contains(Cautions.Judgement, JsonReport.Write(e));
    }
}

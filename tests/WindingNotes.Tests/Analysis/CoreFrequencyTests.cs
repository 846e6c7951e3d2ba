using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Analysis;

/// <summary>
/// A core rated for another frequency than the file's (<c>core K … frequency 60 Hz</c>): its
/// impedances and open-circuit test are given at its own frequency, and its volts per hertz are
/// judged against it.
/// </summary>
public class CoreFrequencyTests
{
    /// <summary>A 240/24 V core at 240 V, its rated voltage, and a 10 ohm load on the secondary.</summary>
    private static string Fed(string fileFrequency, string coreClause) => $"""
        frequency {fileFrequency}
        core K rating 1 kVA{coreClause}
        winding P on K turns 200 rated 240 V from P1 to P2
        winding S on K turns 20 from S1 to S2
        supply s P1 P2 240 V
        ground P2
        ground S2
        load l S1 S2 impedance 10 ohm

        """;

    [Fact]
    public void A_60_Hz_core_at_rated_voltage_in_a_50_Hz_file_is_at_120_percent_volts_per_hertz()
    {
        // Flux goes with V/f (E = 4.44 f N Φ, R13). The core is ideal (no impedance line), so it runs
        // at 240 V / 200 turns = 1.2 V/turn, its rated volts per turn; rated at 60 Hz and fed at 50 Hz
        // that is (1.2/1.2)·(60/50) = 120 % of its rated volts per hertz, above both the 105 % on
        // load and the 110 % at no load (IEEE C57.12.00, from memory): one warning for each.
        var e = Wn.Solved(Fed("50 Hz", " frequency 60 Hz"));
        var warnings = e.Diagnostics.Where(d => d.Code == "overexcited").ToList();
        Assert.Equal(
            [
                "core 'K' runs at 120.0 % of its rated volts per hertz at no load, above the 110.0 % IEEE C57.12.00 allows",
                "core 'K' runs at 120.0 % of its rated volts per hertz on load, above the 105.0 % IEEE C57.12.00 allows",
            ],
            warnings.Select(d => d.Message).Order().ToArray());
        Assert.All(warnings, d => Assert.Equal("K", e.TextAt(d.Span)));
        Wn.Near(1.2, e.Normal!.Cores.Single().VoltsPerTurn!.Value.Magnitude, 1e-12, "volts per turn");
    }

    [Theory]
    // Without the clause the core is rated at the file's 50 Hz: (1.2/1.2)·(50/50) = 100 %.
    [InlineData("50 Hz", "")]
    // Rated at the file's own frequency, stated or not: 100 %.
    [InlineData("60 Hz", " frequency 60 Hz")]
    // A 50 Hz core fed at 60 Hz: (1.2/1.2)·(50/60) = 83.3 %, under-excited, nothing to say.
    [InlineData("60 Hz", " frequency 50 Hz")]
    public void A_core_at_or_below_its_rated_volts_per_hertz_is_not_warned(string fileFrequency, string coreClause) =>
        Assert.DoesNotContain(Wn.Solved(Fed(fileFrequency, coreClause)).Diagnostics, d => d.Code == "overexcited");

    [Fact]
    public void Each_core_is_judged_at_its_own_rated_frequency()
    {
        // Two cores side by side on one 240 V, 50 Hz supply, each at its rated volts per turn: only
        // the one rated at 60 Hz is at 120 %.
        var e = Wn.Solved("""
            frequency 50 Hz
            core K50 rating 1 kVA
            core K60 rating 1 kVA frequency 60 Hz
            winding A on K50 turns 200 rated 240 V from L to N
            winding B on K60 turns 200 rated 240 V from L2 to N2
            join L L2
            join N N2
            supply s L N 240 V
            ground N

            """);
        Assert.Equal("K60", e.TextAt(e.Single("overexcited").Span));
    }

    private static string OneToOne(string coreClause) => $"""
        frequency 50 Hz
        core K rating 2 kVA{coreClause}
        winding P on K turns 100 rated 100 V from P1 to P2
        winding S on K turns 100 rated 100 V from S1 to S2
        impedance P S 3 + j4 ohm
        supply s P1 P2 100 V
        ground P2
        ground S2
        load r S1 S2 impedance 5 ohm

        """;

    [Fact]
    public void The_leakage_reactance_of_a_60_Hz_core_at_50_Hz_is_50_60_of_the_stated_value()
    {
        // 3 + j4 ohm as on the 60 Hz test report of a 1:1 core, in a 50 Hz file with a 5 ohm load:
        // X = 4·50/60 = 3.3333 ohm and R stays 3 ohm, so |I| = 100 V / |(3 + 5) + j3.3333| = 11.538 A.
        // Without the clause the line is at 50 Hz as written: 100/|8 + j4| = 11.180 A.
        var rated60 = Wn.Solved(OneToOne(" frequency 60 Hz")).Normal!;
        var i = rated60.Load("r").Current.Magnitude;
        Wn.Near(100 / Math.Sqrt(8 * 8 + Math.Pow(4 * 50.0 / 60, 2)), i, 1e-9, "load current, 60 Hz core");
        Wn.Near(11.538, i, 1e-4, "load current, 60 Hz core (rounded by hand)");
        Wn.Near(100 / Math.Sqrt(8 * 8 + 4 * 4), Wn.Solved(OneToOne("")).Normal!.Load("r").Current.Magnitude, 1e-9, "load current, 50 Hz core");
        // The resistance is not scaled: copper loss is 3 ohm times I².
        Wn.Near(3 * i * i, rated60.Totals.CopperLoss, 1e-9, "copper loss");
    }

    [Fact]
    public void The_open_circuit_test_of_a_60_Hz_core_is_read_at_60_Hz()
    {
        // Open-circuit test of a 60 Hz core: 240 V, 0.5 A, 30 W, so G = 30/240² (0.125 A at 240 V)
        // and the magnetising part is √(0.5² − 0.125²) = 0.48412 A. In the 50 Hz file its magnetising
        // reactance is 50/60 of the tested one, so at 240 V that part is 0.48412·60/50 = 0.58095 A
        // and |I| = √(0.125² + 0.58095²) = 0.59425 A; the core loss stays 30 W.
        var e = Wn.Solved("""
            frequency 50 Hz
            core K rating 1 kVA frequency 60 Hz
            winding P on K turns 200 rated 240 V from P1 to P2
            no-load K current 0.5 A loss 30 W at P 240 V
            supply s P1 P2 240 V
            ground P2

            """);
        var magnetising = Math.Sqrt(0.5 * 0.5 - 0.125 * 0.125) * 60 / 50;
        var normal = e.Normal!;
        Wn.Near(Math.Sqrt(0.125 * 0.125 + magnetising * magnetising), normal.Supply("s").Current.Magnitude, 1e-9, "no-load current");
        Wn.Near(0.59425, normal.Supply("s").Current.Magnitude, 1e-4, "no-load current (rounded by hand)");
        Wn.Near(30, normal.Totals.CoreLoss, 1e-9, "core loss");
    }

    [Fact]
    public void The_rated_frequency_needs_its_unit()
    {
        var e = Wn.Eval(Fed("50 Hz", " frequency 60"));
        var d = e.Single("missing-unit");
        Assert.True(d.IsError);
        Assert.Equal("60", e.TextAt(d.Span));
        Assert.Equal("give the rated frequency of K a unit: 60 Hz", d.Message);
        Assert.Null(e.Normal);
    }

    [Fact]
    public void The_clause_is_formatted_in_its_place_and_shown_on_hover()
    {
        // The formatter puts the clause after flux-limit, its place in the grammar table.
        var text = Fed("50 Hz", " frequency 60 Hz area 26 cm2").Replace("core K rating", "core K  rating");
        var formatted = Cursor.Apply(text, Formatting.Edits(Wn.Eval(text)));
        Assert.Contains("core K rating 1 kVA area 26 cm2 frequency 60 Hz\n", formatted);

        var (e, position) = Cursor.Parse(formatted.Replace("core K ", "core $0K "));
        Assert.Contains("rating 1.000 kVA, area 26.00 cm2, rated frequency 60.00 Hz", Hovers.At(e, position)!.Markdown);
    }
}

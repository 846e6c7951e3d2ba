using WindingNotes.Editing;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Editing;

public class CompletionTests
{
    private const string Network = """
        frequency 60 Hz
        let vin = 208 V
        core K1 rating 0.5 kVA area 26 cm2
        winding HV on K1 turns 240 rated 240 V from H1 to H2
        tap T60 on HV at 60 turns
        supply mains H1 H2 vin
        load planer T60 H2 power 3.2 kW

        """;

    private static string Check(string line)
    {
        var (evaluation, position) = Cursor.Parse(Network + line);
        var entries = Completion.At(evaluation, position);
        return string.Concat(entries.Select(e => $"{e.Kind} {e.Label}{(e.Detail.Length > 0 ? $" — {e.Detail}" : "")} @{Cursor.Show(e.Range)}\n"));
    }

    [Theory]
    [InlineData("statement-start", "$0")]
    [InlineData("statement-prefix", "wi$0")]
    [InlineData("winding-clauses", "winding LV on K1 $0")]
    [InlineData("winding-core", "winding LV on $0")]
    [InlineData("winding-used-clauses", "winding LV on K1 turns 24 from X1 to X2 $0")]
    [InlineData("units-after-number", "core K2 rating 0.5 $0")]
    [InlineData("after-unit", "core K2 rating 0.5 kVA $0")]
    [InlineData("choice", "load motor X1 H2 power 2 kW pf 0.8 $0")]
    [InlineData("load-nodes", "load motor $0")]
    [InlineData("measure", "expect $0")]
    [InlineData("measure-target", "expect power $0")]
    [InlineData("condition", "expect loading HV $0")]
    [InlineData("value-names", "let vout = 1.1 * $0")]
    [InlineData("cooling-modes", "thermal K1 cooling $0")]
    [InlineData("tap-winding", "tap T10 on $0")]
    [InlineData("section", "impedance HV:H1-T60 $0")]
    [InlineData("group-used", "load motor X1 H2 power 2 kW $0")]
    [InlineData("in-comment", "# a comment $0")]
    [InlineData("number-typed", "core K2 rating 5$0")]
    [InlineData("unknown-statement", "bogus $0")]
    [InlineData("after-angle", "let vout = 208 V angle $0")]
    [InlineData("after-sqrt", "let vout = sqrt $0")]
    [InlineData("open-parenthesis", "core K2 rating (0.5 kVA $0")]
    [InlineData("after-mistake", "winding LV on K1 turns 24 24 from X1 to X2 $0")]
    [InlineData("turns-unit-or-clause", "winding LV on K1 rated 120 turns $0")]
    [InlineData("turns-unit", "tap T30 on HV at 30 turns $0")]
    public void Completes(string name, string line) => Snapshot.Match(Check(line), $"Data/editing/completion/{name}.txt");
}

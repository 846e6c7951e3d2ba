using System.Text.RegularExpressions;
using WindingNotes.Report;
using WindingNotes.Report.Diagrams;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>
/// The numbers of a diagnostic (for the diff) and the result patterns of a sweep plot are matched by
/// hand, so that the native command carries no regular expression engine; they must find what the
/// regular expressions they replace found.
/// </summary>
public class HandScannedTests
{
    private static readonly Regex Number = new(@"-?\d+(?:\.\d+)?(?:E[+-]?\d+)?", RegexOptions.CultureInvariant);

    [Fact]
    public void Numbers_are_the_regular_expressions_numbers()
    {
        string[] messages =
        [
            "", "no number", "winding LV carries 228.1 A, 114 % of its rating", "-0.04 pu", "1.2E-05 ohm", "1.2E+3", "E5 -",
            "3.", "3.E5", "3.5E", "3.5E-", "3.5E-x", "--4", "-.5", "1..2", "a-1b", "x1.2.3", "٣٫٤ and ٣.٤", "12E3E4", "7e5",
        ];
        var random = new Random(17);
        const string alphabet = "-.E+e0189 a٣";
        var strings = messages.Concat(Enumerable.Range(0, 2000).Select(_ => new string([.. Enumerable.Range(0, random.Next(12)).Select(_ => alphabet[random.Next(alphabet.Length)])])));
        foreach (var s in strings)
        {
            Assert.Equal(Number.Matches(s).Select(m => m.Value), ResultDiff.NumbersIn(s));
            Assert.Equal(Number.Replace(s, m => $"<{m.Value}>"), ResultDiff.ReplaceNumbers(s, n => $"<{n}>"));
        }
    }

    [Fact]
    public void Result_patterns_match_as_the_regular_expression_did()
    {
        string[] paths = ["nodes.HV.v.rms", "nodes.LV.v.rms", "nodes.LV.v", "nodes..v.rms", "loads.heater.p", "supplies.grid.i.rms", "nodes.a.b.v.rms", "nodes.HV.v.rmsx", "x.nodes.HV.v.rms", ""];
        string[] patterns = ["nodes.*.v.rms", "*", "*.*", "loads.heater.p", "supplies.*.i.*", "nodes.*", "*.v.rms", "nodes.H*.v.rms", "**.p", "nodes.*.*.v.rms", "", "*V*", "(x)+.*"];
        foreach (var pattern in patterns)
        {
            var regex = new Regex("^" + string.Join("[^.]*", pattern.Split('*').Select(Regex.Escape)) + "$", RegexOptions.CultureInvariant);
            var glob = SweepPlot.Glob(pattern);
            foreach (var path in paths) Assert.True(regex.IsMatch(path) == glob(path), $"'{pattern}' on '{path}'");
        }
    }
}

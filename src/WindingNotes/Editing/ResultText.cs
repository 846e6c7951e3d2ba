using System.Numerics;
using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Text;

namespace WindingNotes.Editing;

/// <summary>
/// The short phrases an editor shows for results, shared by inlay hints and hovers so that a value
/// reads the same in both. Numbers go through <see cref="Numbers"/> like every report's.
/// </summary>
internal static class ResultText
{
    public static string Magnitude(Complex value, string unit) => Numbers.Format(value.Magnitude, unit);

    public static string Percent(double fraction) => TextReport.Percent(fraction);

    /// <summary>"17.11 A, loading 82.12 %".</summary>
    public static string Section(SectionResult s) =>
        s.Loading is { } loading ? $"{Magnitude(s.Current, "A")}, loading {Percent(loading)}" : Magnitude(s.Current, "A");

    /// <summary>"H1-T60 1.711 A, loading 41.06 %" for a section of a tapped winding.</summary>
    public static string NamedSection(SectionResult s) => $"{s.Section.FromPoint}-{s.Section.ToPoint} {Section(s)}";

    /// <summary>"858.5 mV/turn, 1.239 T of 1.600 T".</summary>
    public static string Core(CoreResult k)
    {
        var parts = new List<string>();
        if (k.VoltsPerTurn is { } e) parts.Add($"{Magnitude(e, "V")}/turn");
        if (k.Flux is { } b) parts.Add(k.Core.FluxLimit is { } limit ? $"{Numbers.Format(b, "T")} of {Numbers.Format(limit, "T")}" : Numbers.Format(b, "T"));
        else parts.Add(TextReport.FluxUnknown(k));
        return string.Join(", ", parts);
    }

    /// <summary>"208.0 V, 18.82 A, P 3.208 kW, pf 0.8196 lagging".</summary>
    public static string Terminal(Complex voltage, Complex current, Complex power) =>
        $"{Magnitude(voltage, "V")}, {Magnitude(current, "A")}, P {Numbers.Format(power.Real, "W")}, pf {PowerFactor(power)}";

    public static string PowerFactor(Complex s)
    {
        var pf = s.Magnitude == 0 ? 1 : Math.Abs(s.Real) / s.Magnitude;
        var sense = s.Imaginary > 1e-9 * s.Magnitude ? " lagging" : s.Imaginary < -1e-9 * s.Magnitude ? " leading" : "";
        return Numbers.Fixed(pf) + sense;
    }

    /// <summary>"pass: 228.1 V", "FAIL: 240.3 V", "pass: 0.000 V to 140.2 V over 11 points", "FAIL: cannot be measured".</summary>
    public static string Check(CheckResult c)
    {
        if (!c.Evaluated) return "not evaluated";
        var verdict = c.Passed ? "pass" : "FAIL";
        if (c.Expect.Measure == Model.MeasureKind.VectorGroup) return $"{verdict}: {c.Shown ?? "no clock number"}";
        if (c.Points > 1 && c.Min is { } min && c.Max is { } max)
            return $"{verdict}: {Range(min, max, c.Expect.Unit)} over {c.Points} points";
        return $"{verdict}: " + (c.Value is { } v ? SolveMessages.Show(v, c.Expect.Unit) : "cannot be measured");
    }

    /// <summary>"198.0 V to 240.2 V": a range in one unit (fractions as percent), ends in increasing order.</summary>
    public static string Range(double low, double high, string unit) =>
        low == high ? SolveMessages.Show(low, unit) : $"{SolveMessages.Show(low, unit)} to {SolveMessages.Show(high, unit)}";
}

using WindingNotes.Model;
using WindingNotes.Report;
using WindingNotes.Text;

namespace WindingNotes.Editing;

/// <summary>A value as the editor shows it: in its SI unit, and in the other units the notation names.</summary>
internal static class QuantityText
{
    /// <summary>"416.0 V", "3.600 %", "5.000 ohm angle 53.13 deg".</summary>
    public static string Show(Quantity q)
    {
        var (unit, scale) = q.Dimension.IsNone && q.IsPercent ? ("%", 100.0) : (q.Dimension.SiUnit(), 1.0);
        if (q.IsReal) return Real(q.Real * scale, unit);
        return TextReport.Phasor(q.Value * scale, unit);
    }

    /// <summary>With an SI prefix, but for units a prefix would misread ("mm2" is not a thousandth of a m2).</summary>
    public static string Real(double value, string unit) =>
        unit.Any(char.IsDigit) || unit == "K" ? $"{Numbers.Plain(value)} {unit}" : Numbers.Format(value, unit);

    /// <summary>The value in each other unit of its dimension that the notation names: "0.2080 kV", "208000 mV".</summary>
    public static IReadOnlyList<string> InOtherUnits(Quantity q)
    {
        if (!q.IsReal) return [];
        var result = new List<string>();
        foreach (var symbol in Units.Common)
        {
            if (Units.Find(symbol) is not { } unit || unit.Flags.HasFlag(QuantityFlags.Turns)) continue;
            var fits = q.Dimension.IsNone ? q.IsPercent && unit.Flags.HasFlag(QuantityFlags.Percent) && unit.Dimension.IsNone : unit.Dimension == q.Dimension;
            if (!fits) continue;
            result.Add($"{Numbers.Plain((q.Real - unit.Offset) / unit.Factor, 6)} {symbol}");
        }
        return result;
    }
}

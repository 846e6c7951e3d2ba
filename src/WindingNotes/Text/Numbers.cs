using System.Globalization;
using System.Numerics;
using System.Text;

namespace WindingNotes.Text;

/// <summary>
/// Formats numbers the one way every report and message uses: engineering notation (an SI prefix,
/// exponent a multiple of three) with a fixed number of significant figures, culture-free.
/// </summary>
public static class Numbers
{
    public const int Figures = 4;

    /// <summary>
    /// The share of the largest value of its kind below which a value is rounding the solver left
    /// (a balanced set's zero sequence, a current through a 1 TΩ leak): shown and compared as zero,
    /// so the same network gives the same bytes and noise never reads as a result.
    /// </summary>
    public const double Rounding = 1e-9;

    public static double Clean(double value, double scale) => Math.Abs(value) <= Rounding * scale ? 0 : value;

    public static Complex Clean(Complex value, double scale) => value.Magnitude <= Rounding * scale ? Complex.Zero : value;

    private static readonly string[] Prefixes = ["p", "n", "µ", "m", "", "k", "M", "G", "T"];

    // Units written without a prefix.
    private static readonly HashSet<string> Unprefixed = ["%", "deg", "pu", "turns", "degC", "h", "", "x", "A/mm2"];

    /// <summary>"228.1 V", "3.207 kW", "17.11 mA", "82.10 %".</summary>
    public static string Format(double value, string unit, int figures = Figures)
    {
        Span<char> number = stackalloc char[NumberChars];
        var n = Engineering(number, value, unit, figures, out var prefix);
        return prefix.Length + unit.Length == 0 ? new string(number[..n]) : string.Concat(number[..n], " ", prefix, unit);
    }

    /// <summary><see cref="Format"/>'s text appended, with no string made on the way: a report writes thousands.</summary>
    public static StringBuilder Append(StringBuilder o, double value, string unit, int figures = Figures)
    {
        Span<char> number = stackalloc char[NumberChars];
        var n = Engineering(number, value, unit, figures, out var prefix);
        o.Append(number[..n]);
        return prefix.Length + unit.Length == 0 ? o : o.Append(' ').Append(prefix).Append(unit);
    }

    /// <summary>The most characters a number (without its unit) takes: 40 significant figures and an exponent fit.</summary>
    private const int NumberChars = 128;

    /// <summary>The number of <see cref="Format"/> written into <paramref name="into"/>, its length returned, and the SI prefix its unit takes.</summary>
    private static int Engineering(Span<char> into, double value, string unit, int figures, out string prefix)
    {
        prefix = "";
        if (Unprefixed.Contains(unit)) return Fixed(into, value, figures);
        if (value == 0 || !double.IsFinite(value)) return Fixed(into, value, figures);
        var exponent = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        var group = (int)Math.Floor(exponent / 3.0);
        var mantissa = value / Math.Pow(10, 3 * group);
        // Rounding can carry into the next group: 999.96 with four figures is 1.000 k.
        if (Math.Abs(Math.Round(mantissa, Math.Max(0, figures - 1 - (exponent - 3 * group)))) >= 1000)
        {
            group++;
            mantissa /= 1000;
        }
        group = Math.Clamp(group, -4, 4);
        mantissa = value / Math.Pow(10, 3 * group);
        prefix = Prefixes[group + 4];
        return Fixed(into, mantissa, figures);
    }

    /// <summary>A number with the given significant figures and no prefix, trailing zeros kept.</summary>
    public static string Fixed(double value, int figures = Figures)
    {
        Span<char> number = stackalloc char[NumberChars];
        return new string(number[..Fixed(number, value, figures)]);
    }

    /// <summary><see cref="Fixed(double, int)"/>'s text appended.</summary>
    public static StringBuilder AppendFixed(StringBuilder o, double value, int figures = Figures)
    {
        Span<char> number = stackalloc char[NumberChars];
        return o.Append(number[..Fixed(number, value, figures)]);
    }

    private static int Fixed(Span<char> into, double value, int figures)
    {
        if (!double.IsFinite(value)) return Write(into, value, "");
        if (value == 0) return Write(into, 0.0, 'F', figures - 1);
        var magnitude = Math.Abs(value);
        if (magnitude >= 1e9 || magnitude < 1e-9) return Write(into, value, 'E', figures - 1);
        var exponent = (int)Math.Floor(Math.Log10(magnitude));
        var decimals = Math.Max(0, figures - 1 - exponent);
        var rounded = Math.Round(value, Math.Min(decimals, 15));
        if (rounded != 0 && (int)Math.Floor(Math.Log10(Math.Abs(rounded))) > exponent) decimals = Math.Max(0, decimals - 1);
        return Write(into, rounded, 'F', decimals);
    }

    /// <summary>The value in the format "F3" (<paramref name="kind"/> and <paramref name="digits"/>), the format itself made on the stack.</summary>
    private static int Write(Span<char> into, double value, char kind, int digits)
    {
        Span<char> format = stackalloc char[12];
        format[0] = kind;
        digits.TryFormat(format[1..], out var length, default, CultureInfo.InvariantCulture);
        return Write(into, value, format[..(length + 1)]);
    }

    private static int Write(Span<char> into, double value, ReadOnlySpan<char> format) =>
        value.TryFormat(into, out var written, format, CultureInfo.InvariantCulture) ? written
        : throw new ArgumentOutOfRangeException(nameof(value), "more figures than a number is written with");

    /// <summary>A number for a sentence: significant figures, trailing zeros dropped.</summary>
    public static string Plain(double value, int figures = Figures)
    {
        Span<char> number = stackalloc char[NumberChars];
        return new string(Plain(number, value, figures));
    }

    /// <summary><see cref="Plain(double, int)"/>'s text appended.</summary>
    public static StringBuilder AppendPlain(StringBuilder o, double value, int figures = Figures)
    {
        Span<char> number = stackalloc char[NumberChars];
        return o.Append(Plain(number, value, figures));
    }

    private static ReadOnlySpan<char> Plain(Span<char> into, double value, int figures)
    {
        ReadOnlySpan<char> text = into[..Fixed(into, value, figures)];
        if (text.Contains('.') && !text.Contains('E')) text = text.TrimEnd('0').TrimEnd('.');
        return text is "-0" ? "0" : text;
    }

    /// <summary>"25 %", "1.5 kV", "208 V": engineering notation with trailing zeros dropped, for names such as sweep points.</summary>
    public static string Short(double value, string unit, int figures = 6)
    {
        var text = Format(value, unit, figures);
        var space = text.IndexOf(' ');
        var number = space < 0 ? text : text[..space];
        if (number.Contains('.') && !number.Contains('E')) number = number.TrimEnd('0').TrimEnd('.');
        if (number == "-0") number = "0";
        return space < 0 ? number : number + text[space..];
    }

    /// <summary>A number as JSON writes it: ten significant figures, round-trip safe, no exponent for ordinary sizes.</summary>
    public static string Json(double value)
    {
        if (!double.IsFinite(value)) return "null";
        if (value == 0) return "0";
        var text = value.ToString("G10", CultureInfo.InvariantCulture);
        return text.Contains('E') ? text.Replace("E+", "e").Replace("E-", "e-") : text;
    }
}

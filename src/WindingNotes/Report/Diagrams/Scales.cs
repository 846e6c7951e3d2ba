namespace WindingNotes.Report.Diagrams;

/// <summary>Round steps for grids and axes: 1, 2, 2.5 or 5 times a power of ten.</summary>
public static class Scales
{
    /// <summary>The smallest round step that covers <paramref name="span"/> in at most <paramref name="steps"/> steps.</summary>
    public static double Step(double span, int steps)
    {
        if (!(span > 0) || !double.IsFinite(span)) return 1;
        var raw = span / steps;
        var power = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        foreach (var m in new[] { 1, 2, 2.5, 5, 10 })
            if (m * power >= raw * (1 - 1e-12)) return m * power;
        return 10 * power;
    }

    /// <summary>Round ticks from below <paramref name="low"/> to above <paramref name="high"/>, about <paramref name="steps"/> of them.</summary>
    public static (double Low, double High, double Step) Axis(double low, double high, int steps)
    {
        if (!double.IsFinite(low) || !double.IsFinite(high)) return (0, 1, 0.25);
        if (high - low < 1e-12 * Math.Max(Math.Abs(low), Math.Abs(high)) || high == low)
        {
            var pad = low == 0 ? 1 : Math.Abs(low) * 0.05;
            (low, high) = (low - pad, high + pad);
        }
        var step = Step(high - low, steps);
        return (Math.Floor(low / step + 1e-9) * step, Math.Ceiling(high / step - 1e-9) * step, step);
    }
}

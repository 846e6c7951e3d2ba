namespace WindingNotes.Solve;

/// <summary>One number of a case, by its path in the JSON report ("sections.LV.i.rms") and the unit it is shown in ("%" for fractions).</summary>
public readonly record struct CaseValue(string Path, double Value, string Unit);

/// <summary>
/// Every number of a case that can vary, as the JSON report names it, in the report's order. Bands
/// are kept by these paths. Angles are left out: a range of angles across ±180° has no plain reading.
/// A test checks that each path names the same number in the JSON report.
/// </summary>
public static class CaseValues
{
    public static IEnumerable<CaseValue> Of(CaseResult c)
    {
        foreach (var (point, v) in c.Points) yield return new($"nodes.{point}.v.rms", v.Magnitude, "V");
        foreach (var s in c.Sections)
        {
            var key = $"sections.{s.Section.Name}";
            yield return new($"{key}.i.rms", s.Current.Magnitude, "A");
            yield return new($"{key}.s", s.Apparent, "VA");
            if (s.Loading is { } loading) yield return new($"{key}.loading", loading, "%");
            yield return new($"{key}.loss", s.Loss, "W");
        }
        foreach (var tap in c.Taps) yield return new($"taps.{tap.Point}.i.rms", tap.Current.Magnitude, "A");
        foreach (var changer in c.TapPositions)
        {
            yield return new($"tapChangers.{changer.Changer.Name}.position", changer.Position, "");
            if (changer.Relay is { } relay) yield return new($"tapChangers.{changer.Changer.Name}.relay", relay, "V");
        }
        foreach (var k in c.Cores)
        {
            var key = $"cores.{k.Core.Name}";
            if (k.VoltsPerTurn is { } e) yield return new($"{key}.voltsPerTurn.rms", e.Magnitude, "V");
            if (k.Flux is { } flux) yield return new($"{key}.flux", flux, "T");
            if (k.LossKnown) yield return new($"{key}.loss", k.Loss, "W");
        }
        foreach (var s in c.Supplies)
        {
            var key = $"supplies.{s.Supply.Name}";
            yield return new($"{key}.i.rms", s.Current.Magnitude, "A");
            yield return new($"{key}.p", s.Power.Real, "W");
            yield return new($"{key}.q", s.Power.Imaginary, "var");
            yield return new($"{key}.s", s.Power.Magnitude, "VA");
            yield return new($"{key}.pf", s.PowerFactor, "");
        }
        if (c.Fault is { } f)
        {
            yield return new($"faults.{f.Fault.Name}.i.rms", f.Current.Magnitude, "A");
            yield return new($"faults.{f.Fault.Name}.peak", f.Peak, "A");
            yield break;
        }
        foreach (var l in c.Loads)
        {
            var key = $"loads.{l.Load.Name}";
            yield return new($"{key}.v.rms", l.Voltage.Magnitude, "V");
            yield return new($"{key}.i.rms", l.Current.Magnitude, "A");
            yield return new($"{key}.p", l.Power.Real, "W");
            yield return new($"{key}.q", l.Power.Imaginary, "var");
            if (l.Regulation is { } r) yield return new($"{key}.regulation", r, "%");
        }
        var t = c.Totals;
        yield return new("totals.copperLoss", t.CopperLoss, "W");
        if (t.CoreLossKnown) yield return new("totals.coreLoss", t.CoreLoss, "W");
        if (t.Efficiency is { } eff) yield return new("totals.efficiency", eff, "%");
        yield return new("totals.throughput", t.Throughput, "VA");
        yield return new("totals.transformed", t.Transformed, "VA");
        if (t.MaxEfficiencyLoad is { } load) yield return new("totals.maxEfficiencyLoad", load, "VA");
        if (t.MaxEfficiency is { } max) yield return new("totals.maxEfficiency", max, "%");
    }
}

using System.Globalization;
using System.Text;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Text;

namespace WindingNotes.Report;

/// <summary>
/// The load cycle in each report: per unit its peaks (hot-spot with its winding, top oil) and their
/// times, the loss of life and the ageing, per winding its highest load and hot-spot; then the day
/// hour by hour. Temperatures in degC, times as hh:mm, loss of life in hours; in JSON times in s
/// from midnight.
/// </summary>
public static class ThermalReport
{
    private static string Step(ThermalResult r) => r.Cycle.Step % 60 == 0 ? $"{Numbers.Plain(r.Cycle.Step / 60)} min" : Numbers.Format(r.Cycle.Step, "s");

    private static string Method(ThermalResult r) => r.Cycle.Method == ThermalMethod.DifferenceEquation ? "difference equations" : "exponential response";

    private static string C(double celsius) => Numbers.Format(celsius, "degC");

    private static string Load(ThermalResult r, double value) => r.LoadUnit == "pu" ? Numbers.Fixed(value) + " pu" : Numbers.Format(value, r.LoadUnit);

    /// <summary>The bulk temperature the unit follows: its top oil, or a dry-type unit's average winding temperature.</summary>
    private static string Bulk(ThermalUnitResult u) => u.Unit.Dry ? "winding average" : "top oil";

    private static string Summary(ThermalResult r, ThermalUnitResult u) =>
        $"peak hot-spot {C(u.PeakHotSpot)} at {r.Clock(u.PeakHotSpotTime)} in '{u.HottestWinding}', peak {Bulk(u)} {C(u.PeakTopOil)} at {r.Clock(u.PeakTopOilTime)}, " +
        $"loss of life {ThermalResult.Hours(u.LossOfLife)} (mean ageing {Numbers.Fixed(u.MeanAgeing)}, highest {Numbers.Fixed(u.PeakAgeing)}), " +
        (u.EquivalentAging is { } feqa ? $"FEQA {Numbers.Fixed(feqa)} (FAA up to {Numbers.Fixed(u.PeakAgingFactor!.Value)}), " : "") +
        $"{u.Unit.Cooling} {u.Unit.Class}, {Insulation(u.Unit)}, loss ratio {Numbers.Fixed(u.LossRatio)}";

    /// <summary>What the unit ages by: its paper, or a dry-type unit's class with the basis of its ageing rate.</summary>
    private static string Insulation(ThermalUnitModel u) => u.Dry
        ? $"class {u.InsulationClass} degC insulation (ageing 1 at its rated hot-spot {C(ThermalEquations.AgeingReference(u))}, doubling every 10 K)"
        : $"{(u.Upgraded ? "upgraded" : "non-upgraded")} paper";

    private static string Capability(ThermalResult r, CapabilityResult c)
    {
        var what = c.Capability.Kind == CapabilityKind.ConstantLoad ? "load held all day" : "multiple of the cycle";
        var limits = $"hot-spot {C(c.HotSpotLimit)}" + (c.TopOilLimit is { } o ? $", top oil {C(o)}" : "") + (c.LossOfLifeLimit is { } l ? $", loss of life {ThermalResult.Hours(l)}" : "");
        if (c.Value is not { } v) return $"{what}: unknown ({c.Problem})";
        return c.Beyond
            ? $"{what}: at least {ThermalCapability.Shown(r, c.Capability, v)}, the end of the search (within {limits})"
            : $"{what}: {ThermalCapability.Shown(r, c.Capability, v)}, where the {ThermalCapability.Readable(c.Binding)} reaches {ThermalCapability.Measured(c.Binding, c.AtBinding)} (limits {limits})";
    }

    private static string Winding(ThermalResult r, WindingHeat w) =>
        $"load up to {Numbers.Fixed(w.PeakLoad)} pu from {r.Clock(w.PeakLoadTime)}, hot-spot up to {C(w.PeakHotSpot)} at {r.Clock(w.PeakHotSpotTime)}";

    public static void Text(StringBuilder o, ThermalResult? r)
    {
        if (r is null) return;
        o.Append("\nLoad cycle (").Append(Method(r)).Append(", ").Append(Step(r)).Append(" steps, the day after ").Append(r.Days - 1).Append(" days of the same cycle)\n");
        var unitWidth = TextReport.Width(r.Units.Select(u => u.Unit.Core));
        foreach (var u in r.Units)
        {
            TextReport.Named(o, "  ", u.Unit.Core, unitWidth, Summary(r, u));
            var windingWidth = TextReport.Width(u.Windings.Select(w => w.Winding), least: 10);
            foreach (var w in u.Windings) TextReport.Named(o, "    ", w.Winding, windingWidth, Winding(r, w));
            foreach (var c in r.Capabilities.Where(c => c.Capability.Core == u.Unit.Core)) o.Append("    capability ").Append(Capability(r, c)).Append('\n');
        }
        o.Append("  hour by hour: time, load and ambient up to it").Append(string.Concat(r.Units.Select(u => $"; {u.Unit.Core} {Bulk(u)}, hot-spot"))).Append('\n');
        foreach (var k in r.Hourly())
        {
            o.Append("    ").Append(r.Clock(r.Times[k])).Append("  ").Append(Load(r, r.Load[k])).Append("  ").Append(C(r.Ambient[k]));
            foreach (var u in r.Units) o.Append("  ").Append(C(u.TopOil[k])).Append("  ").Append(C(u.HotSpot[k]));
            o.Append('\n');
        }
    }

    public static void Markdown(StringBuilder o, ThermalResult? r)
    {
        if (r is null) return;
        o.Append("\n### Load cycle\n\n").Append(Method(r)).Append(", ").Append(Step(r)).Append(" steps; the day after ").Append(r.Days - 1).Append(" days of the same cycle.\n\n");
        MarkdownReport.Table(o, 2, ["unit", "hottest winding", "peak hot-spot", "at", r.Units.Any(u => u.Unit.Dry) ? "peak top oil or winding average" : "peak top oil", "at", "loss of life", "mean ageing", "FEQA", "highest FAA"], r.Units.Select(u => new[]
        {
            u.Unit.Core, u.HottestWinding, C(u.PeakHotSpot), r.Clock(u.PeakHotSpotTime), C(u.PeakTopOil), r.Clock(u.PeakTopOilTime), ThermalResult.Hours(u.LossOfLife), Numbers.Fixed(u.MeanAgeing),
            u.EquivalentAging is { } feqa ? Numbers.Fixed(feqa) : "—", u.PeakAgingFactor is { } faa ? Numbers.Fixed(faa) : "—",
        }));
        o.Append('\n');
        foreach (var u in r.Units) o.Append("- ").Append(u.Unit.Core).Append(": ").Append(u.Unit.Cooling.ToString()).Append(' ').Append(u.Unit.Class).Append(", ").Append(Insulation(u.Unit)).Append('\n');
        if (!r.Capabilities.IsEmpty)
        {
            o.Append('\n');
            foreach (var c in r.Capabilities) o.Append("- capability of ").Append(c.Capability.Core).Append(", ").Append(Capability(r, c)).Append('\n');
        }
        o.Append('\n');
        MarkdownReport.Table(o, 2, ["unit", "winding", "highest load", "from", "peak hot-spot", "at"], r.Units.SelectMany(u => u.Windings.Select(w => new[]
        {
            u.Unit.Core, w.Winding, Numbers.Fixed(w.PeakLoad) + " pu", r.Clock(w.PeakLoadTime), C(w.PeakHotSpot), r.Clock(w.PeakHotSpotTime),
        })));
        o.Append('\n');
        string[] header = ["time", "load up to it", "ambient up to it", .. r.Units.SelectMany(u => new[] { $"{u.Unit.Core} {Bulk(u)}", $"{u.Unit.Core} hot-spot" })];
        MarkdownReport.Table(o, 1, header, r.Hourly().Select(k => new[] { r.Clock(r.Times[k]), Load(r, r.Load[k]), C(r.Ambient[k]) }
            .Concat(r.Units.SelectMany(u => new[] { C(u.TopOil[k]), C(u.HotSpot[k]) })).ToArray()));
    }
}

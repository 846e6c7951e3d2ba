using System.Globalization;
using System.Text;
using System.Text.Json;
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

    /// <summary>The samples on the hour, 0 h to 24 h.</summary>
    private static IEnumerable<int> Hourly(ThermalResult r)
    {
        var dt = r.Times.Length > 1 ? r.Times[1] : 86400;
        return Enumerable.Range(0, 25).Select(h => (int)Math.Round(h * 3600 / dt)).Where(k => k < r.Times.Length).Distinct();
    }

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
        foreach (var u in r.Units)
        {
            o.Append("  ").Append(u.Unit.Core.PadRight(12)).Append(' ').Append(Summary(r, u)).Append('\n');
            foreach (var w in u.Windings) o.Append("    ").Append(w.Winding.PadRight(10)).Append(' ').Append(Winding(r, w)).Append('\n');
            foreach (var c in r.Capabilities.Where(c => c.Capability.Core == u.Unit.Core)) o.Append("    capability ").Append(Capability(r, c)).Append('\n');
        }
        o.Append("  hour by hour: time, load and ambient up to it").Append(string.Concat(r.Units.Select(u => $"; {u.Unit.Core} {Bulk(u)}, hot-spot"))).Append('\n');
        foreach (var k in Hourly(r))
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
        MarkdownReport.Table(o, 1, header, Hourly(r).Select(k => new[] { r.Clock(r.Times[k]), Load(r, r.Load[k]), C(r.Ambient[k]) }
            .Concat(r.Units.SelectMany(u => new[] { C(u.TopOil[k]), C(u.HotSpot[k]) })).ToArray()));
    }

    public static void Json(Utf8JsonWriter w, ThermalResult? r)
    {
        if (r is null) return;
        w.WriteStartObject("thermal");
        w.WriteString("method", r.Cycle.Method == ThermalMethod.DifferenceEquation ? "difference-equation" : "exponential");
        JsonReport.Number(w, "step", r.Cycle.Step);
        w.WriteNumber("days", r.Days);
        w.WriteString("loadUnit", r.LoadUnit);
        w.WriteStartObject("units");
        foreach (var u in r.Units)
        {
            w.WriteStartObject(u.Unit.Core);
            w.WriteString("cooling", u.Unit.Cooling.ToString());
            if (u.Unit.InsulationClass is { } insulation) JsonReport.Number(w, "insulationClass", insulation);
            else w.WriteBoolean("upgradedPaper", u.Unit.Upgraded);
            JsonReport.Number(w, "ageingReference", ThermalEquations.AgeingReference(u.Unit));
            JsonReport.Number(w, "lossRatio", u.LossRatio);
            JsonReport.Number(w, "peakHotSpot", u.PeakHotSpot);
            JsonReport.Number(w, "peakHotSpotTime", u.PeakHotSpotTime);
            w.WriteString("hottestWinding", u.HottestWinding);
            JsonReport.Number(w, u.Unit.Dry ? "peakWindingAverage" : "peakTopOil", u.PeakTopOil);
            JsonReport.Number(w, u.Unit.Dry ? "peakWindingAverageTime" : "peakTopOilTime", u.PeakTopOilTime);
            JsonReport.Number(w, "lossOfLife", u.LossOfLife);
            JsonReport.Number(w, "meanAgeing", u.MeanAgeing);
            JsonReport.Number(w, "peakAgeing", u.PeakAgeing);
            if (u.EquivalentAging is { } feqa) JsonReport.Number(w, "equivalentAging", feqa);
            if (u.PeakAgingFactor is { } faa) JsonReport.Number(w, "peakAgingFactor", faa);
            var capabilities = r.Capabilities.Where(c => c.Capability.Core == u.Unit.Core).ToList();
            if (capabilities.Count > 0)
            {
                w.WriteStartObject("capability");
                foreach (var c in capabilities)
                {
                    w.WriteStartObject(c.Capability.KindWord);
                    if (c.Value is { } v)
                    {
                        JsonReport.Number(w, "value", v);
                        w.WriteBoolean("atLeast", c.Beyond);
                        w.WriteString("binding", c.Binding);
                        JsonReport.Number(w, "atBinding", c.AtBinding);
                        JsonReport.Number(w, "hotSpotLimit", c.HotSpotLimit);
                        if (c.TopOilLimit is { } o) JsonReport.Number(w, "topOilLimit", o);
                        if (c.LossOfLifeLimit is { } l) JsonReport.Number(w, "lossOfLifeLimit", l);
                    }
                    else w.WriteString("problem", c.Problem);
                    w.WriteEndObject();
                }
                w.WriteEndObject();
            }
            w.WriteStartObject("windings");
            foreach (var h in u.Windings)
            {
                w.WriteStartObject(h.Winding);
                JsonReport.Number(w, "peakLoad", h.PeakLoad);
                JsonReport.Number(w, "peakLoadTime", h.PeakLoadTime);
                JsonReport.Number(w, "peakHotSpot", h.PeakHotSpot);
                JsonReport.Number(w, "peakHotSpotTime", h.PeakHotSpotTime);
                w.WriteEndObject();
            }
            w.WriteEndObject();
            w.WriteEndObject();
        }
        w.WriteEndObject();
        w.WriteStartArray("hourly");
        foreach (var k in Hourly(r))
        {
            w.WriteStartObject();
            JsonReport.Number(w, "time", r.Times[k]);
            JsonReport.Number(w, "load", r.Load[k]);
            JsonReport.Number(w, "ambient", r.Ambient[k]);
            w.WriteStartObject("units");
            foreach (var u in r.Units)
            {
                w.WriteStartObject(u.Unit.Core);
                JsonReport.Number(w, u.Unit.Dry ? "windingAverage" : "topOil", u.TopOil[k]);
                JsonReport.Number(w, "hotSpot", u.HotSpot[k]);
                w.WriteEndObject();
            }
            w.WriteEndObject();
            w.WriteEndObject();
        }
        w.WriteEndArray();
        w.WriteEndObject();
    }
}

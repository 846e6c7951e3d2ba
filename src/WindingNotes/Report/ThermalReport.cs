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

    private static string Summary(ThermalResult r, ThermalUnitResult u) =>
        $"peak hot-spot {C(u.PeakHotSpot)} at {r.Clock(u.PeakHotSpotTime)} in '{u.HottestWinding}', peak top oil {C(u.PeakTopOil)} at {r.Clock(u.PeakTopOilTime)}, " +
        $"loss of life {ThermalResult.Hours(u.LossOfLife)} (mean ageing {Numbers.Fixed(u.MeanAgeing)}, highest {Numbers.Fixed(u.PeakAgeing)}), " +
        $"{u.Unit.Cooling} {u.Unit.Class}, {(u.Unit.Upgraded ? "upgraded" : "non-upgraded")} paper, loss ratio {Numbers.Fixed(u.LossRatio)}";

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
        }
        o.Append("  hour by hour: time, load and ambient up to it").Append(string.Concat(r.Units.Select(u => $"; {u.Unit.Core} top oil, hot-spot"))).Append('\n');
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
        MarkdownReport.Table(o, 2, ["unit", "hottest winding", "peak hot-spot", "at", "peak top oil", "at", "loss of life", "mean ageing"], r.Units.Select(u => new[]
        {
            u.Unit.Core, u.HottestWinding, C(u.PeakHotSpot), r.Clock(u.PeakHotSpotTime), C(u.PeakTopOil), r.Clock(u.PeakTopOilTime), ThermalResult.Hours(u.LossOfLife), Numbers.Fixed(u.MeanAgeing),
        }));
        o.Append('\n');
        MarkdownReport.Table(o, 2, ["unit", "winding", "highest load", "from", "peak hot-spot", "at"], r.Units.SelectMany(u => u.Windings.Select(w => new[]
        {
            u.Unit.Core, w.Winding, Numbers.Fixed(w.PeakLoad) + " pu", r.Clock(w.PeakLoadTime), C(w.PeakHotSpot), r.Clock(w.PeakHotSpotTime),
        })));
        o.Append('\n');
        string[] header = ["time", "load up to it", "ambient up to it", .. r.Units.SelectMany(u => new[] { $"{u.Unit.Core} top oil", $"{u.Unit.Core} hot-spot" })];
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
            w.WriteBoolean("upgradedPaper", u.Unit.Upgraded);
            JsonReport.Number(w, "lossRatio", u.LossRatio);
            JsonReport.Number(w, "peakHotSpot", u.PeakHotSpot);
            JsonReport.Number(w, "peakHotSpotTime", u.PeakHotSpotTime);
            w.WriteString("hottestWinding", u.HottestWinding);
            JsonReport.Number(w, "peakTopOil", u.PeakTopOil);
            JsonReport.Number(w, "peakTopOilTime", u.PeakTopOilTime);
            JsonReport.Number(w, "lossOfLife", u.LossOfLife);
            JsonReport.Number(w, "meanAgeing", u.MeanAgeing);
            JsonReport.Number(w, "peakAgeing", u.PeakAgeing);
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
                JsonReport.Number(w, "topOil", u.TopOil[k]);
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

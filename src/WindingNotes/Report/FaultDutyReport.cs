using System.Numerics;
using System.Text;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Text;

namespace WindingNotes.Report;

/// <summary>
/// The part of a report a bus fault's case adds: the method and voltage factor, the currents with
/// their sequence components, the peak and the thermal equivalent current, the earth-fault factor,
/// and every winding's duty against its withstand (the fault-duty table a reviewer signs off).
/// </summary>
public static class FaultDutyReport
{
    public static string Method(ShortCircuitResult sc) => sc.Study.Method == FaultMethod.AsLoaded
        ? "network as loaded: supplies as written, constant-power and constant-current loads as their pre-fault impedance"
        : $"equivalent voltage source at the fault (IEC 60909-0), c = {Numbers.Fixed(sc.VoltageFactor, 3)} ({(sc.Minimum ? "cmin" : "cmax")}) on Un = {Numbers.Format(sc.Nominal, "V")} from {sc.NominalFrom}, loads left out"
          + (sc.TransformerCorrections.IsEmpty ? "" : $", network transformers times K_T = 0.95·cmax/(1 + 0.6·xT): {string.Join(", ", sc.TransformerCorrections.Select(k => $"{k.Line} {Numbers.Fixed(k.Factor)}"))}")
          + (sc.WeakestSources.IsEmpty ? "" : $", {string.Join(", ", sc.WeakestSources.Select(s => $"'{s}'"))} at {(sc.WeakestSources.Length == 1 ? "its" : "their")} minimum fault level")
          + (sc.EndTemperature is { } end ? $", resistances given with a temperature at {Numbers.Format(end - 273.15, "degC")}" : "");

    /// <summary>How a two-node fault was solved, and which loads were taken as their pre-fault impedance.</summary>
    public static string Method(FaultResult f)
    {
        if (f.Method == FaultMethod.EquivalentSource)
            return $"equivalent voltage source at the fault (IEC 60909-0), c = {Numbers.Fixed(f.VoltageFactor ?? 1, 3)} on {Numbers.Format(f.Nominal ?? 0, "V")} across the fault at no load, loads left out";
        var loads = f.LoadsAsImpedance.Select(l => $"{(l.Behaviour == LoadBehaviour.ConstantPower ? "constant-power" : "constant-current")} load '{l.Name}'").ToList();
        return "network as loaded: supplies as written" + (loads.Count == 0 ? "" : $", {string.Join(", ", loads)} as {(loads.Count == 1 ? "its" : "their")} pre-fault impedance");
    }

    public static string Kappa(ShortCircuitResult sc) =>
        sc.EquivalentRX is { } rxc
        ? $"κ {Numbers.Fixed(sc.Kappa)} by the equivalent frequency (IEC 60909-0 method C): R/X {Numbers.Fixed(rxc)} = Rc/Xc × fc/f of the short-circuit impedance at fc = {Numbers.Format(sc.EquivalentFrequency, "Hz")} ({Numbers.Format(sc.EquivalentImpedance!.Value.Magnitude, "ohm")}); by the ratio at the fault {Numbers.Fixed(sc.KappaAtFault)}, R/X {Numbers.Fixed(sc.RX)}"
        : sc.KappaExempt
        ? $"κ {Numbers.Fixed(sc.Kappa)} for a meshed network by the ratio R/X at the fault (IEC 60909-0 method B) without the factor 1.15, as R/X is below 0.3 in every branch; R/X {Numbers.Fixed(sc.RX)} of the short-circuit impedance at the fault (positive sequence, {Numbers.Format(sc.Z1.Magnitude, "ohm")})"
        : sc.Study.Meshed
        ? $"κ {Numbers.Fixed(sc.Kappa)} for a meshed network (IEC 60909-0 method B: 1.15 × {Numbers.Fixed(sc.KappaAtFault)} at most {(sc.Nominal > 1000 ? "2.0" : "1.8")}) from R/X {Numbers.Fixed(sc.RX)} of the short-circuit impedance at the fault (positive sequence, {Numbers.Format(sc.Z1.Magnitude, "ohm")})"
        : $"κ {Numbers.Fixed(sc.Kappa)} by the ratio R/X at the fault (IEC 60909-0 method B), R/X {Numbers.Fixed(sc.RX)} of the short-circuit impedance there (positive sequence, {Numbers.Format(sc.Z1.Magnitude, "ohm")})";

    public static void Text(StringBuilder o, ShortCircuitResult sc, Action<string> heading, Action<string, string> line)
    {
        heading($"Bus fault {sc.Fault.Name}, {BusFaultModel.Word(sc.Fault.Kind)} ({sc.Extreme})");
        line("method", Method(sc));
        for (var p = 0; p < 3; p++)
            line($"{sc.Fault.Lines[p].Name}", $"{TextReport.Phasor(sc.LineCurrents[p], "A")} into the fault, {TextReport.Phasor(sc.LineVoltages[p], "V")} to earth");
        if (sc.Fault.ToEarth) line("earth", TextReport.Phasor(sc.EarthCurrent, "A"));
        line("sequence currents", Sequence(sc.Currents, "A"));
        line("sequence voltages", Sequence(sc.Voltages, "V"));
        line("I\"k", Numbers.Format(sc.Initial, "A"));
        line("peak ip", $"{Numbers.Format(sc.Peak, "A")} ({Kappa(sc)}; by k·√2 {Numbers.Fixed(sc.Peak60076 / sc.Initial)}: {Numbers.Format(sc.Peak60076, "A")})");
        line("Ith", $"{Numbers.Format(sc.Thermal, "A")} over {Numbers.Plain(sc.Study.Duration)} s (m {Numbers.Fixed(sc.ThermalFactorM)}, n 1), DC time constant {TimeConstant(sc)}");
        if (sc.EarthFaultFactor is { } k) line("earth-fault factor", Numbers.Fixed(k));
        foreach (var d in sc.Duties) line(d.Winding.Name, Duty(sc, d));
        foreach (var g in sc.Groundings) line(g.Grounding.Element, Grounding(g));
        line("fault duty", SignOff(sc));
    }

    public static void Markdown(StringBuilder o, ShortCircuitResult sc)
    {
        o.Append('\n').Append($"Bus fault {sc.Fault.Name}, {BusFaultModel.Word(sc.Fault.Kind)} ({sc.Extreme}): {Method(sc)}.\n\n");
        MarkdownReport.Table(o, 1, ["line", "current", "angle", "voltage to earth", "angle"], Enumerable.Range(0, 3).Select(p => new[]
        {
            sc.Fault.Lines[p].Name, Numbers.Format(sc.LineCurrents[p].Magnitude, "A"), Deg(sc.LineCurrents[p]),
            Numbers.Format(sc.LineVoltages[p].Magnitude, "V"), Deg(sc.LineVoltages[p]),
        }));
        o.Append('\n');
        MarkdownReport.Table(o, 1, ["sequence", "current", "voltage"],
        [
            ["zero", Numbers.Format(sc.Currents.Zero.Magnitude, "A"), Numbers.Format(sc.Voltages.Zero.Magnitude, "V")],
            ["positive", Numbers.Format(sc.Currents.Positive.Magnitude, "A"), Numbers.Format(sc.Voltages.Positive.Magnitude, "V")],
            ["negative", Numbers.Format(sc.Currents.Negative.Magnitude, "A"), Numbers.Format(sc.Voltages.Negative.Magnitude, "V")],
        ]);
        o.Append('\n');
        MarkdownReport.Table(o, 0, ["I\"k", "κ", "R/X", "ip", "Ith", "duration", "earth-fault factor"],
        [[
            Numbers.Format(sc.Initial, "A"), Numbers.Fixed(sc.Kappa), Numbers.Fixed(sc.RX), Numbers.Format(sc.Peak, "A"),
            Numbers.Format(sc.Thermal, "A"), $"{Numbers.Plain(sc.Study.Duration)} s", sc.EarthFaultFactor is { } k ? Numbers.Fixed(k) : "—",
        ]]);
        o.Append('\n');
        MarkdownReport.Table(o, 1, ["winding", "current", "× rated", "peak (k·√2)", "peak withstand", "temperature after", "limit", "category", "allowed", "frequent faults", "duty"], sc.Duties.Select(d => new[]
        {
            d.Winding.Name, Numbers.Format(d.Current, "A"), d.Multiple is { } m ? Numbers.Plain(m) : "unrated",
            $"{Numbers.Format(d.Peak, "A")} ({Numbers.Fixed(d.AsymmetryFactor)})",
            d.PeakWithstand is { } pw ? $"{Numbers.Format(pw, "A")} ({Numbers.Format(d.PeakDuty!.Value * 100, "%")})" : "not given",
            d.Temperature is { } t ? double.IsFinite(t) ? Numbers.Format(t - 273.15, "degC") : "no finite end" : "no conductor given",
            d.TemperatureLimit is { } l ? Numbers.Format(l - 273.15, "degC") : "—",
            d.Category ?? "—", d.AllowedSeconds is { } s ? $"{Numbers.Plain(s)} s" : "—",
            d.FrequentSeconds is { } fs ? $"{Numbers.Plain(fs)} s" : "—",
            Verdict(sc, d),
        }));
        if (!sc.Groundings.IsEmpty)
        {
            o.Append('\n');
            MarkdownReport.Table(o, 1, ["grounding impedance", "current", "voltage", "I²t", "rated", "duty"], sc.Groundings.Select(g => new[]
            {
                g.Grounding.Element, Numbers.Format(g.Current.Magnitude, "A"), Numbers.Format(g.Voltage.Magnitude, "V"), $"{Numbers.Plain(g.I2t)} A²s",
                Rating(g), g.Exceeded ? "exceeds" : g.Judged ? "withstands" : "not judged",
            }));
        }
        o.Append('\n').Append($"Fault duty in bus fault {sc.Fault.Name} ({sc.Extreme}): {SignOff(sc)}.\n");
    }

    /// <summary>One winding's duty as a sentence.</summary>
    public static string Duty(ShortCircuitResult sc, WindingDuty d)
    {
        var parts = new List<string> { $"{Numbers.Format(d.Current, "A")}{(d.Multiple is { } m ? $" ({Numbers.Plain(m)} × rated)" : "")}, peak {Numbers.Format(d.Peak, "A")} (k·√2 {Numbers.Fixed(d.AsymmetryFactor)})" };
        if (d.PeakWithstand is { } pw) parts.Add($"peak withstand {Numbers.Format(pw, "A")} ({Numbers.Format(d.PeakDuty!.Value * 100, "%")} of it)");
        if (d.Temperature is { } t)
            parts.Add($"{(double.IsFinite(t) ? Numbers.Format(t - 273.15, "degC") : "no finite temperature")} after {Numbers.Plain(sc.Study.Duration)} s (limit {Numbers.Format(d.TemperatureLimit!.Value - 273.15, "degC")})");
        if (d.Category is { } c)
            parts.Add(d.AllowedSeconds is not { } allowed ? $"category {c}: below the through-fault curves ({Numbers.Plain(FaultStudy.CurvesFrom)} × rated)" : $"category {c}: {Numbers.Plain(allowed)} s allowed"
                + (d.FrequentSeconds is { } fs && d.LargestMultiple is { } lm ? $", {Numbers.Plain(fs)} s for frequent faults (largest multiple {Numbers.Plain(lm)})" : ""));
        parts.Add(Verdict(sc, d));
        return string.Join(", ", parts);
    }

    /// <summary>A neutral-grounding impedance's duty as a sentence.</summary>
    public static string Grounding(GroundingDuty g) =>
        $"{TextReport.Phasor(g.Current, "A")} to earth, {TextReport.Phasor(g.Voltage, "V")} across it, I²t {Numbers.Plain(g.I2t)} A²s over {Numbers.Plain(g.Duration)} s; "
        + (g.Judged ? $"{Rating(g)}: {(g.Exceeded ? "exceeds" : "withstands")}" : "no rated current given: not judged");

    private static string Rating(GroundingDuty g) =>
        g.Grounding.RatedCurrent is not { } r ? "not given"
        : g.Grounding.TimeRating is { } t ? $"{Numbers.Format(r, "A")} for {Numbers.Plain(t)} s ({Numbers.Plain(g.RatedI2t!.Value)} A²s)"
        : $"{Numbers.Format(r, "A")}";

    /// <summary>
    /// The line a reviewer signs against under the duty table: whether every winding withstands the fault
    /// on every limit judged (temperature, peak against its peak withstand, infrequent- and frequent-fault
    /// time), naming the windings that do not and why, and the limits not judged for want of data.
    /// </summary>
    public static string SignOff(ShortCircuitResult sc)
    {
        var duration = sc.Study.Duration;
        var failed = sc.Duties.Where(d => Exceeds(sc, d)).Select(d =>
        {
            var why = new List<string>();
            if (d.ThermalExceeded) why.Add("temperature above its limit");
            if (d.PeakExceeded) why.Add($"peak {Numbers.Format(d.PeakDuty!.Value * 100, "%")} of its peak withstand");
            if (d.CategoryExceeded(duration)) why.Add($"longer than category {d.Category} allows");
            if (d.FrequentExceeded(duration)) why.Add("longer than the frequent-fault curve allows");
            return $"{d.Winding.Name} ({string.Join(", ", why)})";
        }).ToList();
        failed.AddRange(sc.Groundings.Where(g => g.Exceeded).Select(g => $"{g.Grounding.Element} ({(g.CurrentExceeded ? "current above its rating" : "I²t above its rating")})"));
        string Names(Func<WindingDuty, bool> missing) => string.Join(", ", sc.Duties.Where(missing).Select(d => d.Winding.Name));
        var unjudged = new List<string>();
        void Unjudged(string limit, string reason, Func<WindingDuty, bool> missing)
        {
            var names = Names(missing);
            if (names.Length > 0) unjudged.Add($"{limit} of {names} ({reason})");
        }
        Unjudged("temperature", "no conductor given", d => d.Temperature is null);
        Unjudged("peak", "no peak withstand given", d => d.PeakWithstand is null);
        Unjudged("category time", "no rating", d => d.Category is null);
        Unjudged("category time", $"below the through-fault curves, which start at {Numbers.Plain(FaultStudy.CurvesFrom)} × rated", d => d.Category is not null && d.AllowedSeconds is null);
        Unjudged("frequent-fault time", "largest through-fault multiple unknown", d => d.AllowedSeconds is not null && d.FrequentSeconds is null);
        var judged = failed.Count > 0
            ? $"not withstood by {string.Join(", ", failed)}"
            : sc.Duties.IsEmpty ? "no winding carries the fault"
            : sc.Duties.All(d => Verdict(sc, d) == "not judged") ? "not judged for any winding"
            : unjudged.Count == 0 ? "every winding withstands it on every limit: temperature, peak against its peak withstand, infrequent- and frequent-fault time"
            : "every winding withstands it on every limit judged";
        return unjudged.Count == 0 || sc.Duties.IsEmpty ? judged : $"{judged}; not judged: {string.Join("; ", unjudged)}";
    }

    private static bool Exceeds(ShortCircuitResult sc, WindingDuty d) => sc.Exceeds(d);

    private static string Verdict(ShortCircuitResult sc, WindingDuty d) =>
        Exceeds(sc, d) ? "exceeds" : d.Temperature is null && d.AllowedSeconds is null && d.PeakWithstand is null ? "not judged" : "withstands";

    private static string TimeConstant(ShortCircuitResult sc) => double.IsFinite(sc.DcTimeConstant) ? Numbers.Format(sc.DcTimeConstant * 1000, "ms") : "infinite";

    private static string Sequence(Sequence s, string unit) =>
        $"zero {TextReport.Phasor(s.Zero, unit)}, positive {TextReport.Phasor(s.Positive, unit)}, negative {TextReport.Phasor(s.Negative, unit)}";

    private static string Deg(Complex v) => $"{TextReport.Degrees(v):F2}°".Replace("-0.00°", "0.00°");
}

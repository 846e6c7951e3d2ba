using WindingNotes.Kernel;
using WindingNotes.Model;
using System.Numerics;
using System.Text;
using System.Text.Json;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report;

/// <summary>
/// The results as JSON in the shape NOTATION.md fixes (schema "windingnotes/results/1"): SI values
/// as plain numbers, phasors as {"rms", "deg"}, ratios as fractions, keys in source order, lines and
/// characters zero-based. Numbers are written with ten significant figures, so the bytes are stable.
/// </summary>
public static class JsonReport
{
    public const string Schema = "windingnotes/results/1";

    public static string Write(Evaluation evaluation)
    {
        using var stream = new MemoryStream();
        using (var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true, Encoder = System.Text.Encodings.Web.JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteString("schema", Schema);
            w.WriteString("file", evaluation.Path);
            w.WriteStartArray("diagnostics");
            foreach (var d in evaluation.Diagnostics) WriteDiagnostic(w, evaluation.Text, d);
            w.WriteEndArray();
            w.WriteStartArray("cases");
            foreach (var c in evaluation.Cases) WriteCase(w, evaluation, c);
            w.WriteEndArray();
            ThermalReport.Json(w, evaluation.Thermal);
            ThreePhaseReport.SequenceJson(w, evaluation.SequenceImpedances);
            ThreePhaseReport.ParallelJson(w, evaluation.Parallel);
            if (evaluation.Checks.Any(c => !c.Evaluated))
            {
                w.WriteStartArray("notEvaluated");
                foreach (var check in evaluation.Checks.Where(c => !c.Evaluated))
                {
                    w.WriteStartObject();
                    w.WriteNumber("line", evaluation.Text.GetPosition(check.Expect.Line.Start).Line);
                    w.WriteString("text", check.Expect.Text);
                    w.WriteEndObject();
                }
                w.WriteEndArray();
            }
            w.WriteString("note", Cautions.Judgement);
            w.WriteEndObject();
        }
        return Encoding.UTF8.GetString(stream.ToArray()) + "\n";
    }

    public static void WriteDiagnostic(Utf8JsonWriter w, SourceText text, Diagnostic d)
    {
        w.WriteStartObject();
        w.WriteString("severity", d.Severity switch
        {
            Severity.Error => "error",
            Severity.Warning => "warning",
            Severity.Information => "information",
            _ => "hint",
        });
        w.WriteString("code", d.Code);
        w.WriteString("message", d.Shown);
        if (d.Case is not null) w.WriteString("case", d.Case);
        WriteRange(w, "range", text.GetRange(d.Span));
        if (d.Acknowledged) w.WriteBoolean("acknowledged", true);
        w.WriteEndObject();
    }

    private static void WriteRange(Utf8JsonWriter w, string name, TextRange range)
    {
        w.WriteStartObject(name);
        w.WriteStartObject("start");
        w.WriteNumber("line", range.Start.Line);
        w.WriteNumber("character", range.Start.Character);
        w.WriteEndObject();
        w.WriteStartObject("end");
        w.WriteNumber("line", range.End.Line);
        w.WriteNumber("character", range.End.Character);
        w.WriteEndObject();
        w.WriteEndObject();
    }

    private static void WriteCase(Utf8JsonWriter w, Evaluation evaluation, CaseResult c)
    {
        w.WriteStartObject();
        w.WriteString("name", c.Case.Name);
        if (c.Case.IsSweepPoint)
        {
            w.WriteStartObject("sweep");
            foreach (var v in c.Case.Sweep) Number(w, v.Name, v.Value);
            w.WriteEndObject();
        }
        w.WriteStartObject("nodes");
        foreach (var (point, v) in c.Points)
        {
            w.WriteStartObject(point);
            Phasor(w, "v", v);
            w.WriteEndObject();
        }
        w.WriteEndObject();

        w.WriteStartObject("sections");
        foreach (var s in c.Sections)
        {
            w.WriteStartObject(s.Section.Name);
            w.WriteString("winding", s.Winding.Name);
            w.WriteString("from", s.Section.FromPoint);
            w.WriteString("to", s.Section.ToPoint);
            Number(w, "turns", s.Section.Turns);
            Phasor(w, "i", s.Current);
            Number(w, "s", s.Apparent);
            if (s.Loading is { } loading) Number(w, "loading", loading);
            Number(w, "loss", s.Loss);
            if (s.CurrentDensity is { } density) Number(w, "currentDensity", density);
            w.WriteEndObject();
        }
        w.WriteEndObject();

        // A winding split by taps or a brush: its copper loss is the sum of its sections'.
        w.WriteStartObject("windings");
        foreach (var winding in c.Sections.GroupBy(s => s.Winding.Name))
        {
            w.WriteStartObject(winding.Key);
            Number(w, "loss", winding.Sum(s => s.Loss));
            w.WriteEndObject();
        }
        w.WriteEndObject();

        if (!c.Taps.IsEmpty)
        {
            w.WriteStartObject("taps");
            foreach (var t in c.Taps)
            {
                w.WriteStartObject(t.Point);
                w.WriteString("winding", t.Winding.Name);
                Phasor(w, "i", t.Current);
                w.WriteEndObject();
            }
            w.WriteEndObject();
        }

        if (!c.TapPositions.IsEmpty)
        {
            w.WriteStartObject("tapChangers");
            foreach (var t in c.TapPositions)
            {
                w.WriteStartObject(t.Changer.Name);
                w.WriteNumber("position", t.Position);
                w.WriteString("state", t.State switch { TapState.InBand => "in-band", TapState.AtLimit => "at-limit", TapState.Hunting => "hunting", TapState.Follows => "follows", TapState.Backwards => "wired-backwards", _ => "stated" });
                if (t.Relay is { } relay) Number(w, "relay", relay);
                if (t.Regulation is { } r)
                {
                    w.WriteStartObject("regulation");
                    w.WriteString("series", r.Series);
                    w.WriteString("shunt", r.Shunt);
                    Number(w, "range", r.Range);
                    Number(w, "currentMultiplier", r.Multiplier);
                    if (r.CurrentRating is { } rating) Number(w, "currentRating", rating);
                    Number(w, "current", r.Current);
                    w.WriteEndObject();
                }
                w.WriteEndObject();
            }
            w.WriteEndObject();
        }

        w.WriteStartObject("cores");
        foreach (var k in c.Cores)
        {
            w.WriteStartObject(k.Core.Name);
            if (k.VoltsPerTurn is { } e) Phasor(w, "voltsPerTurn", e);
            if (k.Flux is { } flux) Number(w, "flux", flux);
            if (k.LossKnown) Number(w, "loss", k.Loss);
            if (k.NoLoadCurrent is { } i0) Phasor(w, "noLoadCurrent", i0);
            w.WriteEndObject();
        }
        w.WriteEndObject();

        w.WriteStartObject("supplies");
        foreach (var s in c.Supplies)
        {
            w.WriteStartObject(s.Supply.Name);
            Phasor(w, "i", s.Current);
            Number(w, "p", s.Power.Real);
            Number(w, "q", s.Power.Imaginary);
            Number(w, "s", s.Power.Magnitude);
            Number(w, "pf", s.PowerFactor);
            w.WriteEndObject();
        }
        w.WriteEndObject();

        if (c.Fault is { } fault)
        {
            w.WriteStartObject("faults");
            w.WriteStartObject(fault.Fault.Name);
            Phasor(w, "i", fault.Current);
            Number(w, "peak", fault.Peak);
            if (double.IsFinite(fault.XR)) Number(w, "xr", fault.XR);
            Number(w, "peakFactor", fault.PeakFactor);
            w.WriteString("method", fault.Method == FaultMethod.AsLoaded ? "as-loaded" : "equivalent-source");
            if (fault.VoltageFactor is { } factor) Number(w, "c", factor);
            if (!fault.LoadsAsImpedance.IsEmpty)
            {
                w.WriteStartArray("loadsAsImpedance");
                foreach (var l in fault.LoadsAsImpedance) w.WriteStringValue(l.Name);
                w.WriteEndArray();
            }
            w.WriteEndObject();
            w.WriteEndObject();
            WriteBands(w, c);
            w.WriteEndObject();
            return;
        }
        if (c.ShortCircuit is { } sc)
        {
            FaultDutyReport.Json(w, sc);
            WriteBands(w, c);
            w.WriteEndObject();
            return;
        }

        w.WriteStartObject("loads");
        foreach (var l in c.Loads)
        {
            w.WriteStartObject(l.Load.Name);
            Phasor(w, "v", l.Voltage);
            Phasor(w, "i", l.Current);
            Number(w, "p", l.Power.Real);
            Number(w, "q", l.Power.Imaginary);
            if (l.Regulation is { } r) Number(w, "regulation", r);
            if (c.Connections.FirstOrDefault(x => x.Connection.Load == l.Load) is { } connection)
            {
                if (connection.CoRatio is { } coRatio) Number(w, "coRatio", coRatio);
                Number(w, "twoWindingRating", connection.TwoWindingRating);
            }
            w.WriteEndObject();
        }
        w.WriteEndObject();

        w.WriteStartObject("totals");
        Number(w, "copperLoss", c.Totals.CopperLoss);
        // Unknown without an open-circuit test of every core: null, never a misleading zero.
        if (c.Totals.CoreLossKnown) Number(w, "coreLoss", c.Totals.CoreLoss);
        else w.WriteNull("coreLoss");
        if (c.Totals.Efficiency is { } eff) Number(w, "efficiency", eff);
        Number(w, "throughput", c.Totals.Throughput);
        Number(w, "transformed", c.Totals.Transformed);
        if (c.Totals.MaxEfficiencyLoad is { } best) Number(w, "maxEfficiencyLoad", best);
        if (c.Totals.MaxEfficiencyFraction is { } fraction) Number(w, "maxEfficiencyFraction", fraction);
        if (c.Totals.MaxEfficiency is { } highest) Number(w, "maxEfficiency", highest);
        w.WriteEndObject();
        ThreePhaseReport.Json(w, c);

        if (c.Case == CaseSpec.Normal)
        {
            w.WriteStartArray("checks");
            foreach (var check in evaluation.Checks)
            {
                w.WriteStartObject();
                w.WriteNumber("line", evaluation.Text.GetPosition(check.Expect.Line.Start).Line);
                w.WriteBoolean("passed", check.Passed);
                if (check.Expect.Measure == MeasureKind.VectorGroup)
                {
                    if (check.Shown is { } shown) w.WriteString("found", shown);
                }
                else if (check.Value is { } v) Number(w, "value", v);
                if (check.Points > 1 || check.Min != check.Max)
                {
                    if (check.Min is { } min) Number(w, "min", min);
                    if (check.Max is { } max) Number(w, "max", max);
                    w.WriteNumber("points", check.Points);
                }
                if (!check.Failures.IsEmpty && check.Points > 1)
                {
                    w.WriteStartArray("failures");
                    foreach (var f in check.Failures) w.WriteStringValue(f);
                    w.WriteEndArray();
                    if (check.Failing > check.Failures.Length) w.WriteNumber("failing", check.Failing);
                }
                w.WriteString("text", check.Expect.Text);
                w.WriteEndObject();
            }
            w.WriteEndArray();
        }
        WriteBands(w, c);
        w.WriteEndObject();
    }

    /// <summary>Each result that varies over the tolerances, by its path in this case, to its range.</summary>
    private static void WriteBands(Utf8JsonWriter w, CaseResult c)
    {
        if (c.Bands.IsEmpty) return;
        w.WriteStartObject("bands");
        foreach (var b in c.Bands)
        {
            w.WriteStartObject(b.Path);
            Number(w, "min", b.Min);
            Number(w, "max", b.Max);
            w.WriteEndObject();
        }
        w.WriteEndObject();
    }

    internal static void Number(Utf8JsonWriter w, string name, double value)
    {
        w.WritePropertyName(name);
        w.WriteRawValue(Numbers.Json(value));
    }

    internal static void Phasor(Utf8JsonWriter w, string name, Complex v)
    {
        w.WriteStartObject(name);
        Number(w, "rms", v.Magnitude);
        var degrees = TextReport.Degrees(v);
        Number(w, "deg", Math.Abs(degrees) < 1e-9 ? 0 : degrees);
        w.WriteEndObject();
    }
}

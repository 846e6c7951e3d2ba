using WindingNotes.Kernel;
using WindingNotes.Model;
using System.Collections.Immutable;
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
            // A sweep's points from its columns, where the evaluation has them; they follow the other cases.
            var sweep = evaluation.SweepColumns;
            foreach (var c in evaluation.Cases)
                if (sweep is null || !c.Case.IsSweepPoint) WriteCase(w, evaluation, c);
            for (var i = 0; i < (sweep?.Count ?? 0); i++) WritePoint(w, sweep!, i);
            w.WriteEndArray();
            var study = new StudyResult(evaluation.Cases, evaluation.Checks) { Thermal = evaluation.Thermal, SequenceImpedances = evaluation.SequenceImpedances, Parallel = evaluation.Parallel };
            CaseLeaves.Fields(StudyResultTable.Study, study, new JsonLeaves(w));
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
        CaseLeaves.Walk(c, new JsonLeaves(w));
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
        WriteBands(w, c.Bands);
        w.WriteEndObject();
    }

    /// <summary>Kept point <paramref name="point"/> of a sweep, from its columns, as <see cref="WriteCase"/> writes its case.</summary>
    private static void WritePoint(Utf8JsonWriter w, SweepColumns sweep, int point)
    {
        w.WriteStartObject();
        w.WriteString("name", sweep.Name(point));
        w.WriteStartObject("sweep");
        foreach (var v in sweep.Points[point]) Number(w, v.Name, v.Value);
        w.WriteEndObject();
        sweep.Walk(point, new JsonLeaves(w));
        WriteBands(w, sweep.Bands(point));
        w.WriteEndObject();
    }

    /// <summary>The leaves of a case (or of the study) written as JSON: objects and arrays by their keys, a phasor as {rms, deg}.</summary>
    private sealed class JsonLeaves(Utf8JsonWriter w) : ICaseLeaves
    {
        // Whether each object or array open is an array: its elements are written without keys.
        private readonly Stack<bool> arrays = new();

        private void Key(string key)
        {
            if (arrays.Count == 0 || !arrays.Peek()) w.WritePropertyName(key);
        }

        public void Open(string key, bool array)
        {
            Key(key);
            if (array) w.WriteStartArray();
            else w.WriteStartObject();
            arrays.Push(array);
        }

        public void Close()
        {
            if (arrays.Pop()) w.WriteEndArray();
            else w.WriteEndObject();
        }

        public void Number(string key, ResultField field, double value)
        {
            Key(key);
            w.WriteRawValue(Numbers.Json(value));
        }

        public void Null(string key, ResultField field) => w.WriteNull(key);

        public void Integer(string key, ResultField field, int value)
        {
            Key(key);
            w.WriteNumberValue(value);
        }

        public void Word(string key, ResultField field, string value)
        {
            Key(key);
            w.WriteStringValue(value);
        }

        public void Boolean(string key, ResultField field, bool value)
        {
            Key(key);
            w.WriteBooleanValue(value);
        }

        public void Phasor(string key, ResultField field, Complex value)
        {
            Key(key);
            PhasorValue(w, value);
        }
    }

    /// <summary>Each result that varies over the tolerances, by its path in this case, to its range.</summary>
    private static void WriteBands(Utf8JsonWriter w, ImmutableArray<Band> bands)
    {
        if (bands.IsEmpty) return;
        w.WriteStartObject("bands");
        foreach (var b in bands)
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
        w.WritePropertyName(name);
        PhasorValue(w, v);
    }

    private static void PhasorValue(Utf8JsonWriter w, Complex v)
    {
        w.WriteStartObject();
        Number(w, "rms", v.Magnitude);
        var degrees = TextReport.Degrees(v);
        Number(w, "deg", Math.Abs(degrees) < 1e-9 ? 0 : degrees);
        w.WriteEndObject();
    }
}

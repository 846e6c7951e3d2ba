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
            var study = new StudyResult(evaluation.Cases, evaluation.Checks) { Thermal = evaluation.Thermal, SequenceImpedances = evaluation.SequenceImpedances, Parallel = evaluation.Parallel };
            WriteFields(w, StudyResultTable.Study, study);
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
        foreach (var group in ResultTable.Case.Concat(StudyResultTable.CaseParts)) WriteGroup(w, group, c);
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

    /// <summary>One group of the results table, by its elements' names (or one object), where the case has it.</summary>
    private static void WriteGroup(Utf8JsonWriter w, ResultGroup group, CaseResult c)
    {
        if (!group.When(c)) return;
        var items = group.Items(c).ToList();
        if (group.OmitWhenEmpty && items.Count == 0) return;
        w.WriteStartObject(group.Key);
        foreach (var (name, item) in items)
        {
            if (name is null)
            {
                WriteFields(w, group.Fields, item);
                continue;
            }
            w.WriteStartObject(name);
            WriteFields(w, group.Fields, item);
            w.WriteEndObject();
        }
        w.WriteEndObject();
    }

    /// <summary>An element's fields by their kind; a field the element lacks is absent (null where its kind says so).</summary>
    private static void WriteFields(Utf8JsonWriter w, IEnumerable<ResultField> fields, object item)
    {
        foreach (var f in fields)
        {
            var value = f.Read(item);
            if (value is null)
            {
                if (f.Kind == ResultKind.NumberOrNull) w.WriteNull(f.Key);
                continue;
            }
            w.WritePropertyName(f.Key);
            WriteValue(w, f, value);
        }
    }

    /// <summary>A value as its field's kind says.</summary>
    private static void WriteValue(Utf8JsonWriter w, ResultField f, object value)
    {
        switch (f.Kind)
        {
            case ResultKind.Number or ResultKind.NumberOrNull: w.WriteRawValue(Numbers.Json((double)value)); break;
            case ResultKind.Phasor: PhasorValue(w, (Complex)value); break;
            case ResultKind.Integer: w.WriteNumberValue((int)value); break;
            case ResultKind.Word or ResultKind.Choice: w.WriteStringValue((string)value); break;
            case ResultKind.Boolean: w.WriteBooleanValue((bool)value); break;
            case ResultKind.Names:
                w.WriteStartArray();
                foreach (var n in (IEnumerable<string>)value) w.WriteStringValue(n);
                w.WriteEndArray();
                break;
            case ResultKind.Sequence:
                var s = (Sequence)value;
                w.WriteStartObject();
                Phasor(w, "zero", s.Zero);
                Phasor(w, "positive", s.Positive);
                Phasor(w, "negative", s.Negative);
                w.WriteEndObject();
                break;
            case ResultKind.Object:
                w.WriteStartObject();
                WriteFields(w, f.Nested, value);
                w.WriteEndObject();
                break;
            case ResultKind.Map:
                w.WriteStartObject();
                foreach (var (name, element) in (IEnumerable<(string, object)>)value)
                {
                    if (f.Item!.Read(element) is not { } v) continue;
                    w.WritePropertyName(name);
                    WriteValue(w, f.Item, v);
                }
                w.WriteEndObject();
                break;
            case ResultKind.List:
                w.WriteStartArray();
                foreach (var element in (IEnumerable<object>)value)
                    if (f.Item!.Read(element) is { } v) WriteValue(w, f.Item, v);
                w.WriteEndArray();
                break;
        }
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

using System.Collections.Immutable;
using System.Text.Json;
using WindingNotes.Workspace;

namespace WindingNotes.Report;

/// <summary>
/// One number of the results: its case, the element it belongs to (<c>load planer</c>), its field
/// in the JSON report (<c>i.deg</c>) and the unit a person reads it in. For an angle, the magnitude
/// of its phasor comes along: the angle of a zero phasor means nothing.
/// </summary>
public sealed record ResultValue(string Case, string Element, string Field, string Unit, double Value, double? Magnitude = null)
{
    public string Label => $"{Element} {FieldLabel(Field)}".Trim();

    /// <summary>"current angle", "voltage", "copper loss", "regulation range": a field as a person says it, its label in the results table (a field of an object after the object's).</summary>
    public static string FieldLabel(string field)
    {
        var parts = field.Split('.');
        if (parts.Length > 1 && Objects.TryGetValue(parts[0], out var whole) && whole.Nested.FirstOrDefault(f => f.Key == parts[1]) is { } part)
            return $"{whole.Label} {part.Label}";
        var label = Solve.ResultTable.FieldNamed(parts[0])?.Label ?? ResultValues.Words(parts[0]);
        // The parts between (a sequence's component, a set's phase), not a phasor's rms or angle.
        var between = parts[1..(parts[^1] is "rms" or "deg" ? ^1 : ^0)];
        if (between.Length > 0) label = $"{label} {string.Join(' ', between.Select(ResultValues.Words))}";
        return parts.Length > 1 && parts[^1] == "deg" ? label + " angle" : label;
    }

    /// <summary>The fields of the results table that are objects of fields (a regulator's <c>regulation</c>), by key.</summary>
    private static readonly ImmutableDictionary<string, Solve.ResultField> Objects =
        Solve.ResultTable.Case.SelectMany(g => g.Fields).Where(f => f.Kind == Solve.ResultKind.Object).DistinctBy(f => f.Key).ToImmutableDictionary(f => f.Key);
}

/// <summary>
/// Every number of an evaluation, read from its JSON report so that whatever the report gains is
/// compared too, in the report's order. Checks and the swept inputs are left to their own comparison.
/// </summary>
public static class ResultValues
{
    /// <summary>How the element of a band's end begins: "band of node X1 voltage:".</summary>
    public const string BandOf = "band of ";

    /// <summary>What an element of each group of the report is called: every group of the results table, so a new group is compared without more, and the bands.</summary>
    private static readonly ImmutableDictionary<string, string> Groups =
        Solve.ResultTable.Case.Select(g => KeyValuePair.Create(g.Key, g.Element)).Append(KeyValuePair.Create("bands", BandOf.Trim())).ToImmutableDictionary();

    /// <summary>The groups that are one object (<c>totals</c>), not elements by name.</summary>
    private static readonly ImmutableHashSet<string> Single = [.. Solve.ResultTable.Case.Where(g => g.Single is not null).Select(g => g.Key)];

    public static ImmutableArray<ResultValue> Of(Evaluation evaluation)
    {
        using var json = JsonDocument.Parse(JsonReport.Write(evaluation));
        var values = ImmutableArray.CreateBuilder<ResultValue>();
        foreach (var c in json.RootElement.GetProperty("cases").EnumerateArray())
        {
            var name = c.GetProperty("name").GetString()!;
            foreach (var group in c.EnumerateObject())
            {
                if (group.Name == "busFault")
                {
                    // A bus fault's study: its currents, and each line's and winding's duty by name.
                    foreach (var p in group.Value.EnumerateObject())
                        if (p.Name is "lines" or "duties")
                            foreach (var e in p.Value.EnumerateObject()) Walk(values, name, $"bus fault {(p.Name == "lines" ? "line" : "winding")} {e.Name}", "", e.Value);
                        else Walk(values, name, "bus fault", p.Name, p.Value);
                    continue;
                }
                if (Solve.StudyResultTable.CaseParts.FirstOrDefault(g => g.Key == group.Name) is { } part)
                {
                    WalkFields(values, name, Words(part.Key), part.Fields, group.Value);
                    continue;
                }
                if (!Groups.TryGetValue(group.Name, out var kind)) continue;
                if (Single.Contains(group.Name))
                {
                    Walk(values, name, group.Name, "", group.Value);
                    continue;
                }
                foreach (var element in group.Value.EnumerateObject())
                {
                    if (group.Name == "bands") Walk(values, name, $"{kind} {Readable(element.Name)}:", "", element.Value, UnitOf(element.Name));
                    else Walk(values, name, $"{kind} {element.Name}", "", element.Value);
                }
            }
        }
        // The study's sections (the load cycle, sequence impedances, paralleled units) with the normal case.
        var sections = Solve.StudyResultTable.Study.Where(f => json.RootElement.TryGetProperty(f.Key, out _)).ToImmutableArray();
        foreach (var section in sections) WalkFields(values, "normal", "", [section], json.RootElement);
        return values.ToImmutable();
    }

    /// <summary>
    /// A part of the report described by the study's results table: each element of a map or list
    /// by its name or number, so a new field or part is compared without more.
    /// </summary>
    private static void WalkFields(ImmutableArray<ResultValue>.Builder values, string @case, string element, ImmutableArray<Solve.ResultField> fields, JsonElement value)
    {
        foreach (var field in fields)
        {
            if (!value.TryGetProperty(field.Key, out var v)) continue;
            var inner = $"{element} {Words(field.Label)}".Trim();
            switch (field)
            {
                case { Kind: Solve.ResultKind.Map, Item: { } item } when v.ValueKind == JsonValueKind.Object:
                    foreach (var e in v.EnumerateObject()) Element(values, @case, $"{inner} {e.Name}", item, e.Value);
                    break;
                case { Kind: Solve.ResultKind.List, Item: { } item } when v.ValueKind == JsonValueKind.Array:
                    var k = 0;
                    foreach (var e in v.EnumerateArray()) Element(values, @case, $"{inner} {++k}", item, e);
                    break;
                case { Kind: Solve.ResultKind.Object, Nested.IsEmpty: false }:
                    WalkFields(values, @case, inner, field.Nested, v);
                    break;
                default:
                    Walk(values, @case, element, field.Key, v, field.Unit);
                    break;
            }
        }
    }

    private static void Element(ImmutableArray<ResultValue>.Builder values, string @case, string element, Solve.ResultField item, JsonElement value)
    {
        if (item.Kind == Solve.ResultKind.Object && !item.Nested.IsEmpty) WalkFields(values, @case, element, item.Nested, value);
        else Walk(values, @case, element, "", value, item.Unit);
    }

    /// <summary>"vectorGroups" as "vector groups": a key of the report as a person says it.</summary>
    internal static string Words(string key) =>
        string.Concat(key.Select((ch, i) => char.IsUpper(ch) && i > 0 ? " " + char.ToLowerInvariant(ch) : ch.ToString()));

    private static void Walk(ImmutableArray<ResultValue>.Builder values, string @case, string element, string field, JsonElement value, string? unit = null)
    {
        switch (value.ValueKind)
        {
            case JsonValueKind.Object:
                foreach (var p in value.EnumerateObject())
                    Walk(values, @case, element, field.Length == 0 ? p.Name : $"{field}.{p.Name}", p.Value, unit);
                if (value.TryGetProperty("deg", out var deg) && deg.ValueKind == JsonValueKind.Number && value.TryGetProperty("rms", out var rms) && rms.ValueKind == JsonValueKind.Number)
                {
                    // The angle follows its magnitude, so a diff can ignore the angle of a zero phasor.
                    var i = values.Count - 1;
                    while (i >= 0 && values[i].Field != $"{field}.deg") i--;
                    if (i >= 0) values[i] = values[i] with { Magnitude = rms.GetDouble() };
                }
                break;
            case JsonValueKind.Number:
                values.Add(new ResultValue(@case, element, field, field.EndsWith("deg") ? "deg" : unit ?? UnitOf(field), value.GetDouble()));
                break;
        }
    }

    /// <summary>The unit of a field of the report, from its name in the results table: "%" marks a fraction shown as percent; a power factor has none.</summary>
    public static string UnitOf(string field)
    {
        var parts = field.Split('.');
        if (parts[^1] == "deg") return "deg";
        var name = parts.Length > 1 && parts[^1] is "rms" or "min" or "max" ? parts[^2] : parts[^1];
        return Solve.ResultTable.FieldNamed(name)?.Unit ?? "";
    }

    /// <summary>"sections.LV.i.rms" as "section LV current".</summary>
    public static string Readable(string path)
    {
        var parts = path.Split('.');
        if (parts.Length < 2) return path;
        if (Single.Contains(parts[0])) return ResultValue.FieldLabel(string.Join('.', parts[1..]));
        var kind = Groups.TryGetValue(parts[0], out var k) ? k : parts[0];
        return parts.Length < 3 ? $"{kind} {parts[1]}" : $"{kind} {parts[1]} {ResultValue.FieldLabel(string.Join('.', parts[2..]))}";
    }
}

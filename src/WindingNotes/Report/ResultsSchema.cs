using System.Text;
using WindingNotes.Solve;

namespace WindingNotes.Report;

/// <summary>
/// The parts of grammar/results.schema.json the results tables describe, written from them: each group
/// of <see cref="ResultTable"/> and each part of <see cref="StudyResultTable.CaseParts"/> is a property of
/// <c>$defs.case</c>, each section of <see cref="StudyResultTable.Study"/> a property of the report,
/// written in place; the rest of the file (the case's name, sweep, checks and bands, the diagnostics, the
/// shared <c>$defs</c>) is left as it is. A test keeps the file equal to it.
/// </summary>
public static class ResultsSchema
{
    private const string CaseLine = "    \"case\": {";
    private const string Indent = "        ";

    /// <summary>The schema file with every part the tables describe written from them; a part new to a table follows the one before it.</summary>
    public static string Written(string schema)
    {
        var lines = schema.Replace("\r\n", "\n").Split('\n').ToList();
        var start = lines.IndexOf(CaseLine);
        var caseBody = start < 0 ? -1 : lines.IndexOf("      \"properties\": {", start) + 1;
        if (caseBody <= 0) throw new FormatException("the schema has no $defs.case.properties");
        lines = InPlace(lines, caseBody, Indent, [.. ResultTable.Case.Concat(StudyResultTable.CaseParts).Select(g => (g.Key, Group(g)))]);
        var top = lines.IndexOf("  \"properties\": {") + 1;
        if (top <= 0) throw new FormatException("the schema has no properties");
        lines = InPlace(lines, top, "    ", [.. StudyResultTable.Study.Select(f => (f.Key, Property("    ", f.Key, f)))]);
        return string.Join('\n', lines);
    }

    /// <summary>
    /// The lines with the properties from <paramref name="body"/> on (each at <paramref name="indent"/>) that
    /// the table has written from it, in the file's order; those the file lacks follow the one before them in the table.
    /// </summary>
    private static List<string> InPlace(List<string> lines, int body, string indent, List<(string Key, List<string> Lines)> table)
    {
        var entries = new List<(string Key, List<string> Lines)>();
        var i = body;
        while (i < lines.Count && lines[i].StartsWith(indent + "\""))
        {
            var key = lines[i][(indent.Length + 1)..lines[i].IndexOf('"', indent.Length + 1)];
            var end = i;
            if (lines[i].TrimEnd(',').EndsWith('{'))
                while (end < lines.Count && lines[end] is var l && l != indent + "}" && l != indent + "},") end++;
            var entry = lines.GetRange(i, end - i + 1);
            entry[^1] = entry[^1].TrimEnd(',');
            entries.Add((key, entry));
            i = end + 1;
        }

        var generated = table.ToDictionary(t => t.Key, t => t.Lines);
        var written = new List<List<string>>();
        var pending = new Queue<string>(table.Select(t => t.Key));
        foreach (var (key, entry) in entries)
        {
            if (!generated.ContainsKey(key))
            {
                written.Add(entry);
                continue;
            }
            // Parts of the table the file lacks, up to this one, in the table's order.
            while (pending.TryDequeue(out var next))
            {
                written.Add(generated[next]);
                if (next == key) break;
            }
        }
        while (pending.TryDequeue(out var rest)) written.Add(generated[rest]);

        var o = lines.Take(body).ToList();
        for (var k = 0; k < written.Count; k++)
            for (var j = 0; j < written[k].Count; j++)
                o.Add(written[k][j] + (j == written[k].Count - 1 && k < written.Count - 1 ? "," : ""));
        o.AddRange(lines.Skip(i));
        return o;
    }

    private static List<string> Group(ResultGroup group)
    {
        var o = new List<string>();
        if (group.Single is not null)
        {
            Object(o, Indent, group.Key, group.Description, group.Fields);
            return o;
        }
        o.Add($"{Indent}{Quote(group.Key)}: {{");
        o.Add($"{Indent}  \"type\": \"object\",");
        if (group.Description.Length > 0) o.Add($"{Indent}  \"description\": {Quote(group.Description)},");
        Object(o, Indent + "  ", "additionalProperties", "", group.Fields);
        o.Add($"{Indent}}}");
        return o;
    }

    /// <summary>An object of fields, none but these allowed, the required ones required.</summary>
    private static void Object(List<string> o, string indent, string key, string description, IEnumerable<ResultField> fields)
    {
        var list = fields.ToList();
        o.Add($"{indent}{Quote(key)}: {{");
        o.Add($"{indent}  \"type\": \"object\",");
        if (description.Length > 0) o.Add($"{indent}  \"description\": {Quote(description)},");
        var required = list.Where(f => f.Required).Select(f => Quote(f.Key)).ToList();
        if (required.Count > 0) o.Add($"{indent}  \"required\": [{string.Join(", ", required)}],");
        o.Add($"{indent}  \"additionalProperties\": false,");
        o.Add($"{indent}  \"properties\": {{");
        for (var k = 0; k < list.Count; k++)
        {
            o.AddRange(Property(indent + "    ", list[k].Key, list[k]));
            if (k < list.Count - 1) o[^1] += ",";
        }
        o.Add($"{indent}  }}");
        o.Add($"{indent}}}");
    }

    /// <summary>A field's schema as the property <paramref name="name"/> (its key, or "additionalProperties" and "items" for the elements of a map or list).</summary>
    private static List<string> Property(string indent, string name, ResultField f)
    {
        var o = new List<string>();
        var description = f.Description.Length > 0 ? $"{indent}  \"description\": {Quote(f.Description)}," : null;
        switch (f.Kind)
        {
            case ResultKind.Object:
                Object(o, indent, name, f.Description, f.Nested);
                break;
            case ResultKind.Map or ResultKind.List:
                o.Add($"{indent}{Quote(name)}: {{");
                o.Add($"{indent}  \"type\": {(f.Kind == ResultKind.Map ? "\"object\"" : "\"array\"")},");
                if (description is not null) o.Add(description);
                if (!f.Choices.IsEmpty) o.Add($"{indent}  \"propertyNames\": {{ \"enum\": [{string.Join(", ", f.Choices.Select(Quote))}] }},");
                o.AddRange(Property(indent + "  ", f.Kind == ResultKind.Map ? "additionalProperties" : "items", f.Item!));
                o.Add($"{indent}}}");
                break;
            default:
                o.Add($"{indent}{Quote(name)}: {{ {Type(f)}{(f.Description.Length > 0 ? $", \"description\": {Quote(f.Description)}" : "")} }}");
                break;
        }
        return o;
    }

    private static string Type(ResultField f) => f.Kind switch
    {
        ResultKind.Number => "\"$ref\": \"#/$defs/value\"",
        ResultKind.NumberOrNull => "\"anyOf\": [{ \"$ref\": \"#/$defs/value\" }, { \"type\": \"null\" }]",
        ResultKind.Phasor => "\"$ref\": \"#/$defs/phasor\"",
        ResultKind.Integer => "\"type\": \"integer\"" + (f.Minimum is { } min ? $", \"minimum\": {min}" : "") + (f.Maximum is { } max ? $", \"maximum\": {max}" : ""),
        ResultKind.Boolean => "\"type\": \"boolean\"",
        ResultKind.Sequence => "\"$ref\": \"#/$defs/sequence\"",
        ResultKind.Word => "\"type\": \"string\"",
        ResultKind.Choice => $"\"enum\": [{string.Join(", ", f.Choices.Select(Quote))}]",
        ResultKind.Names => "\"type\": \"array\", \"items\": { \"type\": \"string\" }",
        _ => throw new ArgumentOutOfRangeException(nameof(f), f.Kind, null),
    };

    /// <summary>A JSON string; other characters stay as they are, as the file is UTF-8.</summary>
    private static string Quote(string text)
    {
        var o = new StringBuilder("\"");
        foreach (var ch in text)
        {
            if (ch is '"' or '\\') o.Append('\\').Append(ch);
            else if (ch < ' ') o.Append($"\\u{(int)ch:x4}");
            else o.Append(ch);
        }
        return o.Append('"').ToString();
    }
}

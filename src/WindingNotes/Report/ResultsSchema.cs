using System.Text;
using WindingNotes.Solve;

namespace WindingNotes.Report;

/// <summary>
/// The case part of grammar/results.schema.json, written from <see cref="ResultTable"/>: each group
/// of the table is a property of <c>$defs.case</c>, written in place, and the rest of the file (the
/// parts of the report written beside the table) is left as it is. A test keeps the file equal to it.
/// </summary>
public static class ResultsSchema
{
    private const string CaseLine = "    \"case\": {";
    private const string PropertiesLine = "      \"properties\": {";
    private const string Indent = "        ";

    /// <summary>The schema file with every group of the results table written from the table; a group new to the table follows the one before it.</summary>
    public static string WithCase(string schema)
    {
        var lines = schema.Replace("\r\n", "\n").Split('\n').ToList();
        var start = lines.IndexOf(CaseLine);
        var body = start < 0 ? -1 : lines.IndexOf(PropertiesLine, start) + 1;
        if (body <= 0) throw new FormatException("the schema has no $defs.case.properties");
        var entries = new List<(string Key, List<string> Lines)>();
        var i = body;
        while (i < lines.Count && lines[i].StartsWith(Indent + "\""))
        {
            var key = lines[i][(Indent.Length + 1)..lines[i].IndexOf('"', Indent.Length + 1)];
            var end = i;
            if (lines[i].TrimEnd(',').EndsWith('{'))
                while (end < lines.Count && lines[end] is not (Indent + "}" or Indent + "},")) end++;
            var entry = lines.GetRange(i, end - i + 1);
            entry[^1] = entry[^1].TrimEnd(',');
            entries.Add((key, entry));
            i = end + 1;
        }

        var table = ResultTable.Case.ToDictionary(g => g.Key, Group);
        var written = new List<(string Key, List<string> Lines)>();
        var pending = new Queue<string>(ResultTable.Case.Select(g => g.Key));
        foreach (var (key, entry) in entries)
        {
            if (!table.TryGetValue(key, out var generated))
            {
                written.Add((key, entry));
                continue;
            }
            // Groups of the table the file lacks, up to this one, in the table's order.
            while (pending.TryDequeue(out var next))
            {
                written.Add((next, table[next]));
                if (next == key) break;
            }
        }
        while (pending.TryDequeue(out var rest)) written.Add((rest, table[rest]));

        var o = new StringBuilder();
        foreach (var line in lines.Take(body)) o.Append(line).Append('\n');
        for (var k = 0; k < written.Count; k++)
        {
            var entry = written[k].Lines;
            for (var j = 0; j < entry.Count; j++)
                o.Append(entry[j]).Append(j == entry.Count - 1 && k < written.Count - 1 ? "," : "").Append('\n');
        }
        o.Append(string.Join('\n', lines.Skip(i)));
        return o.ToString();
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
            var f = list[k];
            var comma = k < list.Count - 1 ? "," : "";
            if (f.Kind == ResultKind.Object)
            {
                Object(o, indent + "    ", f.Key, f.Description, f.Nested);
                o[^1] += comma;
                continue;
            }
            o.Add($"{indent}    {Quote(f.Key)}: {{ {Type(f)}{(f.Description.Length > 0 ? $", \"description\": {Quote(f.Description)}" : "")} }}{comma}");
        }
        o.Add($"{indent}  }}");
        o.Add($"{indent}}}");
    }

    private static string Type(ResultField f) => f.Kind switch
    {
        ResultKind.Number => "\"$ref\": \"#/$defs/value\"",
        ResultKind.NumberOrNull => "\"anyOf\": [{ \"$ref\": \"#/$defs/value\" }, { \"type\": \"null\" }]",
        ResultKind.Phasor => "\"$ref\": \"#/$defs/phasor\"",
        ResultKind.Integer => "\"type\": \"integer\"",
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

using System.Numerics;

namespace WindingNotes.Solve;

/// <summary>One number of a case, by its path in the JSON report ("sections.LV.i.rms") and the unit it is shown in ("%" for fractions).</summary>
public readonly record struct CaseValue(string Path, double Value, string Unit);

/// <summary>
/// Every number of a case that can vary, as the JSON report names it, in the report's order: the
/// fields of <see cref="ResultTable"/> and <see cref="StudyResultTable.CaseParts"/> marked for bands,
/// inside objects and maps too ("busFault.duties.HV.i"). Bands are kept by these paths. Angles are
/// left out: a range of angles across ±180° has no plain reading. A test checks that each path
/// names the same number in the JSON report.
/// </summary>
public static class CaseValues
{
    public static IEnumerable<CaseValue> Of(CaseResult c)
    {
        foreach (var group in ResultTable.Case.Concat(StudyResultTable.CaseParts))
        {
            if (!group.Fields.Any(HasBand) || !group.When(c)) continue;
            foreach (var (name, item) in group.Items(c))
                foreach (var v in Values(name is null ? group.Key : $"{group.Key}.{name}", group.Fields, item)) yield return v;
        }
    }

    /// <summary>Whether the field, or a field inside it, is kept over the tolerances.</summary>
    private static bool HasBand(ResultField f) => f.Band || f.Nested.Any(HasBand) || f.Item is { } item && HasBand(item);

    private static IEnumerable<CaseValue> Values(string path, IEnumerable<ResultField> fields, object item)
    {
        foreach (var field in fields)
            if (HasBand(field))
                foreach (var v in Value($"{path}.{field.Key}", field, field.Read(item))) yield return v;
    }

    private static IEnumerable<CaseValue> Value(string path, ResultField field, object? value)
    {
        switch (value)
        {
            case null: yield break;
            case Complex v when field.Band: yield return new($"{path}.rms", v.Magnitude, field.Unit); break;
            case double v when field.Band: yield return new(path, v, field.Unit); break;
            case int v when field.Band: yield return new(path, v, field.Unit); break;
        }
        var inner = field.Kind switch
        {
            ResultKind.Object => Values(path, field.Nested, value),
            ResultKind.Map => ((IEnumerable<(string Name, object Element)>)value).SelectMany(e => Value($"{path}.{e.Name}", field.Item!, field.Item!.Read(e.Element))),
            _ => [],
        };
        foreach (var v in inner) yield return v;
    }
}

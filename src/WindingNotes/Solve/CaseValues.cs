using System.Numerics;

namespace WindingNotes.Solve;

/// <summary>One number of a case, by its path in the JSON report ("sections.LV.i.rms") and the unit it is shown in ("%" for fractions).</summary>
public readonly record struct CaseValue(string Path, double Value, string Unit);

/// <summary>
/// Every number of a case that can vary, as the JSON report names it, in the report's order: the
/// fields of <see cref="ResultTable"/> marked for bands. Bands are kept by these paths. Angles are
/// left out: a range of angles across ±180° has no plain reading. A test checks that each path
/// names the same number in the JSON report.
/// </summary>
public static class CaseValues
{
    public static IEnumerable<CaseValue> Of(CaseResult c)
    {
        foreach (var group in ResultTable.Case)
        {
            if (!group.When(c)) continue;
            foreach (var (name, item) in group.Items(c))
            {
                var key = name is null ? group.Key : $"{group.Key}.{name}";
                foreach (var field in group.Fields)
                {
                    if (!field.Band) continue;
                    switch (field.Read(item))
                    {
                        case Complex v: yield return new($"{key}.{field.Key}.rms", v.Magnitude, field.Unit); break;
                        case double v: yield return new($"{key}.{field.Key}", v, field.Unit); break;
                        case int v: yield return new($"{key}.{field.Key}", v, field.Unit); break;
                    }
                }
            }
        }
    }
}

using System.Collections.Immutable;
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
        var paths = new PathSink();
        Walk(c, paths);
        return paths.Values;
    }

    /// <summary>
    /// Where a walk of a case's numbers is: <see cref="Enter"/> a part of the path ("loads", "heater",
    /// "v", "rms"), <see cref="Here"/> a number at the path entered, <see cref="Leave"/> the part.
    /// A sweep's columns find each number's column from these parts without writing its path out.
    /// </summary>
    internal interface ISink
    {
        void Enter(string part);
        void Here(double value, string unit);
        void Leave();
    }

    /// <summary>Every number of <see cref="Of"/>, in its order, told to <paramref name="sink"/> by the parts of its path.</summary>
    internal static void Walk(CaseResult c, ISink sink)
    {
        foreach (var group in Banded)
        {
            if (!group.When(c)) continue;
            sink.Enter(group.Key);
            foreach (var (name, item) in group.Items(c))
            {
                if (name is not null) sink.Enter(name);
                Fields(group.Fields, item, sink);
                if (name is not null) sink.Leave();
            }
            sink.Leave();
        }
    }

    /// <summary>The groups with a field kept over the tolerances, in the report's order.</summary>
    private static readonly ResultGroup[] Banded = [.. ResultTable.Case.Concat(StudyResultTable.CaseParts).Where(g => g.Fields.Any(HasBand))];

    /// <summary>Whether the field, or a field inside it, is kept over the tolerances.</summary>
    private static bool HasBand(ResultField f)
    {
        if (f.Band || f.Item is { } item && HasBand(item)) return true;
        foreach (var n in f.Nested)
            if (HasBand(n)) return true;
        return false;
    }

    // An array, not IEnumerable: enumerating it as an interface would box it at every element of every point.
    private static void Fields(ImmutableArray<ResultField> fields, object item, ISink sink)
    {
        foreach (var field in fields)
            if (HasBand(field))
            {
                sink.Enter(field.Key);
                Value(field, field.Read(item), sink);
                sink.Leave();
            }
    }

    private static void Value(ResultField field, object? value, ISink sink)
    {
        switch (value)
        {
            case null: return;
            case Complex v when field.Band:
                sink.Enter("rms");
                sink.Here(v.Magnitude, field.Unit);
                sink.Leave();
                break;
            case double v when field.Band: sink.Here(v, field.Unit); break;
            case int v when field.Band: sink.Here(v, field.Unit); break;
        }
        switch (field.Kind)
        {
            case ResultKind.Object: Fields(field.Nested, value, sink); break;
            case ResultKind.Map:
                foreach (var (name, element) in (IEnumerable<(string Name, object Element)>)value)
                {
                    sink.Enter(name);
                    Value(field.Item!, field.Item!.Read(element), sink);
                    sink.Leave();
                }
                break;
        }
    }

    /// <summary>The numbers with their paths written out, "sections.LV.i.rms".</summary>
    private sealed class PathSink : ISink
    {
        private readonly List<string> parts = [];

        public List<CaseValue> Values { get; } = [];

        public void Enter(string part) => parts.Add(part);

        public void Here(double value, string unit) => Values.Add(new CaseValue(string.Join(".", parts), value, unit));

        public void Leave() => parts.RemoveAt(parts.Count - 1);
    }
}

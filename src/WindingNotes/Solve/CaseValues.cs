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
        CaseLeaves.Walk(c, paths, banded: true);
        return paths.Values;
    }

    /// <summary>The banded numbers of a walk with their paths written out, "sections.LV.i.rms"; a phasor's is its rms value.</summary>
    private sealed class PathSink : ICaseLeaves
    {
        private readonly List<string> parts = [];

        public List<CaseValue> Values { get; } = [];

        public void Open(string key, bool array) => parts.Add(key);

        public void Close() => parts.RemoveAt(parts.Count - 1);

        public void Number(string key, ResultField field, double value) => Here(key, field, value);

        public void Integer(string key, ResultField field, int value) => Here(key, field, value);

        public void Phasor(string key, ResultField field, Complex value)
        {
            if (field.Band) Values.Add(new CaseValue($"{string.Join(".", parts.Append(key))}.rms", value.Magnitude, field.Unit));
        }

        public void Null(string key, ResultField field) { }

        public void Word(string key, ResultField field, string value) { }

        public void Boolean(string key, ResultField field, bool value) { }

        private void Here(string key, ResultField field, double value)
        {
            if (field.Band) Values.Add(new CaseValue(string.Join(".", parts.Append(key)), value, field.Unit));
        }
    }
}

using System.Collections.Immutable;
using System.Numerics;

namespace WindingNotes.Solve;

/// <summary>
/// Told every leaf of a case as the JSON report writes it, in its order: <see cref="Open"/> an
/// object or array by its key (an array's elements by their index), a value of each kind, and
/// <see cref="Close"/>. The field is the results table's, for its unit and whether it is banded;
/// a sequence's phasors and a list's names are told with their field.
/// </summary>
public interface ICaseLeaves
{
    void Open(string key, bool array);
    void Close();
    void Number(string key, ResultField field, double value);
    /// <summary>A <see cref="ResultKind.NumberOrNull"/> field whose value is unknown: written null, never left out.</summary>
    void Null(string key, ResultField field);
    void Integer(string key, ResultField field, int value);
    void Word(string key, ResultField field, string value);
    void Boolean(string key, ResultField field, bool value);
    void Phasor(string key, ResultField field, Complex value);
}

/// <summary>
/// The walk of every leaf of a case the JSON report writes (the groups of <see cref="ResultTable.Case"/>
/// and <see cref="StudyResultTable.CaseParts"/>, each field as its kind says): the JSON report writes
/// a case by it, and a sweep's columns keep each kept point by it and give it back
/// (<see cref="SweepColumns.Walk"/>), so both write the same bytes.
/// </summary>
public static class CaseLeaves
{
    /// <summary>The groups of a case, in the report's order.</summary>
    public static readonly ImmutableArray<ResultGroup> Groups = [.. ResultTable.Case.Concat(StudyResultTable.CaseParts)];

    /// <summary>
    /// Every leaf of <paramref name="c"/>; with <paramref name="banded"/>, only the leaves kept over
    /// the tolerances (and the objects holding them); with <paramref name="shown"/>, each element's
    /// values of its sweep tables' own columns too (a tap changer's position with its state), as
    /// leaves the JSON report does not write (<see cref="IsShown"/>).
    /// </summary>
    public static void Walk(CaseResult c, ICaseLeaves sink, bool banded = false, bool shown = false)
    {
        for (var g = 0; g < Groups.Length; g++)
        {
            var group = Groups[g];
            if (banded && !Banded[g] || !group.When(c)) continue;
            var opened = false;
            // The group's elements as it gives them (not through ResultGroup.Items' projection: this walk runs at every sweep point).
            if (group.Single is { } single) Element(null, single(c));
            else
                foreach (var (name, item) in group.Elements!(c)) Element(name, item);
            if (!opened && !group.OmitWhenEmpty)
            {
                sink.Open(group.Key, false);
                opened = true;
            }
            if (opened) sink.Close();

            void Element(string? name, object item)
            {
                if (!opened) sink.Open(group.Key, false);
                opened = true;
                if (name is not null) sink.Open(name, false);
                Fields(group.Fields, item, sink, banded);
                if (shown)
                    foreach (var field in Shown[g])
                        switch (field.Read(item))
                        {
                            case double v: sink.Number(field.Key, field, v); break;
                            case Complex v: sink.Phasor(field.Key, field, v); break;
                            case int v: sink.Integer(field.Key, field, v); break;
                            case string v: sink.Word(field.Key, field, v); break;
                            case bool v: sink.Boolean(field.Key, field, v); break;
                        }
                if (name is not null) sink.Close();
            }
        }
    }

    /// <summary>An element's fields by their kind; a field the element lacks is absent (null where its kind says so).</summary>
    public static void Fields(ImmutableArray<ResultField> fields, object item, ICaseLeaves sink, bool banded = false)
    {
        foreach (var f in fields)
        {
            if (banded && !HasBand(f)) continue;
            if (Typed(f.Key, f, item, sink)) continue;
            var value = f.Read(item);
            if (value is null)
            {
                if (f.Kind == ResultKind.NumberOrNull) sink.Null(f.Key, f);
                continue;
            }
            Value(f.Key, f, value, sink, banded);
        }
    }

    private static void Value(string key, ResultField f, object value, ICaseLeaves sink, bool banded)
    {
        switch (f.Kind)
        {
            case ResultKind.Number or ResultKind.NumberOrNull: sink.Number(key, f, (double)value); break;
            case ResultKind.Phasor: sink.Phasor(key, f, (Complex)value); break;
            case ResultKind.Integer: sink.Integer(key, f, (int)value); break;
            case ResultKind.Word or ResultKind.Choice: sink.Word(key, f, (string)value); break;
            case ResultKind.Boolean: sink.Boolean(key, f, (bool)value); break;
            case ResultKind.Names:
                sink.Open(key, true);
                var n = 0;
                foreach (var name in (IEnumerable<string>)value) sink.Word(Index(n++), f, name);
                sink.Close();
                break;
            case ResultKind.Sequence:
                var s = (Sequence)value;
                sink.Open(key, false);
                sink.Phasor("zero", f, s.Zero);
                sink.Phasor("positive", f, s.Positive);
                sink.Phasor("negative", f, s.Negative);
                sink.Close();
                break;
            case ResultKind.Object:
                sink.Open(key, false);
                Fields(f.Nested, value, sink, banded);
                sink.Close();
                break;
            case ResultKind.Map:
                sink.Open(key, false);
                foreach (var (name, element) in (IEnumerable<(string, object)>)value)
                    if (!Typed(name, f.Item!, element, sink) && f.Item!.Read(element) is { } v) Value(name, f.Item, v, sink, banded);
                sink.Close();
                break;
            case ResultKind.List:
                sink.Open(key, true);
                var k = 0;
                foreach (var element in (IEnumerable<object>)value)
                {
                    if (f.Item!.ReadNumber is not null || f.Item.ReadPhasor is not null)
                    {
                        // Told with the next index only where it has a value, as below.
                        if (f.Item.ReadNumber?.Invoke(element) is { } number) sink.Number(Index(k++), f.Item, number);
                        else if (f.Item.ReadPhasor?.Invoke(element) is { } phasor) sink.Phasor(Index(k++), f.Item, phasor);
                        continue;
                    }
                    if (f.Item.Read(element) is { } v) Value(Index(k++), f.Item, v, sink, banded);
                }
                sink.Close();
                break;
        }
    }

    /// <summary>
    /// A number or phasor told by its typed read (<see cref="ResultField.ReadNumber"/>), nothing boxed;
    /// false for a field without one. A value the element lacks is left out, as by <see cref="ResultField.Read"/>.
    /// </summary>
    private static bool Typed(string key, ResultField f, object item, ICaseLeaves sink)
    {
        if (f.ReadNumber is { } number)
        {
            if (number(item) is { } v) sink.Number(key, f, v);
            else if (f.Kind == ResultKind.NumberOrNull) sink.Null(key, f);
            return true;
        }
        if (f.ReadPhasor is { } phasor)
        {
            if (phasor(item) is { } v) sink.Phasor(key, f, v);
            return true;
        }
        return false;
    }

    private static readonly string[] Indices = [.. Enumerable.Range(0, 64).Select(i => i.ToString(System.Globalization.CultureInfo.InvariantCulture))];

    /// <summary>An array element's key: its index.</summary>
    private static string Index(int i) => i < Indices.Length ? Indices[i] : i.ToString(System.Globalization.CultureInfo.InvariantCulture);

    /// <summary>Whether a leaf is a sweep table's own value, not written in the JSON report.</summary>
    public static bool IsShown(string key) => key.StartsWith('\u0001');

    /// <summary>The key of the leaf of a group's sweep table <paramref name="table"/>, column <paramref name="column"/>, where the column has its own value.</summary>
    public static string ShownKey(int table, int column) => $"\u0001{table}.{column}";

    /// <summary>Each group's sweep tables' own columns (<see cref="ResultColumn.Read"/>), as fields keyed by <see cref="ShownKey"/>.</summary>
    private static readonly ImmutableArray<ResultField>[] Shown = [.. Groups.Select(g => g.Sweep.SelectMany((table, t) => table.Columns
        .Select((column, i) => (column, i)).Where(x => x.column.Read is not null)
        .Select(x => new ResultField(ShownKey(t, x.i), ResultKind.Word, x.column.Unit, "", x.column.Read!))).ToImmutableArray())];

    /// <summary>The groups with a field kept over the tolerances.</summary>
    private static readonly bool[] Banded = [.. Groups.Select(g => g.Fields.Any(HasBand))];

    /// <summary>Whether the field, or a field inside it, is kept over the tolerances.</summary>
    internal static bool HasBand(ResultField f)
    {
        if (f.Band || f.Item is { } item && HasBand(item)) return true;
        foreach (var n in f.Nested)
            if (HasBand(n)) return true;
        return false;
    }
}

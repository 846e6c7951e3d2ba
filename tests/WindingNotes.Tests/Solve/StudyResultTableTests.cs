using System.Numerics;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// The table of a case's parts after its groups and of the study's sections is well formed: every value
/// it reads has the type its kind says (the JSON writer casts by kind), a choice is one of its choices,
/// and a required field is there.
/// </summary>
public class StudyResultTableTests
{
    private static bool Fits(ResultField f, object? value) => value switch
    {
        null => !f.Required || f.Kind == ResultKind.NumberOrNull,
        double => f.Kind is ResultKind.Number or ResultKind.NumberOrNull,
        Complex => f.Kind == ResultKind.Phasor,
        int => f.Kind == ResultKind.Integer,
        bool => f.Kind == ResultKind.Boolean,
        string s => f.Kind == ResultKind.Word || f.Kind == ResultKind.Choice && f.Choices.Contains(s),
        Sequence => f.Kind == ResultKind.Sequence,
        IEnumerable<(string, object)> => f.Kind == ResultKind.Map,
        IEnumerable<string> => f.Kind == ResultKind.Names,
        IEnumerable<object> => f.Kind == ResultKind.List,
        _ => f.Kind == ResultKind.Object,
    };

    /// <summary>Each value under a field, checked against its kind, down to the numbers.</summary>
    private static void Check(string path, ResultField f, object? value)
    {
        Assert.True(Fits(f, value), $"{path}: {value?.GetType().Name ?? "null"} is not a {f.Kind}");
        switch (f.Kind)
        {
            case ResultKind.Object when value is not null:
                foreach (var n in f.Nested) Check($"{path}.{n.Key}", n, n.Read(value));
                break;
            case ResultKind.Map when value is not null:
                Assert.True(f.Choices.IsEmpty || ((IEnumerable<(string Name, object)>)value).All(e => f.Choices.Contains(e.Name)), path);
                foreach (var (name, element) in (IEnumerable<(string, object)>)value) Check($"{path}.{name}", f.Item!, f.Item!.Read(element));
                break;
            case ResultKind.List when value is not null:
                foreach (var (element, k) in ((IEnumerable<object>)value).Select((e, k) => (e, k))) Check($"{path}[{k}]", f.Item!, f.Item!.Read(element));
                break;
        }
    }

    private static void CheckAll(string name, Evaluation e)
    {
        var study = new StudyResult(e.Cases, e.Checks) { Thermal = e.Thermal, SequenceImpedances = e.SequenceImpedances, Parallel = e.Parallel };
        foreach (var f in StudyResultTable.Study) Check($"{name}: {f.Key}", f, f.Read(study));
        foreach (var c in e.Cases)
            foreach (var group in StudyResultTable.CaseParts.Where(g => g.When(c)))
            {
                var item = group.Single!(c);
                foreach (var f in group.Fields) Check($"{name}, {c.Case.Name}: {group.Key}.{f.Key}", f, f.Read(item));
            }
    }

    [Fact]
    public void A_fields_kind_is_what_it_reads_in_every_example()
    {
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn"))
            CheckAll(Path.GetFileName(file), Wn.Eval(File.ReadAllText(file)));
    }

    [Fact]
    public void A_fields_kind_is_what_it_reads_for_paralleled_units()
    {
        var e = Wn.Solved(ParallelUnitTests.Pair("492 V", "6 %"));
        Assert.NotEmpty(e.Parallel);
        CheckAll("paralleled pair", e);
    }

    [Fact]
    public void Keys_are_unique_in_each_object()
    {
        void Unique(string path, IEnumerable<ResultField> fields)
        {
            var list = fields.ToList();
            Assert.True(list.Count == list.Select(f => f.Key).Distinct().Count(), path);
            foreach (var f in list)
            {
                if (f.Kind == ResultKind.Object) Unique($"{path}.{f.Key}", f.Nested);
                for (var item = f.Item; item is not null; item = item.Item)
                    if (item.Kind == ResultKind.Object) Unique($"{path}.{f.Key}", item.Nested);
            }
        }
        Unique("study", StudyResultTable.Study);
        foreach (var group in StudyResultTable.CaseParts) Unique(group.Key, group.Fields);
        Assert.Empty(StudyResultTable.CaseParts.Select(g => g.Key).Intersect(ResultTable.Case.Select(g => g.Key)));
    }
}

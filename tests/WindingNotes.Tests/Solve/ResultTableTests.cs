using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>The results table is well formed: what the reports and the diff read from it by a field's key means one thing.</summary>
public class ResultTableTests
{
    private static IEnumerable<ResultField> AllFields() =>
        ResultTable.Case.SelectMany(g => g.Fields).SelectMany(f => f.Nested.Prepend(f));

    [Fact]
    public void Fields_of_one_key_share_their_unit_and_label()
    {
        // The diff knows a value only by its key ("i.rms"), so "i" must be a current in amperes in every group
        // (a tap changer's 'regulation' is an object of values, not one, so a load's regulation is a fraction).
        foreach (var key in AllFields().Where(f => f.Kind != ResultKind.Object).GroupBy(f => f.Key))
        {
            Assert.Single(key.Select(f => f.Unit).Distinct());
            Assert.Single(key.Select(f => f.Label).Distinct());
        }
    }

    [Fact]
    public void Keys_are_unique_in_a_group_and_every_column_shows_a_field_or_its_own_value()
    {
        Assert.Equal(ResultTable.Case.Length, ResultTable.Case.Select(g => g.Key).Distinct().Count());
        foreach (var group in ResultTable.Case)
        {
            Assert.Equal(group.Fields.Length, group.Fields.Select(f => f.Key).Distinct().Count());
            foreach (var column in group.Columns)
                Assert.True(column.Read is not null ^ group.Fields.Any(f => f.Key == column.Field), $"{group.Key}: column '{column.Header}'");
            Assert.True(group.Columns.IsEmpty || group.Element.Length > 0 && group.Heading.Length > 0, group.Key);
        }
    }

    [Fact]
    public void A_fields_kind_is_what_it_reads()
    {
        // Every example's values, read through the table, have the type their kind says; the JSON writer casts by kind.
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn"))
        {
            var name = Path.GetFileName(file);
            var evaluation = Wn.Eval(File.ReadAllText(file));
            foreach (var c in evaluation.Cases)
                foreach (var group in ResultTable.Case.Where(g => g.When(c)))
                    foreach (var (_, item) in group.Items(c))
                        foreach (var f in group.Fields)
                            Assert.True(f.Read(item) switch
                            {
                                null => !f.Required || f.Kind == ResultKind.NumberOrNull,
                                double => f.Kind is ResultKind.Number or ResultKind.NumberOrNull,
                                System.Numerics.Complex => f.Kind == ResultKind.Phasor,
                                int => f.Kind == ResultKind.Integer,
                                string => f.Kind is ResultKind.Word or ResultKind.Choice,
                                IEnumerable<string> => f.Kind == ResultKind.Names,
                                _ => f.Kind == ResultKind.Object,
                            }, $"{name}: {group.Key}.{f.Key}");
        }
    }

    [Fact]
    public void The_diff_reads_units_and_labels_from_the_table()
    {
        Assert.Equal("%", ResultValues.UnitOf("loading"));
        Assert.Equal("A", ResultValues.UnitOf("sections.LV.i.rms"));
        Assert.Equal("deg", ResultValues.UnitOf("i.deg"));
        Assert.Equal("VA", ResultValues.UnitOf("maxEfficiencyLoad"));
        Assert.Equal("", ResultValues.UnitOf("pf"));
        Assert.Equal("current angle", ResultValue.FieldLabel("i.deg"));
        Assert.Equal("two-winding rating", ResultValue.FieldLabel("twoWindingRating"));
        Assert.Equal("section LV current", ResultValues.Readable("sections.LV.i.rms"));
    }
}

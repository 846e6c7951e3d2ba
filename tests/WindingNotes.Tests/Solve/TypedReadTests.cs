using System.Numerics;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// A number's and a phasor's typed reads (<see cref="ResultField.ReadNumber"/>, <see cref="ResultField.ReadPhasor"/>),
/// which the walk of every kept sweep point uses instead of the boxed <see cref="ResultField.Read"/>,
/// give the very value the boxed read gives, bit for bit, on every element of every case of the examples.
/// </summary>
public class TypedReadTests
{
    [Fact]
    public void Every_typed_read_gives_what_the_boxed_read_gives()
    {
        var read = 0;
        foreach (var path in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").Order(StringComparer.Ordinal))
        {
            var e = Evaluator.Evaluate(File.ReadAllText(path).Replace("\r\n", "\n"), Path.GetFileName(path));
            foreach (var c in e.Cases.Concat(e.SweepColumns is null ? [] : Wn.Points(e)))
                foreach (var group in CaseLeaves.Groups)
                {
                    if (!group.When(c)) continue;
                    foreach (var (_, item) in group.Items(c))
                        foreach (var field in group.Fields) read += Compare(field, item, $"{Path.GetFileName(path)}, {c.Case.Name}, {group.Key}");
                }
        }
        // The test bites: the examples' cases have hundreds of numbers and phasors.
        Assert.True(read > 1000, $"{read} typed reads");
    }

    /// <summary>The field's typed read against its boxed one, and the same for the fields inside it; how many typed reads were compared.</summary>
    private static int Compare(ResultField f, object item, string where)
    {
        var n = 0;
        var boxed = f.Read(item);
        if (f.ReadNumber is { } number)
        {
            n++;
            Assert.True(Bits((double?)boxed) == Bits(number(item)), $"{where}: {f.Key}");
        }
        if (f.ReadPhasor is { } phasor)
        {
            n++;
            var (want, got) = ((Complex?)boxed, phasor(item));
            Assert.True(Bits(want?.Real) == Bits(got?.Real) && Bits(want?.Imaginary) == Bits(got?.Imaginary), $"{where}: {f.Key}");
        }
        if (boxed is null) return n;
        foreach (var nested in f.Nested) n += Compare(nested, boxed, $"{where}.{f.Key}");
        if (f.Item is { } each && f.Kind == ResultKind.Map)
            foreach (var (name, element) in (IEnumerable<(string, object)>)boxed) n += Compare(each, element, $"{where}.{f.Key}.{name}");
        if (f.Item is { } listed && f.Kind == ResultKind.List)
            foreach (var element in (IEnumerable<object>)boxed) n += Compare(listed, element, $"{where}.{f.Key}[]");
        return n;
    }

    private static long? Bits(double? v) => v is { } x ? BitConverter.DoubleToInt64Bits(x) : null;
}

using System.Text.Json;
using WindingNotes.Report;
using WindingNotes.Solve;
using WindingNotes.Tests.Support;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>
/// Two fields share the JSON key 'regulation': a load's (a fraction, its voltage regulation) and a tap
/// changer's (an object: a step-voltage regulator's range and current rating). Each lives in its own
/// group, so a JSON path tells them apart, the schema gives each its own type there, and the diff,
/// which knows a value by its key, words and units them apart: the load's is a value, the tap changer's
/// an object of values (ResultTableTests keeps the values of one key alike).
/// </summary>
public class RegulationKeyTests
{
    [Fact]
    public void A_loads_regulation_and_a_regulators_are_told_apart_by_their_group_in_the_schema_and_the_diff()
    {
        using var schema = JsonDocument.Parse(File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "grammar", "results.schema.json")));
        JsonElement Field(string group) =>
            Find(schema.RootElement, group).GetProperty("additionalProperties").GetProperty("properties").GetProperty("regulation");
        Assert.Equal("#/$defs/value", Field("loads").GetProperty("$ref").GetString());
        Assert.Equal("object", Field("tapChangers").GetProperty("type").GetString());
        Assert.True(Field("tapChangers").GetProperty("properties").TryGetProperty("range", out _));

        // The example's regulator and its load: the load's regulation a fraction shown in %, the regulator's
        // range in % (10 %: 16 steps of 6.25 % of the series winding's 100 turns over the shunt's 1000) and
        // its current in A.
        var name = "elm-crossing-feeder-regulator.wn";
        var e = Evaluator.Evaluate(File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "examples", name)), $"examples/{name}");
        var normal = ResultValues.Of(e).Where(v => v.Case == "normal").ToList();
        var load = Assert.Single(normal, v => v.Element == "load town" && v.Field == "regulation");
        Assert.Equal("%", load.Unit);
        Assert.Equal("load town regulation", load.Label);
        Wn.Near(e.Normal!.Load("town").Regulation!.Value, load.Value, 1e-9);
        var range = Assert.Single(normal, v => v.Element == "tap changer REG" && v.Field == "regulation.range");
        Assert.Equal("%", range.Unit);
        Assert.Equal(0.1, range.Value, 12);
        Assert.Equal("tap changer REG regulation range", range.Label);
        var current = Assert.Single(normal, v => v.Element == "tap changer REG" && v.Field == "regulation.current");
        Assert.Equal("A", current.Unit);
        Assert.Equal("tap changer REG regulation current", current.Label);
    }

    /// <summary>The schema object of a group of the case: the first property of that name anywhere under the case's items.</summary>
    private static JsonElement Find(JsonElement e, string key)
    {
        if (e.ValueKind == JsonValueKind.Object)
            foreach (var p in e.EnumerateObject())
            {
                if (p.Name == key && p.Value.ValueKind == JsonValueKind.Object && p.Value.TryGetProperty("additionalProperties", out var a) && a.ValueKind == JsonValueKind.Object) return p.Value;
                if (Find(p.Value, key) is { ValueKind: JsonValueKind.Object } found) return found;
            }
        return default;
    }
}

using System.Text.Json;
using System.Text.Json.Nodes;
using Json.Schema;
using WindingNotes.Report;
using WindingNotes.Tests.Solve;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Report;

/// <summary>The JSON report keeps to its documented schema, grammar/results.schema.json (checked with JsonSchema.Net 8.0.5).</summary>
public class ResultsSchemaTests
{
    private static readonly Lazy<JsonSchema> Schema = new(() =>
        JsonSchema.FromText(File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "grammar", "results.schema.json"))));

    private static EvaluationResults Validate(string json)
    {
        using var document = JsonDocument.Parse(json);
        return Schema.Value.Evaluate(document.RootElement, new EvaluationOptions { OutputFormat = OutputFormat.List });
    }

    private static void AssertValid(string json, string what)
    {
        var result = Validate(json);
        var errors = (result.Details ?? []).Where(d => d.Errors is not null)
            .SelectMany(d => d.Errors!.Select(e => $"{d.InstanceLocation}: {e.Key}: {e.Value}"));
        Assert.True(result.IsValid, $"{what} breaks the schema:\n{string.Join("\n", errors)}");
    }

    private static string Example(string name) => File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "examples", name));

    [Theory]
    [MemberData(nameof(ExampleSnapshotTests.Examples), MemberType = typeof(ExampleSnapshotTests))]
    public void Every_examples_json_report_keeps_to_the_schema(string name)
    {
        AssertValid(JsonReport.Write(Wn.Eval(Example(name))), name);
    }

    [Fact]
    public void Reports_with_faults_failed_checks_errors_and_no_solution_keep_to_the_schema()
    {
        var alder = Example("alder-creek-boost.wn");
        AssertValid(JsonReport.Write(Wn.Eval(alder + "fault F1 X1 H2 impedance 0 ohm\n")), "a fault case");
        AssertValid(JsonReport.Write(Wn.Eval(alder.Replace("225 V", "230 V") + "expect flux K9 below 1 T\n")), "failed and unmeasurable checks");
        AssertValid(JsonReport.Write(Wn.Eval("core K1 rating (\nwinding W on K1 from A to B\n")), "a file that is not solved");
        AssertValid(JsonReport.Write(Wn.Eval("")), "an empty file");
        AssertValid(JsonReport.Write(Wn.Eval(alder.Replace("resistance 0.014 ohm", "conductor copper 6 mm2 mean-turn 0.2 m")
            + "no-load K1 current 2 % loss 8 W at HV 240 V\n")), "conductors and a no-load test");
        for (var seed = 0; seed < 10; seed++) AssertValid(JsonReport.Write(Wn.Eval(RandomNetworks.Write(seed))), $"random network {seed}");
    }

    [Fact]
    public void The_case_part_of_the_schema_is_the_results_table()
    {
        // As the EBNF is the grammar table's: grammar/results.schema.json holds each group of
        // Solve/ResultTable.cs as ResultsSchema writes it; UPDATE_EXPECTED=1 rewrites those groups.
        var path = Path.Combine(Snapshot.RepositoryRoot, "grammar", "results.schema.json");
        var file = File.ReadAllText(path);
        if (Snapshot.Updating) File.WriteAllText(path, ResultsSchema.Written(file));
        Assert.Equal(ResultsSchema.Written(file), File.ReadAllText(path));
    }

    [Fact]
    public void A_group_the_schema_lacks_is_written_after_the_one_before_it()
    {
        var file = File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "grammar", "results.schema.json"));
        var start = file.IndexOf("        \"taps\": {", StringComparison.Ordinal);
        var end = file.IndexOf("        \"tapChangers\": {", StringComparison.Ordinal);
        var without = file[..start] + file[end..];
        Assert.Equal(ResultsSchema.Written(file), ResultsSchema.Written(without));
    }

    [Fact]
    public void A_section_of_the_study_the_schema_lacks_is_written_after_the_one_before_it()
    {
        var file = File.ReadAllText(Path.Combine(Snapshot.RepositoryRoot, "grammar", "results.schema.json"));
        var start = file.IndexOf("    \"sequenceImpedances\": {", StringComparison.Ordinal);
        var end = file.IndexOf("    \"parallel\": {", StringComparison.Ordinal);
        Assert.True(start > 0 && end > start);
        Assert.Equal(ResultsSchema.Written(file), ResultsSchema.Written(file[..start] + file[end..]));
    }

    [Fact]
    public void The_schema_rejects_a_report_that_drifts_from_it()
    {
        var report = JsonNode.Parse(JsonReport.Write(Wn.Eval(Example("alder-creek-boost.wn"))))!;
        var normal = report["cases"]![0]!;
        normal["nodes"]!["X1"]!["v"]!.AsObject().Remove("deg");
        normal["loads"]!["planer"]!["kw"] = 3.2;
        report["diagnostics"]!.AsArray().Add(new JsonObject { ["severity"] = "fatal", ["code"] = "Bad Code", ["message"] = "m" });
        var added = report["diagnostics"]!.AsArray().Count - 1;
        var result = Validate(report.ToJsonString());
        Assert.False(result.IsValid);
        var locations = (result.Details ?? []).Where(d => d.Errors is not null).Select(d => d.InstanceLocation.ToString()).ToList();
        Assert.Contains("/cases/0/nodes/X1/v", locations);
        Assert.Contains("/cases/0/loads/planer/kw", locations);
        Assert.Contains($"/diagnostics/{added}/severity", locations);
        Assert.Contains($"/diagnostics/{added}/code", locations);
    }
}

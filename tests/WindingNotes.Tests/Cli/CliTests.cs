using System.Text.Json;
using WindingNotes.Cli;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Cli;

public class CliTests
{
    private static string Example(string name) => Command.Example(name);

    private static (int Code, string Out, string Err) Run(string input, params string[] args) => Command.Run(input, args);

    [Fact]
    public void Every_example_passes_check()
    {
        var files = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").OrderBy(f => f).ToArray();
        Assert.True(files.Length >= 3);
        var (code, output, _) = Run("", ["check", .. files]);
        Assert.True(code == 0, output);
        Assert.DoesNotContain(": error ", output);
    }

    [Fact]
    public void The_notation_example_gives_228_1_volts_at_X1()
    {
        var (code, output, _) = Run("", "report", Example("alder-creek-boost.wn"), "--format", "json");
        Assert.Equal(0, code);
        using var json = JsonDocument.Parse(output);
        var root = json.RootElement;
        Assert.Equal("windingnotes/results/1", root.GetProperty("schema").GetString());
        var normal = root.GetProperty("cases")[0];
        Assert.Equal("normal", normal.GetProperty("name").GetString());
        var x1 = normal.GetProperty("nodes").GetProperty("X1").GetProperty("v").GetProperty("rms").GetDouble();
        Wn.Near(228.1, x1, 0.002, "X1");
        Assert.Equal(["LV", "HV"], normal.GetProperty("sections").EnumerateObject().Select(p => p.Name).Reverse());
    }

    [Fact]
    public void Report_prints_the_same_bytes_twice()
    {
        foreach (var format in new[] { "text", "md", "json" })
        {
            var first = Run("", "report", Example("alder-creek-boost.wn"), "--format", format).Out;
            var second = Run("", "report", Example("alder-creek-boost.wn"), "--format", format).Out;
            Assert.Equal(first, second);
        }
    }

    [Fact]
    public void Check_prints_diagnostics_as_compilers_do_and_fails_on_a_failed_expectation()
    {
        var text = File.ReadAllText(Example("alder-creek-boost.wn")).Replace("between 225 V and 235 V", "between 230 V and 235 V");
        var (code, output, _) = Run(text, "check", "-");
        Assert.Equal(1, code);
        Assert.Contains("<stdin>:14:1: error expect-failed: voltage X1 H2 is 228.1 V: expected between 230 V and 235 V", output);
    }

    [Fact]
    public void A_typo_on_one_line_is_reported_and_the_file_is_not_solved()
    {
        // Solving the rest would give figures of another network (here one without leakage impedance).
        var text = File.ReadAllText(Example("alder-creek-boost.wn")).Replace("impedance HV LV 3.6 % xr 1.1", "impedance HV LV 3.6 % xr");
        var (code, output, _) = Run(text, "report", "-", "--format", "json");
        Assert.Equal(1, code);
        using var json = JsonDocument.Parse(output);
        Assert.Contains(json.RootElement.GetProperty("diagnostics").EnumerateArray(), d => d.GetProperty("severity").GetString() == "error");
        Assert.Equal(0, json.RootElement.GetProperty("cases").GetArrayLength());
        Assert.Equal(2, json.RootElement.GetProperty("notEvaluated").GetArrayLength());
    }

    [Fact]
    public void Bad_usage_and_unreadable_files_exit_2()
    {
        Assert.Equal(2, Run("", "report").Code);
        Assert.Equal(2, Run("", "frobnicate").Code);
        Assert.Equal(2, Run("", "report", "x.wn", "--format", "pdf").Code);
        var (code, _, error) = Run("", "check", "/no/such/file.wn");
        Assert.Equal(2, code);
        Assert.Contains("cannot read", error);
    }
}

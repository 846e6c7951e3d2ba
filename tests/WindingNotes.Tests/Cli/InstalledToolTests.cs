using System.Diagnostics;
using WindingNotes.Tests.Clients;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Cli;

/// <summary>
/// The command as a user installs it (in CI the NativeAOT .NET tool, named by WINDINGNOTES_TOOL)
/// prints byte for byte what the built command prints, on every example and every output, and on
/// every annotated diagnostics file: the shipped form is the tested form. Locally the test skips without the tool; CI requires it.
/// </summary>
public class InstalledToolTests
{
    private static readonly string[][] Outputs =
    [
        ["check"],
        ["report", "--format", "text"],
        ["report", "--format", "json"],
        ["report", "--format", "md"],
        ["textconv"],
        ["diagram", "--kind", "network"],
        ["diagram", "--kind", "phasors"],
    ];

    [InstalledToolFact]
    [Trait("Category", "Long")]
    public void The_installed_command_prints_the_bytes_of_the_built_one()
    {
        var tool = Environment.GetEnvironmentVariable(RealClientTests.Tool) ?? throw new InvalidOperationException($"{RealClientTests.Tool} is not set");
        var examples = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").Order(StringComparer.Ordinal).ToArray();
        Assert.NotEmpty(examples);
        foreach (var example in examples)
        {
            foreach (var output in Outputs)
            {
                string[] args = [output[0], example, .. output[1..]];
                var built = Command.Run("", args);
                var installed = Run(tool, args);
                var what = $"windingnotes {string.Join(' ', args)}";
                Assert.True(built.Code == installed.Code, $"{what}: exit {installed.Code}, built {built.Code}\n{installed.Err}");
                Assert.True(built.Out == installed.Out, $"{what}: standard output differs");
                Assert.True(built.Err == installed.Err, $"{what}: standard error differs:\n{installed.Err}\nbuilt:\n{built.Err}");
            }
        }
        // The annotated diagnostics files: every message, and the parsers' error paths.
        var annotated = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "tests", "WindingNotes.Tests", "Data", "diagnostics"), "*.wn").Order(StringComparer.Ordinal).ToArray();
        Assert.NotEmpty(annotated);
        var builtCheck = Command.Run("", ["check", .. annotated]);
        var installedCheck = Run(tool, ["check", .. annotated]);
        Assert.Equal((builtCheck.Code, builtCheck.Out, builtCheck.Err), installedCheck);
    }

    private static (int Code, string Out, string Err) Run(string program, string[] args)
    {
        var start = new ProcessStartInfo(program) { RedirectStandardOutput = true, RedirectStandardError = true, RedirectStandardInput = true };
        foreach (var a in args) start.ArgumentList.Add(a);
        using var process = Process.Start(start)!;
        process.StandardInput.Close();
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromSeconds(60)))
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail($"{program} {string.Join(' ', args)} did not finish in 60 s");
        }
        return (process.ExitCode, output.Result, error.Result);
    }
}

/// <summary>Runs when WINDINGNOTES_TOOL names the installed command, or when clients are required (CI).</summary>
public sealed class InstalledToolFactAttribute : FactAttribute
{
    public InstalledToolFactAttribute()
    {
        if (string.IsNullOrEmpty(Environment.GetEnvironmentVariable(RealClientTests.Tool)) && !Clients.Clients.Required)
            Skip = $"{RealClientTests.Tool} is not set (.ci/run installs the native tool and sets it)";
    }
}

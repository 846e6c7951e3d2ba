using System.Diagnostics;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Clients;

/// <summary>
/// Two clients no one here wrote drive the built server: a Node script on the official protocol
/// package, and a headless Neovim. Locally a test skips when its client is absent; CI sets
/// WINDINGNOTES_REQUIRE_CLIENTS=1 (in .ci/run, which installs both), and a missing client fails.
/// </summary>
[Trait("Category", "Long")]
public class RealClientTests
{
    public const string Require = "WINDINGNOTES_REQUIRE_CLIENTS";

    /// <summary>Names the installed command (CI: the native .NET tool) for the clients to start instead of the built windingnotes.dll.</summary>
    public const string Tool = "WINDINGNOTES_TOOL";

    /// <summary>How the clients start the command, without its arguments.</summary>
    public static string[] Server =>
        Environment.GetEnvironmentVariable(Tool) is { Length: > 0 } tool ? [tool] : [Dotnet, Path.Combine(AppContext.BaseDirectory, "windingnotes.dll")];

    private static string Dotnet => Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } host ? host : "dotnet";

    public static string NodeClient => Path.Combine(Snapshot.RepositoryRoot, "tests", "clients", "node");

    [NodeClientFact]
    public void The_official_node_protocol_client_covers_every_feature() =>
        Run(Clients.Find("node") ?? throw new InvalidOperationException("node is not installed"), NodeClient, ["client.mjs", .. Server, "lsp", "--stdio"], []);

    [NeovimFact]
    public void Neovim_opens_edits_hovers_and_shuts_the_server_down() =>
        Run(Clients.Find("nvim") ?? throw new InvalidOperationException("nvim is not installed"), Snapshot.RepositoryRoot,
            ["--headless", "--clean", "-n", "-c", "luafile tests/clients/neovim/check.lua"],
            new() { ["WINDINGNOTES_REPO"] = Snapshot.RepositoryRoot, ["WINDINGNOTES_SERVER"] = string.Join('\n', Server) });

    private static void Run(string program, string directory, string[] arguments, Dictionary<string, string> environment)
    {
        var start = new ProcessStartInfo(program) { WorkingDirectory = directory, RedirectStandardOutput = true, RedirectStandardError = true, RedirectStandardInput = true };
        foreach (var a in arguments) start.ArgumentList.Add(a);
        foreach (var (key, value) in environment) start.Environment[key] = value;
        using var process = Process.Start(start)!;
        process.StandardInput.Close();
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromSeconds(120)))
        {
            process.Kill(entireProcessTree: true);
            Assert.Fail($"{Path.GetFileName(program)} did not finish in 120 s\n{output.Result}\n{error.Result}");
        }
        var text = output.Result;
        Assert.True(process.ExitCode == 0 && text.Contains(" passed, 0 failed"), $"{Path.GetFileName(program)} exited {process.ExitCode}\n{text}\n{error.Result}");
    }
}

/// <summary>Where the clients are, found on PATH without running anything.</summary>
internal static class Clients
{
    public static string? Find(string program) =>
        (Environment.GetEnvironmentVariable("PATH") ?? "").Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries)
            .Select(dir => Path.Combine(dir, program))
            .FirstOrDefault(File.Exists);

    public static bool Required => Environment.GetEnvironmentVariable(RealClientTests.Require) == "1";
}

/// <summary>Runs when Node and the client's packages (npm ci in tests/clients/node) are there, or when clients are required.</summary>
public sealed class NodeClientFactAttribute : FactAttribute
{
    public NodeClientFactAttribute()
    {
        var installed = Clients.Find("node") is not null && Directory.Exists(Path.Combine(RealClientTests.NodeClient, "node_modules", "vscode-languageserver-protocol"));
        if (!installed && !Clients.Required) Skip = "node or tests/clients/node/node_modules is absent (npm ci installs it)";
    }
}

/// <summary>Runs when Neovim is there, or when clients are required.</summary>
public sealed class NeovimFactAttribute : FactAttribute
{
    public NeovimFactAttribute()
    {
        if (Clients.Find("nvim") is null && !Clients.Required) Skip = "nvim is absent (apt-get install neovim)";
    }
}

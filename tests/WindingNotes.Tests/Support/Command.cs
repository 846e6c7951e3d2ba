namespace WindingNotes.Tests.Support;

/// <summary>Runs the <c>windingnotes</c> command in-process with its own standard streams.</summary>
public static class Command
{
    public static (int Code, string Out, string Err) Run(string input, params string[] args) => Run(System.Text.Encoding.UTF8.GetBytes(input), args);

    /// <summary>The command with these bytes on its standard input.</summary>
    public static (int Code, string Out, string Err) Run(byte[] input, params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var code = WindingNotes.Cli.Cli.Run(args, output, error, new MemoryStream(input));
        return (code, output.ToString(), error.ToString());
    }

    public static string Example(string name) => Path.Combine(Snapshot.RepositoryRoot, "examples", name);
}

/// <summary>A fresh directory under the system's temporary folder, removed with everything in it.</summary>
public sealed class TemporaryDirectory : IDisposable
{
    public string Path { get; } = Directory.CreateTempSubdirectory("windingnotes-").FullName;

    public string File(string name) => System.IO.Path.Combine(Path, name);

    public void Dispose()
    {
        try
        {
            Directory.Delete(Path, recursive: true);
        }
        catch (IOException)
        {
            // A leftover temporary folder is harmless.
        }
    }
}

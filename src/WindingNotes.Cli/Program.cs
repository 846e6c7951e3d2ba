namespace WindingNotes.Cli;

public static class Program
{
    /// <summary>
    /// The collector's memory may be prepared before a large file is evaluated (<see cref="HeapPages"/>).
    /// Standard output goes through a writer of its own in Console.Out's encoding (no byte-order mark) with a buffer of some kilobytes:
    /// Console.Out's 256 characters made a large report some 600 writes to the system. It is flushed
    /// after every write, as Console.Out is, so what a command writes to standard output and to standard
    /// error keeps its order.
    /// </summary>
    public static int Main(string[] args)
    {
        HeapPages.Allowed = true;
        using var output = new StreamWriter(Console.OpenStandardOutput(), Console.Out.Encoding, OutputBuffer) { AutoFlush = true };
        return Cli.Run(args, output, Console.Error, Console.OpenStandardInput());
    }

    private const int OutputBuffer = 8192;
}

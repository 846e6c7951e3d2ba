using System.Diagnostics;
using System.Text;
using WindingNotes.Cli;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Cli;

/// <summary>
/// Inputs no calculation file is: a named pipe without a writer, devices, a file or a stream above the
/// size limit, bytes that are not UTF-8. Each is refused at once with exit 2 and one message, and
/// standard input is read as a file is. Reproductions of inputs that once hung a command or ran it out of memory.
/// </summary>
public class InputTests
{
    private static readonly string Alder = File.ReadAllText(Command.Example("alder-creek-boost.wn"));

    /// <summary>Runs the command with a deadline: a hang fails the test instead of holding up the run.</summary>
    private static (int Code, string Out, string Err) Run(byte[] input, params string[] args)
    {
        var run = Task.Run(() => Command.Run(input, args));
        Assert.True(run.Wait(TimeSpan.FromSeconds(60)), $"{string.Join(' ', args)} did not return");
        return run.Result;
    }

    [Theory]
    [InlineData("check")]
    [InlineData("report")]
    [InlineData("fmt")]
    public void Devices_directories_and_named_pipes_are_refused_without_being_opened(string command)
    {
        using var dir = new TemporaryDirectory();
        var fifo = dir.File("pipe.wn");
        using (var mkfifo = Process.Start("mkfifo", [fifo])) mkfifo.WaitForExit();
        foreach (var (path, what) in new[] { ("/dev/zero", "a device"), ("/dev/urandom", "a device"), (fifo, "a named pipe"), (dir.Path, "a directory") })
        {
            var (code, _, error) = Run([], command, path);
            Assert.True(code == 2, $"{command} {path}: {code} {error}");
            Assert.Contains($"cannot read '{path}': it is {what}", error);
        }
    }

    [Fact]
    public void A_file_or_standard_input_above_the_limit_is_refused_with_exit_2()
    {
        using var dir = new TemporaryDirectory();
        var big = dir.File("big.wn");
        using (var stream = File.Create(big)) stream.SetLength(ConsoleIo.MaxInput + 1L);
        var (code, _, error) = Run([], "check", big);
        Assert.Equal(2, code);
        Assert.Contains("larger than 16 MB", error);
        // Standard input is read up to the limit and no further.
        var endless = new byte[ConsoleIo.MaxInput + 10];
        (code, _, error) = Run(endless, "fmt", "-");
        Assert.Equal(2, code);
        Assert.Contains("cannot read '<stdin>': it is larger than 16 MB", error);
        // At the limit it is read.
        var atLimit = Encoding.UTF8.GetBytes(Alder + new string('#', ConsoleIo.MaxInput - Encoding.UTF8.GetByteCount(Alder)));
        Assert.Equal(0, Run(atLimit, "check", "-").Code);
    }

    [Fact]
    public void Standard_input_reads_as_a_file_does_a_byte_order_mark_accepted_and_invalid_utf8_refused()
    {
        using var dir = new TemporaryDirectory();
        byte[] bom = [0xEF, 0xBB, 0xBF, .. Encoding.UTF8.GetBytes(Alder)];
        File.WriteAllBytes(dir.File("bom.wn"), bom);
        foreach (var source in new[] { "-", dir.File("bom.wn") })
        {
            var (code, output, error) = Run(bom, "check", source);
            Assert.True(code == 0, $"{source}: {output} {error}");
        }
        byte[] latin1 = [.. Encoding.ASCII.GetBytes("let r = 5 ohm  # "), 0xB5, 0x0A];
        File.WriteAllBytes(dir.File("latin1.wn"), latin1);
        foreach (var command in new[] { "check", "report", "fmt" })
            foreach (var (source, name) in new[] { ("-", "<stdin>"), (dir.File("latin1.wn"), dir.File("latin1.wn")) })
            {
                var (code, output, error) = Run(latin1, command, source);
                Assert.True(code == 2, $"{command} {source}: {code}");
                Assert.Equal($"windingnotes: cannot read '{name}': it is not UTF-8 text; it was left as it is\n", error.Replace("\r\n", "\n"));
                if (command == "fmt") Assert.Equal("", output);
            }
        Assert.Equal(latin1, File.ReadAllBytes(dir.File("latin1.wn")));
    }
}

using WindingNotes.Tests.Analysis;
using Xunit;

namespace WindingNotes.Tests.Cli;

public class ProgressTests
{
    [Fact]
    public void A_long_sweep_writes_nothing_on_standard_error_when_it_is_not_a_terminal()
    {
        var output = new StringWriter();
        var error = new StringWriter();
        var input = SweepTests.Variable("sweep BR from 0 % to 100 % step 0.1 %");
        var code = WindingNotes.Cli.Cli.Run(["check", "-"], output, error, new MemoryStream(System.Text.Encoding.UTF8.GetBytes(input)));
        Assert.Equal(0, code);
        Assert.Equal("", error.ToString());
        Assert.EndsWith("1 file: 0 errors, 0 warnings, 0 of 0 checks passed\n", output.ToString().Replace("\r\n", "\n"));
    }
}

using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using Xunit;

namespace WindingNotes.Tests.Syntax;

public class FormatterTests
{
    [Theory]
    [InlineData("winding  HV on K1   from H1 to H2 turns 240   # primary\n", "winding HV on K1 turns 240 from H1 to H2 # primary\n")]
    [InlineData("let z = -3+j4 ohm\nlet y=( 2*z )/sqrt( 4 )", "let z = -3 + j4 ohm\nlet y = (2 * z) / sqrt(4)\n")]
    [InlineData("   # indented comment   \n\n\nground N", "# indented comment\n\n\nground N\n")]
    [InlineData("core K1 rating ( broken\n", "core K1 rating ( broken\n")]
    [InlineData("impedance HV:H1-T60   LV 3.6 % ± 10 %\r\nground N\r\n", "impedance HV:H1-T60 LV 3.6 % ± 10 %\r\nground N\r\n")]
    [InlineData("winding HV on K1 \\\n  from H1 to H2 \\\n  turns 240\n", "winding HV on K1 \\\n    turns 240 \\\n    from H1 to H2\n")]
    [InlineData("1e1e1 \\", "1e1e1 \\\n")]
    [InlineData("core K1 rating 1 kVA \\", "core K1 rating 1 kVA\n")]
    public void Formats_to_the_canonical_layout(string input, string expected)
    {
        Assert.Equal(expected, Formatter.Format(Parser.Parse(input)));
        Assert.Equal(expected, Formatter.Format(Parser.Parse(expected)));
    }

    [Fact]
    public void Formatting_the_examples_is_idempotent_and_keeps_every_comment()
    {
        foreach (var file in Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn"))
        {
            var text = File.ReadAllText(file);
            var once = Formatter.Format(Parser.Parse(text));
            Assert.Equal(once, Formatter.Format(Parser.Parse(once)));
            var comments = Parser.Parse(text).Lines.Select(l => l.Comment?.Text.TrimEnd()).OfType<string>();
            var kept = Parser.Parse(once).Lines.Select(l => l.Comment?.Text).OfType<string>();
            Assert.Equal(comments, kept);
            // The examples are what users copy: they are kept in the canonical layout.
            Assert.True(once == text, $"{Path.GetFileName(file)} is not in canonical layout: run windingnotes fmt on it");
        }
    }
}

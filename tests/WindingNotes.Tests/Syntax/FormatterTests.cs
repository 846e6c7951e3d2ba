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
    [InlineData("winding HV on K1 \\\n  from H1 to H2 \\\n  turns 240\n", "winding HV on K1 \\\n    from H1 to H2 \\\n    turns 240\n")]
    [InlineData("1e1e1 \\", "1e1e1 \\")]
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

/// <summary>Inputs on which the formatter once changed meaning: each is kept as it reads, or formatted without changing it.</summary>
public class FormatterMeaningTests
{
    [Theory]
    // A sign before a signed number: written together it would be the tolerance sign.
    [InlineData("let a = + -1 V\n", "let a = + -1 V\n")]
    [InlineData("let b = 2 V * + -3\n", "let b = 2 V * + -3\n")]
    [InlineData("let c = -  -3 V\n", "let c = - -3 V\n")]
    // A duplicate clause is an error: moving it next to the first would read as another statement.
    [InlineData("winding W on K turns 200 from A to B turns + 100\n", "winding W on K turns 200 from A to B turns + 100\n")]
    // A break inside a clause or before a comment stays where it is, so diagnostics keep their lines.
    [InlineData("winding W on K turns \\\n 200   from A to B\n", "winding W on K turns \\\n    200 from A to B\n")]
    [InlineData("let x = 1 V + \\\n  2 V\nground N\n", "let x = 1 V + \\\n  2 V\nground N\n")]
    [InlineData("ground  N \\\n# why\nground M\n", "ground  N \\\n# why\nground M\n")]
    [InlineData("ground  N \\\n\nground M\n", "ground  N \\\n\nground M\n")]
    // Each line break stays as written: a lone CR is not turned into CRLF beside a continuation.
    [InlineData("ground  N \\\r  \r\nground M\r\n", "ground  N \\\r  \r\nground M\r\n")]
    [InlineData("winding W on K \\\rturns 200  from A to B\r\nground N\r\n", "winding W on K \\\r    turns 200 from A to B\r\nground N\r\n")]
    // A blank line after a line kept with a lone CR keeps its spaces: without them CR and LF would be one break (fuzzer seeds 1,034,510 and 1,124,320).
    [InlineData("core ( broken\r \nground M\n", "core ( broken\r \nground M\n")]
    [InlineData("core ( broken\r \n\nground  M\n", "core ( broken\r \n\nground M\n")]
    // A line kept as written that ends the file in a continuation gets no line break: the continuation would take it.
    [InlineData("winding W on K turns 9 \\", "winding W on K turns 9 \\")]
    public void Keeps_meaning_and_lines(string input, string expected)
    {
        Assert.Equal(expected, Formatter.Format(Parser.Parse(input)));
        Assert.Null(Robustness.FormatProperty.Problem(input));
    }
}

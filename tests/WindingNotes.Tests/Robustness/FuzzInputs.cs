using System.Text;
using WindingNotes.Syntax;
using WindingNotes.Tests.Solve;
using WindingNotes.Tests.Support;

namespace WindingNotes.Tests.Robustness;

/// <summary>One fuzz input: the text, what it was made from (for the diff against it) and how.</summary>
public sealed record FuzzInput(int Seed, string BaseName, string Base, string Text, string Recipe)
{
    public bool IsLarge => Text.Length > 200_000;
}

/// <summary>
/// Makes fuzz inputs from a seed: a base (an example, an annotated diagnostics file, a grammar test
/// file, a random network; now and then an empty, a huge or a five-megabyte file) and a few
/// mutations of its tokens, characters, lines and numbers. The same seed always gives the same input.
/// </summary>
public static class FuzzInputs
{
    /// <summary>The longest input made: a mutation that would make a longer one is left out.</summary>
    public const int MaxLength = 6_000_000;

    /// <summary>With huge inputs on, the last seed of every block of this many is a five-megabyte file.</summary>
    public const int HugeEvery = 5000;

    private static readonly Lazy<(string Name, string Text)[]> Examples = new(() => [.. Read("examples", "*.wn")]);

    private static readonly Lazy<(string Name, string Text)[]> Files = new(() =>
    [
        .. Examples.Value,
        .. Read("tests/WindingNotes.Tests/Data/diagnostics", "*.wn"),
        .. Read("grammar/tests", "*.wn"),
    ]);

    /// <summary>Every line of every file: material to splice into another input.</summary>
    private static readonly Lazy<string[]> Lines = new(() =>
        [.. Files.Value.SelectMany(f => f.Text.Split('\n')).Where(l => l.Trim().Length > 0 && !l.StartsWith("# ")).Distinct()]);

    private static IEnumerable<(string, string)> Read(string folder, string pattern) =>
        Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, folder), pattern)
            .OrderBy(f => f, StringComparer.Ordinal)
            .Select(f => ($"{folder}/{Path.GetFileName(f)}", File.ReadAllText(f).Replace("\r\n", "\n")));

    public static FuzzInput Make(int seed, bool huge = true)
    {
        var random = new Random(seed);
        var (name, text) = Base(seed, random, huge);
        var recipe = new List<string>();
        var mutations = random.Next(6) switch { 0 => 0, 1 or 2 => 1, 3 => 2, 4 => 3, _ => random.Next(4, 12) };
        var mutated = text;
        for (var i = 0; i < mutations; i++)
        {
            var (next, what) = Mutate(mutated, random);
            // Inputs stay within a few megabytes: the mutations of a huge one could otherwise multiply it past memory.
            if (next.Length > MaxLength) continue;
            mutated = next;
            recipe.Add(what);
        }
        return new FuzzInput(seed, name, text, mutated, recipe.Count == 0 ? "as is" : string.Join("; ", recipe));
    }

    private static (string Name, string Text) Base(int seed, Random random, bool huge)
    {
        if (huge && seed % HugeEvery == HugeEvery - 1) return Huge(random);
        var files = Files.Value;
        return random.Next(100) switch
        {
            < 40 => Pick(Examples.Value, random),
            < 60 => files[random.Next(files.Length)],
            < 85 => ("random network", RandomNetworks.Write(random.Next())),
            < 90 => ("spliced lines", string.Concat(Enumerable.Range(0, random.Next(1, 40)).Select(_ => Pick(Lines.Value, random) + "\n"))),
            < 93 => ("many units", ManyUnits(random.Next(), random.Next(2, 12))),
            < 96 => ("blank", Pick(["", "\n", "\r\n", "\r", " ", "\t\t\n", "#", "# only a comment\n", "\\", "\\\n", "\uFEFF", "\n\n\n\n"], random)),
            _ => ("long line", LongLine(random)),
        };
    }

    /// <summary>Random networks one after another, each unit's names its own: a file of many independent units.</summary>
    public static string ManyUnits(int seed, int units)
    {
        var o = new StringBuilder("frequency 50 Hz\n");
        for (var u = 0; u < units; u++) o.Append(Unit(RandomNetworks.Write(seed + u), $"u{u}_"));
        return o.ToString();
    }

    /// <summary>A file as one unit of a larger one: every name prefixed, the frequency line left to the file.</summary>
    public static string Unit(string text, string prefix)
    {
        var o = new StringBuilder();
        foreach (var line in Parser.Parse(text).Lines)
        {
            if (line.Statement?.Kind == StatementKind.Frequency) continue;
            foreach (var t in line.Tokens)
                o.Append(t.Kind == TokenKind.Word && !Grammar.Keywords.Contains(t.Text) && WindingNotes.Model.Units.Find(t.Text) is null ? prefix + t.Text : t.Text);
        }
        return o.ToString();
    }

    /// <summary>About five megabytes: either many distinct units, or the examples over and over (every name defined again).</summary>
    public static (string, string) Huge(Random random)
    {
        var o = new StringBuilder();
        if (random.Next(2) == 0)
        {
            var seed = random.Next();
            o.Append("frequency 50 Hz\n");
            for (var u = 0; o.Length < 5_000_000; u++) o.Append(Unit(RandomNetworks.Write(seed + u), $"u{u}_"));
            return ("five megabytes of units", o.ToString());
        }
        var files = Files.Value;
        for (var i = 0; o.Length < 5_000_000; i++) o.Append(files[i % files.Length].Text).Append('\n');
        return ("five megabytes of repeats", o.ToString());
    }

    private static string LongLine(Random random) => random.Next(4) switch
    {
        0 => "let x = " + string.Join(" + ", Enumerable.Repeat("1 V", random.Next(500, 3000))) + "\n",
        1 => "frequency " + new string('(', random.Next(50, 5000)) + "50 Hz\n",
        2 => "core K " + string.Concat(Enumerable.Repeat("rating 1 kVA ", random.Next(100, 2000))) + "\n",
        _ => "winding W on K turns " + new string('9', random.Next(100, 100_000)) + " from A to B\n",
    };

    // ---- mutations ----

    private static (string, string) Mutate(string text, Random random) => random.Next(21) switch
    {
        0 => TokenEdit(text, random, "delete token", (_, _) => ""),
        1 => TokenEdit(text, random, "duplicate token", (t, _) => t + " " + t),
        2 or 3 => TokenEdit(text, random, "replace token", (_, r) => Word(text, r)),
        4 => TokenEdit(text, random, "insert token", (t, r) => Word(text, r) + " " + t),
        5 or 6 => CharEdit(text, random),
        7 => LineEdit(text, random, "duplicate line", (l, _) => [l, l]),
        8 => LineEdit(text, random, "delete line", (_, _) => []),
        9 => LineEdit(text, random, "truncate line", (l, r) => [l[..r.Next(l.Length + 1)]]),
        10 => (text[..random.Next(text.Length + 1)], "truncate file"),
        11 => LineEdit(text, random, "split line", (l, r) => l.Length == 0 ? [l] : [l[..r.Next(l.Length)], l[r.Next(l.Length)..]]),
        12 => LineEdit(text, random, "splice line", (l, r) => [l, Pick(Lines.Value, r)]),
        13 => LineEdit(text, random, "continue line", (l, r) => [l + Pick([" \\", "\\", " \\ ", "\\\t"], r)]),
        14 or 15 => NumberEdit(text, random),
        16 => TokenEdit(text, random, "parenthesise", (t, r) =>
        {
            var depth = Pick([1, 2, 10, 63, 64, 65, 200, 3000], r);
            return r.Next(3) == 0 ? new string('(', depth) + t : new string('(', depth) + t + new string(')', depth);
        }),
        // Classes of input that once made the formatter change meaning: a sign before a signed value,
        // a break inside a clause (with any line break, a lone CR too), a clause written twice.
        17 => TokenEdit(text, random, "sign", (t, r) => Pick(["+ ", "- ", "+ -", "- +", "+", "-"], r) + t),
        18 => TokenEdit(text, random, "break before", (t, r) => Pick([" \\\n", " \\\r", " \\\r\n", "\\\n  ", " \\\n# why\n", " \\\n\n"], r) + t),
        19 => TokenEdit(text, random, "repeat clause", (t, r) => $"{t} {Pick(Keywords, r)} {Pick(Numbers, r)}"),
        _ => TokenEdit(text, random, "repeat token", (t, r) => string.Join(" ", Enumerable.Repeat(t, Math.Min(Pick([2, 10, 100, 1999, 2001, 5000], r), 1 + MaxLength / (t.Length + 1))))),
    };

    private static (string, string) TokenEdit(string text, Random random, string what, Func<string, Random, string> change)
    {
        var tokens = Lexer.Lex(text).Where(t => t.Kind is not (TokenKind.Whitespace or TokenKind.Newline)).ToList();
        if (tokens.Count == 0) return (Word(text, random) + text, $"{what} (insert into an empty text)");
        var token = tokens[random.Next(tokens.Count)];
        var replacement = change(token.Text, random);
        return (text[..token.Span.Start] + replacement + text[token.Span.End..], $"{what} '{Short(token.Text)}' at {token.Span.Start} -> '{Short(replacement)}'");
    }

    private static (string, string) CharEdit(string text, Random random)
    {
        var at = random.Next(text.Length + 1);
        var c = Pick(Characters, random);
        return random.Next(3) switch
        {
            0 => (text[..at] + c + text[at..], $"insert U+{Code(c)} at {at}"),
            1 when at < text.Length => (text[..at] + text[(at + 1)..], $"delete char at {at}"),
            _ when at < text.Length => (text[..at] + c + text[(at + 1)..], $"replace char at {at} with U+{Code(c)}"),
            _ => (text + c, $"append U+{Code(c)}"),
        };
    }

    private static (string, string) LineEdit(string text, Random random, string what, Func<string, Random, string[]> change)
    {
        var lines = text.Split('\n').ToList();
        var index = random.Next(lines.Count);
        var replaced = change(lines[index], random);
        lines.RemoveAt(index);
        lines.InsertRange(index, replaced);
        return (string.Join('\n', lines), $"{what} {index + 1}");
    }

    private static (string, string) NumberEdit(string text, Random random)
    {
        var numbers = Lexer.Lex(text).Where(t => t.Kind is TokenKind.Number or TokenKind.Imaginary).ToList();
        var number = Pick(Numbers, random);
        if (numbers.Count == 0) return (text + " " + number, $"append number {number}");
        var token = numbers[random.Next(numbers.Count)];
        var prefix = token.Kind == TokenKind.Imaginary && random.Next(2) == 0 ? "j" : "";
        return (text[..token.Span.Start] + prefix + number + text[token.Span.End..], $"number '{token.Text}' at {token.Span.Start} -> '{prefix}{number}'");
    }

    /// <summary>A word to put in: a keyword, a unit, a symbol, a name of the text, a number or something odd.</summary>
    private static string Word(string text, Random random) => random.Next(7) switch
    {
        0 or 1 => Pick(Keywords, random),
        2 => Pick(WindingNotes.Model.Units.Common, random),
        3 => Pick(["+", "-", "*", "/", "(", ")", "=", ":", ",", "±", "+-", "#", "j", "j1", "%", "angle", "sqrt", "sqrt(", "\\"], random),
        4 => Names(text) is { Length: > 0 } names ? Pick(names, random) : "X1",
        5 => Pick(Numbers, random),
        _ => Pick(Characters, random),
    };

    private static readonly string[] Keywords = [.. Grammar.Keywords.Order(StringComparer.Ordinal)];

    private static string[] Names(string text) =>
        [.. Lexer.Lex(text).Where(t => t.Kind == TokenKind.Word && !Grammar.Keywords.Contains(t.Text)).Select(t => t.Text).Distinct().Take(200)];

    private static readonly string[] Numbers =
    [
        "0", "0.0", "-0", "000", "1", "2", "1e308", "1.7976931348623157e308", "1e309", "-1e308", "1e-308", "4.9e-324", "1e-400",
        "99999999999999999999999999999", "123456789012345678901234567890e-10", "1_000", "1__0", "_1", "1_", "1e", "1e+", "1e-",
        ".5", "5.", "0.1e-5", "1E5", "NaN", "nan", "Infinity", "inf", "-inf", "0x10", "1,5", "1.2.3", "1e1e1", "2²", "٣", "1/0",
        "0/0", "(1e308 * 10)", "-(1e-308 / 1e308)", "sqrt(-1)", "3 + j4", "j0", "1e-20", "1e20", "1e15", "-10", "2.5", "1e-12", "1e-200 * 1e-200",
    ];

    private static readonly string[] Characters =
    [
        "Ω", "°", "²", "³", "±", "µ", "μ", "é", "ß", "中", "😀", "𝄞", "\uD800", "\uDBFF", "\uDC00", "\uDFFF", "\u0000", "\u0001",
        "\t", "\v", "\f", "\u001B", "\u007F", "\u0085", "\u00A0", "\u2028", "\u2029", "\uFEFF", "\u200B", "\u202E", "\uFFFD",
        "\uFFFF", "\r", "\n", "\r\n", "\\", "#", "'", "\"", "`", "|", "<", ">", "&", "{", "}", "[", "]", "$", "@", "~", "^", "!",
        "?", ";", "%", "_", "-", "+", "(", ")", ":", "=", "ｊ", "٣", "Ⅻ", "ǅ", "ﬁ", "İ", "ı", "K", "Å", "e\u0301", "\u0301",
    ];

    private static T Pick<T>(IReadOnlyList<T> items, Random random) => items[random.Next(items.Count)];

    private static string Short(string s) => s.Length <= 24 ? Escape(s) : Escape(s[..20]) + $"…({s.Length})";

    private static string Escape(string s) => string.Concat(s.Select(c => c < ' ' || char.IsSurrogate(c) || c > '~' ? $"\\u{(int)c:X4}" : c.ToString()));

    private static string Code(string s) => string.Join("+", s.Select(c => ((int)c).ToString("X4")));
}

using BenchmarkDotNet.Attributes;
using WindingNotes.Syntax;
using Parser = WindingNotes.Syntax.Parser;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Parsing alone, on the 1,000-line file: the whole parse, and its statements read by the reader of
/// the grammar table (the Pidgin statement parsers it replaced took 13.6 times as long; RESULTS.md).
/// </summary>
[MemoryDiagnoser]
public class ParseBenchmarks
{
    private string text = "";
    private (StatementForm Form, Token[] Tokens)[] statements = [];

    [GlobalSetup]
    public void Setup()
    {
        text = Documents.ThousandLines;
        statements = [.. Parser.Parse(text).Lines
            .Select(l => l.Significant.ToArray())
            .Where(t => t.Length > 0 && Grammar.ByKeyword.ContainsKey(t[0].Text))
            .Select(t => (Grammar.ByKeyword[t[0].Text], t))];
    }

    [Benchmark]
    public SyntaxTree ThousandLines() => Parser.Parse(text);

    [Benchmark]
    public int StatementsByReader()
    {
        var read = 0;
        foreach (var (form, tokens) in statements)
            if (StatementReader.Read(form, tokens).Stop is null) read++;
        return read;
    }
}

using System.Text;
using System.Text.Json;
using WindingNotes.Editing;
using WindingNotes.Model;
using WindingNotes.Report;
using WindingNotes.Report.Diagrams;
using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Tests.Robustness;

/// <summary>
/// One input through everything a user can reach: evaluation (parse, bind, solve, the study),
/// every report format and the result diff, the formatter, and every editor feature at many
/// positions. What it checks: no exception and no <c>internal-error</c>; every diagnostic, hint,
/// range and edit inside the document; edits that do not overlap; document symbols whose selection
/// lies in their range; semantic tokens in order; formatting that is idempotent and keeps the
/// statements; a rename that keeps the model's shape. <see cref="Step"/> says where it is, for a hang.
/// </summary>
public sealed class FuzzTarget(FuzzInput input, TimeSpan timeLimit, TimeSpan giveUp)
{
    private readonly List<string> problems = [];
    private readonly Random random = new(input.Seed);
    private CancellationToken cancel;

    public volatile string Step = "start";

    public IReadOnlyList<string> Problems => problems;

    /// <summary>True when the input worked past <c>giveUp</c> (processor time of its thread) and was cancelled.</summary>
    public bool Overran { get; private set; }

    public void Run()
    {
        // Made on this thread: it counts this thread's processor time, as the evaluation's own limit does.
        using var watch = new WindingNotes.Solve.TimeBudget(giveUp);
        cancel = watch.Token;
        try
        {
            var evaluation = Do("evaluate", () => Evaluator.Evaluate(input.Text, "fuzz.wn", cancel, timeLimit: timeLimit));
            if (evaluation is null) return;
            Diagnostics(evaluation);
            Reports(evaluation);
            Formatting(evaluation);
            Editor(evaluation);
        }
        finally
        {
            Overran = watch.Exceeded;
        }
    }

    private T? Do<T>(string step, Func<T> action)
    {
        Step = step;
        try
        {
            return action();
        }
        catch (Exception e)
        {
            problems.Add($"{step}: {e.GetType().Name}: {e.Message}\n{e.StackTrace}");
            return default;
        }
    }

    private void Do(string step, Action action) => Do(step, () => { action(); return 0; });

    private void Fail(string problem) => problems.Add($"{Step}: {problem}");

    // ---- diagnostics ----

    private void Diagnostics(Evaluation e)
    {
        Step = "diagnostics";
        foreach (var d in e.Diagnostics)
        {
            if (d.Code == "internal-error") Fail(d.Message);
            if (d.Span == default && e.Text.Text.Trim().Length > 0) Fail($"diagnostic {d.Code} has no range: {d.Shown}");
            Span(e.Text, d.Span, $"diagnostic {d.Code}");
            foreach (var h in d.Hints) Span(e.Text, h.Span, $"hint of {d.Code}");
            foreach (var r in d.Related) Span(e.Text, r.Span, $"related span of {d.Code}");
            Range(e.Text, e.Text.GetRange(d.Span), $"diagnostic {d.Code}");
        }
    }

    // ---- reports ----

    private void Reports(Evaluation e)
    {
        Do("text report", () => TextReport.Write(e));
        Do("markdown report", () => MarkdownReport.Write(e) + MarkdownReport.Summary(e));
        Do("json report", () => JsonDocument.Parse(JsonReport.Write(e)).Dispose());
        Do("network diagram", () => Svg(NetworkDiagram.Draw(e).Svg, "network diagram"));
        if (e.Normal is { } normal) Do("phasor diagram", () => Svg(PhasorDiagram.Draw(e, normal).Svg, "phasor diagram"));
        Do("one-line diagram", () => Svg(OneLineDiagram.Draw(e).Svg, "one-line diagram"));
        if (e.Normal is { } solved) Do("phase-set diagram", () => Svg(PhaseSetDiagram.Draw(e, solved).Svg, "phase-set diagram"));
        Do("diagnostic lines", () => string.Concat(e.Diagnostics.Select(d => DiagnosticLines.Format(e, d))));
        Do("diff with itself", () =>
        {
            var diff = ResultDiff.Compare(e, e);
            if (!diff.IsEmpty) Fail($"an evaluation differs from itself: {DiffReport.Text(diff)}");
        });
        if (Baselines.Of(input, timeLimit, cancel) is not { } baseline) return;
        Do("diff with the base", () =>
        {
            var diff = ResultDiff.Compare(baseline, e);
            return DiffReport.Text(diff) + DiffReport.Markdown(diff) + DiffReport.Summary(diff);
        });
    }

    private void Svg(string svg, string what)
    {
        try
        {
            System.Xml.Linq.XDocument.Parse(svg);
        }
        catch (System.Xml.XmlException x)
        {
            Fail($"{what} is not well-formed XML: {x.Message}");
        }
    }

    // ---- the formatter ----

    private void Formatting(Evaluation e)
    {
        var formatted = Do("format", () => Formatter.Format(e.Syntax));
        if (formatted is null) return;
        Do("format again", () =>
        {
            if (FormatProperty.Problem(e.Syntax, formatted, bind: !input.IsLarge) is { } problem) Fail(problem);
        });
        Do("formatting edits", () =>
        {
            var edits = WindingNotes.Editing.Formatting.Edits(e);
            if (Apply(e.Text, edits, "formatting edit") is { } applied && applied != formatted)
                Fail("the formatting edits do not give the formatted text");
        });
    }

    private static string Codes(IEnumerable<Diagnostic> diagnostics) => string.Join(",", diagnostics.Select(d => d.Code).Order(StringComparer.Ordinal));

    // ---- editor features ----

    private void Editor(Evaluation e)
    {
        var text = e.Text;
        Do("inlay hints", () =>
        {
            foreach (var h in InlayHints.For(e)) Position(text, h.Position, "inlay hint");
            foreach (var h in InlayHints.For(e, new TextRange(RandomPosition(text), new Position(text.LineCount + 2, 0)))) Position(text, h.Position, "inlay hint in a range");
        });
        Do("document symbols", () => Symbols(text, DocumentSymbols.For(e)));
        Do("semantic tokens", () => Tokens(text, SemanticTokens.For(e)));
        Do("quick fixes at diagnostics", () =>
        {
            foreach (var d in e.Diagnostics.Take(20)) Fixes(e, text.GetRange(d.Span));
        });
        var positions = Positions(e);
        var renamed = false;
        foreach (var p in positions)
        {
            Do($"hover at {p}", () => { if (Hovers.At(e, p) is { } h) Range(text, h.Range, "hover"); });
            Do($"completion at {p}", () => { foreach (var c in Completion.At(e, p)) Range(text, c.Range, $"completion '{c.Label}'"); });
            Do($"definition at {p}", () => { if (Navigation.Definition(e, p) is { } r) Range(text, r, "definition"); });
            Do($"references at {p}", () =>
            {
                foreach (var r in Navigation.References(e, p, includeDefinition: true)) Range(text, r, "reference");
                Navigation.References(e, p, includeDefinition: false);
            });
            Do($"prepare rename at {p}", () => { if (Navigation.PrepareRename(e, p) is { } t) Range(text, t.Range, "rename target"); });
            Do($"quick fixes at {p}", () => Fixes(e, new TextRange(p, p)));
            if (!renamed) renamed = Do($"rename at {p}", () => Rename(e, p));
        }
    }

    private List<Position> Positions(Evaluation e)
    {
        var text = e.Text;
        var count = input.IsLarge ? 4 : 14;
        var positions = new List<Position> { new(0, 0), text.GetPosition(text.Length), new(text.LineCount + 3, 7), new(0, 100_000), new(-1, -1) };
        foreach (var d in e.Diagnostics.Take(3)) positions.AddRange([text.GetPosition(d.Span.Start), text.GetPosition(d.Span.End)]);
        for (var i = 0; i < count; i++) positions.Add(RandomPosition(text));
        return positions;
    }

    private Position RandomPosition(SourceText text) => text.GetPosition(random.Next(text.Length + 1));

    private static readonly string[] NewNames = ["Zq9", "V", "kVA", "ohm", "sqrt", "angle", "Ω", "e", "pf", "x_1", "T1", "H1"];

    /// <summary>A rename must change the name everywhere and nothing else: the model keeps its shape and its diagnostics.</summary>
    private bool Rename(Evaluation e, Position p)
    {
        var name = NewNames[random.Next(NewNames.Length)];
        var result = Navigation.Rename(e, p, name);
        if (result.Error is not null || result.Edits.Count == 0) return false;
        // A second definition of a name is not bound to the symbol, so a rename leaves it (and its error) behind.
        if (e.Diagnostics.Any(d => d.Code == "duplicate-name")) return true;
        if (Apply(e.Text, result.Edits, "rename edit") is not { } renamed) return true;
        var before = Binder.Bind(e.Syntax);
        var after = Binder.Bind(Parser.Parse(renamed));
        string Shape(WindingNotes.Model.Model m) => string.Join(",", m.Symbols.Symbols.GroupBy(s => s.Kind).OrderBy(g => g.Key).Select(g => $"{g.Key}:{g.Count()}")) + " | " + Codes(m.Diagnostics);
        if (Shape(before) != Shape(after)) Fail($"renaming to '{name}' changed the model: {Shape(before)} -> {Shape(after)}\n--- renamed ---\n{Quote(renamed)}");
        return true;
    }

    private void Fixes(Evaluation e, TextRange range)
    {
        foreach (var fix in QuickFixes.For(e, range))
            Apply(e.Text, fix.Edits, $"quick fix '{fix.Title}'");
    }

    private void Symbols(SourceText text, IEnumerable<OutlineSymbol> symbols)
    {
        foreach (var s in symbols)
        {
            Range(text, s.Range, $"symbol {s.Name}");
            Range(text, s.SelectionRange, $"selection of symbol {s.Name}");
            if (Before(s.SelectionRange.Start, s.Range.Start) || Before(s.Range.End, s.SelectionRange.End))
                Fail($"symbol {s.Name}: selection {s.SelectionRange} outside its range {s.Range}");
            Symbols(text, s.Children);
        }
    }

    private void Tokens(SourceText text, IReadOnlyList<SemanticToken> tokens)
    {
        SemanticToken? previous = null;
        foreach (var t in tokens)
        {
            if (t.Line < 0 || t.Line >= text.LineCount || t.Length <= 0 || t.Character < 0 || t.Character + t.Length > text.GetLineSpan(t.Line).Length)
                Fail($"semantic token {t} outside its line");
            else if (previous is { } p && (t.Line < p.Line || (t.Line == p.Line && t.Character < p.Character + p.Length)))
                Fail($"semantic token {t} overlaps or precedes {p}");
            previous = t;
        }
    }

    // ---- positions, ranges and edits ----

    private void Span(SourceText text, TextSpan span, string what)
    {
        if (span.Start < 0 || span.Length < 0 || span.End > text.Length) Fail($"{what}: span {span} outside the document of {text.Length}");
    }

    private void Position(SourceText text, Position p, string what)
    {
        if (p.Line < 0 || p.Line >= text.LineCount || p.Character < 0 || p.Character > text.GetLineSpan(p.Line).Length)
            Fail($"{what}: position {p} outside the document");
    }

    private void Range(SourceText text, TextRange r, string what)
    {
        Position(text, r.Start, what);
        Position(text, r.End, what);
        if (Before(r.End, r.Start)) Fail($"{what}: range {r} ends before it starts");
    }

    private static bool Before(Position a, Position b) => a.Line < b.Line || (a.Line == b.Line && a.Character < b.Character);

    /// <summary>The text with the edits applied, after checking each lies in the document and none overlaps another.</summary>
    private string? Apply(SourceText text, IEnumerable<TextEdit> edits, string what)
    {
        var spans = new List<(TextSpan Span, string Text)>();
        foreach (var edit in edits)
        {
            Range(text, edit.Range, what);
            spans.Add((TextSpan.FromBounds(text.GetOffset(edit.Range.Start), text.GetOffset(edit.Range.End)), edit.NewText));
        }
        spans.Sort((a, b) => a.Span.Start.CompareTo(b.Span.Start));
        for (var i = 1; i < spans.Count; i++)
            if (spans[i].Span.Start < spans[i - 1].Span.End)
            {
                Fail($"{what}: edits at {spans[i - 1].Span} and {spans[i].Span} overlap");
                return null;
            }
        var o = new StringBuilder();
        var at = 0;
        foreach (var (span, newText) in spans)
        {
            o.Append(text.Text, at, span.Start - at).Append(newText);
            at = span.End;
        }
        return o.Append(text.Text, at, text.Length - at).ToString();
    }

    private static string Quote(string text) => FormatProperty.Quote(text);
}

/// <summary>
/// Evaluations of the bases to diff each input against: a file's made once, a random network's
/// now and then (each is new), a huge one's never (it would double the cost of the run).
/// </summary>
internal static class Baselines
{
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<string, Lazy<Evaluation>> Files = new();

    public static Evaluation? Of(FuzzInput input, TimeSpan limit, CancellationToken cancel)
    {
        if (input.Base.Length > 20_000) return null;
        if (input.BaseName.EndsWith(".wn", StringComparison.Ordinal))
            return Files.GetOrAdd(input.Base, t => new Lazy<Evaluation>(() => Evaluator.Evaluate(t, "base.wn", timeLimit: limit))).Value;
        return input.Seed % 3 == 0 ? Evaluator.Evaluate(input.Base, "base.wn", cancel, timeLimit: limit) : null;
    }
}

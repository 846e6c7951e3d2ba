using System.Diagnostics;
using WindingNotes.Editing;
using WindingNotes.Report;
using WindingNotes.Report.Diagrams;
using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Every stage a user can reach, timed once on files of many control-power units of 1, 2 and 5 MB
/// (or the sizes given): whether each grows about linearly with the file, or stops at a stated limit.
/// A measurement printed as a table, never asserted. Run:
/// <c>dotnet run -c Release --project tests/WindingNotes.Benchmarks -- stages 1 2 5</c>.
/// </summary>
public static class Stages
{
    /// <summary>A 1 MB file holds about 938 units of <see cref="Documents.ManyUnits"/>.</summary>
    private const double UnitsPerMegabyte = 938;

    public static void Run(string[] args)
    {
        var sizes = args.Length > 0 ? args.Select(a => double.Parse(a, System.Globalization.CultureInfo.InvariantCulture)).ToArray() : [1, 2, 5];
        Console.WriteLine($"load average at start: {Load()}");
        foreach (var megabytes in sizes)
        {
            var text = Documents.ManyUnits((int)Math.Round(megabytes * UnitsPerMegabyte));
            Console.WriteLine($"\n{megabytes} MB: {text.Length:N0} characters, {text.Count(c => c == '\n'):N0} lines");
            Time("parse", () => Parser.Parse(text).Lines.Length);
            var e = Time("evaluate (60 s limit)", () => Evaluator.Evaluate(text, "stages.wn"))!;
            Console.WriteLine($"    {e.Cases.Length} cases, {e.Diagnostics.Length} diagnostics{(e.Diagnostics.FirstOrDefault(x => x.IsError) is { } error ? $", first error: {error.Code}: {error.Message}" : "")}");
            var edited = text.Replace("power 180 W", "power 190 W");
            var other = Time("evaluate an edited copy", () => Evaluator.Evaluate(edited, "stages.wn"))!;
            Time("diff (edited against the first)", () => DiffReport.Text(ResultDiff.Compare(e, other)).Length);
            Time("text report", () => TextReport.Write(e).Length);
            Time("json report", () => JsonReport.Write(e).Length);
            Time("format", () => Formatter.Format(e.Syntax).Length);
            Time("formatting edits", () => Formatting.Edits(e).Count);
            if (e.Normal is { } normal) Time("phasor diagram", () => PhasorDiagram.Draw(e, normal).Svg.Length);
            Time("network diagram", () => NetworkDiagram.Draw(e).Svg.Length);
            Time("one-line diagram", () => OneLineDiagram.Draw(e).Svg.Length);
            var at = e.Text.GetPosition(text.IndexOf("PRI1 ", StringComparison.Ordinal));
            Time("references of PRI1", () => Navigation.References(e, at, includeDefinition: true).Count());
            Time("rename PRI1", () => Navigation.Rename(e, at, "PRIMARY1").Edits.Count);
            var last = e.Text.GetPosition(text.LastIndexOf("PRI", StringComparison.Ordinal));
            Time("hover at the last unit", () => Hovers.At(e, last) is null ? 0 : 1);
            Time("completion at the last unit", () => Completion.At(e, last).Count());
            Time("semantic tokens", () => SemanticTokens.For(e).Count);
            Time("inlay hints", () => InlayHints.For(e).Count());
            Time("document symbols", () => DocumentSymbols.For(e).Count());
        }
        Console.WriteLine($"\nload average at end: {Load()}");
    }

    private static T Time<T>(string stage, Func<T> work)
    {
        var cpu = Process.GetCurrentProcess().TotalProcessorTime;
        var clock = Stopwatch.StartNew();
        var result = work();
        var wall = clock.Elapsed;
        var used = Process.GetCurrentProcess().TotalProcessorTime - cpu;
        Console.WriteLine($"  {stage,-34} {wall.TotalSeconds,8:F2} s wall {used.TotalSeconds,8:F2} s processor");
        return result;
    }

    private static string Load() => File.Exists("/proc/loadavg") ? File.ReadAllText("/proc/loadavg").Trim() : "unknown";
}

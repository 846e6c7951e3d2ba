using System.Numerics;
using WindingNotes.Solve;
using WindingNotes.Text;
using WindingNotes.Workspace;
using Xunit;

namespace WindingNotes.Tests.Support;

/// <summary>Evaluates notation in tests and reads results by name.</summary>
public static class Wn
{
    public static Evaluation Eval(string text) => Evaluator.Evaluate(text.Replace("\r\n", "\n"), "test.wn");

    /// <summary>
    /// Every sweep point's case of an evaluation, as it was solved, by evaluating its text again and
    /// keeping each point's case as it comes: the evaluation keeps a sweep's points only in its columns.
    /// </summary>
    public static List<CaseResult> Points(Evaluation e)
    {
        var points = new List<CaseResult>();
        Evaluator.Evaluate(e.Text.Text, e.Path, sweepPoint: points.Add);
        return points;
    }

    /// <summary>Evaluates and fails the test on any error diagnostic, so a reference check never passes on a half-read file.</summary>
    public static Evaluation Solved(string text)
    {
        var e = Eval(text);
        var errors = e.Diagnostics.Where(d => d.IsError && d.Code != "expect-failed").ToList();
        Assert.True(errors.Count == 0, string.Join("\n", errors.Select(d => $"{e.Text.GetPosition(d.Span.Start)} {d.Code}: {d.Shown}")));
        Assert.NotNull(e.Normal);
        return e;
    }

    public static Complex V(this CaseResult c, string a, string b) => c.PointVoltage(a) - c.PointVoltage(b);

    public static SectionResult Section(this CaseResult c, string name) => c.Sections.Single(s => s.Section.Name == name);

    public static LoadResult Load(this CaseResult c, string name) => c.Loads.Single(l => l.Load.Name == name);

    public static SupplyResult Supply(this CaseResult c, string name) => c.Supplies.Single(s => s.Supply.Name == name);

    /// <summary>Asserts a relative closeness, the way printed figures are compared.</summary>
    public static void Near(double expected, double actual, double relative, string what = "")
    {
        var error = Math.Abs(actual - expected) / Math.Max(Math.Abs(expected), 1e-300);
        Assert.True(error <= relative, $"{what}: expected {expected} within {relative:P3}, got {actual} (off by {error:P4})");
    }

    public static IEnumerable<Diagnostic> Errors(this Evaluation e) => e.Diagnostics.Where(d => d.IsError);

    /// <summary>The diagnostic with the code, or a failure listing what there is.</summary>
    public static Diagnostic Single(this Evaluation e, string code)
    {
        var found = e.Diagnostics.Where(d => d.Code == code).ToList();
        Assert.True(found.Count == 1, $"expected one '{code}', found: {string.Join("; ", e.Diagnostics.Select(d => $"{d.Code}: {d.Shown}"))}");
        return found[0];
    }

    public static string TextAt(this Evaluation e, TextSpan span) => e.Text[span];
}

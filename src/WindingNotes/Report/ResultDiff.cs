using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Text;
using WindingNotes.Workspace;

namespace WindingNotes.Report;

public enum CheckState { Absent, Pass, Fail }

/// <summary>
/// An expectation in both revisions (or one), matched by what it measures, so changing its bounds
/// keeps it the same expectation; <see cref="OldText"/> is set when its statement changed.
/// </summary>
public sealed record CheckChange(string Text, string? OldText, int? Line, CheckState Old, CheckState New, double? OldValue, double? NewValue, string Unit)
{
    public bool Regressed => Old == CheckState.Pass && New == CheckState.Fail;

    public bool StateChanged => Old != New;
}

/// <summary>A result that moved, appeared or went away. Old or New is null when the result is in one revision only.</summary>
public sealed record ValueChange(string Case, string Element, string Label, string Unit, double? Old, double? New)
{
    /// <summary>How far it moved, for ranking: the relative change, an angle's shift in radians; infinite from or to zero, null when new or gone.</summary>
    public double? Size => (Old, New) switch
    {
        ({ } a, { } b) when Unit == "deg" => Math.Abs(ResultDiff.AngleChange(a, b)) * Math.PI / 180,
        ({ } a, { } b) => ResultDiff.Relative(a, b) is { } r ? Math.Abs(r) : double.PositiveInfinity,
        _ => null,
    };
}

/// <summary>
/// One result over a sweep, compared point by point (points matched by their swept values): how
/// many of the points both revisions solved it moved at, and the largest move with its point.
/// </summary>
public sealed record SweepChange(string Element, string Label, string Unit, int Moved, int Points, ValueChange Largest)
{
    /// <summary>"BR=100 %": where the largest move is.</summary>
    public string Where => Largest.Case.StartsWith("sweep ") ? Largest.Case["sweep ".Length..] : Largest.Case;
}

/// <summary>A tolerance band compared by its ends; an end is null where the band is in one revision only.</summary>
public sealed record BandChange(string Case, string Label, string Unit, double? OldMin, double? OldMax, double? NewMin, double? NewMax);

/// <summary>
/// A diagnostic that appeared, went away (New or Old null) or changed only in the numbers it quotes
/// (both set): a caution that quotes a voltage is one change when the voltage moves.
/// </summary>
public sealed record DiagnosticChange(Severity Severity, string Code, string? Old, string? New)
{
    public bool Added => Old is null;

    public bool Gone => New is null;

    /// <summary>A rating warning that appeared or went away: a winding, core or brush that went over its rating, or came back under it.</summary>
    public bool RatingCrossed => (Added || Gone) && RatingTally.Codes.Contains(Code);
}

/// <summary>What a change to a file did to its results: expectations first, then every result that moved.</summary>
public sealed record ResultDiff(
    string OldName,
    string NewName,
    double Threshold,
    ImmutableArray<CheckChange> Checks,
    ImmutableArray<ValueChange> Values,
    ImmutableArray<SweepChange> Sweeps,
    ImmutableArray<BandChange> Bands,
    ImmutableArray<string> CasesAdded,
    ImmutableArray<string> CasesRemoved,
    ImmutableArray<DiagnosticChange> Diagnostics)
{
    public bool Regressed => Checks.Any(c => c.Regressed);

    public bool IsEmpty => Checks.IsEmpty && Values.IsEmpty && Sweeps.IsEmpty && Bands.IsEmpty && CasesAdded.IsEmpty && CasesRemoved.IsEmpty && Diagnostics.IsEmpty;

    public const double DefaultThreshold = 0.001;

    /// <summary>
    /// Compares two evaluations. A value moved when its relative change exceeds the threshold (a
    /// fraction); an angle when its shift in radians does, which is the relative change it makes to
    /// its phasor. Values within 1e-9 of the largest of their unit in the case count as zero, so
    /// rounding noise never shows. Sweep points are compared point by point and each result over
    /// the sweep is told once, by its largest move; a tolerance band by its two ends.
    /// </summary>
    public static ResultDiff Compare(Evaluation old, Evaluation @new, double threshold = DefaultThreshold, string? oldName = null, string? newName = null)
    {
        var before = ResultValues.Of(old);
        var after = ResultValues.Of(@new);
        var oldCases = CaseNames(old).ToHashSet();
        var newCases = CaseNames(@new).ToHashSet();
        var sweepPoints = SweepPoints(@new).ToHashSet();
        var scale = Scales(before.Concat(after));

        var values = new List<ValueChange>();
        var oldByKey = Index(before);
        var newByKey = Index(after);
        // Over a sweep: how many points compared each result, by its label.
        var compared = new Dictionary<string, int>();
        foreach (var a in after)
        {
            var key = (a.Case, a.Element, a.Field);
            if (!oldCases.Contains(a.Case) || newByKey[key] != a) continue;
            if (!oldByKey.TryGetValue(key, out var b))
            {
                if (!IsZero(a, scale)) values.Add(Change(a, null, a.Value));
                continue;
            }
            if (sweepPoints.Contains(a.Case)) compared[a.Label] = compared.GetValueOrDefault(a.Label) + 1;
            if (Moved(b, a, threshold, scale)) values.Add(Change(a, b.Value, a.Value));
        }
        foreach (var b in before)
            if (newCases.Contains(b.Case) && !newByKey.ContainsKey((b.Case, b.Element, b.Field)) && !IsZero(b, scale))
                values.Add(Change(b, b.Value, null));

        var sweeps = values.Where(v => sweepPoints.Contains(v.Case)).GroupBy(v => v.Label).Select(g => new SweepChange(
            g.First().Element, g.Key, g.First().Unit, g.Count(), Math.Max(g.Count(), compared.GetValueOrDefault(g.Key)), g.MaxBy(v => v.Size ?? -1)!));
        var rest = values.Where(v => !sweepPoints.Contains(v.Case)).ToList();
        var bands = rest.Where(v => v.Element.StartsWith(ResultValues.BandOf)).GroupBy(v => (v.Case, v.Element)).Select(g => Band(g.Key.Case, g.Key.Element, g.First().Unit, oldByKey, newByKey));

        return new ResultDiff(
            oldName ?? old.Path, newName ?? @new.Path, threshold,
            CompareChecks(old, @new, threshold),
            [.. rest.Where(v => !v.Element.StartsWith(ResultValues.BandOf))],
            [.. sweeps],
            [.. bands],
            [.. CaseNames(@new).Where(n => !oldCases.Contains(n))],
            [.. CaseNames(old).Where(n => !newCases.Contains(n))],
            CompareDiagnostics(old, @new));
    }

    /// <summary>Every case's name in the report's order: the sweep's kept points from its columns, after the others.</summary>
    private static IEnumerable<string> CaseNames(Evaluation e) =>
        e.Cases.Where(c => e.SweepColumns is null || !c.Case.IsSweepPoint).Select(c => c.Case.Name).Concat(e.SweepColumns is null ? [] : SweepPoints(e));

    private static IEnumerable<string> SweepPoints(Evaluation e) =>
        e.SweepColumns is { } sweep ? Enumerable.Range(0, sweep.Count).Select(sweep.Name) : e.Cases.Where(c => c.Case.IsSweepPoint).Select(c => c.Case.Name);

    private static ValueChange Change(ResultValue v, double? old, double? @new) => new(v.Case, v.Element, v.Label, v.Unit, old, @new);

    /// <summary>A band's two ends in each revision; the element is "band of node X1 voltage:".</summary>
    private static BandChange Band(string @case, string element, string unit,
        Dictionary<(string, string, string), ResultValue> before, Dictionary<(string, string, string), ResultValue> after)
    {
        double? End(Dictionary<(string, string, string), ResultValue> values, string field) => values.TryGetValue((@case, element, field), out var v) ? v.Value : null;
        return new BandChange(@case, element[ResultValues.BandOf.Length..].TrimEnd(':'), unit, End(before, "min"), End(before, "max"), End(after, "min"), End(after, "max"));
    }

    private static Dictionary<(string, string, string), ResultValue> Index(IEnumerable<ResultValue> values)
    {
        var index = new Dictionary<(string, string, string), ResultValue>();
        foreach (var v in values) index.TryAdd((v.Case, v.Element, v.Field), v);
        return index;
    }

    private static Dictionary<(string, string), double> Scales(IEnumerable<ResultValue> values)
    {
        var scale = new Dictionary<(string, string), double>();
        foreach (var v in values)
        {
            var key = (v.Case, v.Unit);
            scale[key] = Math.Max(scale.GetValueOrDefault(key), Math.Abs(v.Value));
        }
        return scale;
    }

    private static bool IsZero(double value, string @case, string unit, Dictionary<(string, string), double> scale) =>
        Numbers.Clean(value, scale.GetValueOrDefault((@case, unit))) == 0;

    private static bool IsZero(ResultValue v, Dictionary<(string, string), double> scale) =>
        v.Unit == "deg" ? v.Magnitude is { } m && IsZero(m, v.Case, PhasorUnit(v.Field), scale) : IsZero(v.Value, v.Case, v.Unit, scale);

    private static string PhasorUnit(string angleField) => ResultValues.UnitOf(angleField[..^"deg".Length] + "rms");

    private static bool Moved(ResultValue old, ResultValue @new, double threshold, Dictionary<(string, string), double> scale)
    {
        if (old.Unit == "deg")
        {
            if (IsZero(old, scale) || IsZero(@new, scale)) return false;
            return Math.Abs(AngleChange(old.Value, @new.Value)) * Math.PI / 180 > threshold;
        }
        var zeroBefore = IsZero(old, scale);
        var zeroAfter = IsZero(@new, scale);
        if (zeroBefore || zeroAfter) return zeroBefore != zeroAfter;
        return Math.Abs(@new.Value - old.Value) > threshold * Math.Abs(old.Value);
    }

    /// <summary>The shift from one angle to another in degrees, the short way round.</summary>
    public static double AngleChange(double from, double to)
    {
        var d = (to - from) % 360;
        return d > 180 ? d - 360 : d <= -180 ? d + 360 : d;
    }

    /// <summary>The relative change, or null from zero.</summary>
    public static double? Relative(double old, double @new) => old == 0 ? null : (@new - old) / Math.Abs(old);

    private static ImmutableArray<CheckChange> CompareChecks(Evaluation old, Evaluation @new, double threshold)
    {
        var before = ChecksByMeasure(old);
        var after = ChecksByMeasure(@new);
        var beforeIndex = before.ToDictionary(p => p.Key, p => p.Value);
        var afterIndex = after.ToDictionary(p => p.Key, p => p.Value);
        var changes = new List<CheckChange>();
        foreach (var (key, now) in after)
        {
            var state = State(now.Check);
            if (!beforeIndex.TryGetValue(key, out var was))
            {
                changes.Add(new CheckChange(now.Text, null, now.Line, CheckState.Absent, state, null, now.Check.Value, now.Check.Expect.Unit));
                continue;
            }
            var oldState = State(was.Check);
            var moved = was.Check.Value is { } a && now.Check.Value is { } b && Math.Abs(b - a) > threshold * Math.Abs(a);
            if (oldState != state || moved || was.Text != now.Text || (was.Check.Value is null) != (now.Check.Value is null))
                changes.Add(new CheckChange(now.Text, was.Text == now.Text ? null : was.Text, now.Line, oldState, state, was.Check.Value, now.Check.Value, now.Check.Expect.Unit));
        }
        foreach (var (key, was) in before)
            if (!afterIndex.ContainsKey(key))
                changes.Add(new CheckChange(was.Text, null, null, State(was.Check), CheckState.Absent, was.Check.Value, null, was.Check.Expect.Unit));
        // Expectations that now fail first, then those that changed state, then the rest.
        return [.. changes.OrderBy(c => c.Regressed ? 0 : c.StateChanged ? 1 : 2)];
    }

    private static CheckState State(CheckResult check) => check.Passed ? CheckState.Pass : CheckState.Fail;

    /// <summary>
    /// Checks by what they measure (<c>voltage X1 H2</c>, and how many such checks came before), each
    /// with its statement in the canonical layout and its one-based line, in source order.
    /// </summary>
    private static List<KeyValuePair<(string Measure, int Occurrence), (CheckResult Check, string Text, int Line)>> ChecksByMeasure(Evaluation evaluation)
    {
        var result = new List<KeyValuePair<(string, int), (CheckResult, string, int)>>();
        var seen = new Dictionary<string, int>();
        foreach (var check in evaluation.Checks)
        {
            var measure = string.Join(' ', check.Expect.MeasureText.Split((char[])[' ', '\t', '\\', '\r', '\n'], StringSplitOptions.RemoveEmptyEntries));
            var occurrence = seen[measure] = seen.GetValueOrDefault(measure, -1) + 1;
            var text = Formatter.Format(Parser.Parse(check.Expect.Text)).Trim();
            result.Add(new((measure, occurrence), (check, text, evaluation.Text.GetPosition(check.Expect.Line.Start).Line + 1)));
        }
        return result;
    }

    /// <summary>
    /// Diagnostics that appeared or went away, by what they say (positions move with every edit); one
    /// that says the same with other numbers is a change of those numbers. Failed checks are told above.
    /// </summary>
    private static ImmutableArray<DiagnosticChange> CompareDiagnostics(Evaluation old, Evaluation @new)
    {
        static List<(Severity Severity, string Code, string Message)> Of(Evaluation e) =>
            [.. e.Diagnostics.Where(d => d.Code != "expect-failed").Select(d => (d.Severity, d.Code, d.Shown))];
        var before = Of(old);
        var after = Of(@new);
        // Each side less what the other has, as multisets: linear in the diagnostics, for files of thousands.
        static Dictionary<(Severity, string, string), int> Counts(List<(Severity, string, string)> list)
        {
            var counts = new Dictionary<(Severity, string, string), int>();
            foreach (var d in list) counts[d] = counts.GetValueOrDefault(d) + 1;
            return counts;
        }
        static bool Take(Dictionary<(Severity, string, string), int> counts, (Severity, string, string) d)
        {
            if (counts.GetValueOrDefault(d) == 0) return false;
            counts[d]--;
            return true;
        }
        var inBefore = Counts(before);
        var added = after.Where(d => !Take(inBefore, d)).ToList();
        var inAfter = Counts(after);
        var gone = before.Where(d => !Take(inAfter, d)).ToList();
        // A gone diagnostic that says what an added one says, with other numbers, is its old wording.
        var byWording = gone.Select((d, i) => (Key: (d.Severity, d.Code, Wording(d.Message)), Index: i)).GroupBy(x => x.Key)
            .ToDictionary(g => g.Key, g => new Queue<int>(g.Select(x => x.Index)));
        var paired = new HashSet<int>();
        var changes = new List<DiagnosticChange>();
        foreach (var d in added)
        {
            string? was = null;
            if (byWording.TryGetValue((d.Severity, d.Code, Wording(d.Message)), out var queue) && queue.TryDequeue(out var i))
            {
                paired.Add(i);
                was = gone[i].Message;
            }
            changes.Add(new DiagnosticChange(d.Severity, d.Code, was, d.Message));
        }
        changes.AddRange(gone.Where((_, i) => !paired.Contains(i)).Select(d => new DiagnosticChange(d.Severity, d.Code, d.Message, null)));
        return [.. changes];
    }

    /// <summary>
    /// Each number of a message, as messages write it ("227.9", "-0.04", "1.2E-05": the regular expression
    /// <c>-?\d+(?:\.\d+)?(?:E[+-]?\d+)?</c>, leftmost first), replaced by what <paramref name="replace"/>
    /// gives for it. Scanned by hand: a regular expression would bring .NET's regular expression engines
    /// into the native command, whose start-up writes out every type it carries.
    /// </summary>
    public static string ReplaceNumbers(string message, Func<string, string> replace)
    {
        var o = new System.Text.StringBuilder(message.Length);
        var i = 0;
        while (i < message.Length)
        {
            var end = NumberEnd(message, i);
            if (end < 0) o.Append(message[i++]);
            else
            {
                o.Append(replace(message[i..end]));
                i = end;
            }
        }
        return o.ToString();
    }

    /// <summary>The numbers of a message, in order (as <see cref="ReplaceNumbers"/> finds them).</summary>
    public static List<string> NumbersIn(string message)
    {
        var found = new List<string>();
        ReplaceNumbers(message, n => { found.Add(n); return n; });
        return found;
    }

    /// <summary>Where a number starting at <paramref name="start"/> ends, or -1 if none starts there.</summary>
    private static int NumberEnd(string s, int start)
    {
        var i = start;
        if (i < s.Length && s[i] == '-') i++;
        var digits = Digits(s, i);
        if (digits == i) return -1;
        i = digits;
        // A fraction or an exponent only with digits after it; else the number ends before it.
        if (i < s.Length && s[i] == '.' && Digits(s, i + 1) > i + 1) i = Digits(s, i + 1);
        if (i < s.Length && s[i] == 'E')
        {
            var j = i + 1;
            if (j < s.Length && (s[j] == '+' || s[j] == '-')) j++;
            if (Digits(s, j) > j) i = Digits(s, j);
        }
        return i;
    }

    // char.IsDigit is the regular expression's \d: a Unicode decimal digit.
    private static int Digits(string s, int i)
    {
        while (i < s.Length && char.IsDigit(s[i])) i++;
        return i;
    }

    /// <summary>A message with its numbers taken out: what it says, whatever the values.</summary>
    private static string Wording(string message) => ReplaceNumbers(message, _ => "#");
}

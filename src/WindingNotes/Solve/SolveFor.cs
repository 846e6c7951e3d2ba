using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// A 'find' line: the value of a let in [low, high] that makes a measure equal a target. The range
/// is scanned in <see cref="Intervals"/> equal intervals; each change of sign of (measure − target)
/// brackets a root, refined by the Illinois form of regula falsi (which keeps the bracket, so it
/// cannot wander out of it). One root is the answer; none, or several, is an error that says what
/// the scan saw, never a nearest value. A bracket across which the measure jumps (a tap changer
/// changing position, say) without passing through the target is no root, and is said so.
/// </summary>
public static class SolveFor
{
    public const int Intervals = 40;

    private const int MaxIterations = 100;

    /// <summary>The value found, or null after an error.</summary>
    public static Quantity? Run(FindModel find, TapPlan plan, DiagnosticBag diagnostics, CancellationToken cancel)
    {
        var lo = find.Low.Real;
        var hi = find.High.Real;
        var unsolved = 0;
        double? Residual(double x)
        {
            var p = plan.Solve(new BindOverrides { Values = ImmutableDictionary<string, Quantity>.Empty.Add(find.Let, At(x)) }, CaseSpec.Normal, withFaults: false, cancel);
            if (p.Case is not { } c) return null;
            return Checks.Measure(find.Measure, c, out _) is { } m ? m - find.Target : null;
        }
        Quantity At(double x) => find.Low with { Value = x };

        var scan = Bracket(Residual, lo, hi, Intervals, 1e-13);
        unsolved = scan.Unsolved;
        var solved = scan.Values;
        if (solved.Count == 0)
        {
            diagnostics.ReportFindUnsolved(find);
            return null;
        }
        var scale = Math.Max(Math.Abs(find.Target), solved.Max(Math.Abs));
        var roots = new List<double>(scan.Zeros);
        var jumps = new List<double>();
        foreach (var (x, fx) in scan.Crossings)
        {
            if (fx is { } r && Math.Abs(r) <= 1e-6 * scale) roots.Add(x);
            else jumps.Add(x);
        }
        roots.Sort();
        var unit = Unit(find.Low);
        if (roots.Count == 1)
        {
            diagnostics.ReportFound(find, Text(roots[0], unit), unsolved);
            return At(roots[0]);
        }
        if (roots.Count > 1) diagnostics.ReportFindSeveral(find, [.. roots.Select(r => Text(r, unit))]);
        else diagnostics.ReportFindNone(find, solved.Min() + find.Target, solved.Max() + find.Target, [.. jumps.Select(j => Text(j, unit))], unsolved);
        return null;
    }

    /// <summary>
    /// What a scan of [lo, hi] in equal intervals saw: the residuals it could compute (<see cref="Values"/>),
    /// how many points it could not, the points where the residual is zero, and each change of sign
    /// refined to where it happens (with the residual there, or null where it could not be computed), in order.
    /// </summary>
    internal sealed record Scan(List<double> Values, int Unsolved, List<double> Zeros, List<(double X, double? F)> Crossings);

    /// <summary>
    /// The bracketing search of 'find', for any residual: each change of sign between two points of
    /// the scan is refined until the bracket is narrower than <paramref name="narrow"/> times the range.
    /// The thermal capability searches the same way (<see cref="ThermalCapability"/>).
    /// </summary>
    internal static Scan Bracket(Func<double, double?> residual, double lo, double hi, int intervals, double narrow)
    {
        var xs = Enumerable.Range(0, intervals + 1).Select(k => lo + (hi - lo) * k / intervals).ToArray();
        var fs = xs.Select(residual).ToArray();
        var zeros = new List<double>();
        var crossings = new List<(double, double?)>();
        for (var k = 0; k < xs.Length; k++)
        {
            if (fs[k] is not { } fk) continue;
            if (fk == 0)
            {
                zeros.Add(xs[k]);
                continue;
            }
            if (k + 1 >= xs.Length || fs[k + 1] is not { } fn || fn == 0 || Math.Sign(fk) == Math.Sign(fn)) continue;
            crossings.Add(Refine(xs[k], fk, xs[k + 1], fn, residual, (hi - lo) * narrow));
        }
        return new Scan([.. fs.OfType<double>()], fs.Count(f => f is null), zeros, crossings);
    }

    /// <summary>Illinois regula falsi on a bracket [a, b] with f(a), f(b) of opposite signs, until it is narrower than <paramref name="narrowest"/>.</summary>
    private static (double X, double? F) Refine(double a, double fa, double b, double fb, Func<double, double?> f, double narrowest)
    {
        var side = 0;
        var x = a;
        double? fx = fa;
        for (var i = 0; i < MaxIterations && Math.Abs(b - a) > narrowest; i++)
        {
            x = (a * fb - b * fa) / (fb - fa);
            if (!(x > Math.Min(a, b) && x < Math.Max(a, b))) x = (a + b) / 2;
            fx = f(x);
            if (fx is not { } v) return (x, null);
            if (v == 0) return (x, 0);
            if (Math.Sign(v) == Math.Sign(fb))
            {
                (b, fb) = (x, v);
                if (side == -1) fa /= 2;
                side = -1;
            }
            else
            {
                (a, fa) = (x, v);
                if (side == 1) fb /= 2;
                side = 1;
            }
        }
        return (x, fx);
    }

    private static string Unit(Quantity q) => q.IsPercent ? "%" : q.Flags.HasFlag(QuantityFlags.Turns) ? "turns" : q.Dimension.IsNone ? "" : q.Dimension.SiUnit();

    /// <summary>A let's value as the file writes it: "28.35 turns", "4.375 %", "7.62 kV".</summary>
    public static string Text(Quantity q) => Text(q.Real, Unit(q));

    private static string Text(double x, string unit) => unit == "%" ? Numbers.Format(x * 100, "%") : Numbers.Format(x, unit);
}

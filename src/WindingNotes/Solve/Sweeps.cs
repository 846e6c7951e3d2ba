using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// One sweep line, checked and ready to run: the value at index k is From + k·Step, so no list of
/// values is held, however long the sweep.
/// </summary>
public sealed record SweepAxis(SweepModel Sweep, Quantity From, double Step, long Count)
{
    public string Name => Sweep.Target.Name;

    public Quantity Value(long k) => From with { Value = From.Real + k * Step };

    /// <summary>The value as reports write it: "25 %", "60 turns", "208 V".</summary>
    public SweepValue Label(long k)
    {
        var v = Value(k).Real;
        var unit = Unit(Sweep);
        return new SweepValue(Name, v, Numbers.Short(unit == "%" ? v * 100 : v, unit));
    }

    /// <summary>The unit a sweep's values are written in: "%" (values are fractions), "turns", or the SI unit of its values.</summary>
    public static string Unit(SweepModel sweep) =>
        sweep.From.IsPercent ? "%"
        : sweep.From.Flags.HasFlag(QuantityFlags.Turns) || (sweep.From.Dimension.IsNone && sweep.Target.Kind == SymbolKind.Brush) ? "turns"
        : sweep.From.Dimension.SiUnit();
}

/// <summary>
/// Sweeps: each `sweep` line gives an axis; several make a grid (the first line varies slowest).
/// The number of points has a budget: a sweep over it is reported and not run, never left to hang.
/// </summary>
public static class Sweeps
{
    /// <summary>The most points (sweep points times tolerance samples) one evaluation solves.</summary>
    public const long Budget = 1_000_000;

    /// <summary>
    /// The most sweep points whose results an evaluation keeps: a longer sweep keeps every so many
    /// (and its last), and says so; its checks, ratings and cautions still cover every point. A report
    /// of more points than this is read by no one.
    /// </summary>
    public const int Kept = 2001;

    /// <summary>
    /// The most element results (points, sections, cores, supplies, loads) the kept points hold
    /// together: a point of a large network holds its own network and a result for every element
    /// (some 600 bytes each), so a sweep of a thousand-line file keeps fewer points, not a gigabyte.
    /// </summary>
    public const int KeptElements = 100_000;

    /// <summary>The sweep points kept of a network whose normal case has <paramref name="c"/>'s elements: at least the first and the last.</summary>
    public static int KeptFor(CaseResult c) =>
        Math.Clamp(KeptElements / Math.Max(1, c.Points.Length + c.Sections.Length + c.Cores.Length + c.Supplies.Length + c.Loads.Length), 2, Kept);

    /// <summary>The axes to run, or none after a diagnostic when a sweep line cannot run or the grid is over the budget.</summary>
    public static ImmutableArray<SweepAxis> Plan(Model.Model model, DiagnosticBag diagnostics)
    {
        var axes = ImmutableArray.CreateBuilder<SweepAxis>();
        var seen = new Dictionary<string, SweepModel>(StringComparer.Ordinal);
        var failed = false;
        foreach (var sweep in model.Sweeps)
        {
            if (seen.TryGetValue(sweep.Target.Name, out var first))
            {
                diagnostics.ReportSweepDuplicate(sweep.Line, sweep.Target.Name, first.Line);
                failed = true;
                continue;
            }
            seen[sweep.Target.Name] = sweep;
            if (Axis(model, sweep, diagnostics) is { } axis) axes.Add(axis);
            else failed = true;
        }
        if (failed || axes.Count == 0) return [];
        double total = 1;
        foreach (var a in axes) total *= a.Count;
        if (total > Budget)
        {
            diagnostics.ReportSweepBudget(model.Sweeps[0].Line, total, Budget);
            return [];
        }
        return axes.ToImmutable();
    }

    /// <summary>The number of grid points; zero without sweeps.</summary>
    public static long Count(ImmutableArray<SweepAxis> axes) => axes.IsEmpty ? 0 : axes.Aggregate(1L, (n, a) => n * a.Count);

    /// <summary>The overrides and labels of grid point k, the last axis varying fastest.</summary>
    public static (BindOverrides Overrides, ImmutableArray<SweepValue> Labels) Point(ImmutableArray<SweepAxis> axes, long k)
    {
        var values = ImmutableDictionary.CreateBuilder<string, Quantity>(StringComparer.Ordinal);
        var labels = new SweepValue[axes.Length];
        for (var i = axes.Length - 1; i >= 0; i--)
        {
            var index = k % axes[i].Count;
            k /= axes[i].Count;
            values[axes[i].Name] = axes[i].Value(index);
            labels[i] = axes[i].Label(index);
        }
        return (new BindOverrides { Values = values.ToImmutable() }, [.. labels]);
    }

    private static SweepAxis? Axis(Model.Model model, SweepModel sweep, DiagnosticBag diagnostics)
    {
        var (from, to) = (sweep.From, sweep.To);
        if (!from.IsReal || !to.IsReal || !from.Dimension.Fits(to.Dimension) || from.IsPercent != to.IsPercent)
        {
            diagnostics.ReportSweepRange(sweep.Line, "a sweep runs between two real values of one kind");
            return null;
        }
        if (sweep.Target.Kind == SymbolKind.Let)
        {
            // A let that failed to evaluate was reported at its own line.
            if (!model.Lets.TryGetValue(sweep.Target.Name, out var nominal)) return null;
            if (!nominal.Dimension.Fits(from.Dimension) || nominal.IsPercent != from.IsPercent)
            {
                diagnostics.ReportSweepRange(sweep.Line, $"'{sweep.Target.Name}' is {nominal.Dimension.Describe()}{(nominal.IsPercent ? " in %" : "")}, but the sweep runs over {from.Dimension.Describe()}{(from.IsPercent ? " in %" : "")}");
                return null;
            }
        }
        else if (!from.Dimension.IsNone && from.Dimension != Dimension.Voltage)
        {
            diagnostics.ReportSweepRange(sweep.Line, $"a brush moves in turns, % or volts, not in {from.Dimension.SiUnit()}");
            return null;
        }
        var span = to.Real - from.Real;
        if (sweep.Points is { } n)
        {
            if (n < 1)
            {
                diagnostics.ReportSweepRange(sweep.Line, "a sweep needs at least one point");
                return null;
            }
            return new SweepAxis(sweep, from, n == 1 ? 0 : span / (n - 1), n);
        }
        var step = sweep.Step!.Value;
        if (!step.IsReal || !step.Dimension.Fits(from.Dimension) || step.IsPercent != from.IsPercent || !(step.Real > 0))
        {
            diagnostics.ReportSweepRange(sweep.Line, "the step must be a real value above zero, of the same kind as the range");
            return null;
        }
        // The step goes from the start towards the end; a point within rounding of the end counts.
        var size = Math.Abs(step.Real);
        var steps = Math.Floor(Math.Abs(span) / size * (1 + 1e-12) + 1e-9);
        var count = (long)Math.Min(steps + 1, 1e15);
        return new SweepAxis(sweep, from, span >= 0 ? size : -size, count);
    }
}

using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// Rating checks, warned at the line of what is over its rating: windings over their rated current or
/// above the usual current density, cores over their flux limit or over-excited, brushes over their current limit, autotransformer
/// connections that need more two-winding rating than their cores have. Each finding is gathered over
/// the normal case and every sweep point and reported once, with its worst value and where.
/// </summary>
public sealed class RatingTally
{
    /// <summary>Volts per turn may reach 105 % of rated on load and 110 % at no load (IEEE C57.12.00, from memory).</summary>
    public const double OnLoadExcitation = 1.05, NoLoadExcitation = 1.10;

    /// <summary>The codes of the rating warnings: a diff and a report summary count them as ratings crossed.</summary>
    public static readonly ImmutableHashSet<string> Codes = ["loading-high", "flux-high", "overexcited", "brush-current-high", "current-density-high", "connection-rating", "hot-spot-high", "top-oil-high", "cycle-current-high", "regulator-current-high"];

    private readonly Dictionary<(string Code, string Key), Finding> findings = [];
    private readonly List<(string Code, string Key)> order = [];
    private int points;
    private string? point;
    private CaseSpec pointCase = CaseSpec.Normal;
    private readonly HashSet<(string, string)> seen = [];
    private readonly Dictionary<string, int> windingAt = new(StringComparer.Ordinal);
    private readonly List<(WindingNet Winding, double Worst)> worstLoading = [];
    private (ImmutableArray<WindingNet> Windings, ILookup<int, WindingNet> RatedOn) rated;

    private sealed record Finding(string Code, TextSpan Span, string Name, double Value, double Limit, string Where, int Count, string Detail);

    public void Observe(PointResult p)
    {
        if (p.Case is not { } c) return;
        points++;
        // Where the point is, worded only when something there is over its rating.
        (point, pointCase) = (null, c.Case);
        seen.Clear();
        void Found(string code, string key, TextSpan span, string name, double value, double limit, string detail = "")
        {
            var id = (code, key);
            if (!seen.Add(id)) return;
            point ??= pointCase.Where == "as written" ? "" : $"at {pointCase.Where}";
            if (!findings.TryGetValue(id, out var f))
            {
                order.Add(id);
                findings[id] = new Finding(code, span, name, value, limit, point, 1, detail);
                return;
            }
            findings[id] = value > f.Value
                ? f with { Value = value, Limit = limit, Where = point, Count = f.Count + 1, Detail = detail }
                : f with { Count = f.Count + 1 };
        }

        var network = c.Solution.Network;
        // A regulator's series winding may carry more than its rated current at a narrower range of
        // regulation: it is checked against that rating below, not against its rated current here.
        var regulators = network.Model.TapChangers.IsEmpty ? [] : network.Model.TapChangers.Select(t => (Changer: t, Rating: Regulators.Rating(t, c)))
            .Where(r => r.Rating?.CurrentRating is not null).ToList();
        var series = regulators.Count == 0 ? null : regulators.Select(r => r.Rating!.Series).ToHashSet(StringComparer.Ordinal);
        // Each winding's worst loading, the windings in order of their first section (as a grouping by
        // name gives them), the greatest as Enumerable.Max takes it (NaN below every number); in kept
        // tables, since every sweep point passes here.
        windingAt.Clear();
        worstLoading.Clear();
        foreach (var s in c.Sections)
        {
            if (s.Loading is not { } loading || series?.Contains(s.Winding.Name) == true) continue;
            if (!windingAt.TryGetValue(s.Winding.Name, out var at))
            {
                windingAt[s.Winding.Name] = worstLoading.Count;
                worstLoading.Add((s.Winding, loading));
            }
            else if (double.IsNaN(worstLoading[at].Worst) || loading > worstLoading[at].Worst) worstLoading[at] = (worstLoading[at].Winding, loading);
        }
        foreach (var (winding, worst) in worstLoading)
            if (worst > 1 + 1e-9) Found("loading-high", winding.Name, winding.Source.NameSpan, winding.Name, worst, 1);
        // Only a copper conductor has a usual band: without one there is nothing to group.
        if (c.Sections.Any(static s => s.Winding.Source.Conductor is { Material: ConductorMaterial.Copper }))
            foreach (var (span, winding, density) in CurrentDensity.AboveBand(c))
                Found("current-density-high", winding, span, winding, density, CurrentDensity.CopperHigh);
        foreach (var k in c.Cores)
            if (k.Flux is { } flux && k.Core.FluxLimit is { } limit && flux > limit * (1 + 1e-9))
                Found("flux-high", k.Core.Name, k.Core.Source.NameSpan, k.Core.Name, flux, limit);
        foreach (var (t, r) in regulators)
            if (r!.Current > r.CurrentRating!.Value * (1 + 1e-9))
                Found("regulator-current-high", t.Name, t.NameSpan, t.Name, r.Current, r.CurrentRating.Value, DiagnosticBag.RegulatorLimitText(r));
        // The windings that state a rated voltage, by core: the network's wiring, the same at every point of a sweep.
        if (rated.Windings != network.Windings)
            rated = (network.Windings, network.Windings.Where(w => w.Source.Rated is not null && w.Turns > 0).ToLookup(w => w.Core));
        Excitation(c.Solution, network, rated.RatedOn, c.Loads.Length > 0 && !c.Case.WithoutLoads, Found);
        if (p.NoLoadSolution is { } noLoad) Excitation(noLoad, network, rated.RatedOn, false, Found);
        foreach (var brush in network.Model.Taps)
        {
            if (!brush.IsBrush || brush.CurrentLimit is null) continue;
            // The current of the tap result of its name (each name once in a case's taps).
            var current = 0.0;
            foreach (var t in c.Taps)
                if (t.Point == brush.Name)
                {
                    current = t.Current.Magnitude;
                    break;
                }
            if (current > brush.CurrentLimit!.Value * (1 + 1e-9)) Found("brush-current-high", brush.Name, brush.NameSpan, brush.Name, current, brush.CurrentLimit.Value);
        }
        if (c.Connections.IsEmpty) return;
        var islands = c.Connections.GroupBy(x => x.Connection.Load.Index).ToDictionary(g => g.Key, g => g.Select(x => x.Connection.Island).Distinct().Count());
        foreach (var island in c.Connections.GroupBy(x => x.Connection.Island))
        {
            var cores = island.First().Connection.Cores.Select(i => network.Cores[i]).ToList();
            if (cores.Count == 0 || cores.Any(k => k.Source.Rating is null)) continue;
            var rating = cores.Sum(k => k.Source.Rating!.Value);
            // A load fed from two supplies (two legs, two lines) is one load; one fed from several
            // islands (a delta load on single-phase units in grounded wye) is shared among them equally,
            // as its co-ratio is taken, so that an island needs what its own series windings carry.
            var loads = island.DistinctBy(x => x.Connection.Load.Index).ToList();
            var needed = loads.Sum(x => x.TwoWindingRating / islands[x.Connection.Load.Index]);
            var throughput = loads.Sum(x => x.Throughput / islands[x.Connection.Load.Index]);
            if (needed > rating * (1 + 1e-9))
                Found("connection-rating", string.Join(",", island.First().Connection.Cores), cores[0].Source.NameSpan, string.Join(", ", cores.Select(k => k.Name)), needed, rating,
                    $"{Numbers.Format(throughput, "VA")} throughput at a co-ratio of {Numbers.Fixed(needed / throughput)}");
        }
    }

    /// <summary>
    /// Volts per hertz against rated: the core's volts per turn over the rated voltage per turn of the
    /// first winding on it that states a rated voltage, times the core's rated frequency (its own, or
    /// the frequency as written) over the frequency. Flux goes with V/f, so a core fed at rated
    /// voltage below its rated frequency is over-excited: at 50 Hz a 60 Hz core at rated voltage is
    /// at 120 %.
    /// </summary>
    private static void Excitation(Solution solution, Network network, ILookup<int, WindingNet> ratedOn, bool onLoad, Action<string, string, TextSpan, string, double, double, string> found)
    {
        var limit = onLoad ? OnLoadExcitation : NoLoadExcitation;
        foreach (var core in network.Cores)
        {
            var rated = ratedOn[core.Index].FirstOrDefault();
            if (rated is null) continue;
            var ratio = solution.CoreVoltsPerTurn[core.Index].Magnitude / (rated.Source.Rated!.Value / rated.Turns)
                * network.Model.RatedFrequencyOf(core.Source) / network.Model.Frequency;
            if (ratio > limit * (1 + 1e-9))
                found("overexcited", $"{core.Name}/{(onLoad ? "load" : "no-load")}", core.Source.NameSpan, core.Name, ratio, limit, onLoad ? "on load" : "at no load");
        }
    }

    public void Report(DiagnosticBag diagnostics)
    {
        foreach (var id in order)
        {
            var f = findings[id];
            var where = SolveMessages.PointsText(f.Where, f.Count, points);
            switch (f.Code)
            {
                case "loading-high": diagnostics.ReportLoadingHigh(f.Span, f.Name, f.Value, where); break;
                case "flux-high": diagnostics.ReportFluxHigh(f.Span, f.Name, f.Value, f.Limit, where); break;
                case "overexcited": diagnostics.ReportOverexcited(f.Span, f.Name, f.Value, f.Limit, f.Detail, where); break;
                case "brush-current-high": diagnostics.ReportBrushCurrentHigh(f.Span, f.Name, f.Value, f.Limit, where); break;
                case "regulator-current-high": diagnostics.ReportRegulatorCurrentHigh(f.Span, f.Name, f.Value, f.Limit, f.Detail, where); break;
                case "current-density-high": diagnostics.ReportCurrentDensityHigh(f.Span, f.Name, f.Value, CurrentDensity.CopperLow, f.Limit, where); break;
                default: diagnostics.ReportConnectionRating(f.Span, f.Name, f.Value, f.Limit, f.Detail, where); break;
            }
        }
    }

    /// <summary>
    /// A brush set outside its travel, or a sweep that takes it there: positions compared in turns
    /// from the winding's from end.
    /// </summary>
    public static void CheckBrushRanges(Network network, ImmutableArray<SweepAxis> axes, DiagnosticBag diagnostics)
    {
        foreach (var brush in network.Model.Taps.Where(t => t.IsBrush && t.Range is not null))
        {
            var winding = network.Windings.FirstOrDefault(w => w.Name == brush.Winding);
            if (winding is null) continue;
            var r = brush.Range!;
            var (low, high) = (Turns(r.From, r.FromUnit, winding), Turns(r.To, r.ToUnit, winding));
            if (low > high) (low, high) = (high, low);
            bool Outside(double t) => t < low - 1e-9 * winding.Turns || t > high + 1e-9 * winding.Turns;
            if (Outside(Turns(brush.Position, brush.Unit, winding)))
                diagnostics.ReportBrushOutsideRange(brush.PositionSpan, brush.Name);
            foreach (var axis in axes.Where(a => a.Name == brush.Name))
            {
                var unit = axis.From.IsPercent ? TapUnit.Fraction : axis.From.Dimension.IsNone ? TapUnit.Turns : TapUnit.Volts;
                if (Outside(Turns(axis.Value(0).Real, unit, winding)) || Outside(Turns(axis.Value(axis.Count - 1).Real, unit, winding)))
                    diagnostics.ReportSweepOutsideRange(axis.Sweep.Line, brush.Name);
            }
        }
    }

    private static double Turns(double position, TapUnit unit, WindingNet w) => unit switch
    {
        TapUnit.Turns => position,
        TapUnit.Fraction => position * w.Turns,
        _ => w.RatedVoltage is { } v ? position / v * w.Turns : double.NaN,
    };
}

using System.Collections.Immutable;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>One setting of the toleranced values: the deviation in [−1, 1] of each, by its start offset, and how messages name it.</summary>
public sealed record ToleranceSample(string Where, ImmutableDictionary<int, double> Deviations);

/// <summary>
/// Where the toleranced values go to find each result's range: every corner (each value at one end
/// of its tolerance) when there are at most <see cref="MaxCornerValues"/>, else a seeded Monte Carlo
/// of <see cref="Samples"/> draws, uniform within each tolerance, so the bands are the same every run.
/// </summary>
public static class Tolerances
{
    public const int MaxCornerValues = 10;

    public const int Samples = 1000;

    public const int Seed = 1;

    public static ImmutableArray<ToleranceSample> Plan(Model.Model model, DiagnosticBag diagnostics)
    {
        var sites = model.Tolerances.Where(t => t.Spread > 0).DistinctBy(t => t.Span.Start).ToList();
        if (sites.Count == 0) return [];
        var samples = ImmutableArray.CreateBuilder<ToleranceSample>();
        if (sites.Count <= MaxCornerValues)
        {
            for (var corner = 0; corner < 1 << sites.Count; corner++)
            {
                var deviations = ImmutableDictionary.CreateBuilder<int, double>();
                for (var i = 0; i < sites.Count; i++) deviations[sites[i].Span.Start] = (corner >> i & 1) == 1 ? 1 : -1;
                var where = string.Join(", ", sites.Select(s => $"{s.Description} at {(deviations[s.Span.Start] > 0 ? "+" : "-")}{Numbers.Plain(s.Spread * 100)} %"));
                samples.Add(new ToleranceSample($"with {where}", deviations.ToImmutable()));
            }
            return samples.ToImmutable();
        }
        diagnostics.ReportToleranceSamples(sites[0].Span, sites.Count, Samples, Seed);
        // System.Random with a seed uses one fixed algorithm, so the draws are the same on every run.
        var random = new Random(Seed);
        for (var k = 0; k < Samples; k++)
        {
            var deviations = ImmutableDictionary.CreateBuilder<int, double>();
            foreach (var site in sites) deviations[site.Span.Start] = 2 * random.NextDouble() - 1;
            samples.Add(new ToleranceSample($"in tolerance sample {k + 1}", deviations.ToImmutable()));
        }
        return samples.ToImmutable();
    }
}

/// <summary>The range of every number of a case over the tolerance samples, kept by the paths of the case as written.</summary>
internal sealed class BandSet
{
    private readonly Dictionary<string, int> index = new(StringComparer.Ordinal);
    private readonly List<(string Path, string Unit, double Min, double Max)> ranges = [];

    public BandSet(CaseResult nominal)
    {
        foreach (var v in CaseValues.Of(nominal))
        {
            if (!index.TryAdd(v.Path, ranges.Count)) continue;
            ranges.Add((v.Path, v.Unit, v.Value, v.Value));
        }
    }

    public void Add(CaseResult sample)
    {
        foreach (var v in CaseValues.Of(sample))
        {
            if (!index.TryGetValue(v.Path, out var i)) continue;
            var r = ranges[i];
            ranges[i] = r with { Min = Math.Min(r.Min, v.Value), Max = Math.Max(r.Max, v.Value) };
        }
    }

    /// <summary>The results that vary by more than rounding.</summary>
    public ImmutableArray<Band> ToBands() =>
        [.. ranges.Where(r => r.Max - r.Min > 1e-9 * Math.Max(Math.Abs(r.Min), Math.Abs(r.Max))).Select(r => new Band(r.Path, r.Unit, r.Min, r.Max))];
}

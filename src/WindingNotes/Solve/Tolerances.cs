using System.Collections.Immutable;
using System.Numerics;
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

/// <summary>
/// The range of every number of a case over the tolerance samples, kept by the paths of the case as
/// written. A sample's numbers come in the nominal's order (<see cref="CaseLeaves.Walk"/>): each is
/// matched to the nominal's number at its place by comparing its path's parts with that number's path,
/// without writing the path out; a number whose path differs there (a sample of another shape) is
/// found by its path written out, as a number the nominal lacks is left out.
/// </summary>
internal sealed class BandSet : ICaseLeaves
{
    private readonly Dictionary<string, int> index = new(StringComparer.Ordinal);
    private readonly List<(string Path, string Unit, double Min, double Max)> ranges = [];

    /// <summary>The range each of the nominal's numbers goes to, by its place (a path written twice goes to its first range).</summary>
    private readonly List<int> order = [];

    private readonly List<string> parts = [];
    private int place;

    public BandSet(CaseResult nominal)
    {
        foreach (var v in CaseValues.Of(nominal))
        {
            if (index.TryAdd(v.Path, ranges.Count)) ranges.Add((v.Path, v.Unit, v.Value, v.Value));
            order.Add(index[v.Path]);
        }
    }

    public void Add(CaseResult sample)
    {
        place = 0;
        parts.Clear();
        CaseLeaves.Walk(sample, this, banded: true);
    }

    void ICaseLeaves.Open(string key, bool array) => parts.Add(key);

    void ICaseLeaves.Close() => parts.RemoveAt(parts.Count - 1);

    void ICaseLeaves.Number(string key, ResultField field, double value) => Here(field, value, key);

    void ICaseLeaves.Integer(string key, ResultField field, int value) => Here(field, value, key);

    // A phasor's band is of its rms value, "….v.rms" (CaseValues).
    void ICaseLeaves.Phasor(string key, ResultField field, Complex value) => Here(field, value.Magnitude, key, "rms");

    void ICaseLeaves.Null(string key, ResultField field) { }

    void ICaseLeaves.Word(string key, ResultField field, string value) { }

    void ICaseLeaves.Boolean(string key, ResultField field, bool value) { }

    private void Here(ResultField field, double value, string key, string? rms = null)
    {
        if (!field.Band) return;
        var depth = parts.Count;
        parts.Add(key);
        if (rms is not null) parts.Add(rms);
        var at = place < order.Count && IsPath(ranges[order[place]].Path) ? order[place] : index.GetValueOrDefault(string.Join(".", parts), -1);
        parts.RemoveRange(depth, parts.Count - depth);
        place++;
        if (at < 0) return;
        var r = ranges[at];
        ranges[at] = r with { Min = Math.Min(r.Min, value), Max = Math.Max(r.Max, value) };
    }

    /// <summary>Whether the parts entered, joined by dots, are <paramref name="path"/>.</summary>
    private bool IsPath(string path)
    {
        var rest = path.AsSpan();
        for (var i = 0; i < parts.Count; i++)
        {
            if (i > 0)
            {
                if (rest.IsEmpty || rest[0] != '.') return false;
                rest = rest[1..];
            }
            if (!rest.StartsWith(parts[i], StringComparison.Ordinal)) return false;
            rest = rest[parts[i].Length..];
        }
        return rest.IsEmpty;
    }

    /// <summary>The results that vary by more than rounding.</summary>
    public ImmutableArray<Band> ToBands() =>
        [.. ranges.Where(r => r.Max - r.Min > 1e-9 * Math.Max(Math.Abs(r.Min), Math.Abs(r.Max))).Select(r => new Band(r.Path, r.Unit, r.Min, r.Max))];
}

using System.Collections.Immutable;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// One unit through the cycle: its windings, their load factors at each cycle point from the
/// solved currents, the thermal state, and what is recorded of the day given.
/// </summary>
internal sealed class Heating
{
    private readonly ThermalUnitModel unit;
    private readonly double ratio;
    private readonly WindingNet[] windings;

    /// <summary>Per cycle point: the ultimate top-oil rise, and per winding its load factor K and ultimate hot-spot gradient.</summary>
    private readonly double[] topOil;
    private readonly double[][] load, gradient;
    private readonly ThermalEquations.State state;

    private double[] topOilSamples = [], hotSpotSamples = [];
    private double[][] windingHotSpot = [];
    private double lossOfLife, peakAgeing, aged, peakFaa;

    private Heating(ThermalUnitModel unit, double ratio, WindingNet[] windings, double[] topOil, double[][] load, double[][] gradient)
    {
        (this.unit, this.ratio, this.windings, this.topOil, this.load, this.gradient) = (unit, ratio, windings, topOil, load, gradient);
        state = new ThermalEquations.State(windings.Length);
    }

    /// <summary>
    /// The unit's windings are those on its core (on each phase core of a three-phase core). Its load
    /// factor K² is its load loss over its load loss at rated current, where the windings have
    /// resistance; else the mean of its windings' K². Each winding's K is its most loaded section's
    /// current over its rated current, so an autotransformer connection heats by the transformed
    /// power only, and windings loaded unequally heat unequally.
    /// </summary>
    public static Heating? Of(ThermalUnitModel u, Model.Model model, Network network, SectionHeat[][] solved, DiagnosticBag diagnostics)
    {
        var coreNames = model.Cores.Any(c => c.Name == u.Core)
            ? new HashSet<string> { u.Core }
            : [.. model.Cores.Where(c => c.Name.StartsWith(u.Core + "_", StringComparison.Ordinal)).Select(c => c.Name)];
        var windings = network.Windings.Where(w => coreNames.Contains(network.Cores[w.Core].Source.Name)).ToArray();
        if (windings.Length == 0)
        {
            diagnostics.ReportThermalNoWindings(u.NameSpan, u.Core);
            return null;
        }
        if (windings.FirstOrDefault(w => w.RatedCurrent is null) is { } unrated)
        {
            diagnostics.ReportThermalNoRating(u.NameSpan, unrated.Source.Name);
            return null;
        }
        var ratedLoss = windings.Sum(w => w.Resistance * w.RatedCurrent!.Value * w.RatedCurrent!.Value);
        double ratio;
        if (u.LossRatio is { } given) ratio = given;
        else
        {
            var noLoad = model.NoLoads.Where(n => coreNames.Contains(n.Core)).ToList();
            if (ratedLoss <= 0 || noLoad.Count < coreNames.Count || noLoad.Sum(n => n.Loss) <= 0)
            {
                diagnostics.ReportThermalNoLossRatio(u.NameSpan, u.Core);
                return null;
            }
            ratio = ratedLoss / noLoad.Sum(n => n.Loss);
        }
        var index = windings.Select((w, i) => (w.Index, i)).ToDictionary(p => p.Index, p => p.i);
        var topOil = new double[solved.Length];
        var load = new double[solved.Length][];
        var gradient = new double[solved.Length][];
        for (var p = 0; p < solved.Length; p++)
        {
            var k = new double[windings.Length];
            double loss = 0;
            foreach (var s in solved[p])
            {
                if (!index.TryGetValue(s.Winding, out var w)) continue;
                k[w] = Math.Max(k[w], s.Current / windings[w].RatedCurrent!.Value);
                loss += s.Loss;
            }
            var k2 = ratedLoss > 0 ? loss / ratedLoss : k.Average(x => x * x);
            topOil[p] = ThermalEquations.TopOilRise(u, ratio, k2);
            load[p] = k;
            gradient[p] = [.. k.Select(x => ThermalEquations.HotSpotGradient(u, x))];
        }
        return new Heating(u, ratio, windings, topOil, load, gradient);
    }

    public void Settle(int point) => state.Settle(unit, topOil[point], gradient[point]);

    public double[] Snapshot() => [state.TopOil, .. Enumerable.Range(0, windings.Length).Select(state.Gradient)];

    public void Advance(ThermalMethod method, double dt, int point, bool changed)
    {
        if (method == ThermalMethod.DifferenceEquation) state.Step(unit, dt, topOil[point], gradient[point]);
        else state.Exponential(unit, dt, topOil[point], gradient[point], changed);
    }

    public void Begin(int steps, double ambient)
    {
        topOilSamples = new double[steps + 1];
        hotSpotSamples = new double[steps + 1];
        windingHotSpot = [.. windings.Select(_ => new double[steps + 1])];
        lossOfLife = 0;
        peakAgeing = 0;
        aged = 0;
        peakFaa = 0;
        Sample(0, ambient);
    }

    /// <summary>The temperatures at the end of a step, and the step's ageing: its rate at the hot-spot reached, over the step.</summary>
    public void Record(int sample, double ambient, double dt)
    {
        Sample(sample, ambient);
        var v = ThermalEquations.AgeingRate(unit, hotSpotSamples[sample]);
        lossOfLife += v * dt;
        peakAgeing = Math.Max(peakAgeing, v);
        // IEEE C57.91: F_EQA = Σ F_AA·Δt / Σ Δt, the steps' F_AA at the hot-spot reached, as the ageing above.
        var faa = ThermalEquations.AgingAccelerationFactor(hotSpotSamples[sample]);
        aged += faa * dt;
        peakFaa = Math.Max(peakFaa, faa);
    }

    private void Sample(int k, double ambient)
    {
        var oil = ambient + state.TopOil;
        topOilSamples[k] = oil;
        var hottest = double.NegativeInfinity;
        for (var w = 0; w < windings.Length; w++)
        {
            windingHotSpot[w][k] = oil + state.Gradient(w);
            hottest = Math.Max(hottest, windingHotSpot[w][k]);
        }
        hotSpotSamples[k] = hottest;
    }

    public ThermalUnitResult Result(double[] times, ImmutableArray<CyclePointModel> points, int[] pointAt, double dt)
    {
        var heats = ImmutableArray.CreateBuilder<WindingHeat>();
        for (var w = 0; w < windings.Length; w++)
        {
            var hot = ArgMax(windingHotSpot[w]);
            var busiest = Enumerable.Range(0, points.Length).Where(pointAt.Contains).MaxBy(p => load[p][w]);
            heats.Add(new WindingHeat(windings[w].Source.Name, load[busiest][w], points[busiest].Time, windingHotSpot[w][hot], times[hot]));
        }
        var peakOil = ArgMax(topOilSamples);
        var peakHot = ArgMax(hotSpotSamples);
        return new ThermalUnitResult(unit, ratio, heats.ToImmutable())
        {
            TopOil = [.. topOilSamples],
            HotSpot = [.. hotSpotSamples],
            PeakTopOil = topOilSamples[peakOil],
            PeakTopOilTime = times[peakOil],
            PeakHotSpot = hotSpotSamples[peakHot],
            PeakHotSpotTime = times[peakHot],
            HottestWinding = heats.MaxBy(h => h.PeakHotSpot)!.Winding,
            LossOfLife = lossOfLife / 3600,
            MeanAgeing = lossOfLife / 86400,
            PeakAgeing = peakAgeing,
            EquivalentAging = unit.Dry ? null : aged / 86400,
            PeakAgingFactor = unit.Dry ? null : peakFaa,
        };
    }

    /// <summary>The first sample of the largest value: the peak's time as it is first reached.</summary>
    private static int ArgMax(double[] values)
    {
        var best = 0;
        for (var i = 1; i < values.Length; i++)
            if (values[i] > values[best] + 1e-9) best = i;
        return best;
    }
}

using BenchmarkDotNet.Attributes;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>
/// A brush sweep of 101 points on a bench variable autotransformer, the whole pipeline: each point
/// re-binds, builds and solves its case and its no-load companion. Divide by 101 for a point.
/// </summary>
[MemoryDiagnoser]
public class SweepBenchmarks
{
    private string text = "";

    [GlobalSetup]
    public void Setup() => text = """
        frequency 60 Hz
        core VT rating 1.4 kVA area 18 cm2 flux-limit 1.5 T
        winding W on VT turns 234 rated 140.4 V from A to B resistance 0.55 ohm rated-current 8 A
        tap LINE on W at 200 turns
        brush BR on W at 50 % range 0 % to 100 % current-limit 8 A
        supply bench LINE A 120 V fault-level 2 kA xr 2
        ground A
        load heater BR A impedance 40 ohm
        sweep BR from 0 % to 100 % step 1 %
        expect voltage BR A between 0 V and 141 V
        """;

    [Benchmark]
    public Evaluation BrushSweep101Points() => Evaluator.Evaluate(text, "sweep.wn");
}

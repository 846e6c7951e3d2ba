using BenchmarkDotNet.Attributes;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>The whole pipeline (parse, bind, build, solve, checks) on documents of known size.</summary>
[MemoryDiagnoser]
public class EvaluateBenchmarks
{
    private string boost = "", connected = "";

    [GlobalSetup]
    public void Setup()
    {
        boost = """
            frequency 60 Hz
            core K1 rating 0.5 kVA area 26 cm2 flux-limit 1.6 T
            winding HV on K1 turns 240 rated 240 V from H1 to H2 resistance 1.4 ohm
            winding LV on K1 turns 24 rated 24 V from X1 to X2 resistance 0.014 ohm
            impedance HV LV 3.6 % xr 1.1
            supply mains H1 H2 208 V
            ground H2
            join H1 X2
            load planer X1 H2 power 3.2 kW pf 0.82 lagging
            expect voltage X1 H2 between 225 V and 235 V
            """;
        connected = Documents.Connected(100);
    }

    [Benchmark]
    public Evaluation BoostExample() => Evaluator.Evaluate(boost, "boost.wn");

    /// <summary>Two control-power units with their faults and checks: 50 lines.</summary>
    [Benchmark]
    public Evaluation FiftyLines() => Evaluator.Evaluate(Documents.FiftyLines, "fifty.wn");

    /// <summary>Forty-three such units: 1,000 lines, 43 faults.</summary>
    [Benchmark]
    public Evaluation ThousandLines() => Evaluator.Evaluate(Documents.ThousandLines, "thousand.wn");

    /// <summary>One connected network of 300 sections (about 600 unknowns, sparse LU), loaded and without loads.</summary>
    [Benchmark]
    public Evaluation Connected300Sections() => Evaluator.Evaluate(connected, "connected.wn");
}

using BenchmarkDotNet.Attributes;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>The whole pipeline (parse, bind, build, solve, checks) on documents of known size.</summary>
[MemoryDiagnoser]
public class EvaluateBenchmarks
{
    private string boost = "", connected = "";
    private SyntaxTree thousandTree = null!;
    private Model.Model thousandModel = null!;

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
        thousandTree = Parser.Parse(Documents.ThousandLines);
        thousandModel = ZigzagImpedances.Bind(thousandTree);
    }

    [Benchmark]
    public Evaluation BoostExample() => Evaluator.Evaluate(boost, "boost.wn");

    /// <summary>Two control-power units with their faults and checks: 50 lines.</summary>
    [Benchmark]
    public Evaluation FiftyLines() => Evaluator.Evaluate(Documents.FiftyLines, "fifty.wn");

    /// <summary>Forty-three such units: 1,000 lines, 43 faults.</summary>
    [Benchmark]
    public Evaluation ThousandLines() => Evaluator.Evaluate(Documents.ThousandLines, "thousand.wn");

    /// <summary>A stage of <see cref="ThousandLines"/> alone: binding its parsed tree (its parse is <see cref="ParseBenchmarks.ThousandLines"/>).</summary>
    [Benchmark]
    public Model.Model ThousandLinesBind() => ZigzagImpedances.Bind(thousandTree);

    /// <summary>A stage of <see cref="ThousandLines"/> alone: building the network of its bound model.</summary>
    [Benchmark]
    public Network ThousandLinesBuild() => NetworkBuilder.Build(thousandModel);

    /// <summary>One connected network of 300 sections (about 600 unknowns, sparse LU), loaded and without loads.</summary>
    [Benchmark]
    public Evaluation Connected300Sections() => Evaluator.Evaluate(connected, "connected.wn");
}

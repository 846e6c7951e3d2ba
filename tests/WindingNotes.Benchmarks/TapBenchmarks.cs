using System.Collections.Immutable;
using BenchmarkDotNet.Attributes;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>
/// Tap-changer settling and 'find' go through a bind, a network build and a solve per point (a
/// position tried, a value of the let scanned). Side by side: a feeder regulator settled at each of
/// 100 load points, a 'find' on the same regulator, and the parts of one point alone (bind, build,
/// solve) to show where the time of a point goes.
/// </summary>
[MemoryDiagnoser]
public class TapBenchmarks
{
    private const int Loads = 100;
    private string settling = "", finding = "";
    private SyntaxTree syntax = null!;
    private BindOverrides point = null!;
    private Model.Model model = null!;
    private Network network = null!;

    /// <summary>A 7.62 kV regulator, line-drop compensated, feeding a load centre through a feeder (an invented one).</summary>
    private static string Regulator(string tail) => $"""
        frequency 60 Hz
        let sel = 0 %
        core REG_K rating 167 kVA
        winding SHUNT on REG_K turns 1000 rated 7620 V from N to S
        winding SERIES on REG_K turns 100 rated 762 V rated-current 219 A from S1 to S2
        impedance SHUNT SERIES 0.9 % xr 2
        brush SEL on SERIES at sel
        join S S1
        core LINE rating 10 MVA
        winding LA on LINE turns 100 from A1 to A2
        winding LB on LINE turns 100 from CTR to B2
        impedance LA LB 1.2 + j2.6 ohm
        join SEL A1
        join N A2 B2
        supply substation S N 7450 V fault-level 4 kA xr 6
        ground N
        let demand = 900 kW
        load town CTR N power demand pf 0.92
        {tail}
        """;

    [GlobalSetup]
    public void Setup()
    {
        settling = Regulator($"""
            let rset = 1.2 V * 200 / 63.5
            let xset = 2.6 V * 200 / 63.5
            tap-changer REG on SERIES sets sel positions -16 to 16 step 6.25 % on-load reversing regulate SEL N target 122 V bandwidth 2 V pt-ratio 63.5 compensation rset xset line-current town ct 200 A
            sweep demand from 9 kW to 900 kW step {900.0 / Loads} kW
            """);
        finding = Regulator("find sel voltage CTR N equals 7700 V from 0 % to 100 %");
        syntax = Parser.Parse(settling);
        point = new BindOverrides { Values = ImmutableDictionary<string, Quantity>.Empty.Add("sel", new Quantity(0.5, Dimension.None, QuantityFlags.Percent)) };
        model = Binder.Bind(syntax, point);
        network = NetworkBuilder.Build(model);
    }

    /// <summary>The regulator settled at each of 100 load points (about 13 positions tried a point), per load point.</summary>
    [Benchmark(OperationsPerInvoke = Loads)]
    public Evaluation SettlingPerLoadPoint() => Evaluator.Evaluate(settling, "settling.wn");

    /// <summary>A 'find' on the selector: 41 points scanned and the bracket refined, for the whole file.</summary>
    [Benchmark]
    public Evaluation Find() => Evaluator.Evaluate(finding, "find.wn");

    /// <summary>One point's bind alone (the re-bind each position and each scanned value costs).</summary>
    [Benchmark]
    public Model.Model BindOnePoint() => Binder.Bind(syntax, point);

    /// <summary>One point's network build alone.</summary>
    [Benchmark]
    public Network BuildOnePoint() => NetworkBuilder.Build(model);

    /// <summary>One point's solve alone (the normal case, loads by Newton).</summary>
    [Benchmark]
    public PointResult SolveOnePoint() => Points.Solve(network, CaseSpec.Normal, false, default);
}

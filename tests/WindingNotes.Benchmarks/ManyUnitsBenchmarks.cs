using BenchmarkDotNet.Attributes;
using WindingNotes.Workspace;

namespace WindingNotes.Benchmarks;

/// <summary>
/// How evaluation grows with the number of units: n control-power units of 21 lines, each with a
/// fault and five checks, so n fault cases. Linear in n is the aim (a fault's case costs its own
/// unit); n² is what work in the size of the whole file per fault gives.
/// </summary>
[MemoryDiagnoser]
public class ManyUnitsBenchmarks
{
    private string text = "";

    [Params(100, 400)]
    public int Units { get; set; }

    [GlobalSetup]
    public void Setup() => text = Documents.ManyUnits(Units);

    [Benchmark]
    public Evaluation Evaluate() => Evaluator.Evaluate(text, "many.wn");
}

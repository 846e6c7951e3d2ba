using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

public enum SequenceKind { Positive, Zero }

/// <summary>
/// One sequence test of a three-phase unit: the winding energised at its line terminals, the winding
/// short-circuited (null: every other winding open, the open-circuit zero-sequence test), and the
/// impedance measured, ohms per phase at the energised terminals; the percentage on the unit's
/// rated power at the energised terminals' rated line-to-line voltage, where both are known.
/// </summary>
public sealed record SequenceTest(SequenceKind Kind, string Energised, string? Shorted, Complex Impedance, double? BaseVoltage, double? BasePower)
{
    /// <summary>|Z| over the base impedance V²/S, a fraction; null where the base is unknown.</summary>
    public double? PerUnit => BaseVoltage is { } v && BasePower is { } s ? Impedance.Magnitude * s / (v * v) : null;

    /// <summary>
    /// Whether an open-circuit zero-sequence test measures the magnetising branch: not at a zigzag,
    /// whose halves on a limb carry equal and opposite ampere-turns, so it measures their leakage.
    /// </summary>
    public bool Magnetising { get; init; }
}

/// <summary>The sequence tests of one three-phase unit.</summary>
public sealed record UnitSequenceImpedances(string Core, ImmutableArray<SequenceTest> Tests);

/// <summary>
/// The sequence impedances a test would measure on each three-phase unit, by setting up the test
/// connections on the unit alone (its cores, windings, taps, impedances and open-circuit tests; no
/// supply, load or other element of the file) and solving that network with the same solver.
///
/// Positive sequence (IEC 60076-1, short-circuit impedance): a balanced abc set on the energised
/// winding's line terminals, the other winding's line terminals joined (short-circuited), every
/// other winding open; Z1 = V1/I1 of the line voltages and currents (star equivalent, per phase).
/// Zero sequence (IEC 60076-1, zero-sequence impedance): one voltage U between the energised
/// winding's three line terminals joined together and its neutral; Z0 = 3·U/I per phase, I the
/// current in the joined lines; the other winding short-circuited (line terminals and its neutral
/// joined) or, for the zero-sequence magnetising impedance, every other winding open. A delta is
/// closed in the winding itself, so it carries zero-sequence current in every test, as it does in
/// service. A winding without a neutral terminal takes no zero-sequence test.
/// </summary>
public static class SequenceImpedances
{
    private const string TestNeutral = "test:n";
    private const string TestLines = "test:l";

    /// <summary>The standard set: per pair in the order written, positive sequence from the first; zero sequence from each that has a neutral, the other short-circuited; the zero-sequence magnetising impedance from each that has a neutral.</summary>
    public static ImmutableArray<UnitSequenceImpedances> Run(Model.Model model, CancellationToken cancel = default)
    {
        var result = ImmutableArray.CreateBuilder<UnitSequenceImpedances>();
        foreach (var core in model.ThreePhase.Cores)
        {
            var windings = WindingsOn(model, core.Name);
            // A zigzag alone (a grounding transformer) has one test: its zero-sequence impedance.
            if (windings.Count < 2 && windings is not [{ Connection: PhaseConnection.Zigzag }]) continue;
            var tests = ImmutableArray.CreateBuilder<SequenceTest>();
            for (var i = 0; i < windings.Count; i++)
                for (var j = i + 1; j < windings.Count; j++)
                {
                    cancel.ThrowIfCancellationRequested();
                    if (Measure(model, core, SequenceKind.Positive, windings[i], windings[j]) is { } z1) tests.Add(z1);
                    foreach (var (a, b) in new[] { (windings[i], windings[j]), (windings[j], windings[i]) })
                        if (Measure(model, core, SequenceKind.Zero, a, b) is { } z0) tests.Add(z0);
                }
            foreach (var w in windings)
                if (Measure(model, core, SequenceKind.Zero, w, null) is { } open) tests.Add(open);
            result.Add(new UnitSequenceImpedances(core.Name, tests.ToImmutable()));
        }
        return result.ToImmutable();
    }

    /// <summary>The three-phase windings on a unit, in the order written.</summary>
    public static List<ThreePhaseWindingModel> WindingsOn(Model.Model model, string core) =>
        [.. model.ThreePhase.Windings.Where(w => w.Core == core)];

    /// <summary>The neutral a zero-sequence test energises a winding from: its neutral terminal, or for a series winding its common winding's.</summary>
    public static string? NeutralOf(Model.Model model, ThreePhaseWindingModel w)
    {
        if (w.Connection == PhaseConnection.Series)
            return CommonOf(model, w) is { } common ? NeutralOf(model, common) : null;
        return w.NeutralTerminal ? w.StarPoint : null;
    }

    private static ThreePhaseWindingModel? CommonOf(Model.Model model, ThreePhaseWindingModel series) =>
        model.ThreePhase.Windings.FirstOrDefault(c => c.Core == series.Core && c.Connection != PhaseConnection.Series
            && c.LineTerminals.Select(t => t.Name).SequenceEqual(series.OtherEnds.Select(t => t.Name)));

    /// <summary>One test solved; null where it cannot be made (zero sequence from a winding without a neutral) or the network did not solve.</summary>
    public static SequenceTest? Measure(Model.Model model, ThreePhaseCoreModel core, SequenceKind kind, ThreePhaseWindingModel energised, ThreePhaseWindingModel? shorted)
    {
        var neutral = kind == SequenceKind.Zero ? NeutralOf(model, energised) : null;
        if (kind == SequenceKind.Zero && neutral is null) return null;
        var test = TestModel(model, core, kind, energised, shorted, neutral);
        var network = NetworkBuilder.Build(test);
        var solution = NetworkSolver.Solve(network, CaseSpec.Normal);
        // A join of the file's between the unit's terminals (a line to another winding's line) can put a
        // test source across a short, which the builder leaves out: that test cannot be made.
        if (!solution.Solved || network.Supplies.Length != test.Supplies.Length) return null;
        var currents = network.Supplies.Select(s => solution.SupplyCurrents[s.Index]).ToArray();
        Complex z;
        if (kind == SequenceKind.Positive)
        {
            var v = network.Supplies.Select(s => s.Voltage).ToArray();
            var i1 = Sequence.Of(currents[0], currents[1], currents[2]).Positive;
            if (i1 == Complex.Zero) return null;
            z = Sequence.Of(v[0], v[1], v[2]).Positive / i1;
        }
        else
        {
            if (currents[0] == Complex.Zero) return null;
            z = 3 * network.Supplies[0].Voltage / currents[0];
        }
        var baseVoltage = RatedLineVoltage(model, energised);
        return new SequenceTest(kind, energised.Name, shorted?.Name, z, baseVoltage, RatedPower(model, core))
        {
            Magnetising = kind == SequenceKind.Zero && shorted is null && energised.Connection != PhaseConnection.Zigzag,
        };
    }

    /// <summary>
    /// The unit alone with the test's connections: a source of the energised winding's rated phase
    /// voltage (1 kV where unknown; the network is linear), earthed at the test's neutral.
    /// </summary>
    private static Model.Model TestModel(Model.Model model, ThreePhaseCoreModel core, SequenceKind kind, ThreePhaseWindingModel energised, ThreePhaseWindingModel? shorted, string? neutral)
    {
        var limbs = core.Limbs.ToHashSet(StringComparer.Ordinal);
        var windings = model.Windings.Where(w => limbs.Contains(w.Core)).ToImmutableArray();
        var names = windings.Select(w => w.Name).ToHashSet(StringComparer.Ordinal);
        var taps = model.Taps.Where(t => names.Contains(t.Winding)).ToImmutableArray();
        var points = windings.SelectMany(w => new[] { w.From.Name, w.To.Name }).Concat(taps.Select(t => t.Name)).ToHashSet(StringComparer.Ordinal);
        NodeRef Ref(string name) => new(name, core.NameSpan);
        var joins = model.Joins.Select(j => j.Where(p => points.Contains(p.Name)).ToImmutableArray()).Where(j => j.Length > 1).ToList();
        var lines = energised.LineTerminals.Select(t => Ref(t.Name)).ToArray();
        if (shorted is not null)
        {
            var other = NeutralOf(model, shorted);
            joins.Add([.. shorted.LineTerminals.Select(t => Ref(t.Name)), .. kind == SequenceKind.Zero && other is not null ? [Ref(other)] : Array.Empty<NodeRef>()]);
        }
        var phaseVoltage = RatedLineVoltage(model, energised) is { } v ? v / Math.Sqrt(3) : 1000;
        var supplies = ImmutableArray.CreateBuilder<SupplyModel>();
        NodeRef ground;
        if (kind == SequenceKind.Positive)
        {
            ground = Ref(TestNeutral);
            for (var k = 0; k < 3; k++)
                supplies.Add(new SupplyModel($"test:{Phases.Letters[k]}", core.NameSpan, core.Line, lines[k], ground, phaseVoltage * Complex.Pow(Phases.A, -k)) { Impedance = Complex.Zero });
        }
        else
        {
            ground = Ref(neutral!);
            joins.Add([Ref(TestLines), .. lines]);
            supplies.Add(new SupplyModel("test:0", core.NameSpan, core.Line, Ref(TestLines), ground, phaseVoltage) { Impedance = Complex.Zero });
        }
        var made = new[] { TestNeutral, TestLines }.Select(p => new Symbol(p, Syntax.SymbolKind.Node, core.NameSpan, core.Line) { Derived = true });
        return model with
        {
            Cores = [.. model.Cores.Where(c => limbs.Contains(c.Name))],
            NoLoads = [.. model.NoLoads.Where(n => limbs.Contains(n.Core))],
            Windings = windings,
            Taps = taps,
            Impedances = [.. model.Impedances.Where(z => names.Contains(z.First.Winding))],
            Joins = [.. joins],
            Grounds = [ground],
            Supplies = supplies.ToImmutable(),
            Loads = [],
            Faults = [],
            BusFaults = [],
            Sweeps = [],
            Expects = [],
            Tolerances = [],
            TapChangers = [],
            Find = null,
            ThreePhase = new ThreePhaseModel { Cores = [core], Windings = [.. model.ThreePhase.Windings.Where(w => w.Core == core.Name)] },
            Thermal = ThermalModel.Empty,
            Points = [.. model.Points.Where(p => points.Contains(p.Name)), .. made],
        };
    }

    /// <summary>
    /// The rated line-to-line voltage at a winding's line terminals: a wye's or series winding's phase
    /// winding times √3, a zigzag's half times 3, a delta's phase winding; a series winding's line
    /// terminals stand at its own and its common winding's rated voltages together.
    /// </summary>
    public static double? RatedLineVoltage(Model.Model model, ThreePhaseWindingModel w)
    {
        if (model.Windings.FirstOrDefault(x => x.Name == w.PhaseWindings[0])?.Rated is not { } phase) return null;
        var own = w.Connection switch
        {
            PhaseConnection.Wye or PhaseConnection.Series => phase * Math.Sqrt(3),
            PhaseConnection.Zigzag => phase * 3,
            PhaseConnection.Ends when w.StarPoint is not null => phase * Math.Sqrt(3),
            _ => phase,
        };
        if (w.Connection != PhaseConnection.Series) return own;
        return CommonOf(model, w) is { } common && RatedLineVoltage(model, common) is { } x ? own + x : null;
    }

    /// <summary>
    /// The unit's rated power: the core's three-phase rating, or for an autotransformer (a series
    /// winding) its throughput S·V_H/(V_H − V_X) (R5), the power its impedances are stated on.
    /// </summary>
    public static double? RatedPower(Model.Model model, ThreePhaseCoreModel core)
    {
        if (core.Rating is not { } rating) return null;
        var series = model.ThreePhase.Windings.FirstOrDefault(w => w.Core == core.Name && w.Connection == PhaseConnection.Series);
        if (series is null) return rating;
        return RatedLineVoltage(model, series) is { } high && CommonOf(model, series) is { } common && RatedLineVoltage(model, common) is { } low && high > low
            ? rating * high / (high - low) : null;
    }

    public static bool IsSequence(ExpectModel e) => e.Measure is MeasureKind.PositiveSequence or MeasureKind.ZeroSequence;

    /// <summary>The 'expect positive-sequence' and 'expect zero-sequence' lines: each test solved as its line names it (the first winding energised).</summary>
    public static ImmutableArray<CheckResult> Check(Model.Model model, ImmutableArray<UnitSequenceImpedances> units, DiagnosticBag diagnostics)
    {
        var results = ImmutableArray.CreateBuilder<CheckResult>();
        var windings = model.ThreePhase.Windings.ToDictionary(w => w.Name, StringComparer.Ordinal);
        foreach (var e in model.Expects.Where(IsSequence))
        {
            var kind = e.Measure == MeasureKind.PositiveSequence ? SequenceKind.Positive : SequenceKind.Zero;
            var energised = windings[e.Targets[0].Name];
            var shorted = e.Targets.Length > 1 ? windings[e.Targets[1].Name] : null;
            var core = model.ThreePhase.Cores.First(c => c.Name == energised.Core);
            var test = units.FirstOrDefault(u => u.Core == core.Name)?.Tests.FirstOrDefault(t => t.Kind == kind && t.Energised == energised.Name && t.Shorted == shorted?.Name)
                ?? Measure(model, core, kind, energised, shorted);
            var value = e.Unit is "%" or "pu" ? test?.PerUnit : test?.Impedance.Magnitude;
            if (value is not { } v)
            {
                var problem = test is not null ? $"the per-unit base of '{core.Name}' is unknown: give the core a 'rating' and '{energised.Name}' a 'rated' voltage, or check in ohm"
                    : kind == SequenceKind.Zero && NeutralOf(model, energised) is null ? $"'{energised.Name}' has no neutral terminal to energise it from (name one after 'neutral')"
                    : "the test network could not be solved";
                diagnostics.ReportCannotCheck(e, problem);
                results.Add(new CheckResult(e, false, null));
                continue;
            }
            var slack = 1e-9 * Math.Max(Math.Abs(double.IsFinite(e.Low) ? e.Low : 0), Math.Abs(double.IsFinite(e.High) ? e.High : 0));
            var passed = v >= e.Low - slack && v <= e.High + slack;
            if (!passed) diagnostics.ReportCheckFailed(e, v, "", [], 1, 1);
            results.Add(new CheckResult(e, passed, v) { Min = v, Max = v, Failing = passed ? 0 : 1 });
        }
        return results.ToImmutable();
    }
}

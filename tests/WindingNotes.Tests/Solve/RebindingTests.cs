using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Solve;
using WindingNotes.Syntax;
using WindingNotes.Tests.Support;
using WindingNotes.Text;
using Xunit;

namespace WindingNotes.Tests.Solve;

/// <summary>
/// Points bound again statement by statement (<see cref="Binder.Rebind"/>) against the document
/// bound in full at the same values: the same model, element by element; and the points solved
/// through <see cref="Rebinding"/> (a let sweep of a load by updating a base's factors, tolerance
/// samples and sweeps reaching supplies, windings, taps and leakage built and solved in full) equal
/// to the general path in every number (1e-9 of each unit's largest value) and every message.
/// </summary>
public class RebindingTests
{
    /// <summary>The twenty sections with a let for the heater's impedance, swept.</summary>
    private static readonly string LoadSweep = BrushSweepTests.TwentySections(
        sweep: "sweep rh from 5 ohm to 50 ohm points 40", loads: "let rh = 20 ohm\nload heater BR A impedance rh");

    /// <summary>Twelve values with a tolerance: a Monte Carlo over the leakage, resistances, taps, supply and loads.</summary>
    private static string MonteCarlo()
    {
        var text = BrushSweepTests.TwentySections(sweep: "")
            .Replace("impedance P W 4 % xr 3", "impedance P W 4 % +- 7.5 % xr 3")
            .Replace("load heater BR A impedance 20 ohm", "load heater BR A impedance 20 ohm +- 10 %")
            .Replace("load lamp P9 H2 impedance 200 ohm", "load lamp P9 H2 impedance 200 ohm +- 10 %")
            .Replace("resistance 1.2 ohm", "resistance 1.2 ohm +- 5 %")
            .Replace("resistance 0.3 ohm", "resistance 0.3 ohm +- 5 %")
            .Replace("480 V fault-level 10 kA", "480 V +- 5 % fault-level 10 kA +- 20 %");
        for (var i = 1; i <= 5; i++) text = text.Replace($"tap P{i} on P at {i * 26} turns", $"tap P{i} on P at {i * 26} turns +- 1 %");
        return text + "fault F1 P9 H2\n";
    }

    public static TheoryData<string, string, bool> Sweeps_ => new()
    {
        { "a let that sets a load", LoadSweep, true },
        { "a let read by another let, a constant-power load", BrushSweepTests.TwentySections(
            sweep: "sweep kw from 0.5 kW to 3 kW points 30", loads: "let kw = 2 kW\nlet half = kw / 2\nload heater BR A power half pf 0.9 lagging"), false },
        { "a let that sets the supply's voltage", BrushSweepTests.TwentySections(sweep: "sweep v from 400 V to 500 V points 25")
            .Replace("supply mains H1 H2 480 V", "let v = 480 V\nsupply mains H1 H2 v"), false },
        { "a let that sets a winding's resistance", BrushSweepTests.TwentySections(sweep: "sweep r from 0.1 ohm to 0.5 ohm points 25")
            .Replace("resistance 0.3 ohm", "resistance r").Replace("frequency 60 Hz", "frequency 60 Hz\nlet r = 0.3 ohm"), false },
        { "a let that sets a tap's position", BrushSweepTests.TwentySections(sweep: "sweep t from 262 turns to 284 turns points 12")
            .Replace("tap P10 on P at 260 turns", "tap P10 on P at t").Replace("frequency 60 Hz", "frequency 60 Hz\nlet t = 260 turns"), false },
    };

    [Theory]
    [MemberData(nameof(Sweeps_))]
    public void Every_point_bound_again_equals_the_full_solve(string what, string text, bool updates)
    {
        var syntax = Parser.Parse(text);
        var model = Binder.Bind(syntax);
        Assert.False(model.HasErrors, $"{what}: {string.Join("; ", model.Diagnostics)}");
        var axes = Sweeps.Plan(model, new DiagnosticBag());
        var count = Sweeps.Count(axes);
        Assert.True(count > 10, what);
        var rebinding = new Rebinding(syntax, model);
        for (long k = 0; k < count; k++)
        {
            var (overrides, labels) = Sweeps.Point(axes, k);
            overrides = overrides with { RatedFrequency = model.Frequency };
            var spec = CaseSpec.ForSweep(labels);
            AssertSameModel(Binder.Bind(syntax, overrides), Binder.Rebind(model, overrides)?.Model, $"{what} at {spec.Where}");
            AssertSamePoint(Points.Solve(syntax, overrides, spec, withFaults: false, default), rebinding.Solve(overrides, spec, withFaults: false, default), $"{what} at {spec.Where}");
        }
        Assert.Equal(count, rebinding.Rebound);
        if (updates)
        {
            Assert.True(rebinding.Updated >= count - 1, $"{what}: {rebinding.Updated} of {count} points updated");
            // Their loads are all the points change: the case without loads is the base's, solved once.
            Assert.True(rebinding.NoLoadKept >= count - 1, $"{what}: {rebinding.NoLoadKept} of {count} points kept the base's case without loads");
        }
        // Points built and solved in full refactor on the first's pivots (the sparse threshold: 42 unknowns).
        else Assert.True(rebinding.Refactorisations.Refactored >= count - 1, $"{what}: {rebinding.Refactorisations} refactorisations for {count} points");
    }

    [Fact]
    public void Tolerance_samples_bound_again_equal_the_full_solve_with_their_faults()
    {
        var text = MonteCarlo();
        var syntax = Parser.Parse(text);
        var model = Binder.Bind(syntax);
        Assert.False(model.HasErrors, string.Join("; ", model.Diagnostics));
        var samples = Tolerances.Plan(model, new DiagnosticBag());
        Assert.Equal(Tolerances.Samples, samples.Length);
        var rebinding = new Rebinding(syntax, model);
        // Every twentieth of the thousand samples: each moves all twelve values.
        foreach (var sample in samples.Where((_, i) => i % 20 == 0))
        {
            var overrides = new BindOverrides { Deviations = sample.Deviations, RatedFrequency = model.Frequency };
            AssertSameModel(Binder.Bind(syntax, overrides), Binder.Rebind(model, overrides)?.Model, sample.Where);
            var full = Points.Solve(syntax, overrides, CaseSpec.Normal, withFaults: true, default);
            var fast = rebinding.Solve(overrides, CaseSpec.Normal, withFaults: true, default);
            AssertSamePoint(full, fast, sample.Where);
            Assert.Equal(full.Faults.Length, fast.Faults.Length);
            Assert.NotEmpty(full.Faults);
            foreach (var (f, g) in full.Faults.Zip(fast.Faults)) BrushSweepTests.AssertSame(f, g, $"{sample.Where}, {f.Case.Name}");
        }
        Assert.Equal(samples.Length / 20, rebinding.Rebound);
        // The first sample is built in full; every other is restamped on its network (no value changes the wiring).
        Assert.Equal(samples.Length / 20 - 1, rebinding.Restamped);
        // Each sample's three cases (loaded, without loads, the fault) refactor on the first sample's pivots.
        Assert.True(rebinding.Refactorisations.Refactored >= 3 * (samples.Length / 20 - 1), $"{rebinding.Refactorisations} refactorisations");
    }

    /// <summary>
    /// The bands kept number by number in the nominal's order (<see cref="BandSet"/>) are those of every
    /// number's path written out and looked up, the minimum and maximum over the samples: here over
    /// the Monte Carlo's samples, and over a case of another shape (the fault's: its numbers at other
    /// places, found by their paths).
    /// </summary>
    [Fact]
    public void Bands_kept_by_place_are_those_kept_by_path()
    {
        var syntax = Parser.Parse(MonteCarlo());
        var model = Binder.Bind(syntax);
        var rebinding = new Rebinding(syntax, model);
        var nominal = Points.Solve(syntax, new BindOverrides { RatedFrequency = model.Frequency }, CaseSpec.Normal, withFaults: true, default);
        var points = Tolerances.Plan(model, new DiagnosticBag()).Take(30)
            .Select(s => rebinding.Solve(new BindOverrides { Deviations = s.Deviations, RatedFrequency = model.Frequency }, CaseSpec.Normal, withFaults: true, default)).ToList();
        var cases = points.Select(p => p.Case!).Append(points[0].Faults[0]).ToList();
        var bands = new BandSet(nominal.Case!);
        foreach (var c in cases) bands.Add(c);
        // By path: the nominal's numbers (the first of a path twice written), widened by each sample's of the same path.
        var byPath = new Dictionary<string, (double Min, double Max)>();
        foreach (var v in CaseValues.Of(nominal.Case!)) byPath.TryAdd(v.Path, (v.Value, v.Value));
        foreach (var c in cases)
            foreach (var v in CaseValues.Of(c))
                if (byPath.TryGetValue(v.Path, out var r)) byPath[v.Path] = (Math.Min(r.Min, v.Value), Math.Max(r.Max, v.Value));
        var expected = byPath.Where(r => r.Value.Max - r.Value.Min > 1e-9 * Math.Max(Math.Abs(r.Value.Min), Math.Abs(r.Value.Max))).ToList();
        var got = bands.ToBands();
        Assert.True(got.Length > 20, $"{got.Length} bands");
        Assert.Equal(expected.Select(r => (r.Key, r.Value.Min, r.Value.Max)), got.Select(b => (b.Path, b.Min, b.Max)));
    }

    /// <summary>
    /// A let that moves tap P10 (at 260 turns between P9 at 234 and P11 at 286) from 200 to 300 turns:
    /// inside the stretch between two neighbouring taps only numbers change, and the point is restamped
    /// on the network of the point before; passing a neighbour (P8 at 208, P9, P11) changes which
    /// points the sections run between, and the point is built in full. Every point equals the full solve.
    /// </summary>
    [Fact]
    public void A_tap_that_passes_another_is_built_in_full_and_the_others_are_restamped()
    {
        var text = BrushSweepTests.TwentySections(sweep: "sweep t from 200 turns to 300 turns points 21")
            .Replace("tap P10 on P at 260 turns", "tap P10 on P at t").Replace("frequency 60 Hz", "frequency 60 Hz\nlet t = 260 turns");
        var syntax = Parser.Parse(text);
        var model = Binder.Bind(syntax);
        Assert.False(model.HasErrors, string.Join("; ", model.Diagnostics));
        var axes = Sweeps.Plan(model, new DiagnosticBag());
        Assert.Equal(21, Sweeps.Count(axes));
        var rebinding = new Rebinding(syntax, model);
        // Between which neighbours the tap lies: 182 (P7) 208 (P8) 234 (P9) 286 (P11) 312 (P12).
        static int Stretch(double turns) => new[] { 208.0, 234, 286 }.Count(b => turns > b);
        var previous = -1;
        for (long k = 0; k < 21; k++)
        {
            var (overrides, labels) = Sweeps.Point(axes, k);
            overrides = overrides with { RatedFrequency = model.Frequency };
            var spec = CaseSpec.ForSweep(labels);
            var before = rebinding.Restamped;
            AssertSamePoint(Points.Solve(syntax, overrides, spec, withFaults: false, default), rebinding.Solve(overrides, spec, withFaults: false, default), spec.Where);
            var stretch = Stretch(200 + 5 * k);
            Assert.Equal(stretch == previous, rebinding.Restamped == before + 1);
            previous = stretch;
        }
        // Four stretches: 200–205, 210–230, 235–285, 290–300 turns.
        Assert.Equal(21 - 4, rebinding.Restamped);

        // The builder's own test, directly: built at 260 turns, the same wiring at 240, another at 230 (P9 passed).
        WindingNotes.Model.Model At(long k) => Binder.Rebind(model, Sweeps.Point(axes, k).Overrides with { RatedFrequency = model.Frequency })!.Value.Model;
        var built = NetworkBuilder.Build(At(12));
        Assert.NotNull(NetworkBuilder.Restamp(built, built.Model));
        Assert.NotNull(NetworkBuilder.Restamp(built, At(8)));
        Assert.Null(NetworkBuilder.Restamp(built, At(6)));
    }

    /// <summary>Every example with tolerances: its samples through <see cref="Rebinding"/> (restamped where they can be) equal the full bind, build and solve.</summary>
    [Fact]
    public void Every_example_tolerance_sample_equals_the_full_solve()
    {
        var examples = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").Order(StringComparer.Ordinal).ToList();
        var (samplesSeen, restamped) = (0, 0);
        foreach (var path in examples)
        {
            var syntax = Parser.Parse(File.ReadAllText(path).Replace("\r\n", "\n"));
            var model = Binder.Bind(syntax);
            if (model.HasErrors) continue;
            var samples = Tolerances.Plan(model, new DiagnosticBag());
            if (samples.IsEmpty) continue;
            var rebinding = new Rebinding(syntax, model);
            foreach (var sample in samples.Take(40))
            {
                var overrides = new BindOverrides { Deviations = sample.Deviations, RatedFrequency = model.Frequency };
                var where = $"{Path.GetFileName(path)} {sample.Where}";
                var full = Points.Solve(syntax, overrides, CaseSpec.Normal, withFaults: true, default);
                var fast = rebinding.Solve(overrides, CaseSpec.Normal, withFaults: true, default);
                AssertSamePoint(full, fast, where);
                Assert.Equal(full.Faults.Length, fast.Faults.Length);
                foreach (var (f, g) in full.Faults.Zip(fast.Faults)) BrushSweepTests.AssertSame(f, g, $"{where}, {f.Case.Name}");
                samplesSeen++;
            }
            restamped += rebinding.Restamped;
        }
        Assert.True(samplesSeen > 0);
        Assert.True(restamped > 0);
    }

    /// <summary>
    /// Every example with a sweep: its first 40 points solved through <see cref="Rebinding"/> (a let of
    /// loads by updating a base, with the base's case without loads; anything else restamped or built in
    /// full) equal the full bind, build and solve at the same values, in every number and message.
    /// </summary>
    [Fact]
    public void Every_example_sweep_point_solved_again_equals_the_full_solve()
    {
        var examples = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").Order(StringComparer.Ordinal).ToList();
        var (pointsSeen, kept) = (0, 0);
        foreach (var path in examples)
        {
            var syntax = Parser.Parse(File.ReadAllText(path).Replace("\r\n", "\n"));
            var model = Binder.Bind(syntax);
            if (model.HasErrors) continue;
            var axes = Sweeps.Plan(model, new DiagnosticBag());
            if (axes.IsEmpty) continue;
            var rebinding = new Rebinding(syntax, model);
            for (long k = 0; k < Math.Min(Sweeps.Count(axes), 40); k++)
            {
                var (overrides, labels) = Sweeps.Point(axes, k);
                overrides = overrides with { RatedFrequency = model.Frequency };
                var spec = CaseSpec.ForSweep(labels);
                var where = $"{Path.GetFileName(path)} at {spec.Where}";
                AssertSamePoint(Points.Solve(syntax, overrides, spec, withFaults: false, default), rebinding.Solve(overrides, spec, withFaults: false, default), where);
                pointsSeen++;
            }
            kept += rebinding.NoLoadKept;
        }
        Assert.True(pointsSeen > 0);
        // The examples' let sweeps of a load (a pumping station's demand) take the update with the base's case without loads.
        Assert.True(kept > 0, "no example point kept its base's case without loads");
    }

    [Fact]
    public void A_let_that_reaches_a_check_or_a_message_is_bound_in_full()
    {
        // The let is read by an expect line: not a kind bound again alone.
        var checkText = LoadSweep.Replace("sweep rh", "expect voltage BR A below rh * 12 A\nsweep rh");
        var check = Binder.Bind(Parser.Parse(checkText));
        Assert.False(check.HasErrors, string.Join("; ", check.Diagnostics));
        Assert.Null(Binder.Rebind(check, Value("rh", 10, Dimension.Impedance)));
        // A value that gives a message at the point (a load's negative resistance) is bound in full, and the message is the binder's.
        var model = Binder.Bind(Parser.Parse(LoadSweep));
        Assert.NotNull(Binder.Rebind(model, Value("rh", 10, Dimension.Impedance)));
        Assert.Null(Binder.Rebind(model, Value("rh", -10, Dimension.Impedance)));
        // The document as written with no sweep or tolerance keeps nothing to bind again.
        Assert.Null(Binder.Bind(Parser.Parse(BrushSweepTests.TwentySections(sweep: ""))).Reach);
    }

    /// <summary>Every example with a sweep or a tolerance: each point and sample bound again (where it can be) is the full bind at its values.</summary>
    [Fact]
    public void Every_example_point_bound_again_equals_the_full_bind()
    {
        var examples = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").Order(StringComparer.Ordinal).ToList();
        var rebound = 0;
        foreach (var path in examples)
        {
            var syntax = Parser.Parse(File.ReadAllText(path).Replace("\r\n", "\n"));
            var model = Binder.Bind(syntax);
            if (model.HasErrors || model.Reach is null) continue;
            var axes = Sweeps.Plan(model, new DiagnosticBag());
            var samples = Tolerances.Plan(model, new DiagnosticBag());
            var points = Enumerable.Range(0, (int)Math.Min(Sweeps.Count(axes), 50)).Select(k => Sweeps.Point(axes, k).Overrides)
                .Concat(samples.Take(50).Select(s => new BindOverrides { Deviations = s.Deviations }));
            foreach (var overrides in points)
            {
                var at = overrides with { RatedFrequency = model.Frequency };
                if (Binder.Rebind(model, at) is not { } again) continue;
                AssertSameModel(Binder.Bind(syntax, at), again.Model, $"{Path.GetFileName(path)}");
                rebound++;
            }
        }
        Assert.True(rebound > 0);
    }

    /// <summary>A load cycle of a let: every cycle point's model bound again is the full bind at that load, and the study takes that path.</summary>
    [Fact]
    public void A_load_cycle_of_a_let_binds_its_points_again()
    {
        // The thermal tests' 100 kVA unit with its load's current a let.
        var text = "let demand = 500 A\n" + ThermalTests.Unit("current demand pf 1",
            "thermal T cooling ONAN top-oil-rise 52 K hot-spot-gradient 26 K loss-ratio 6 exponents 0.8 and 1.6",
            "load-cycle of demand ambient 20 degC\ncycle-point 0 h load 1200 A\ncycle-point 8 h load 700 A\ncycle-point 16 h load 300 A");
        var syntax = Parser.Parse(text);
        var model = Binder.Bind(syntax);
        Assert.False(model.HasErrors, string.Join("; ", model.Diagnostics));
        Assert.NotNull(model.Reach);
        foreach (var point in model.Thermal.Cycle!.Points)
        {
            var overrides = new BindOverrides { Values = System.Collections.Immutable.ImmutableDictionary<string, Quantity>.Empty.Add("demand", point.Load), RatedFrequency = model.RatedFrequency };
            AssertSameModel(Binder.Bind(syntax, overrides), Binder.Rebind(model, overrides)?.Model, $"cycle point of {point.Load.Value} A");
        }
        // The study's cycle at those models: K = 1200 A / (100 kVA / 100 V) at the first point.
        var e = WindingNotes.Workspace.Evaluator.Evaluate(text, "cycle.wn");
        Assert.Equal(1.2, e.Thermal!.Units[0].Windings[0].PeakLoad, 9);
    }

    /// <summary>Every example with tap changers: the positions the plan binds, bound again, are the full bind at them.</summary>
    [Fact]
    public void Tap_changer_positions_are_bound_again_as_the_full_bind()
    {
        var examples = Directory.GetFiles(Path.Combine(Snapshot.RepositoryRoot, "examples"), "*.wn").Order(StringComparer.Ordinal).ToList();
        var (rebound, planRebound) = (0, 0);
        foreach (var path in examples)
        {
            var syntax = Parser.Parse(File.ReadAllText(path).Replace("\r\n", "\n"));
            var model = Binder.Bind(syntax);
            if (model.HasErrors || model.TapChangers.IsEmpty || TapPlan.For(syntax, model) is not { } plan) continue;
            foreach (var step in new[] { -2, -1, 1, 3 })
            {
                var positions = model.TapChangers.Select(t => Math.Clamp(step, t.Low, t.High)).ToArray();
                var at = plan.At(BindOverrides.None, positions);
                if (Binder.Rebind(model, at) is not { } again) continue;
                AssertSameModel(Binder.Bind(syntax, at), again.Model, $"{Path.GetFileName(path)} at {step}");
                rebound++;
            }
            // The plan's own points: the positions settled, bound again where they can be.
            plan.SettleNominal(new DiagnosticBag(), default);
            planRebound += plan.Rebound;
        }
        Assert.True(rebound > 0, "no example's positions were bound again");
        Assert.True(planRebound > 0, "no example's settling bound its positions again");
    }

    private static BindOverrides Value(string name, double value, Dimension dimension) =>
        new() { Values = System.Collections.Immutable.ImmutableDictionary<string, Quantity>.Empty.Add(name, new Quantity(value, dimension)) };

    private static void AssertSameModel(WindingNotes.Model.Model full, WindingNotes.Model.Model? again, string where)
    {
        Assert.True(again is not null, $"{where}: not bound again");
        Assert.Equal(full.Loads.ToList(), again!.Loads.ToList());
        Assert.Equal(full.Supplies.ToList(), again.Supplies.ToList());
        Assert.Equal(full.Windings.ToList(), again.Windings.ToList());
        Assert.Equal(full.Taps.ToList(), again.Taps.ToList());
        Assert.Equal(full.Impedances.ToList(), again.Impedances.ToList());
        Assert.Equal(full.Faults.ToList(), again.Faults.ToList());
        Assert.Equal(full.Cores.ToList(), again.Cores.ToList());
        Assert.Equal(full.Lets.OrderBy(l => l.Key), again.Lets.OrderBy(l => l.Key));
        Assert.Equal(BrushSweepTests.Describe(full.Diagnostics), BrushSweepTests.Describe(again.Diagnostics));
    }

    private static void AssertSamePoint(PointResult full, PointResult fast, string where)
    {
        Assert.Equal(BrushSweepTests.Describe(full.Diagnostics), BrushSweepTests.Describe(fast.Diagnostics));
        Assert.Equal(full.Solved, fast.Solved);
        if (!full.Solved) return;
        BrushSweepTests.AssertSame(full.Case!, fast.Case!, where);
        Assert.Equal(full.NoLoad is null, fast.NoLoad is null);
        if (full.NoLoad is { } noLoad) BrushSweepTests.AssertSame(noLoad, fast.NoLoad!, where + " without loads");
    }
}

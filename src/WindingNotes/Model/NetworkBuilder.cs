using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Text;

namespace WindingNotes.Model;

/// <summary>
/// Builds the solver's network from the model: nodes from joins and grounds, turns from ratings,
/// sections from taps and brushes, resistances, the leakage matrix of each core, magnetising
/// admittances and supply impedances.
/// </summary>
public static class NetworkBuilder
{
    public static Network Build(Model model) => new BuildRun(model).Run();

    /// <summary>
    /// The network of <paramref name="model"/> restamped on <paramref name="built"/>'s wiring, without
    /// building it afresh: for a model that differs from <paramref name="built"/>'s only in values (a
    /// tolerance sample, a let). Turns, sections, resistances, leakage, supplies and loads are computed
    /// as <see cref="Build"/> computes them, with their messages; the nodes, and the messages that
    /// depend on the wiring alone (islands without a ground or a source), are the built network's.
    /// Null, and the caller builds in full, where the values change the wiring (a tap passing another,
    /// a supply or a winding left out, a leakage member of other sections), where they give an error,
    /// and for three-phase units (their vector groups follow the turns).
    /// </summary>
    public static Network? Restamp(Network built, Model model) => new BuildRun(model).Restamp(built);

    /// <summary>A tap's place on its winding in turns from the from end; NaN where volts are given and the winding has no rating.</summary>
    internal static double Turns(TapModel tap, WindingNet w) => tap.Unit switch
    {
        TapUnit.Turns => tap.Position,
        TapUnit.Fraction => tap.Position * w.Turns,
        _ => w.RatedVoltage is { } v ? tap.Position / v * w.Turns : double.NaN,
    };

    /// <summary>Whether a tap at this many turns lies on the winding (within rounding), as the builder checks it.</summary>
    internal static bool OnWinding(double position, WindingNet w) => position >= -1e-9 && position <= w.Turns * (1 + 1e-9);

    private sealed class BuildRun(Model model)
    {
        private readonly DiagnosticBag diagnostics = new();
        /// <summary>The node of each point: found by <see cref="BuildNodes"/>, or the built network's when restamping.</summary>
        private IDictionary<string, int> nodeOf = new Dictionary<string, int>(StringComparer.Ordinal);
        private ImmutableArray<NetworkNode> nodes = [];
        private readonly Dictionary<string, WindingNet> windingNamed = new(StringComparer.Ordinal);
        private readonly ILookup<string, NoLoadModel> noLoadsOf = model.NoLoads.ToLookup(n => n.Core, StringComparer.Ordinal);

        public Network Run()
        {
            BuildNodes();
            var windings = BuildWindings();
            var sections = BuildSections(windings);
            // Sorted out once, so that a file of many units builds in time linear in its length.
            var sectionsOf = sections.ToLookup(s => s.Core);
            foreach (var w in windings) windingNamed.TryAdd(w.Name, w);
            var linesOf = model.Impedances.ToLookup(l => windingNamed.GetValueOrDefault(l.First.Winding)?.Core ?? -1);
            var cores = model.Cores.Select((c, i) => BuildCore(c, i, windings, [.. sectionsOf[i]], linesOf[i])).ToImmutableArray();
            var supplies = BuildSupplies();
            var loads = model.Loads.Select((l, i) => new LoadNet(i, l, nodeOf[l.A.Name], nodeOf[l.B.Name])).ToImmutableArray();
            var network = new Network(model, nodes, nodeOf.ToImmutableDictionary(), windings, sections, cores, supplies, loads, [])
            {
                Couplings = MagneticCircuit.Couplings(model, windings, cores, diagnostics),
                ValueDiagnostics = diagnostics.Count,
            };
            WarnIslands(network);
            network = network with { VectorGroups = VectorGroups.Find(network, diagnostics) };
            return network with { Diagnostics = diagnostics.ToImmutable() };
        }

        public Network? Restamp(Network built)
        {
            if (!model.ThreePhase.Cores.IsEmpty || !built.VectorGroups.IsEmpty) return null;
            (nodes, nodeOf) = (built.Nodes, built.NodeOfPoint);
            var windings = BuildWindings();
            if (!SameWindings(built.Windings, windings)) return null;
            var sections = BuildSections(windings);
            if (!SameSections(built.Sections, sections)) return null;
            var sectionsOf = sections.ToLookup(s => s.Core);
            foreach (var w in windings) windingNamed.TryAdd(w.Name, w);
            var linesOf = model.Impedances.ToLookup(l => windingNamed.GetValueOrDefault(l.First.Winding)?.Core ?? -1);
            var cores = model.Cores.Select((c, i) => BuildCore(c, i, windings, [.. sectionsOf[i]], linesOf[i])).ToImmutableArray();
            if (!SameCores(built.Cores, cores)) return null;
            var supplies = BuildSupplies();
            if (!SameSupplies(built.Supplies, supplies)) return null;
            var loads = model.Loads.Select((l, i) => new LoadNet(i, l, nodeOf[l.A.Name], nodeOf[l.B.Name])).ToImmutableArray();
            var couplings = MagneticCircuit.Couplings(model, windings, cores, diagnostics);
            if (diagnostics.HasErrors || couplings.Length != built.Couplings.Length) return null;
            // The values' messages are this model's, in the builder's order; those of the wiring follow them.
            return built with
            {
                Model = model, Windings = windings, Sections = sections, Cores = cores, Supplies = supplies, Loads = loads, Couplings = couplings,
                Diagnostics = [.. diagnostics, .. built.Diagnostics.AsSpan()[built.ValueDiagnostics..]], ValueDiagnostics = diagnostics.Count,
            };
        }

        private static bool SameWindings(ImmutableArray<WindingNet> built, ImmutableArray<WindingNet> now)
        {
            if (built.Length != now.Length) return false;
            for (var i = 0; i < now.Length; i++)
                if (built[i].Core != now[i].Core || built[i].Name != now[i].Name) return false;
            return true;
        }

        private static bool SameSections(ImmutableArray<Section> built, ImmutableArray<Section> now)
        {
            if (built.Length != now.Length) return false;
            for (var k = 0; k < now.Length; k++)
            {
                var (a, b) = (built[k], now[k]);
                if (a.Winding != b.Winding || a.Core != b.Core || a.NodeA != b.NodeA || a.NodeB != b.NodeB
                    || a.FromPoint != b.FromPoint || a.ToPoint != b.ToPoint || a.Name != b.Name) return false;
            }
            return true;
        }

        /// <summary>The same sections on each core in the same leakage members, and the same open-circuit test winding.</summary>
        private static bool SameCores(ImmutableArray<CoreNet> built, ImmutableArray<CoreNet> now)
        {
            if (built.Length != now.Length) return false;
            for (var c = 0; c < now.Length; c++)
            {
                var (a, b) = (built[c], now[c]);
                if (!a.Sections.SequenceEqual(b.Sections) || a.NoLoadWinding != b.NoLoadWinding
                    || a.Coupling is null || b.Coupling is null || !a.Coupling.MemberOf.AsSpan().SequenceEqual(b.Coupling.MemberOf)) return false;
            }
            return true;
        }

        private static bool SameSupplies(ImmutableArray<SupplyNet> built, ImmutableArray<SupplyNet> now)
        {
            if (built.Length != now.Length) return false;
            for (var i = 0; i < now.Length; i++)
                if (built[i].NodeP != now[i].NodeP || built[i].NodeQ != now[i].NodeQ || built[i].Source.IsSource != now[i].Source.IsSource) return false;
            return true;
        }

        private void BuildNodes()
        {
            var points = model.Points.Select(p => p.Name).ToList();
            var index = points.Select((p, i) => (p, i)).ToDictionary(x => x.p, x => x.i, StringComparer.Ordinal);
            // One extra set stands for earth, so that all grounded points become one node.
            var earth = points.Count;
            var sets = new DisjointSets(points.Count + 1);
            foreach (var join in model.Joins)
                for (var i = 1; i < join.Length; i++) sets.Union(index[join[0].Name], index[join[i].Name]);
            foreach (var ground in model.Grounds) sets.Union(index[ground.Name], earth);

            var rootToNode = new Dictionary<int, int>();
            var members = new List<List<string>>();
            var isEarth = new List<bool>();
            int NodeFor(int root)
            {
                if (!rootToNode.TryGetValue(root, out var n))
                {
                    rootToNode[root] = n = members.Count;
                    members.Add([]);
                    isEarth.Add(false);
                }
                return n;
            }
            for (var i = 0; i < points.Count; i++)
            {
                var n = NodeFor(sets.Find(i));
                members[n].Add(points[i]);
                nodeOf[points[i]] = n;
            }
            if (model.Grounds.Length > 0) isEarth[nodeOf[model.Grounds[0].Name]] = true;
            nodes = members.Select((m, i) => new NetworkNode(i, [.. m], isEarth[i])).ToImmutableArray();
        }

        /// <summary>
        /// Turns and rated voltages. On each core the first winding that gives both sets the volts
        /// per turn; the others must agree within the ratio tolerance of IEC 60076-1 (0.5 %). Where no
        /// winding gives turns, turns are taken equal to rated volts: ratios are right, absolute
        /// turns (and so flux density) unknown.
        /// </summary>
        private ImmutableArray<WindingNet> BuildWindings()
        {
            var result = new WindingNet[model.Windings.Length];
            var coreIndex = new Dictionary<string, int>(StringComparer.Ordinal);
            foreach (var (c, i) in model.Cores.Select((c, i) => (c, i))) coreIndex.TryAdd(c.Name, i);
            foreach (var group in model.Windings.Select((w, i) => (w, i)).GroupBy(x => x.w.Core))
            {
                var index = coreIndex.GetValueOrDefault(group.Key, -1);
                var core = index >= 0 ? model.Cores[index] : null;
                var reference = group.FirstOrDefault(x => x.w.Turns is not null && x.w.Rated is not null).w;
                var perTurn = reference is null ? (double?)null : reference.Rated!.Value / reference.Turns!.Value;
                var anyTurns = group.Any(x => x.w.Turns is not null);
                foreach (var (w, i) in group)
                {
                    if (w.Turns is { } t && w.Rated is { } v && perTurn is { } vpt && reference != w && Math.Abs(v / t / vpt - 1) > 0.005)
                        diagnostics.ReportVoltsPerTurnMismatch(w.NameSpan, w.Name, v / t, reference!.Name, vpt);
                    double turns;
                    var known = true;
                    if (w.Turns is { } given) turns = given;
                    else if (w.Rated is { } rated && perTurn is { } known1) turns = rated / known1;
                    else if (w.Rated is { } ratedOnly && !anyTurns)
                    {
                        turns = ratedOnly;
                        known = false;
                    }
                    else
                    {
                        diagnostics.ReportRatioUnknown(w.NameSpan, w.Name);
                        turns = w.Rated ?? 1;
                        known = false;
                    }
                    var ratedVoltage = w.Rated ?? turns * perTurn;
                    var ratedCurrent = w.RatedCurrent ?? (w.Rating ?? core?.Rating) / ratedVoltage;
                    result[i] = new WindingNet(i, w, index, turns, known, ratedVoltage, ratedCurrent, Resistance(w, turns));
                }
            }
            return [.. result];
        }

        /// <summary>The winding's resistance at the reference temperature: stated, measured at a temperature, or from its conductor.</summary>
        private double Resistance(WindingModel w, double turns)
        {
            var material = w.Conductor?.Material ?? ConductorMaterial.Copper;
            if (w.Resistance is { } r)
                return w.ResistanceTemperature is { } measuredAt ? Conductors.Correct(r, measuredAt, model.Temperature, material) : r;
            if (w.Conductor is { } c)
            {
                var length = c.PerTurn ? c.Length * turns : c.Length;
                var r20 = Conductors.Resistivity20(c.Material) * length / c.Area;
                return Conductors.Correct(r20, 293.15, model.Temperature, c.Material);
            }
            return 0;
        }

        private ImmutableArray<Section> BuildSections(ImmutableArray<WindingNet> windings)
        {
            var sections = ImmutableArray.CreateBuilder<Section>();
            var tapsOf = model.Taps.ToLookup(t => t.Winding, StringComparer.Ordinal);
            foreach (var w in windings)
            {
                var points = new List<(string Name, double Position)> { (w.Source.From.Name, 0) };
                foreach (var tap in tapsOf[w.Name])
                {
                    var position = Turns(tap, w);
                    if (double.IsNaN(position)) diagnostics.ReportTapNeedsRating(tap.PositionSpan, w.Name);
                    else if (!OnWinding(position, w)) diagnostics.ReportTapOutside(tap.PositionSpan, tap.Name, position, w.Turns);
                    else points.Add((tap.Name, Math.Clamp(position, 0, w.Turns)));
                }
                points.Add((w.Source.To.Name, w.Turns));
                // Stable: taps at one position keep their source order (the order is total, so an unstable sort keeps it).
                var order = new int[points.Count];
                for (var i = 0; i < order.Length; i++) order[i] = i;
                Array.Sort(order, (x, y) => points[x].Position.CompareTo(points[y].Position) is var c and not 0 ? c : x.CompareTo(y));
                var ordered = new List<(string Name, double Position)>(order.Length);
                foreach (var i in order) ordered.Add(points[i]);
                for (var k = 0; k + 1 < ordered.Count; k++)
                {
                    var (a, b) = (ordered[k], ordered[k + 1]);
                    var turns = b.Position - a.Position;
                    var name = ordered.Count == 2 ? w.Name : $"{w.Name}:{a.Name}-{b.Name}";
                    sections.Add(new Section(sections.Count, name, w.Index, w.Core, nodeOf[a.Name], nodeOf[b.Name], a.Name, b.Name, turns));
                }
            }
            return sections.ToImmutable();
        }

        private CoreNet BuildCore(CoreModel core, int index, ImmutableArray<WindingNet> windings, List<Section> onCore, IEnumerable<ImpedanceModel> lines)
        {
            var test = NoLoadTest(core, index);
            var coupling = Leakage.SectionMatrix(model, index, onCore, windings, lines, test?.Winding.Name, diagnostics);
            var admittance = test is { } t ? MagnetisingAdmittance(t.Test, t.Winding, model.RatedFrequencyOf(core)) : Complex.Zero;
            return new CoreNet(index, core, [.. onCore.Select(s => s.Index)], coupling.Matrix([.. onCore.Select(s => s.Turns)]), admittance, core.FluxLimit)
            {
                NoLoadWinding = test?.Winding.Index ?? -1,
                Coupling = coupling,
            };
        }

        /// <summary>The core's open-circuit test and its winding; a second test of one core is an error.</summary>
        private (NoLoadModel Test, WindingNet Winding)? NoLoadTest(CoreModel core, int index)
        {
            var tests = noLoadsOf[core.Name].ToList();
            foreach (var extra in tests.Skip(1)) diagnostics.ReportDuplicateNoLoad(extra.Line, core.Name, tests[0].Line);
            if (tests.Count == 0 || windingNamed.GetValueOrDefault(tests[0].Winding.Name) is not { } w) return null;
            if (w.Core != index)
            {
                diagnostics.ReportNoLoadOffCore(tests[0].Winding.Span, w.Name, core.Name);
                return null;
            }
            return (tests[0], w);
        }

        /// <summary>
        /// The magnetising admittance referred to one turn, from an open-circuit test on winding W
        /// (open-circuit test relations): G = P/V², |Y| = I/V, B = √(|Y|² − G²), each times N_W² (a
        /// winding of N turns sees Y/N²). Core loss then goes with the square of the volts per turn.
        /// </summary>
        private Complex MagnetisingAdmittance(NoLoadModel test, WindingNet w, double ratedFrequency)
        {
            var current = test.CurrentIsFraction
                ? test.Current * (w.RatedCurrent ?? double.NaN)
                : test.Current;
            if (double.IsNaN(current))
            {
                diagnostics.ReportNoLoadNeedsRating(test.Line, w.Name);
                return Complex.Zero;
            }
            var g = test.Loss / (test.Voltage * test.Voltage);
            var y = current / test.Voltage;
            if (y < g)
            {
                diagnostics.ReportNoLoadInconsistent(test.Line);
                return Complex.Zero;
            }
            // The test was made at the core's rated frequency: the magnetising reactance follows the frequency (B ∝ 1/f).
            var b = Math.Sqrt(y * y - g * g) * ratedFrequency / model.Frequency;
            return new Complex(g, -b) * w.Turns * w.Turns;
        }

        private ImmutableArray<SupplyNet> BuildSupplies()
        {
            var result = ImmutableArray.CreateBuilder<SupplyNet>();
            foreach (var s in model.Supplies)
            {
                var (p, q) = (nodeOf[s.Positive.Name], nodeOf[s.Negative.Name]);
                if (p == q)
                {
                    diagnostics.ReportSupplyShorted(s.NameSpan, s.Name, s.Positive.Name, s.Negative.Name);
                    continue;
                }
                result.Add(new SupplyNet(result.Count, s, p, q, s.Voltage, SupplyImpedance(s, model.Frequency / model.RatedFrequency)));
            }
            return result.ToImmutable();
        }

        /// <summary>
        /// The internal impedance: stated, or from the fault level (|Z| = |E|/I_f, or |E|²/S_f) split by
        /// X/R. Without an X/R the impedance is taken as pure reactance, the conservative case for peaks.
        /// It is given at the frequency as written; its reactance is scaled by <paramref name="f"/>, the
        /// frequency over that one.
        /// </summary>
        private static Complex SupplyImpedance(SupplyModel s, double f)
        {
            if (s.Impedance is { } z) return new Complex(z.Real, z.Imaginary * f);
            var e = s.Voltage.Magnitude;
            double? magnitude = s.FaultCurrent is { } i ? e / i : s.FaultPower is { } sf ? e * e / sf : null;
            if (magnitude is not { } m) return Complex.Zero;
            if (s.XR is not { } xr) return new Complex(0, m * f);
            var r = m / Math.Sqrt(1 + xr * xr);
            return new Complex(r, r * xr * f);
        }

        /// <summary>
        /// A part with loads and no source carries nothing: said at its loads. A galvanic island with
        /// a supply or a load and no ground floats: its voltages are given against its first node. An
        /// island of windings alone (an open winding) carries no current and needs no ground.
        /// </summary>
        private void WarnIslands(Network network)
        {
            var parts = Islands.Parts(network, withLoads: true, []);
            int PartOf(int a, int b) => parts.Find(Islands.Anchor(network, a, b));
            var fed = network.Supplies.Where(s => s.Source.IsSource).Select(s => PartOf(s.NodeP, s.NodeQ)).ToHashSet();
            var dead = network.Loads.Where(l => l.NodeA != l.NodeB && !fed.Contains(PartOf(l.NodeA, l.NodeB))).ToList();
            foreach (var part in dead.GroupBy(l => PartOf(l.NodeA, l.NodeB)))
                diagnostics.ReportNoSource(part.Select(l => (l.Name, l.Source.NameSpan)).ToList());

            var references = Islands.References(network, []);
            var deadNodes = dead.SelectMany(l => new[] { l.NodeA, l.NodeB }).ToHashSet();
            var active = new HashSet<int>();
            foreach (var s in network.Supplies) active.Add(references[s.NodeP]);
            foreach (var l in network.Loads.Where(l => !deadNodes.Contains(l.NodeA))) active.Add(references[l.NodeA]);
            var used = new HashSet<int>();
            foreach (var s in network.Sections) { used.Add(s.NodeA); used.Add(s.NodeB); }
            foreach (var s in network.Supplies) { used.Add(s.NodeP); used.Add(s.NodeQ); }
            foreach (var l in network.Loads) { used.Add(l.NodeA); used.Add(l.NodeB); }
            var usedOf = used.ToLookup(n => references[n]);
            foreach (var island in active.Order())
            {
                if (nodes[island].IsEarth) continue;
                var members = usedOf[island].Order().SelectMany(n => nodes[n].Points).ToList();
                var span = model.Points.First(p => p.Name == members[0]).Span;
                diagnostics.ReportNoGround(span, nodes[island].Name, members);
            }
        }
    }
}

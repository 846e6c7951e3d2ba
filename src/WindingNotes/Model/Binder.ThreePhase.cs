using System.Collections.Immutable;
using Phasor = System.Numerics.Complex;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Model;

// Three-phase statements: each expands to phase elements (cores, windings, supplies, loads) that
// the single-phase notation could have written, named NAME_a, NAME_b, NAME_c, so the solver sees
// nothing new and anything can still be wired by hand.
internal sealed partial class BindRun
{
    private static readonly string[] Connections = ["wye", "delta", "zigzag", "series", "ends"];

    private readonly Dictionary<string, CoreConstruction> threePhaseCores = new(StringComparer.Ordinal);
    private readonly Dictionary<string, ThreePhaseWindingModel> threePhaseWindings = new(StringComparer.Ordinal);
    private readonly List<Symbol> derivedPoints = [];
    private readonly ImmutableArray<ThreePhaseCoreModel>.Builder phaseCores = ImmutableArray.CreateBuilder<ThreePhaseCoreModel>();
    private readonly ImmutableArray<ThreePhaseSupplyModel>.Builder phaseSupplies = ImmutableArray.CreateBuilder<ThreePhaseSupplyModel>();
    private readonly ImmutableArray<ThreePhaseLoadModel>.Builder phaseLoads = ImmutableArray.CreateBuilder<ThreePhaseLoadModel>();

    private static ClauseSyntax? ConnectionOf(StatementSyntax s) => s.Clauses.FirstOrDefault(c => c.Keyword?.Text is { } k && Connections.Contains(k));

    private static CoreConstruction ConstructionOf(string word) => word switch
    {
        "bank" => CoreConstruction.Bank,
        "three-limb" => CoreConstruction.ThreeLimb,
        "five-limb" => CoreConstruction.FiveLimb,
        _ => CoreConstruction.Shell,
    };

    private ThreePhaseModel ThreePhaseResult() => new()
    {
        Cores = phaseCores.ToImmutable(),
        Windings = [.. threePhaseWindings.Values.OrderBy(w => w.Line.Start)],
        Supplies = phaseSupplies.ToImmutable(),
        Loads = phaseLoads.ToImmutable(),
    };

    // ---- names of phase elements, defined with the statement so later lines may use them ----

    private void DeclarePhases(StatementSyntax s)
    {
        if (rejected.Contains(s) || s.Head.Name(0) is not { } head) return;
        var name = head.Text;
        switch (s.Kind)
        {
            case StatementKind.Core when s.Clause("construction")?.Word(_ => true) is { } word:
                threePhaseCores[name] = ConstructionOf(word.Text);
                foreach (var limb in Phases.All(name)) Derive(limb, SymbolKind.Core, head, s);
                break;
            case StatementKind.Winding when ConnectionOf(s) is { } connection:
                declaredThreePhase.Add(name);
                foreach (var phase in Phases.All(name)) Derive(phase, SymbolKind.Winding, head, s);
                if (connection.Keyword!.Text is "wye" or "zigzag" && connection.Names.Count() == 3) Derive(name + "_n", SymbolKind.Node, head, s);
                if (connection.Keyword!.Text == "zigzag")
                    foreach (var phase in Phases.All(name))
                    {
                        Derive(phase + "n", SymbolKind.Winding, head, s);
                        Derive(phase + "m", SymbolKind.Node, head, s);
                    }
                break;
            case StatementKind.ThreePhaseSupply:
                declaredThreePhase.Add(name);
                foreach (var phase in Phases.All(name)) Derive(phase, SymbolKind.Supply, head, s);
                Derive(name + "_zn", SymbolKind.Supply, head, s);
                Derive(name + "_n", SymbolKind.Node, head, s);
                Derive(name + "_e", SymbolKind.Node, head, s);
                break;
            case StatementKind.ThreePhaseLoad:
                declaredThreePhase.Add(name);
                if (s.Clause("wye") is { } wye && wye.Name(0) is null) Derive(name + "_n", SymbolKind.Node, head, s);
                foreach (var phase in s.Clause("delta") is null ? Phases.All(name) : DeltaNames(name)) Derive(phase, SymbolKind.Load, head, s);
                break;
        }
    }

    private static string[] DeltaNames(string name) => [$"{name}_ab", $"{name}_bc", $"{name}_ca"];

    private Symbol? Derive(string name, SymbolKind kind, NameSyntax from, StatementSyntax s)
    {
        var symbol = new Symbol(name, kind, from.Name.Span, s.Span, from.Text);
        if (symbols.TryDefineDerived(symbol, out var existing)) return existing;
        // Reported once, at the statement that names it in its text or, failing that, here.
        if (!existing.Derived) diagnostics.ReportPhaseNameTaken(from.Name, name, existing.Span);
        return null;
    }

    /// <summary>A point the expansion needs that the author did not name (a star point, a zigzag's mid-point).</summary>
    private NodeRef MadePoint(string name, NameSyntax from)
    {
        if (symbols.Find(name) is { Derived: true, Kind: SymbolKind.Node } point && !derivedPoints.Contains(point)) derivedPoints.Add(point);
        return new NodeRef(name, from.Name.Span);
    }

    // ---- cores ----

    /// <summary>A core with a construction: three limbs of a third of its rating each.</summary>
    private bool BindThreePhaseCore(StatementSyntax s, CoreModel core)
    {
        var construction = s.Clause("construction");
        var zeroSyntax = s.Value("zero-sequence");
        if (construction is null)
        {
            if (zeroSyntax is not null) diagnostics.ReportOutOfBounds(s.Clause("zero-sequence")!.Span, "'zero-sequence'", "given on a three-phase core (with 'construction')");
            return false;
        }
        var kind = threePhaseCores.GetValueOrDefault(core.Name);
        Phasor? zero = null;
        if (Value(zeroSyntax, $"the zero-sequence impedance of {core.Name}") is { } z)
        {
            if (!(z.IsPercent && z.Dimension.IsNone) || z.Value.Real < 0 || z.Value == Phasor.Zero)
                diagnostics.ReportWrongDimension(zeroSyntax!.Span, "an impedance above zero in % or pu on the core's rating", z.Dimension);
            else if (kind == CoreConstruction.Bank)
                diagnostics.ReportBankZeroSequence(zeroSyntax!.Span);
            else zero = z.Value.Imaginary == 0 ? new Phasor(0, z.Value.Real) : z.Value;
        }
        var limbs = Phases.All(core.Name);
        foreach (var limb in limbs)
            cores.Add(core with { Name = limb, Rating = core.Rating / 3 });
        phaseCores.Add(new ThreePhaseCoreModel(core.Name, core.NameSpan, core.Line, kind, [.. limbs]) { ZeroSequence = zero, Rating = core.Rating });
        return true;
    }

    // ---- windings ----

    /// <summary>
    /// A winding on a three-phase core: its phase windings from its connection. Rated voltages are
    /// line-to-line for wye, zigzag and series windings, so a phase winding gets rated/√3 (a zigzag
    /// half rated/3); a delta's or named ends' phase winding gets the rated voltage. The kVA rating
    /// is the three-phase rating, a third to each phase winding.
    /// </summary>
    private bool BindThreePhaseWinding(StatementSyntax s, WindingModel w, Symbol core)
    {
        var connection = ConnectionOf(s);
        var threePhaseCore = threePhaseCores.ContainsKey(core.Name);
        var name = s.Head.Name(0)!;
        if (connection is null)
        {
            if (threePhaseCore) diagnostics.ReportNeedsConnection(name.Name, core.Name);
            return threePhaseCore;
        }
        if (!threePhaseCore)
        {
            diagnostics.ReportConnectionOnSinglePhase(connection.Keyword!, core.Name);
            return true;
        }
        var kind = Enum.Parse<PhaseConnection>(connection.Keyword!.Text, ignoreCase: true);
        var names = connection.Names.ToList();
        var limbs = Phases.All(core.Name);
        var phases = Phases.All(w.Name);
        var factor = kind switch { PhaseConnection.Wye or PhaseConnection.Series => 1 / Math.Sqrt(3), PhaseConnection.Zigzag => 1.0 / 3, _ => 1 };
        WindingModel Phase(string phase, string limb, NodeRef from, NodeRef to) => w with
        {
            Name = phase, Core = limb, From = from, To = to,
            Rated = w.Rated * factor,
            Rating = w.Rating / 3,
        };
        NodeRef Line(int k) => new(names[k].Text, names[k].Name.Span);
        var lines = names.Take(3).Select((n, k) => Line(k)).ToImmutableArray();
        string? star = null;
        var neutral = false;
        var other = ImmutableArray<NodeRef>.Empty;
        var made = new List<WindingModel>();
        switch (kind)
        {
            case PhaseConnection.Wye or PhaseConnection.Zigzag:
                neutral = names.Count > 3;
                var starRef = neutral ? Line(3) : MadePoint(w.Name + "_n", name);
                star = starRef.Name;
                for (var k = 0; k < 3; k++)
                {
                    if (kind == PhaseConnection.Wye)
                    {
                        made.Add(Phase(phases[k], limbs[k], lines[k], starRef));
                        continue;
                    }
                    // Phase k: from its line terminal through the half on limb k to the mid-point, then
                    // through the half on the next limb, entered at its unmarked end, to the star point:
                    // V = N·(e_k − e_k+1), 30° ahead of e_k for the abc sequence.
                    var mid = MadePoint($"{phases[k]}m", name);
                    made.Add(Phase(phases[k], limbs[k], lines[k], mid));
                    made.Add(Phase(phases[k] + "n", limbs[(k + 1) % 3], starRef, mid));
                }
                break;
            case PhaseConnection.Delta:
                for (var k = 0; k < 3; k++) made.Add(Phase(phases[k], limbs[k], lines[k], lines[(k + 1) % 3]));
                break;
            case PhaseConnection.Series:
                other = [.. names.Skip(3).Select(n => Node(n, s)).OfType<NodeRef>()];
                if (other.Length < 3) return true;
                for (var k = 0; k < 3; k++) made.Add(Phase(phases[k], limbs[k], lines[k], other[k]));
                break;
            default:
                var ends = names.Select(n => Node(n, s)).ToList();
                if (ends.Any(e => e is null)) return true;
                // The ends are the winding's own terminals: used here, never lonely.
                foreach (var end in names) nodeUses[symbols.Find(end.Text)!].Add(end.Name.Span.Start);
                for (var k = 0; k < 3; k++) made.Add(Phase(phases[k], limbs[k], ends[2 * k]!, ends[2 * k + 1]!));
                // A point on every phase is a star point; the line terminals are then the other ends, else the from ends.
                var common = Enumerable.Range(0, 3).Select(k => new[] { names[2 * k].Text, names[2 * k + 1].Text })
                    .Aggregate((IEnumerable<string> a, IEnumerable<string> b) => a.Intersect(b)).FirstOrDefault();
                lines = common is null
                    ? [ends[0]!, ends[2]!, ends[4]!]
                    : [.. Enumerable.Range(0, 3).Select(k => ends[2 * k]!.Name == common ? ends[2 * k + 1]! : ends[2 * k]!)];
                star = common;
                neutral = common is not null;
                break;
        }
        windings.AddRange(made);
        threePhaseWindings[w.Name] = new ThreePhaseWindingModel(w.Name, w.NameSpan, s.Span, core.Name, kind, lines, [.. phases])
        {
            StarPoint = star,
            NeutralTerminal = neutral,
            OtherEnds = other,
        };
        return true;
    }

    /// <summary>The phase winding of a three-phase winding on one limb (a zigzag's line-side half).</summary>
    private static string PhaseOn(ThreePhaseWindingModel w, int limb) => w.PhaseWindings[limb];

    /// <summary>Impedance lines between a zigzag and another three-phase winding on its core, fitted once the unit is bound.</summary>
    private readonly List<ZigzagImpedance> zigzagImpedances = [];

    /// <summary>An impedance between two three-phase windings holds on each limb; with a single-phase winding it is an error.</summary>
    private void AddImpedance(ImpedanceModel z)
    {
        var first = z.First.From is null ? threePhaseWindings.GetValueOrDefault(z.First.Winding) : null;
        var second = z.Second.From is null ? threePhaseWindings.GetValueOrDefault(z.Second.Winding) : null;
        if (first is null && second is null)
        {
            impedances.Add(z);
            return;
        }
        if (first is { Connection: PhaseConnection.Zigzag } && first == second)
        {
            // A zigzag named twice: the impedance between its two halves on each limb, the line-side
            // half of phase k and the star-side half of phase k − 1 (ohms referred to a half, % on a limb).
            for (var k = 0; k < 3; k++)
                impedances.Add(z with { First = z.First with { Winding = PhaseOn(first, k) }, Second = z.Second with { Winding = first.PhaseWindings[(k + 2) % 3] + "n" } });
            return;
        }
        if (first is not null && first == second)
        {
            // One mistake, one message: not one for each limb.
            diagnostics.ReportSameWinding(z.Second.Span);
            return;
        }
        if (first is not null && second is not null && first.Core == second.Core && (first.Connection == PhaseConnection.Zigzag) != (second.Connection == PhaseConnection.Zigzag))
        {
            // A zigzag with another winding of its unit: fitted to the unit's short-circuit test once all is bound.
            zigzagImpedances.Add(first.Connection == PhaseConnection.Zigzag ? new(z, second.Name, first.Name) : new(z, first.Name, second.Name));
            return;
        }
        if (first is null || second is null || first.Connection == PhaseConnection.Zigzag || second.Connection == PhaseConnection.Zigzag)
        {
            diagnostics.ReportPhaseImpedance(z.Line);
            return;
        }
        for (var k = 0; k < 3; k++)
            impedances.Add(z with { First = z.First with { Winding = PhaseOn(first, k) }, Second = z.Second with { Winding = PhaseOn(second, k) } });
    }

    /// <summary>
    /// An open-circuit test of a three-phase core: total loss, line voltage and line current (or
    /// percent) at a three-phase winding; each limb gets a third of the loss at the phase voltage.
    /// At a zigzag each limb's test is taken at its line-side half: a half stands at V/3, and the
    /// limb's magnetising current I_a − I_c of a balanced set is √3 times the line current; in percent
    /// of rated current it is the same figure (a half's rated current is √3 times the line's).
    /// </summary>
    private void AddNoLoad(NoLoadModel test)
    {
        if (!threePhaseCores.ContainsKey(test.Core))
        {
            noLoads.Add(test);
            return;
        }
        if (threePhaseWindings.GetValueOrDefault(test.Winding.Name) is not { } w || w.Core != test.Core)
        {
            diagnostics.ReportNoLoadOffCore(test.Winding.Span, test.Winding.Name, test.Core);
            return;
        }
        var (voltage, current) = w.Connection switch
        {
            PhaseConnection.Delta or PhaseConnection.Ends => (test.Voltage, test.Current / Math.Sqrt(3)),
            PhaseConnection.Zigzag => (test.Voltage / 3, test.Current * Math.Sqrt(3)),
            _ => (test.Voltage / Math.Sqrt(3), test.Current),
        };
        for (var k = 0; k < 3; k++)
            noLoads.Add(test with
            {
                Core = Phases.Of(test.Core, k),
                Winding = test.Winding with { Name = w.PhaseWindings[k] },
                Voltage = voltage,
                Current = test.CurrentIsFraction ? test.Current : current,
                Loss = test.Loss / 3,
            });
    }

    /// <summary>
    /// A zigzag on a core with no magnetising branch, alone (a grounding transformer) or beside wye
    /// windings without a neutral terminal: each limb carries equal and opposite ampere-turns of two
    /// zigzag phases and every zigzag phase voltage is a difference of two limbs' volts per turn, a
    /// floating star point takes up whatever the other windings' phases share, and no delta closes
    /// on the sum; so nothing fixes the flux common to the three limbs and the network has no unique
    /// solution. Said here, once, with what fixes it, not by the solver.
    /// </summary>
    private void CheckZigzagMagnetising()
    {
        foreach (var core in phaseCores)
        {
            if (core.ZeroSequence is not null || noLoads.Any(n => core.Limbs.Contains(n.Core))) continue;
            var on = threePhaseWindings.Values.Where(w => w.Core == core.Name).OrderBy(w => w.Line.Start).ToList();
            var phaseWindings = on.SelectMany(w => w.PhaseWindings.SelectMany(p => new[] { p, p + "n" })).ToHashSet(StringComparer.Ordinal);
            if (on.FirstOrDefault(w => w.Connection == PhaseConnection.Zigzag) is not { } zigzag
                || on.Any(w => w.Connection != PhaseConnection.Zigzag && (w.Connection != PhaseConnection.Wye || w.NeutralTerminal))
                || windings.Any(w => core.Limbs.Contains(w.Core) && !phaseWindings.Contains(w.Name))) continue;
            diagnostics.ReportZigzagUnmagnetised(zigzag.NameSpan, zigzag.Name, core.Name, alone: on.Count == 1);
        }
    }

    /// <summary>Three-phase windings, supplies and loads by name, whether or not they bound: a check or a tap names one of their phases.</summary>
    private readonly HashSet<string> declaredThreePhase = new(StringComparer.Ordinal);

    // ---- supplies and loads ----

    /// <summary>
    /// A three-phase source: a wye of three phase supplies of V/√3 from a star point, phase a at the
    /// stated angle, b and c 120° behind and ahead (abc), each with the positive-sequence impedance
    /// Z1; the star point is earthed through Zn = (Z0 − Z1)/3, so the zero-sequence impedance is
    /// Z1 + 3·Zn = Z0 (symmetrical components, any power-systems textbook), directly where Z0 = Z1.
    /// Z1 from a three-phase fault level: |Z1| = V²/S or V/(√3·I); Z0 from a line-to-ground fault
    /// current: I = 3E/(2·Z1 + Z0), E = V/√3, taken at the angle of Z1.
    /// </summary>
    private void BindThreePhaseSupply(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var lines = Enumerable.Range(1, 3).Select(i => Node(s.Head.Name(i), s)).ToList();
        var voltage = Complex(s.Head.Value(), Dimension.Voltage, $"the voltage of {name.Text}");
        var z1Given = Complex(s.Value("impedance"), Dimension.Impedance, $"the impedance of {name.Text}");
        var levelSyntax = s.Value("fault-level");
        var level = Value(levelSyntax, $"the fault level of {name.Text}");
        var xr = Real(s.Value("xr"), Dimension.None, "the X/R ratio", positive: true);
        var zeroSyntax = s.Value("zero-sequence");
        var zero = Value(zeroSyntax, $"the zero-sequence of {name.Text}");
        if (z1Given is not null && level is not null)
            diagnostics.ReportExclusiveClauses(s.Clause("fault-level")!.Keyword!, s.Clause("impedance")!.Keyword!);
        if (lines.Any(l => l is null) || voltage is not { } v || v == Phasor.Zero) return;
        var vll = v.Magnitude;
        var unitAngle = xr is { } ratio ? new Phasor(1, ratio) / Math.Sqrt(1 + ratio * ratio) : Phasor.ImaginaryOne;
        var z1 = z1Given ?? Phasor.Zero;
        if (level is { } l)
        {
            if (l.Dimension.Fits(Dimension.CurrentDim) && l.IsReal && l.Real > 0) z1 = vll / (Math.Sqrt(3) * l.Real) * unitAngle;
            else if (l.Dimension.Fits(Dimension.ApparentPower) && l.IsReal && l.Real > 0) z1 = vll * vll / l.Real * unitAngle;
            else
            {
                diagnostics.ReportWrongDimension(levelSyntax!.Span, "a positive current or apparent power", l.Dimension);
                return;
            }
        }
        var z0 = z1;
        if (zero is { } z)
        {
            if (z.Dimension.Fits(Dimension.Impedance)) z0 = z.Value;
            else if (z.Dimension.Fits(Dimension.CurrentDim) && z.IsReal && z.Real > 0 && 3 * vll / Math.Sqrt(3) / z.Real - 2 * z1.Magnitude is var m && m > 0)
                z0 = m * (z1 == Phasor.Zero ? unitAngle : z1 / z1.Magnitude);
            else
            {
                diagnostics.ReportWrongDimension(zeroSyntax!.Span, "an impedance, or a line-to-ground fault current below what a bolted source of this positive-sequence impedance would give", z.Dimension);
                return;
            }
        }
        // The minimum keeps the source's earthing: Zn = (Z0 − Z1)/3 as at the fault level.
        var z1Minimum = MinimumImpedance(s, name.Text, vll, single: false, xr, z1.Magnitude);
        var acb = s.Clause("sequence")?.Word(w => w == "acb") is not null;
        var star = MadePoint(name.Text + "_n", name);
        var phases = Phases.All(name.Text);
        for (var k = 0; k < 3; k++)
        {
            var shift = Phasor.Pow(Phases.A, acb ? k : -k);
            supplies.Add(new SupplyModel(phases[k], name.Name.Span, s.Span, lines[k]!, star, v / Math.Sqrt(3) * shift) { Impedance = z1, MinimumImpedance = z1Minimum });
        }
        var zn = (z0 - z1) / 3;
        if (zn == Phasor.Zero) grounds.Add(star);
        else
        {
            var earth = MadePoint(name.Text + "_e", name);
            grounds.Add(earth);
            supplies.Add(new SupplyModel(name.Text + "_zn", name.Name.Span, s.Span, star, earth, Phasor.Zero) { Impedance = zn, Neutral = true });
        }
        phaseSupplies.Add(new ThreePhaseSupplyModel(name.Text, name.Name.Span, s.Span, [.. lines!], vll, acb, z1, z0));
    }

    /// <summary>A three-phase load: one phase load a phase, wye (to a neutral or a star point of its own) or delta.</summary>
    private void BindThreePhaseLoad(StatementSyntax s)
    {
        var name = s.Head.Name(0)!;
        var lines = Enumerable.Range(1, 3).Select(i => Node(s.Head.Name(i), s)).ToList();
        var delta = s.Clause("delta") is not null;
        var neutral = s.Clause("wye")?.Name(0) is { } n ? Node(n, s) : null;
        var bound = lines.All(l => l is not null) && (neutral is not null || s.Clause("wye")?.Name(0) is null);
        if (Demands(s, name.Text, 3, bound) is not { } demands || !bound) return;
        var star = delta ? null : neutral ?? MadePoint(name.Text + "_n", name);
        var names = delta ? DeltaNames(name.Text) : Phases.All(name.Text);
        for (var k = 0; k < 3; k++)
        {
            var (a, b) = delta ? (lines[k]!, lines[(k + 1) % 3]!) : (lines[k]!, star!);
            loads.Add(new LoadModel(names[k], name.Name.Span, s.Span, a, b, demands[k].Behaviour, demands[k].S0, demands[k].V0));
        }
        phaseLoads.Add(new ThreePhaseLoadModel(name.Text, name.Name.Span, s.Span, [.. lines!], delta, [.. names]) { StarPoint = star?.Name });
    }

    // ---- checks ----

    private void BindVectorGroupExpect(StatementSyntax s, ClauseSyntax measure, ClauseSyntax condition)
    {
        if (measure.Keyword!.Text != "vector-group" || condition.Keyword!.Text != "is")
        {
            diagnostics.ReportVectorGroupPair(measure.Keyword!.Text == "vector-group" ? condition.Span : measure.Span);
            return;
        }
        var core = Resolve(measure.Name(0), "a core", SymbolKind.Core);
        if (core is null || condition.Name(0) is not { } symbol) return;
        if (!threePhaseCores.ContainsKey(core.Name))
        {
            diagnostics.ReportNotThreePhase(measure.Name(0)!.Name, core.Name);
            return;
        }
        expects.Add(new ExpectModel(s.Span, tree.Text[s.Span], MeasureKind.VectorGroup, [new NodeRef(core.Name, measure.Name(0)!.Name.Span)], ConditionKind.Between, 1, 1, "")
        {
            MeasureText = tree.Text[measure.Span],
            ConditionText = tree.Text[condition.Span],
            Symbol = symbol.Text,
        });
    }

    /// <summary>
    /// 'expect positive-sequence HV LV …' and 'expect zero-sequence HV [LV] …': two (or for the
    /// zero-sequence magnetising impedance one) three-phase windings of one unit, bounds in ohm or
    /// as a percentage on the unit's rating, the unit the first bound is written in deciding.
    /// </summary>
    private void BindSequenceExpect(StatementSyntax s, ClauseSyntax measure, ClauseSyntax condition)
    {
        var windings = new List<ThreePhaseWindingModel>();
        foreach (var name in measure.Names)
        {
            if (Resolve(name, "a winding", SymbolKind.Winding) is not { } symbol) return;
            if (!threePhaseWindings.TryGetValue(symbol.Name, out var w))
            {
                if (!declaredThreePhase.Contains(symbol.Name)) diagnostics.ReportSequenceWinding(name.Name, "is not a three-phase winding: sequence impedances belong to a winding declared with 'wye', 'delta', 'zigzag', 'series' or 'ends' on a three-phase core");
                return;
            }
            if (windings.Count == 1 && (w.Core != windings[0].Core || w.Name == windings[0].Name))
            {
                diagnostics.ReportSequenceWinding(name.Name, w.Name == windings[0].Name ? "is the winding energised: name another winding of the unit to short-circuit" : $"is on '{w.Core}', not on '{windings[0].Core}': a test is made on one unit");
                return;
            }
            windings.Add(w);
        }
        if (windings.Count == 0) return;
        if (condition.Keyword!.Text is "is" or "clear-of-limits")
        {
            diagnostics.ReportOutOfBounds(condition.Span, $"a check on {measure.Keyword!.Text}", "'below', 'above', 'between' or 'near'");
            return;
        }
        var first = Value(condition.Value(0), "a bound on the impedance");
        if (first is null) return;
        var ohms = first.Value.Dimension.Fits(Dimension.Impedance) && !first.Value.IsBare;
        var (dimension, unit) = ohms ? (Dimension.Impedance, "ohm") : (Dimension.None, UnitWord(condition.Value(0)) == "pu" ? "pu" : "%");
        var what = $"a bound on {measure.Keyword!.Text}";
        if (ConditionRange(condition, v => Real(v, dimension, what, ratio: !ohms), dimension, percentOfNear: ohms, ohms ? ["%", "ohm"] : ["%"]) is not (var low, var high, var target)) return;
        var kind = measure.Keyword!.Text == "positive-sequence" ? MeasureKind.PositiveSequence : MeasureKind.ZeroSequence;
        expects.Add(new ExpectModel(s.Span, tree.Text[s.Span], kind, [.. measure.Names.Select(n => new NodeRef(n.Text, n.Name.Span))],
            Enum.Parse<ConditionKind>(condition.Keyword.Text, true), low, high, unit)
        {
            Target = target,
            MeasureText = tree.Text[measure.Span],
            ConditionText = tree.Text[condition.Span],
        });
    }
}

using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

public enum TapState { Stated, InBand, AtLimit, Hunting, Follows, Backwards }

/// <summary>
/// Where a tap changer stands in a case: its position, how it got there, and for a controlled one
/// the voltage its relay sees (regulated voltage over the pt-ratio, less the line-drop compensation).
/// </summary>
public sealed record TapPosition(TapChangerModel Changer, int Position, TapState State, double? Relay)
{
    public bool AtLowest => Position == Changer.Low;

    /// <summary>A step-voltage regulator's range of regulation and current rating in this case; null for other tap changers.</summary>
    public RegulatorRating? Regulation { get; init; }

    public bool AtHighest => Position == Changer.High;

    public string StateText => State switch
    {
        TapState.Stated => "stated",
        TapState.InBand => "in band",
        TapState.AtLimit => AtHighest ? "at highest, below band" : "at lowest, above band",
        TapState.Hunting => "hunting",
        TapState.Backwards => AtHighest ? "at highest, wired backwards" : AtLowest ? "at lowest, wired backwards" : "wired backwards",
        _ => $"follows {Changer.Follows}",
    };
}

/// <summary>
/// The tap changers and the 'find' of a document, and the points solved with them: a point is bound
/// with each tap changer's let at its position (and the found value), its reversed windings reversed,
/// then built and solved. Controlled tap changers settle as real controllers do: from their starting
/// positions, one step at a time, the first out of its band in the order written moving first (so
/// cascaded regulators settle from the first written), until every relay is in its band or stopped
/// at a limit; a position visited twice is hunting, reported, never looped on. Followers take their
/// master's position after every step.
/// </summary>
public sealed class TapPlan
{
    private readonly SyntaxTree syntax;
    private readonly ImmutableArray<TapChangerModel> changers;
    private readonly Dictionary<string, Quantity> written;
    private readonly Dictionary<string, WindingModel> windings;

    /// <summary>The value 'find' found, merged into every point; empty before it is found.</summary>
    public ImmutableDictionary<string, Quantity> Found { get; internal set; } = ImmutableDictionary<string, Quantity>.Empty;

    /// <summary>The positions of the normal case, once settled.</summary>
    public ImmutableArray<TapPosition> Nominal { get; private set; } = [];

    /// <summary>The document as written, bound: positions bind again only the statements their lets reach (<see cref="Binder.Rebind"/>).</summary>
    private readonly Model.Model nominal;

    /// <summary>The positions' networks differ in their numbers: each refactors on the pivots of the first.</summary>
    private readonly SymbolicFactors factors = new();

    private TapPlan(SyntaxTree syntax, Model.Model model)
    {
        this.syntax = syntax;
        nominal = model;
        changers = model.TapChangers;
        written = model.TapChangers.Where(t => model.Lets.ContainsKey(t.Let)).ToDictionary(t => t.Name, t => model.Lets[t.Let]);
        windings = model.Windings.ToDictionary(w => w.Name);
    }

    /// <summary>A plan where the document has tap changers or a 'find', else null.</summary>
    public static TapPlan? For(SyntaxTree syntax, Model.Model model) =>
        model.TapChangers.IsEmpty && model.Find is null ? null : new TapPlan(syntax, model);

    /// <summary>The bind overrides of a point at these positions: the tap changers' lets, and the found value.</summary>
    public BindOverrides At(BindOverrides point, int[] positions)
    {
        var values = point.Values.SetItems(Found);
        for (var i = 0; i < changers.Length; i++)
        {
            var t = changers[i];
            if (!written.TryGetValue(t.Name, out var q)) continue;
            var steps = t.Reversing ? Math.Abs(positions[i]) : positions[i];
            values = values.SetItem(t.Let, q with { Value = q.Value + steps * t.Step.Value });
        }
        return point with { Values = values };
    }

    /// <summary>How many points were bound again statement by statement (for tests: the path is taken).</summary>
    internal int Rebound { get; private set; }

    /// <summary>How many of the points' factorisations were refactorisations (for tests).</summary>
    internal int Refactored => factors.Refactored;

    /// <summary>The model of a point bound at these positions, its reversed windings reversed.</summary>
    public Model.Model Bind(BindOverrides point, int[] positions)
    {
        var overrides = At(point, positions);
        // As a sweep point's: the statements the positions and the point's values reach, bound again; in full where they cannot be alone.
        var again = Binder.Rebind(nominal, overrides)?.Model;
        if (again is not null) Rebound++;
        var model = again ?? ZigzagImpedances.Bind(syntax, overrides);
        var reversed = changers.Where((t, i) => t.Reversing && positions[i] < 0).Select(t => t.Winding).ToHashSet(StringComparer.Ordinal);
        return reversed.Count == 0 || model.HasErrors ? model : Reverse(model, reversed);
    }

    /// <summary>
    /// A reversing switch: each winding named is connected the other way round, its ends exchanged and
    /// every tap and brush on it kept the same number of turns from the same terminal (so the let
    /// that places a selector keeps its meaning), which is what changing the switch over does.
    /// </summary>
    public static Model.Model Reverse(Model.Model model, IReadOnlySet<string> reversed)
    {
        var byName = model.Windings.ToDictionary(w => w.Name);
        var taps = model.Taps.Select(t =>
        {
            if (!reversed.Contains(t.Winding)) return t;
            var w = byName[t.Winding];
            double? mirrored = t.Unit switch
            {
                TapUnit.Fraction => 1 - t.Position,
                TapUnit.Turns => w.Turns - t.Position,
                _ => w.Rated - t.Position,
            };
            // A winding given by its rated voltage only: a tap in turns is placed by the builder, so it is left; the builder's own check applies.
            return mirrored is { } m ? t with { Position = m } : t;
        }).ToImmutableArray();
        var windingsOut = model.Windings.Select(w => reversed.Contains(w.Name) ? w with { From = w.To, To = w.From } : w).ToImmutableArray();
        return model with { Windings = windingsOut, Taps = taps };
    }

    /// <summary>
    /// The last point bound and built, by its overrides (the same object) and positions: settling ends
    /// where it last solved, so the faults at the settled positions and the document's own model at
    /// them reuse it instead of binding and building again.
    /// </summary>
    private (BindOverrides Point, string Key, Model.Model Model, Network? Network)? last;

    /// <summary>The model of the normal case at its settled positions, once settled.</summary>
    public Model.Model? NominalModel { get; private set; }

    /// <summary>One point at fixed positions: bind, build, solve (as <see cref="Points.Solve(SyntaxTree, BindOverrides, CaseSpec, bool, CancellationToken)"/>).</summary>
    public PointResult SolveAt(BindOverrides point, int[] positions, CaseSpec spec, bool withFaults, CancellationToken cancel)
    {
        var (model, network) = Built(point, positions);
        if (network is null) return new PointResult(null, null, [], model.Diagnostics);
        if (network.Diagnostics.Any(d => d.IsError)) return new PointResult(null, null, [], [.. model.Diagnostics, .. network.Diagnostics]);
        var solved = Points.Solve(network, spec, withFaults, c => NetworkSolver.Solve(network, c, factors, cancel), cancel, factors);
        return solved with { Diagnostics = [.. model.Diagnostics, .. network.Diagnostics, .. solved.Diagnostics] };
    }

    /// <summary>The model (as <see cref="Bind"/>) and its network (null where the model has errors or no supply) of a point.</summary>
    private (Model.Model Model, Network? Network) Built(BindOverrides point, int[] positions)
    {
        var key = Key(positions);
        if (last is { } l && ReferenceEquals(l.Point, point) && l.Key == key) return (l.Model, l.Network);
        var model = Bind(point, positions);
        Network? network = null;
        if (!model.HasErrors && !model.Supplies.IsEmpty)
            network = NetworkBuilder.Build(point.RatedFrequency is { } rated ? model with { RatedFrequency = rated } : model);
        last = (point, key, model, network);
        return (model, network);
    }

    /// <summary>A point with its tap changers settled, the positions attached to its case.</summary>
    public PointResult Solve(BindOverrides point, CaseSpec spec, bool withFaults, CancellationToken cancel)
    {
        var (p, taps, _) = Settle(point, spec, withFaults, cancel);
        return p.Case is { } c ? p with { Case = c with { TapPositions = taps } } : p;
    }

    /// <summary>Settles the normal case and keeps its positions; the positions as overrides for the document's own model.</summary>
    public (BindOverrides Overrides, int[] Positions) SettleNominal(DiagnosticBag diagnostics, CancellationToken cancel)
    {
        var (p, taps, positions) = Settle(BindOverrides.None, CaseSpec.Normal, withFaults: false, cancel);
        NominalModel = Built(BindOverrides.None, positions).Model;
        // The document's own evaluation solves this point again and reports what its solve says;
        // here only what settling found.
        diagnostics.AddRange(p.Diagnostics.Where(d => d.Code.StartsWith("tap-", StringComparison.Ordinal)));
        Nominal = taps;
        return (At(BindOverrides.None, positions), positions);
    }

    private (PointResult Point, ImmutableArray<TapPosition> Taps, int[] Positions) Settle(BindOverrides point, CaseSpec spec, bool withFaults, CancellationToken cancel)
    {
        var index = changers.Select((t, i) => (t.Name, i)).ToDictionary(x => x.Name, x => x.i);
        var positions = changers.Select(t => t.Start).ToArray();
        Follow(positions);
        var history = new Dictionary<string, double?[]>(StringComparer.Ordinal);
        var controlled = changers.Any(t => t.Control is not null);
        var budget = 20 + 4 * changers.Sum(t => t.High - t.Low);
        var extra = new List<Diagnostic>();
        var states = new TapState[changers.Length];
        // A control wired backwards: its step toward the band moved its relay away from it.
        var backwards = new (int From, int To, double Before, double After)?[changers.Length];
        (int Who, int From, double Relay, int Sign)? stepped = null;
        while (true)
        {
            cancel.ThrowIfCancellationRequested();
            var p = SolveAt(point, positions, spec, withFaults && !controlled, cancel);
            if (p.Case is not { } c || !controlled) return Finish(p, p.Case, null);
            var relays = changers.Select(t => t.Control is { } k ? Relay(k, c) : null).ToArray();
            history[Key(positions)] = relays;
            if (stepped is { } last && backwards[last.Who] is null && relays[last.Who] is { } now
                && (now - last.Relay) * last.Sign < -1e-9 * Math.Max(Math.Abs(now), Math.Abs(last.Relay)))
                backwards[last.Who] = (last.From, positions[last.Who], last.Relay, now);
            var mover = -1;
            for (var i = 0; i < changers.Length && mover < 0; i++)
            {
                if (changers[i].Control is not { } k || relays[i] is not { } v) continue;
                var step = v < k.BandLow ? 1 : v > k.BandHigh ? -1 : 0;
                states[i] = step == 0 ? TapState.InBand : TapState.AtLimit;
                if (step != 0 && positions[i] + step >= changers[i].Low && positions[i] + step <= changers[i].High) mover = i * 2 + (step > 0 ? 1 : 0);
            }
            if (mover < 0) return Finish(p, c, relays);
            var who = mover / 2;
            var from = positions[who];
            positions[who] += mover % 2 == 1 ? 1 : -1;
            stepped = (who, from, relays[who]!.Value, mover % 2 == 1 ? 1 : -1);
            Follow(positions);
            if (history.TryGetValue(Key(positions), out var before) || --budget < 0)
            {
                states[who] = TapState.Hunting;
                var k = changers[who].Control!;
                extra.Add(Bag(b => b.ReportTapHunting(changers[who], from, positions[who], relays[who]!.Value, before?[who], k, spec.Where)));
                positions[who] = from;
                Follow(positions);
                return Finish(p, c, relays);
            }

            (PointResult, ImmutableArray<TapPosition>, int[]) Finish(PointResult p, CaseResult? c, double?[]? relays)
            {
                if (withFaults && controlled && c is not null)
                {
                    // The faults are solved once, at the settled positions.
                    var withF = SolveAt(point, positions, spec, true, cancel);
                    if (withF.Case is not null) p = withF;
                }
                if (relays is not null)
                    for (var i = 0; i < changers.Length; i++)
                    {
                        if (states[i] == TapState.AtLimit && backwards[i] is { } w && changers[i].Control is { } kw)
                        {
                            // One diagnostic for the cause: the limit it ran to follows from the wiring.
                            states[i] = TapState.Backwards;
                            extra.Add(Bag(b => b.ReportTapBackwards(changers[i], w.From, w.To, w.Before, w.After, kw)));
                        }
                        else if (states[i] == TapState.AtLimit && changers[i].Control is { } k && relays[i] is { } v)
                            extra.Add(Bag(b => b.ReportTapLimit(changers[i], positions[i], v, k)));
                    }
                var taps = changers.Select((t, i) => new TapPosition(t, positions[i],
                    t.Follows is not null ? TapState.Follows : t.Control is null ? TapState.Stated : states[i], relays?[i])
                    { Regulation = p.Case is { } at ? Regulators.Rating(t, at) : null }).ToImmutableArray();
                return (p with { Diagnostics = [.. p.Diagnostics, .. extra] }, taps, (int[])positions.Clone());
            }
        }

        void Follow(int[] at)
        {
            for (var i = 0; i < changers.Length; i++)
                if (changers[i].Follows is { } m && index.TryGetValue(m, out var j))
                    at[i] = Math.Clamp(at[j], changers[i].Low, changers[i].High);
        }
    }

    private static string Key(int[] positions) => string.Join(",", positions);

    private static Diagnostic Bag(Func<DiagnosticBag, Diagnostic> report) => report(new DiagnosticBag());

    /// <summary>The relay's voltage: V/pt − (I/ct)·(R + jX), as a line-drop compensator forms it.</summary>
    public static double? Relay(TapControlModel k, CaseResult c)
    {
        var v = (c.PointVoltage(k.A.Name) - c.PointVoltage(k.B.Name)) / k.PtRatio;
        if (k.Line is null || k.CtRating is not { } ct) return v.Magnitude;
        var name = k.Line.Name;
        var i = c.Loads.FirstOrDefault(l => l.Load.Name == name)?.Current
            ?? c.Supplies.FirstOrDefault(s => s.Supply.Name == name)?.Current
            ?? c.Sections.FirstOrDefault(s => s.Winding.Name == name)?.Current;
        if (i is not { } current) return null;
        return (v - current / ct * k.Compensation).Magnitude;
    }
}

/// <summary>The tap changers and the 'find' before the study: what the evaluator does with a <see cref="TapPlan"/>.</summary>
public static class TapStudy
{
    /// <summary>
    /// Finds the 'find' value, settles the normal case, and gives the document's model and network at
    /// those values (the found let and the positions); null after an error, which leaves the file unsolved.
    /// </summary>
    public static (Model.Model Model, Network Network)? Prepare(TapPlan plan, Model.Model model, DiagnosticBag diagnostics, CancellationToken cancel)
    {
        var fixedLets = model.TapChangers.Select(t => t.Let).Concat(model.Find is { } f ? [f.Let] : []).ToHashSet(StringComparer.Ordinal);
        var clash = false;
        foreach (var sweep in model.Sweeps.Where(s => fixedLets.Contains(s.Target.Name)))
        {
            diagnostics.ReportFindSwept(sweep.Line, sweep.Target.Name);
            clash = true;
        }
        if (model.Find is { } find && model.TapChangers.FirstOrDefault(t => t.Let == find.Let) is { } both)
        {
            diagnostics.ReportFindSwept(find.Line, both.Let);
            clash = true;
        }
        if (clash) return null;
        if (model.Find is { } wanted)
        {
            if (SolveFor.Run(wanted, plan, diagnostics, cancel) is not { } value) return null;
            plan.Found = ImmutableDictionary<string, Quantity>.Empty.Add(wanted.Let, value);
        }
        var (overrides, positions) = plan.SettleNominal(diagnostics, cancel);
        var settled = plan.NominalModel ?? plan.Bind(overrides, positions);
        settled = CompleteExpects(settled);
        if (settled.HasErrors) return null;
        var network = NetworkBuilder.Build(settled with { RatedFrequency = model.RatedFrequency });
        return network.Diagnostics.Any(d => d.IsError) ? null : (settled, network);
    }

    /// <summary>'clear-of-limits' reads the tap changer's range, which the line may name after the expect.</summary>
    public static Model.Model CompleteExpects(Model.Model model)
    {
        var ranges = model.TapChangers.ToDictionary(t => t.Name);
        return model with
        {
            Expects = [.. model.Expects.Select(e => e.Measure == MeasureKind.Position && double.IsNaN(e.Low) && ranges.TryGetValue(e.Targets[0].Name, out var t)
                ? e with { Low = t.Low + 1, High = t.High - 1 } : e)],
        };
    }
}

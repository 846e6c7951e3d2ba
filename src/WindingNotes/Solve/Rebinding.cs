using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// Sweep points and tolerance samples that change lets and toleranced values, without binding the
/// whole document: the statements the values reach are bound again (<see cref="Binder.Rebind"/>),
/// the rest of the model is the document's as written. Where they reach only loads, the network is
/// the one built for an earlier such point (the base) with the new loads, solved by updating the
/// base's factors in the columns of the loads' nodes, loaded and without loads (as
/// <see cref="LoadScaling"/> does for a load cycle); an update refused is a full solve. Anything
/// else (a tolerance sample, a let of a supply, a winding, a tap or the leakage) is restamped on the
/// network of an earlier point built in full (<see cref="NetworkBuilder.Restamp"/>): the nodes, the
/// parts and their systems' unknowns and patterns are that network's, only the numbers are stamped
/// again (<see cref="MnaSystem.Restamped"/>), and each case is solved in full on them, refactored
/// on the kept pivots; where the values change the wiring or give a message of their own, the point
/// is built and solved in full (and becomes the network restamped on). Whatever cannot be bound
/// again alone is bound in full.
/// </summary>
internal sealed class Rebinding(SyntaxTree syntax, Model.Model nominal)
{
    private Base? current;

    /// <summary>The factorisations of the points built and solved in full, refactored for the next such point (a tolerance sample, a supply's value).</summary>
    private readonly SymbolicFactors factors = new();

    /// <summary>How many of those points' factorisations were refactorisations, and how many of them fell back to a fresh factorisation (for tests).</summary>
    internal (int Refactored, int FellBack) Refactorisations => (factors.Refactored, factors.FellBack);

    /// <summary>How many points were bound again statement by statement (for tests: the path is taken).</summary>
    public int Rebound { get; private set; }

    /// <summary>How many points were solved by updating a base's factors (for tests).</summary>
    public int Updated => (current?.Updated ?? 0) + retired;

    private int retired;

    /// <summary>How many let points of loads took their base's solution without loads, which their loads do not reach (for tests).</summary>
    public int NoLoadKept => (current?.NoLoadKept ?? 0) + retiredNoLoad;

    private int retiredNoLoad;

    private Stamped? stamped;

    /// <summary>How many points were restamped on a network built for an earlier point (for tests: the path is taken).</summary>
    public int Restamped { get; private set; }

    public PointResult Solve(BindOverrides overrides, CaseSpec spec, bool withFaults, CancellationToken cancel)
    {
        if (Binder.Rebind(nominal, overrides) is not var (model, loadsOnly)) return Points.Solve(syntax, overrides, spec, withFaults, cancel);
        Rebound++;
        if (overrides.RatedFrequency is { } rated) model = model with { RatedFrequency = rated };
        if (loadsOnly && !withFaults && current is { } b)
        {
            var moved = b.With(model);
            var point = Points.Solve(moved, spec, withFaults: false, c => b.Solve(moved, c, factors, cancel), cancel);
            return point with { Diagnostics = [.. b.Diagnostics, .. point.Diagnostics] };
        }
        // A let sweep of loads keeps to its update (above); a point of it built in full is its next base.
        if (!(loadsOnly && !withFaults) && !model.HasErrors && !model.Supplies.IsEmpty && stamped is { } s && NetworkBuilder.Restamp(s.Network, model) is { } network)
        {
            Restamped++;
            var point = Points.Solve(network, spec, withFaults, c => s.Solve(network, c, factors, cancel), cancel, factors);
            return point with { Diagnostics = [.. model.Diagnostics, .. network.Diagnostics, .. point.Diagnostics] };
        }
        var general = Points.Solve(model, spec, withFaults, factors, cancel);
        if (loadsOnly && !withFaults)
        {
            retired += current?.Updated ?? 0;
            retiredNoLoad += current?.NoLoadKept ?? 0;
            current = Base.Of(general);
        }
        else stamped = Stamped.Of(general) ?? stamped;
        return general;
    }

    /// <summary>
    /// A network built in full and solved, and its cases' systems without a fault, to restamp: each
    /// into a matrix and right-hand side of its own kept here (<see cref="MnaSystem.RestampedInto"/>),
    /// since a case's systems are solved before the next case or point stamps them again.
    /// </summary>
    private sealed class Stamped(Network network)
    {
        private readonly Dictionary<bool, List<(MnaSystem System, SystemMatrix Matrix, Complex[] Rhs)>> systems = [];

        public Network Network => network;

        public static Stamped? Of(PointResult p) => p.Case?.Solution.Network is { } n ? new Stamped(n) : null;

        /// <summary>A case of <paramref name="changed"/>, restamped from this network: solved on this network's systems with its numbers.</summary>
        public Solution Solve(Network changed, CaseSpec spec, SymbolicFactors factors, CancellationToken cancel)
        {
            cancel.ThrowIfCancellationRequested();
            if (spec.Fault is not null) return NetworkSolver.Solve(changed, spec, factors, cancel);
            if (!systems.TryGetValue(spec.WithoutLoads, out var kept))
                systems[spec.WithoutLoads] = kept = [.. NetworkSolver.Systems(network, spec).Select(m => (m, m.A.Clone(), new Complex[m.Size]))];
            return NetworkSolver.Solve(changed, spec, kept.Select(k => k.System.RestampedInto(changed, k.Matrix, k.Rhs)), factors, cancel);
        }
    }

    /// <summary>
    /// A network solved the general way with no message from its solves, and its factors, loaded and
    /// without loads. A point on it changes only loads, which the case without loads leaves out: its
    /// solution there is the base's own (<paramref name="noLoad"/>), given for the point's network and case, not solved again.
    /// </summary>
    private sealed class Base(Network network, ImmutableArray<Diagnostic> diagnostics, Solution? noLoad)
    {
        private readonly Dictionary<bool, KeptFactors> updates = [];
        private readonly Dictionary<MnaSystem, int[]> loadColumns = [];

        public int Updated { get; private set; }

        /// <summary>How many points took the base's solution without loads as their own (for tests).</summary>
        public int NoLoadKept { get; private set; }

        /// <summary>The model's and the builder's messages, which every point on this base shares.</summary>
        public ImmutableArray<Diagnostic> Diagnostics => diagnostics;

        public static Base? Of(PointResult p)
        {
            if (p.Case is not { } c || !c.Solution.Diagnostics.IsEmpty || p.NoLoadSolution is { } n && !n.Diagnostics.IsEmpty) return null;
            if (c.Solution.Network.Loads.Length > 0 && p.NoLoadSolution is null) return null;
            return new Base(c.Solution.Network, p.Diagnostics, p.NoLoadSolution);
        }

        /// <summary>The base's network with the loads of <paramref name="model"/>, which differs from the base's only in its loads and lets.</summary>
        public Network With(Model.Model model) =>
            network with { Model = model, Loads = [.. network.Loads.Select(l => l with { Source = model.Loads[l.Index] })] };

        public Solution Solve(Network changed, CaseSpec spec, SymbolicFactors factors, CancellationToken cancel)
        {
            cancel.ThrowIfCancellationRequested();
            if (spec.WithoutLoads && spec.Fault is null && noLoad is { Scope: null } same)
            {
                NoLoadKept++;
                return same with { Network = changed, Case = spec };
            }
            if (!updates.TryGetValue(spec.WithoutLoads, out var kept)) updates[spec.WithoutLoads] = kept = KeptFactors.Of(network, spec);
            if (kept.Solve(changed, spec, Columns) is not { } x) return NetworkSolver.Solve(changed, spec, factors, cancel);
            Updated++;
            return x;
        }

        /// <summary>The unknowns a load's admittance is stamped in: the voltages of its nodes.</summary>
        private int[] Columns(MnaSystem m)
        {
            if (!loadColumns.TryGetValue(m, out var columns))
                loadColumns[m] = columns = [.. m.LinearLoads.SelectMany(l => new[] { l.ColumnA, l.ColumnB }).Where(c => c >= 0).Distinct().Order()];
            return columns;
        }
    }
}

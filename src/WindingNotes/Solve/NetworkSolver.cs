using System.Collections.Immutable;
using System.Numerics;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// Solves one case of a network: each independent part on its own (a file of many units stays many
/// small systems), linear parts by one LU solve, parts with constant-power or constant-current loads
/// by Newton's method. Failures are diagnostics naming the elements involved, never exceptions.
/// </summary>
public static class NetworkSolver
{
    public static Solution Solve(Network network, CaseSpec spec, CancellationToken cancel = default) => Solve(network, spec, null, cancel);

    /// <summary>The same, refactoring on <paramref name="kept"/>'s factorisations where a part's pattern is one of them (see <see cref="SymbolicFactors"/>).</summary>
    internal static Solution Solve(Network network, CaseSpec spec, SymbolicFactors? kept, CancellationToken cancel = default)
    {
        var diagnostics = new DiagnosticBag();
        var (a, b) = spec.Fault is { } f ? (network.Node(f.A.Name), network.Node(f.B.Name)) : (-1, -1);
        // The islands' references are the wiring's, a fault joining two islands as its branch does.
        var wiring = Wiring.Of(network);
        Func<int, bool> isReference = n => wiring.IsReference(n, a, b);
        var parts = new List<(MnaSystem, Complex[])>();
        var solved = true;

        var groups = SolveGroup.Find(network, spec);
        // A fault leaves every part but its own as the normal case has it: its case is that part alone.
        var faulted = groups.Where(g => g.HasFault).ToList();
        if (faulted.Count > 0) groups = faulted;
        foreach (var group in groups)
        {
            cancel.ThrowIfCancellationRequested();
            // A part with no source carries no current and no voltage.
            if (group.Supplies.Count == 0) continue;
            var m = MnaSystem.Assemble(network, group, isReference, spec);
            var x = SolveSystem(ref m, network, diagnostics, kept, cancel);
            if (x is null) solved = false;
            else parts.Add((m, x));
        }
        // Every message of a case other than the file as written belongs to that case.
        var found = spec == CaseSpec.Normal ? diagnostics.ToImmutable() : [.. diagnostics.Select(d => d with { Case = spec.Name })];
        var solution = Collect(network, spec, parts, solved, found, partOnly: faulted.Count > 0);
        return faulted.Count > 0 ? solution with { Scope = ScopeOf(network, spec, faulted) } : solution;
    }

    /// <summary>The systems of the parts with a source of a case without a fault, assembled as <see cref="Solve(Network, CaseSpec, SymbolicFactors?, CancellationToken)"/> assembles them.</summary>
    internal static List<MnaSystem> Systems(Network network, CaseSpec spec)
    {
        var wiring = Wiring.Of(network);
        Func<int, bool> isReference = n => wiring.IsReference(n, -1, -1);
        return [.. SolveGroup.Find(network, spec).Where(g => g.Supplies.Count > 0).Select(g => MnaSystem.Assemble(network, g, isReference, spec))];
    }

    /// <summary>
    /// A case without a fault solved on its parts' systems already assembled (restamped on a kept
    /// network's: <see cref="MnaSystem.Restamped"/>), as <see cref="Solve(Network, CaseSpec, SymbolicFactors?, CancellationToken)"/> solves them.
    /// </summary>
    internal static Solution Solve(Network network, CaseSpec spec, IEnumerable<MnaSystem> systems, SymbolicFactors? kept, CancellationToken cancel)
    {
        var diagnostics = new DiagnosticBag();
        var parts = new List<(MnaSystem, Complex[])>();
        var solved = true;
        foreach (var system in systems)
        {
            cancel.ThrowIfCancellationRequested();
            var m = system;
            var x = SolveSystem(ref m, network, diagnostics, kept, cancel);
            if (x is null) solved = false;
            else parts.Add((m, x));
        }
        var found = spec == CaseSpec.Normal ? diagnostics.ToImmutable() : [.. diagnostics.Select(d => d with { Case = spec.Name })];
        return Collect(network, spec, parts, solved, found);
    }

    /// <summary>The elements of the parts, and their points: those on their nodes, and at earth those their elements name.</summary>
    private static CaseScope ScopeOf(Network network, CaseSpec spec, List<SolveGroup> groups)
    {
        // Loops into sets, in the order the parts list them (a set keeps the order it was filled in): once per fault.
        HashSet<int> Gather(Func<SolveGroup, List<int>> of)
        {
            var set = new HashSet<int>();
            foreach (var g in groups)
                foreach (var i in of(g)) set.Add(i);
            return set;
        }
        var (nodes, sections, supplies, loads) = (Gather(g => g.Nodes), Gather(g => g.Sections), Gather(g => g.Supplies), Gather(g => g.Loads));
        var points = new HashSet<string>(StringComparer.Ordinal);
        foreach (var n in nodes)
            foreach (var p in network.Nodes[n].Points) points.Add(p);
        foreach (var k in sections) { points.Add(network.Sections[k].FromPoint); points.Add(network.Sections[k].ToPoint); }
        foreach (var i in supplies) { points.Add(network.Supplies[i].Source.Positive.Name); points.Add(network.Supplies[i].Source.Negative.Name); }
        foreach (var i in loads) { points.Add(network.Loads[i].Source.A.Name); points.Add(network.Loads[i].Source.B.Name); }
        if (spec.Fault is { } f) { points.Add(f.A.Name); points.Add(f.B.Name); }
        return new CaseScope(points, sections, Gather(g => g.Cores), supplies, loads);
    }

    /// <summary>
    /// The solution from the solved unknowns of each part (parts not listed carry nothing).
    /// <paramref name="partOnly"/>: the solution holds the values of these parts only (a fault's case).
    /// </summary>
    internal static Solution Collect(Network network, CaseSpec spec, IEnumerable<(MnaSystem System, Complex[] X)> parts, bool solved, ImmutableArray<Diagnostic> diagnostics, bool partOnly = false)
    {
        var voltages = new Phasors.Builder(network.Nodes.Length, partOnly);
        var sections = new Phasors.Builder(network.Sections.Length, partOnly);
        var cores = new Phasors.Builder(network.Cores.Length, partOnly);
        var supplies = new Phasors.Builder(network.Supplies.Length, partOnly);
        var loads = new Phasors.Builder(network.Loads.Length, partOnly);
        var fault = Complex.Zero;
        foreach (var (m, x) in parts)
        {
            foreach (var (node, column) in m.NodeColumn) voltages.Set(node, x[column]);
            foreach (var (k, column) in m.SectionColumn) sections.Set(k, x[column]);
            foreach (var (c, column) in m.CoreColumn) cores.Set(c, x[column]);
            foreach (var (s, column) in m.SupplyColumn) supplies.Set(s, x[column]);
            if (m.FaultColumn >= 0) fault = x[m.FaultColumn];
            Complex At(int column) => column >= 0 ? x[column] : Complex.Zero;
            foreach (var (load, a, b) in m.LinearLoads)
            {
                var l = network.Loads[load].Source;
                loads.Set(load, Complex.Conjugate(l.S0) / (l.V0 * l.V0) * (At(a) - At(b)));
            }
            foreach (var load in m.NonlinearLoads)
                loads.Set(load.Load, NewtonSolver.LoadCurrent(load, NewtonSolver.Across(load, x)));
        }
        // Only the values set can need chopping: the others are zero, so the largest set is the largest of all.
        Chop(voltages);
        Chop(sections, supplies, loads);
        Chop(cores);
        return new Solution(network, spec, voltages.Build(), sections.Build(), cores.Build(), supplies.Build(), loads.Build(), fault, solved, diagnostics);
    }

    private static Complex[]? SolveSystem(ref MnaSystem m, Network network, DiagnosticBag diagnostics, SymbolicFactors? kept, CancellationToken cancel)
    {
        if (m.NonlinearLoads.Length > 0) m = DropDanglingLoads(m, network, diagnostics);
        var first = LinearSolver.Solve(m.A, m.B, kept);
        if (m.NonlinearLoads.Length == 0) return Accept(first, m, diagnostics) ? first.X : null;

        var scale = 0.0;
        foreach (var b in m.B) scale = Math.Max(scale, b.Magnitude);
        // What the factors of the first solve hold beside the system's own matrix.
        List<NewtonSolver.Stamp> firstStamps = [];
        // Loads in series with nothing else at the nodes between them leave those nodes undetermined
        // without the loads: start from the loads as impedances drawing their demand at the source voltage.
        if (first.Status != SolveStatus.Solved && scale > 0)
        {
            var a0 = m.A.Clone();
            var stamps = m.NonlinearLoads.Select(l => new NewtonSolver.Stamp(l.ColumnA, l.ColumnB, AdmittanceAt(l, scale))).ToList();
            foreach (var s in stamps) Stamp(a0, s);
            if (LinearSolver.Solve(a0, m.B, kept) is { Status: SolveStatus.Solved } loaded) (first, firstStamps) = (loaded, stamps);
        }
        if (!Accept(first, m, diagnostics)) return null;

        // Start Newton from the loads as impedances that draw their demand at the open-circuit voltage.
        var a = m.A.Clone();
        var startStamps = new List<NewtonSolver.Stamp>();
        foreach (var load in m.NonlinearLoads)
        {
            var v = NewtonSolver.Across(load, first.X);
            if (v.Magnitude <= 1e-9 * scale)
            {
                diagnostics.ReportLoadWithoutVoltage(network.Loads[load.Load].Source);
                m = m.Without(load);
                continue;
            }
            startStamps.Add(new NewtonSolver.Stamp(load.ColumnA, load.ColumnB, AdmittanceAt(load, v.Magnitude)));
            Stamp(a, startStamps[^1]);
        }
        // With every load dropped the part is linear, and the first solve is its solution.
        if (m.NonlinearLoads.Length == 0) return first.X;
        var start = LinearSolver.Solve(a, m.B, kept);
        // Newton's Jacobian is the system as the start factored it, or as the first solve did.
        var newton = start is { Status: SolveStatus.Solved, Factors: { } factors }
            ? NewtonSolver.Solve(m, factors, startStamps, start.X, cancel)
            : NewtonSolver.Solve(m, first.Factors!, firstStamps, first.X, cancel);
        if (newton.Converged) return newton.X;
        diagnostics.ReportNoConvergence(m.NonlinearLoads.Select(l => network.Loads[l.Load].Source).ToList(), NewtonSolver.MaxIterations);
        return null;
    }

    /// <summary>The admittance that draws the load's demand at <paramref name="v"/> volts.</summary>
    private static Complex AdmittanceAt(NonlinearLoad load, double v) =>
        Complex.Conjugate(load.Exponent == 0 ? load.S0 : load.S0 * (v / load.V0)) / (v * v);

    private static void Stamp(SystemMatrix a, NewtonSolver.Stamp s)
    {
        var y = s.Y;
        if (s.ColumnA >= 0) { a[s.ColumnA, s.ColumnA] += y; if (s.ColumnB >= 0) a[s.ColumnA, s.ColumnB] -= y; }
        if (s.ColumnB >= 0) { a[s.ColumnB, s.ColumnB] += y; if (s.ColumnA >= 0) a[s.ColumnB, s.ColumnA] -= y; }
    }

    /// <summary>
    /// A constant-power or constant-current load that is the only element at a node (a winding left
    /// out for a mistyped core, say) carries no current by KCL, so it draws nothing; the linear start
    /// leaves it out and would find that node's voltage undetermined. Such a load is named and dropped,
    /// and its node held at the voltage of its other end, so the rest of the part still solves (and a
    /// load that then stands alone at that other end is dropped in turn).
    /// </summary>
    private static MnaSystem DropDanglingLoads(MnaSystem m, Network network, DiagnosticBag diagnostics)
    {
        for (var dropped = true; dropped;)
        {
            dropped = false;
            foreach (var load in m.NonlinearLoads)
            {
                var (end, other) = IsDangling(m, load.ColumnA) ? (load.ColumnA, load.ColumnB) : IsDangling(m, load.ColumnB) ? (load.ColumnB, load.ColumnA) : (-1, -1);
                if (end < 0) continue;
                diagnostics.ReportLoadWithoutVoltage(network.Loads[load.Load].Source);
                m = m.Holding(load, end, other);
                dropped = true;
            }
        }
        return m;

        // No linear element stamps the node's own equation (its KCL row).
        static bool Lone(MnaSystem m, int c)
        {
            foreach (var v in m.A.Values(c))
                if (v != Complex.Zero) return false;
            return true;
        }
        static bool IsDangling(MnaSystem m, int c) => c >= 0 && m.NonlinearLoads.Count(l => l.ColumnA == c || l.ColumnB == c) == 1 && Lone(m, c);
    }

    private static bool Accept(LinearSolver.Result result, MnaSystem m, DiagnosticBag diagnostics)
    {
        if (result.Status == SolveStatus.Solved) return true;
        var elements = result.NullEquations.Select(i => m.Equations[i])
            .Concat(result.NullUnknowns.Select(i => m.Unknowns[i]))
            .DistinctBy(e => (e.Kind, e.Name))
            .OrderBy(e => e.Kind == ElementKind.Node ? 1 : 0)
            .ToList();
        // A weakest direction that names nothing (not a number, say) is the part's: its supplies.
        if (elements.Count == 0) elements = [.. m.Unknowns.Where(e => e.Kind == ElementKind.Supply)];
        if (result.Status == SolveStatus.IllConditioned)
        {
            diagnostics.ReportIllConditioned(elements, result.Condition, result.Residual);
            return result.X.Length == m.Size;
        }
        // A source in the null space is shorted: through ideal windings, or by a fault with no impedance.
        if (elements.FindIndex(e => e.Kind == ElementKind.Supply) is var supply and >= 0)
            diagnostics.ReportSupplyShortedThrough(elements[supply], [.. elements.Where((e, i) => i != supply && e.Kind != ElementKind.Node)]);
        else diagnostics.ReportSingular(elements);
        return false;
    }

    /// <summary>Rounding leaves values like 1e-17 where the answer is zero; they would print as noise.</summary>
    private static void Chop(params Phasors.Builder[] groups)
    {
        var max = 0.0;
        foreach (var values in groups)
            if (values.Largest() is var largest && largest > max) max = largest;
        foreach (var values in groups) values.Chop(1e-12 * max);
    }
}

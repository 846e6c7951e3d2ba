using System.Collections.Immutable;
using WindingNotes.Kernel;
using WindingNotes.Model;
using WindingNotes.Syntax;
using WindingNotes.Text;

namespace WindingNotes.Solve;

/// <summary>
/// The document solved at one set of values: its case (normal or a sweep point), the same network
/// without loads (for regulation and excitation at no load), and the fault cases when asked for.
/// </summary>
public sealed record PointResult(CaseResult? Case, Solution? NoLoadSolution, ImmutableArray<CaseResult> Faults, ImmutableArray<Diagnostic> Diagnostics)
{
    public bool Solved => Case is not null;

    /// <summary>
    /// The results of the network without loads (the case itself where it has none), made when first
    /// asked for: a sweep point's regulation and excitation read only the no-load solution, so most
    /// points never make them.
    /// </summary>
    public CaseResult? NoLoad => noLoad ??= Case is { } c && c.Solution.Network.Loads.IsEmpty ? c
        : NoLoadSolution is { } s ? Results.Compute(s, null) : null;

    private CaseResult? noLoad;

    /// <summary>Equal points: the same case, no-load solution, faults and messages (the results made on first use are no part of it).</summary>
    public bool Equals(PointResult? other) => other is not null && (ReferenceEquals(this, other) ||
        Case == other.Case && NoLoadSolution == other.NoLoadSolution && Sequences.Equal(Faults, other.Faults) && Sequences.Equal(Diagnostics, other.Diagnostics));

    public override int GetHashCode() => HashCode.Combine(Case, NoLoadSolution);
}

/// <summary>
/// Solves points: from the parsed document, bound with overrides and its network built afresh, or
/// from a network and a way to solve its cases. A study's sweep points and tolerance samples go
/// through <see cref="Rebinding"/> (bound again only where the values reach, restamped or updated on
/// an earlier point's network) and points that move only brushes through <see cref="BrushSweep"/>;
/// both give the same results, and take the first way where they cannot.
/// </summary>
public static class Points
{
    public static PointResult Solve(SyntaxTree syntax, BindOverrides overrides, CaseSpec spec, bool withFaults, CancellationToken cancel)
    {
        var model = ZigzagImpedances.Bind(syntax, overrides);
        if (overrides.RatedFrequency is { } rated) model = model with { RatedFrequency = rated };
        return Solve(model, spec, withFaults, cancel);
    }

    /// <summary>The point of a model bound at its values (the rated frequency as written set): built and solved.</summary>
    public static PointResult Solve(Model.Model model, CaseSpec spec, bool withFaults, CancellationToken cancel) => Solve(model, spec, withFaults, null, cancel);

    /// <summary>The same, each case's parts refactored on <paramref name="kept"/>'s factorisations where it holds one of their pattern.</summary>
    internal static PointResult Solve(Model.Model model, CaseSpec spec, bool withFaults, SymbolicFactors? kept, CancellationToken cancel)
    {
        // As for the document itself: a point whose model did not bind completely is not solved.
        if (model.HasErrors || model.Supplies.IsEmpty) return new PointResult(null, null, [], model.Diagnostics);
        var network = NetworkBuilder.Build(model);
        if (network.Diagnostics.Any(d => d.IsError)) return new PointResult(null, null, [], [.. model.Diagnostics, .. network.Diagnostics]);
        var solved = Solve(network, spec, withFaults, c => NetworkSolver.Solve(network, c, kept, cancel), cancel, kept);
        return solved with { Diagnostics = [.. model.Diagnostics, .. network.Diagnostics, .. solved.Diagnostics] };
    }

    public static PointResult Solve(Network network, CaseSpec spec, bool withFaults, CancellationToken cancel) =>
        Solve(network, spec, withFaults, c => NetworkSolver.Solve(network, c, cancel), cancel);

    /// <summary>The same with the case and its no-load companion solved by <paramref name="solve"/>, which must give what <see cref="NetworkSolver"/> gives.</summary>
    internal static PointResult Solve(Network network, CaseSpec spec, bool withFaults, Func<CaseSpec, Solution> solve, CancellationToken cancel, SymbolicFactors? kept = null)
    {
        var diagnostics = ImmutableArray.CreateBuilder<Diagnostic>();
        var main = solve(spec);
        diagnostics.AddRange(main.Diagnostics);
        if (!main.Solved) return new PointResult(null, null, [], diagnostics.ToImmutable());
        Solution? noLoad = null;
        if (!network.Loads.IsEmpty)
        {
            var solved = solve(spec.WithoutLoad());
            diagnostics.AddRange(solved.Diagnostics);
            if (solved.Solved) noLoad = solved;
        }
        var result = Results.Compute(main, noLoad);
        var faults = ImmutableArray.CreateBuilder<CaseResult>();
        if (withFaults && !network.Model.Faults.IsEmpty)
        {
            // One network with the loads as their pre-fault impedance serves every fault of the point.
            var loaded = Faults.MethodOf(network.Model) == FaultMethod.AsLoaded ? Faults.AsLoaded(network, main) : null;
            foreach (var fault in network.Model.Faults)
                if (Faults.Solve(network, fault, main, noLoad, diagnostics, cancel, loaded, kept) is { } solved) faults.Add(solved);
        }
        return new PointResult(result, noLoad, faults.ToImmutable(), diagnostics.ToImmutable());
    }
}

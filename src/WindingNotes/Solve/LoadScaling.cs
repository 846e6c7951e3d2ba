using WindingNotes.Kernel;
using WindingNotes.Model;

namespace WindingNotes.Solve;

/// <summary>
/// A network with every load's demand scaled by one factor (a load cycle's points), made from the
/// built network instead of building it again: the builder's network depends on the loads' demand
/// only through the loads themselves. Solved by updating the factors of the network as built in the
/// columns of the loads' nodes (<see cref="KeptFactors"/>), where its loads are all linear; else,
/// or where the update is refused, solved in full. Either gives what a full solve gives, to rounding.
/// </summary>
internal sealed class LoadScaling(Network network)
{
    private KeptFactors? factors;
    private readonly Dictionary<MnaSystem, int[]> loadColumns = [];

    /// <summary>How many networks were solved by updating the factors (for tests: the path is taken).</summary>
    public int Updated { get; private set; }

    /// <summary>The network as built, at the loads as written.</summary>
    public Network Network => network;

    /// <summary>The network at its loads times <paramref name="k"/>.</summary>
    public Network At(double k)
    {
        var model = network.Model with { Loads = [.. network.Model.Loads.Select(l => l with { S0 = l.S0 * k })] };
        return network with { Model = model, Loads = [.. network.Loads.Select(l => l with { Source = model.Loads[l.Index] })] };
    }

    /// <summary>The normal case of a network <see cref="At"/> gave.</summary>
    public Solution Solve(Network scaled, CancellationToken cancel)
    {
        cancel.ThrowIfCancellationRequested();
        factors ??= KeptFactors.Of(network, CaseSpec.Normal);
        if (factors.Solve(scaled, CaseSpec.Normal, Columns) is not { } updated) return NetworkSolver.Solve(scaled, CaseSpec.Normal, cancel);
        Updated++;
        return updated;
    }

    /// <summary>The unknowns a load's admittance is stamped in: the voltages of its nodes.</summary>
    private int[] Columns(MnaSystem m)
    {
        if (!loadColumns.TryGetValue(m, out var columns))
            loadColumns[m] = columns = [.. m.LinearLoads.SelectMany(l => new[] { l.ColumnA, l.ColumnB }).Where(c => c >= 0).Distinct().Order()];
        return columns;
    }
}

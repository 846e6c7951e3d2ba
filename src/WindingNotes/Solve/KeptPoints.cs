namespace WindingNotes.Solve;

/// <summary>
/// The sweep points whose results a study keeps: every one up to <c>capacity</c>
/// (<see cref="Sweeps.KeptFor"/>); past that the step doubles and every second point kept is let
/// go, so wherever the sweep stops (at its end or at the time limit) the points kept are evenly
/// spread, from the first to the last solved.
/// </summary>
internal sealed class KeptPoints(int capacity)
{
    private readonly List<(long K, CaseResult Case)> kept = [];
    private (long K, CaseResult Case) last = (-1, null!);

    /// <summary>One point kept in every so many.</summary>
    public long Stride { get; private set; } = 1;

    /// <summary>The points given, kept or not.</summary>
    public long Solved { get; private set; }

    public int Count => Cases.Count();

    public IEnumerable<CaseResult> Cases =>
        kept.Count > 0 && kept[^1].K == last.K || last.K < 0 ? kept.Select(p => p.Case) : kept.Select(p => p.Case).Append(last.Case);

    /// <summary>Point <paramref name="k"/> of the sweep, given in increasing order.</summary>
    public void Add(long k, CaseResult c)
    {
        Solved++;
        last = (k, c);
        if (k % Stride != 0) return;
        kept.Add((k, c));
        if (kept.Count <= capacity) return;
        Stride *= 2;
        kept.RemoveAll(p => p.K % Stride != 0);
    }
}

using System.Diagnostics;

namespace WindingNotes.Solve;

/// <summary>
/// How long one evaluation may run. Its <see cref="Token"/> is cancelled by the caller's token or
/// when the time is up; long work checks that one token, and whoever catches the cancellation asks
/// <see cref="Exceeded"/> to tell a limit reached (a diagnostic, with what was done kept) from a
/// caller that gave up (the cancellation goes on up).
/// </summary>
public sealed class TimeBudget : IDisposable
{
    private readonly CancellationToken caller;
    private readonly CancellationTokenSource timer;
    private readonly CancellationTokenSource linked;
    private readonly Stopwatch clock = Stopwatch.StartNew();

    public TimeBudget(TimeSpan limit, CancellationToken cancel = default)
    {
        Limit = limit;
        caller = cancel;
        timer = limit == Timeout.InfiniteTimeSpan ? new CancellationTokenSource() : new CancellationTokenSource(limit);
        linked = CancellationTokenSource.CreateLinkedTokenSource(cancel, timer.Token);
    }

    /// <summary>No limit, only the caller's cancellation.</summary>
    public static TimeBudget Unlimited(CancellationToken cancel = default) => new(Timeout.InfiniteTimeSpan, cancel);

    public TimeSpan Limit { get; }

    public TimeSpan Elapsed => clock.Elapsed;

    public CancellationToken Token => linked.Token;

    /// <summary>True when the time ran out and the caller had not cancelled.</summary>
    public bool Exceeded => timer.IsCancellationRequested && !caller.IsCancellationRequested;

    public void Dispose()
    {
        linked.Dispose();
        timer.Dispose();
    }
}

namespace WindingNotes.Solve;

/// <summary>
/// How long one evaluation may run, in processor time of the thread that evaluates (the evaluation
/// runs on the one thread that made its budget), so a loaded machine, which stretches the wall
/// clock, does not change the verdict: a file that evaluates within its limit on a quiet machine does
/// on a busy one. Where the platform has no clock of a thread's processor time (<see cref="ThreadClock"/>)
/// the limit is wall-clock time. Its <see cref="Token"/> is cancelled by the caller's token or when the
/// time is up; long work checks that one token, and whoever catches the cancellation asks
/// <see cref="Exceeded"/> to tell a limit reached (a diagnostic, with what was done kept) from a
/// caller that gave up (the cancellation goes on up).
/// </summary>
public sealed class TimeBudget : IDisposable
{
    private readonly CancellationToken caller;
    private readonly CancellationTokenSource timer;
    private readonly CancellationTokenSource linked;
    private readonly Func<TimeSpan?>? used;
    private readonly TimeSpan start;
    private readonly Timer? poll;
    private readonly Lock gate = new();
    private bool disposed;

    public TimeBudget(TimeSpan limit, CancellationToken cancel = default) : this(limit, cancel, ThreadClock.OfCurrentThread())
    {
    }

    /// <param name="used">The processor time used so far by the evaluating thread; null: the limit is wall-clock time.</param>
    internal TimeBudget(TimeSpan limit, CancellationToken cancel, Func<TimeSpan?>? used)
    {
        Limit = limit;
        caller = cancel;
        this.used = used;
        var infinite = limit == Timeout.InfiniteTimeSpan;
        timer = infinite ? new CancellationTokenSource() : used is null ? new CancellationTokenSource(limit) : new CancellationTokenSource();
        linked = CancellationTokenSource.CreateLinkedTokenSource(cancel, timer.Token);
        if (infinite || used is null) return;
        start = used() ?? TimeSpan.Zero;
        if (limit <= TimeSpan.Zero) timer.Cancel();
        // A thread uses at most as much processor time as passes on the wall clock, so the limit cannot
        // be met before 'limit' has passed: the clock is read then, and again after whatever is left.
        else poll = new Timer(_ => Poll(), null, limit, Timeout.InfiniteTimeSpan);
    }

    /// <summary>No limit, only the caller's cancellation.</summary>
    public static TimeBudget Unlimited(CancellationToken cancel = default) => new(Timeout.InfiniteTimeSpan, cancel);

    public TimeSpan Limit { get; }

    public CancellationToken Token => linked.Token;

    /// <summary>True when the time ran out and the caller had not cancelled.</summary>
    public bool Exceeded => timer.IsCancellationRequested && !caller.IsCancellationRequested;

    /// <summary>
    /// Reads the clock: past the limit (or when the thread's clock can no longer be read) the token is
    /// cancelled, else the next reading is set for when the rest could at the earliest be used. Returns
    /// the time left, zero once cancelled.
    /// </summary>
    internal TimeSpan Poll()
    {
        lock (gate)
        {
            if (disposed || timer.IsCancellationRequested) return TimeSpan.Zero;
            var left = used!() is { } now ? Limit - (now - start) : TimeSpan.Zero;
            if (left <= TimeSpan.Zero)
            {
                timer.Cancel();
                return TimeSpan.Zero;
            }
            poll?.Change(left, Timeout.InfiniteTimeSpan);
            return left;
        }
    }

    public void Dispose()
    {
        lock (gate)
        {
            if (disposed) return;
            disposed = true;
            poll?.Dispose();
            linked.Dispose();
            timer.Dispose();
        }
    }
}

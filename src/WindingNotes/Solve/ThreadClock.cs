using System.Runtime.InteropServices;

namespace WindingNotes.Solve;

/// <summary>
/// The processor time of one thread, readable from any thread: Linux's per-thread CPU clock
/// (<c>pthread_getcpuclockid</c>, <c>clock_gettime</c>). Other platforms have no such clock here, and
/// the time budget falls back to the wall clock there.
/// </summary>
internal static partial class ThreadClock
{
    /// <summary>A reader of the calling thread's processor time (null once it cannot be read), or null where the platform gives none.</summary>
    public static Func<TimeSpan?>? OfCurrentThread()
    {
        if (!OperatingSystem.IsLinux()) return null;
        try
        {
            if (pthread_getcpuclockid(pthread_self(), out var id) != 0) return null;
            return () => clock_gettime(id, out var t) == 0 ? TimeSpan.FromTicks(t.Seconds * TimeSpan.TicksPerSecond + t.Nanoseconds / 100) : null;
        }
        catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException)
        {
            return null;
        }
    }

    [StructLayout(LayoutKind.Sequential)]
    private struct TimeSpec
    {
        public nint Seconds;
        public nint Nanoseconds;
    }

    [DllImport("libc")]
    private static extern nuint pthread_self();

    [DllImport("libc")]
    private static extern int pthread_getcpuclockid(nuint thread, out int clock);

    [DllImport("libc")]
    private static extern int clock_gettime(int clock, out TimeSpec time);
}

using System.Diagnostics;
using System.Runtime.InteropServices;

namespace WindingNotes.Tests.Support;

/// <summary>
/// Processor time of the calling thread, so a budget counts the work of one input and not the
/// machine's load: CI runs the fuzzer beside other tests on few cores, which stretches wall time
/// several times over. Linux gives the thread's clock (CLOCK_THREAD_CPUTIME_ID); elsewhere this
/// falls back to wall time, which is stricter.
/// </summary>
public static class ThreadClock
{
    private const int ThreadCpuTime = 3; // CLOCK_THREAD_CPUTIME_ID in <time.h> on Linux

    [StructLayout(LayoutKind.Sequential)]
    private struct TimeSpec { public long Seconds; public long Nanoseconds; }

    [DllImport("libc", EntryPoint = "clock_gettime")]
    private static extern int ClockGetTime(int clock, out TimeSpec time);

    public static TimeSpan Now
    {
        get
        {
            if (OperatingSystem.IsLinux() && ClockGetTime(ThreadCpuTime, out var t) == 0)
                return TimeSpan.FromTicks(t.Seconds * TimeSpan.TicksPerSecond + t.Nanoseconds / 100);
            return Stopwatch.GetElapsedTime(0);
        }
    }
}

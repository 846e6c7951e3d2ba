using System.Runtime.InteropServices;

namespace WindingNotes.Cli;

/// <summary>
/// The collector's fresh memory in transparent huge pages, on Linux. A command allocates some
/// megabytes (the report of a 1,000-line file about 9 MB), and the collector clears memory before
/// handing it out, so every 4 KB page of it was a page fault: some 2,500 for that report, about
/// 19 µs each on a virtual machine, most of its time. The collector commits memory 64 KB at a time
/// as it goes, too little for a 2 MB page; a region without collections (GC.TryStartNoGCRegion) is
/// committed in one piece. So huge pages are asked for over the collector's range
/// above the heap (THP's "madvise" mode, the usual default), the region is started, and the 2 MB
/// block the heap is already in (whose first pages the runtime's start has written) is collapsed
/// into one huge page (MADV_COLLAPSE, Linux 6.1+). A 2 MB page is then one fault. Past the budget
/// the collector collects as ever (the region ends by itself). A kernel or libc that knows none of
/// this refuses it and the command runs as before; nothing it computes or writes changes. It is
/// done once, before the first file of <see cref="Worthwhile"/> characters or more is evaluated, and
/// only in the command's own process (<see cref="Allowed"/>, set by Main; never in a test's): a small
/// file, `--version` or the language server would pay the preparation (a 2 MB page cleared, a
/// collection, some milliseconds) for fewer faults than it saves. RESULTS.md ("The 1,000-line
/// report's fresh memory") has the figures.
/// </summary>
internal static class HeapPages
{
    /// <summary>What a command may allocate before its first collection (small and large objects): a file of some thousands of lines.</summary>
    private const long Budget = 32 << 20, LargeObjects = 4 << 20;

    /// <summary>
    /// How far above the heap's block the advice reaches: the collector takes its next regions from its
    /// reserve above the first ones (256 GB of address space by default); were the reserve smaller, the
    /// advice beyond it would only let other anonymous memory have huge pages.
    /// </summary>
    private const nint Reach = 256 << 20;

    private const nint HugePage = 2 << 20;

    private const int AdviseHugePages = 14, AdviseCollapse = 25; // MADV_HUGEPAGE, MADV_COLLAPSE

    /// <summary>The smallest file worth it, in characters (some 200 lines; the 1,000-line file has 44,000).</summary>
    public const int Worthwhile = 8 << 10;

    /// <summary>Whether this process is the command's own: Main says so.</summary>
    public static bool Allowed { get; set; }

    private static bool prepared;

    /// <summary>Prepares the collector's memory before <paramref name="text"/> is evaluated, once, where it is worth it.</summary>
    public static void Before(string text)
    {
        if (!Allowed || prepared || text.Length < Worthwhile) return;
        prepared = true;
        Prepare();
    }

    private static void Prepare()
    {
        if (!OperatingSystem.IsLinux() || !Environment.Is64BitProcess) return;
        try
        {
            madvise(HeapBlock(), Reach, AdviseHugePages);
            if (GC.TryStartNoGCRegion(Budget, LargeObjects)) madvise(HeapBlock(), HugePage, AdviseCollapse);
        }
        catch (Exception e) when (e is DllNotFoundException or EntryPointNotFoundException or InvalidOperationException or ArgumentOutOfRangeException)
        {
            // Not glibc, or a collector configured otherwise (a server collector's limits): the command runs as before.
        }
    }

    /// <summary>The 2 MB block the collector allocates in now: that of a new object.</summary>
    private static nint HeapBlock()
    {
        var handle = GCHandle.Alloc(new byte[1], GCHandleType.Pinned);
        var at = handle.AddrOfPinnedObject();
        handle.Free();
        return at & ~(HugePage - 1);
    }

    [DllImport("libc.so.6")]
    private static extern int madvise(nint address, nint length, int advice);
}

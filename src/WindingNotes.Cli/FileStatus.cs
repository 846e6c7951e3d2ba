using System.Runtime.InteropServices;

namespace WindingNotes.Cli;

/// <summary>
/// What the file system says of a path that .NET does not: its type (a FIFO or a device is not a
/// calculation file, and opening a FIFO without a writer would wait for ever), owner, group and link
/// count. Read with Linux's statx, whose structure is laid out the same on every architecture, so
/// one declaration serves; Mono.Unix would bring a native library of its own for these few fields.
/// Elsewhere (no statx) it is unknown and the callers go on as before.
/// </summary>
internal sealed record FileStatus(uint Type, uint Mode, uint Owner, uint Group, uint Links, long Size)
{
    public const uint Regular = 0x8000, Directory = 0x4000, Fifo = 0x1000, CharacterDevice = 0x2000, BlockDevice = 0x6000, Socket = 0xC000, Link = 0xA000;

    public bool IsRegular => Type == Regular;

    public string TypeName => Type switch
    {
        Directory => "a directory",
        Fifo => "a named pipe",
        CharacterDevice or BlockDevice => "a device",
        Socket => "a socket",
        Link => "a symbolic link",
        _ => "not a regular file",
    };

    /// <summary>The status of the path (of the link itself where <paramref name="followLinks"/> is false); null where unknown.</summary>
    public static FileStatus? Of(string path, bool followLinks = true)
    {
        if (!OperatingSystem.IsLinux()) return null;
        var buffer = new byte[256];
        try
        {
            if (statx(AtCurrentDirectory, path, followLinks ? 0 : SymlinkNoFollow, BasicStats, buffer) != 0) return null;
        }
        catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException)
        {
            return null;
        }
        var mode = BitConverter.ToUInt16(buffer, 28);
        return new FileStatus((uint)mode & 0xF000, (uint)mode & 0xFFF, BitConverter.ToUInt32(buffer, 20), BitConverter.ToUInt32(buffer, 24),
            BitConverter.ToUInt32(buffer, 16), (long)BitConverter.ToUInt64(buffer, 40));
    }

    /// <summary>Gives a file an owner and a group; false where that is not allowed or not known how.</summary>
    public static bool SetOwner(string path, uint owner, uint group)
    {
        if (!OperatingSystem.IsLinux()) return false;
        try
        {
            return chown(path, owner, group) == 0;
        }
        catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException)
        {
            return false;
        }
    }

    private const int AtCurrentDirectory = -100, SymlinkNoFollow = 0x100;
    private const uint BasicStats = 0x7ff;

    [DllImport("libc", SetLastError = true)]
    private static extern int statx(int directory, string path, int flags, uint mask, byte[] buffer);

    [DllImport("libc", SetLastError = true)]
    private static extern int chown(string path, uint owner, uint group);
}

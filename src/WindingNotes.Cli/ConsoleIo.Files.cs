using System.Text;

namespace WindingNotes.Cli;

/// <summary>Reading a file exactly and replacing it atomically, for commands that rewrite files.</summary>
public sealed partial record ConsoleIo
{
    private static readonly UTF8Encoding StrictUtf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

    private static ReadOnlySpan<byte> Bom => [0xEF, 0xBB, 0xBF];

    /// <summary>The largest input read, in bytes: a calculation file is a few hundred kilobytes at most, and a larger input (a device, an endless pipe) would only exhaust memory.</summary>
    public const int MaxInput = 16 << 20;

    /// <summary>
    /// The text of a file, or of standard input for "-", read the same way: a regular file only (a
    /// named pipe or a device is refused before it is opened), at most <see cref="MaxInput"/> bytes,
    /// a byte-order mark dropped, bytes that are not UTF-8 refused (read as replacement characters
    /// they would be lost, and written back by fmt). Null after a message when it cannot be read.
    /// </summary>
    public string? Read(string path)
    {
        var name = DisplayName(path);
        byte[]? bytes;
        try
        {
            if (path == "-") bytes = ReadAtMost(Input);
            else
            {
                if (FileStatus.Of(path) is { IsRegular: false } status) return Refuse(name, $"it is {status.TypeName}, not a calculation file");
                using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read);
                bytes = stream.Length > MaxInput ? null : ReadAtMost(stream);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            return Refuse(name, e.Message);
        }
        if (bytes is null) return Refuse(name, $"it is larger than {MaxInput >> 20} MB, the most a calculation file may be");
        var start = bytes.AsSpan().StartsWith(Bom) ? Bom.Length : 0;
        try
        {
            return StrictUtf8.GetString(bytes, start, bytes.Length - start);
        }
        catch (DecoderFallbackException)
        {
            return Refuse(name, "it is not UTF-8 text; it was left as it is");
        }
    }

    private string? Refuse(string name, string why)
    {
        Error.WriteLine($"windingnotes: cannot read '{name}': {why}");
        return null;
    }

    /// <summary>The whole stream, or null as soon as it passes <see cref="MaxInput"/> bytes.</summary>
    private static byte[]? ReadAtMost(Stream stream)
    {
        var o = new MemoryStream();
        var buffer = new byte[81920];
        int read;
        while ((read = stream.Read(buffer)) > 0)
        {
            if (o.Length + read > MaxInput) return null;
            o.Write(buffer, 0, read);
        }
        return o.ToArray();
    }

    /// <summary>
    /// Writes a file, or replaces its content without a moment in which it is lost: the text goes to
    /// a new file beside it, flushed to disk, which is then renamed over the old one (atomic on one
    /// file system). An existing file's byte-order mark and permissions are kept; a symbolic link
    /// stays a link. False after a message when it fails, with the original untouched.
    /// </summary>
    public bool Replace(string path, string text)
    {
        var target = Path.GetFullPath(path);
        string? temporary = null;
        try
        {
            var info = new FileInfo(target);
            if (info.LinkTarget is not null && info.ResolveLinkTarget(returnFinalTarget: true) is { } linked) target = linked.FullName;
            var exists = File.Exists(target);
            var keepBom = exists && File.ReadAllBytes(target).AsSpan().StartsWith(Bom);
            var directory = Path.GetDirectoryName(target)!;
            temporary = Path.Combine(directory, $".{Path.GetFileName(target)}.{Environment.ProcessId}.{Guid.NewGuid():N}.tmp");
            using (var stream = new FileStream(temporary, FileMode.CreateNew, FileAccess.Write))
            {
                if (keepBom) stream.Write(Bom);
                stream.Write(StrictUtf8.GetBytes(text));
                stream.Flush(flushToDisk: true);
            }
            if (exists && !OperatingSystem.IsWindows()) File.SetUnixFileMode(temporary, File.GetUnixFileMode(target));
            File.Move(temporary, target, overwrite: true);
            temporary = null;
            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            Error.WriteLine($"windingnotes: cannot write '{path}': {e.Message}; the file was left as it was");
            return false;
        }
        finally
        {
            if (temporary is not null) TryDelete(temporary);
        }
    }

    private static void TryDelete(string path)
    {
        try
        {
            File.Delete(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Nothing more to do: the original is intact and the message has been written.
        }
    }
}

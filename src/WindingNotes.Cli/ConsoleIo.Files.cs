using System.Text;

namespace WindingNotes.Cli;

/// <summary>Reading a file exactly and replacing it atomically, for commands that rewrite files.</summary>
public sealed partial record ConsoleIo
{
    private static readonly UTF8Encoding StrictUtf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

    private static ReadOnlySpan<byte> Bom => [0xEF, 0xBB, 0xBF];

    /// <summary>
    /// A file's text, refusing bytes that are not UTF-8: reading them as replacement characters and
    /// writing the file back would lose them. Null after a message when the file cannot be read.
    /// </summary>
    public string? ReadExact(string path)
    {
        byte[] bytes;
        try
        {
            bytes = File.ReadAllBytes(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            Error.WriteLine($"windingnotes: cannot read '{path}': {e.Message}");
            return null;
        }
        var start = bytes.AsSpan().StartsWith(Bom) ? Bom.Length : 0;
        try
        {
            return StrictUtf8.GetString(bytes, start, bytes.Length - start);
        }
        catch (DecoderFallbackException)
        {
            Error.WriteLine($"windingnotes: '{path}' is not UTF-8 text; it was left as it is");
            return null;
        }
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

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
                // Unbuffered: the file is read in large pieces (ReadAtMost), so a buffer would only be copied through.
                using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 0);
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
        // A file of known length is read straight into an array of its size, if it has not grown meanwhile;
        // a copy through a buffer and a growing stream took three times its bytes, all fresh memory.
        if (stream.CanSeek && stream.Length is > 0 and <= MaxInput && stream.Position == 0)
        {
            var whole = new byte[stream.Length];
            if (stream.ReadAtLeast(whole, whole.Length, throwOnEndOfStream: false) == whole.Length && stream.Read(stackalloc byte[1]) == 0) return whole;
            stream.Position = 0;
        }
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
    /// file system). The new file is made readable by its owner alone, then given the original's
    /// byte-order mark, permissions, owner and group before the rename. A symbolic link is followed
    /// only to a file inside the folder it was named from (and stays a link); a file with other
    /// names (hard links) or without write permission is refused, since a rename would part it from
    /// its other names or overrule its protection. The temporary file's name says whose it is, so a
    /// later run removes one a killed run left. False after a message when it fails, with the
    /// original untouched.
    /// </summary>
    public bool Replace(string path, string text)
    {
        var given = Path.GetFullPath(path);
        var target = given;
        string? temporary = null;
        bool Refuse(string why)
        {
            Error.WriteLine($"windingnotes: cannot write '{path}': {why}; the file was left as it was");
            return false;
        }
        try
        {
            var info = new FileInfo(given);
            if (info.LinkTarget is not null)
            {
                if (info.ResolveLinkTarget(returnFinalTarget: true) is not { } linked) return Refuse("it is a symbolic link to nothing");
                target = linked.FullName;
                var folder = Path.GetDirectoryName(given)! + Path.DirectorySeparatorChar;
                if (!target.StartsWith(folder, StringComparison.Ordinal)) return Refuse($"it is a symbolic link to '{target}', outside the folder it was named from; format that file itself");
            }
            var status = FileStatus.Of(target);
            if (status is { Links: > 1 }) return Refuse($"it has {status.Links} names (hard links), and replacing it would part them");
            var exists = File.Exists(target);
            if (exists && (status is { } s ? (s.Mode & 0x80) == 0 : new FileInfo(target).IsReadOnly)) return Refuse("it is read-only");
            var keepBom = exists && File.ReadAllBytes(target).AsSpan().StartsWith(Bom);
            var directory = Path.GetDirectoryName(target)!;
            RemoveLeftovers(directory, Path.GetFileName(target));
            temporary = Path.Combine(directory, $"{TemporaryPrefix(Path.GetFileName(target))}{Environment.ProcessId}.tmp");
            var options = new FileStreamOptions { Mode = FileMode.CreateNew, Access = FileAccess.Write };
            if (!OperatingSystem.IsWindows()) options.UnixCreateMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;
            using (var stream = new FileStream(temporary, options))
            {
                if (keepBom) stream.Write(Bom);
                stream.Write(StrictUtf8.GetBytes(text));
                stream.Flush(flushToDisk: true);
            }
            if (status is { } original && FileStatus.Of(temporary) is { } made && (made.Owner != original.Owner || made.Group != original.Group)
                && !FileStatus.SetOwner(temporary, original.Owner, original.Group))
                return Refuse($"its owner and group ({original.Owner}:{original.Group}) cannot be kept by this user");
            if (exists && !OperatingSystem.IsWindows()) File.SetUnixFileMode(temporary, File.GetUnixFileMode(target));
            File.Move(temporary, target, overwrite: true);
            temporary = null;
            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            return Refuse(e.Message);
        }
        finally
        {
            if (temporary is not null) TryDelete(temporary);
        }
    }

    private static string TemporaryPrefix(string name) => $".{name}.windingnotes-fmt.";

    /// <summary>Removes the temporary files of runs on this file that are no longer running (killed before their rename).</summary>
    private static void RemoveLeftovers(string directory, string name)
    {
        var prefix = TemporaryPrefix(name);
        foreach (var file in Directory.EnumerateFiles(directory, prefix + "*.tmp"))
        {
            var id = Path.GetFileName(file)[prefix.Length..^".tmp".Length];
            if (int.TryParse(id, out var pid) && !Running(pid)) TryDelete(file);
        }
    }

    private static bool Running(int pid)
    {
        if (pid == Environment.ProcessId) return false;
        try
        {
            using var process = System.Diagnostics.Process.GetProcessById(pid);
            return !process.HasExited;
        }
        catch (Exception e) when (e is ArgumentException or InvalidOperationException)
        {
            return false;
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

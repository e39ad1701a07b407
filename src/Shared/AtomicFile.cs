using System.Text;

namespace StringModes.Shared;

/// <summary>
/// Whole-file writes that never leave a half-written file under the target name: the content goes to a
/// temporary file in the same folder (same file system, so the final rename is atomic on POSIX), is flushed
/// to disk, then replaces the target with <see cref="File.Move(string, string, bool)"/>.
/// One source file, compiled into each assembly that writes files (see docs/architecture.md).
/// </summary>
internal static class AtomicFile
{
    /// <summary>Writes what <paramref name="write"/> puts into the stream to <paramref name="path"/>. I/O errors propagate (the CLI maps them to exit code 5).</summary>
    public static void Write(string path, Action<Stream> write)
    {
        var full = Path.GetFullPath(path);
        var folder = Path.GetDirectoryName(full) ?? throw new ArgumentException("Path has no folder.", nameof(path));
        var temp = Path.Combine(folder, "." + Path.GetFileName(full) + "." + Guid.NewGuid().ToString("N") + ".tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }

            File.Move(temp, full, overwrite: true);
        }
        catch
        {
            TryDelete(temp);
            throw;
        }
    }

    /// <summary>Writes <paramref name="bytes"/> to <paramref name="path"/>.</summary>
    public static void WriteAllBytes(string path, byte[] bytes) => Write(path, s => s.Write(bytes));

    /// <summary>Writes <paramref name="text"/> as UTF-8 without a byte-order mark.</summary>
    public static void WriteAllText(string path, string text) =>
        WriteAllBytes(path, new UTF8Encoding(encoderShouldEmitUTF8Identifier: false).GetBytes(text));

    private static void TryDelete(string path)
    {
        try
        {
            File.Delete(path);
        }
        catch (IOException)
        {
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}

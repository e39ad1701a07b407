namespace StringModes.Video.Output;

/// <summary>Writes a file to a temporary name in the same folder, then renames it into place: readers never see half a file.</summary>
public static class AtomicFile
{
    /// <summary>Writes what <paramref name="write"/> puts into the stream to <paramref name="path"/> atomically.</summary>
    public static void Write(string path, Action<Stream> write)
    {
        var full = Path.GetFullPath(path);
        var dir = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(dir);
        var temporary = Path.Combine(dir, $".{Path.GetFileName(full)}.partial-{Environment.ProcessId}");
        try
        {
            using (var stream = new FileStream(temporary, FileMode.Create, FileAccess.Write, FileShare.None))
            {
                write(stream);
                stream.Flush(true);
            }
            File.Move(temporary, full, true);
        }
        finally
        {
            if (File.Exists(temporary)) File.Delete(temporary);
        }
    }

    /// <summary>Writes UTF-8 text (no byte-order mark) atomically.</summary>
    public static void WriteAllText(string path, string text)
        => Write(path, s => s.Write(new System.Text.UTF8Encoding(false).GetBytes(text)));
}

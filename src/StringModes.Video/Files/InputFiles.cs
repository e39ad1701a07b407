namespace StringModes.Video.Files;

/// <summary>
/// Checks a user-given input file before anything reads it, so that every way of being unusable gets its own
/// one-line message naming the file and the fix. A named pipe or a device is refused without being opened: opening a
/// pipe with no writer would block for ever (they report a length of 0, like an empty file).
/// </summary>
public static class InputFiles
{
    /// <summary>
    /// Throws <see cref="InputFileException"/> unless <paramref name="path"/> is an existing, non-empty regular file
    /// that can be opened for reading. <paramref name="what"/> names it in messages ("a rig file");
    /// <paramref name="emptyFix"/> says what to do about an empty one.
    /// </summary>
    public static void RequireReadable(string path, string what, string emptyFix)
    {
        if (Directory.Exists(path))
            throw new InputFileException($"{path}: is a folder, not {what}; give the path of the file itself");
        if (!File.Exists(path))
            throw new InputFileException($"{path}: no such file; check the path");
        if (new FileInfo(path).Length == 0)
            throw new InputFileException($"{path}: is empty (0 bytes) or not a regular file (a pipe or device); {emptyFix}");
        try
        {
            using (File.OpenRead(path)) { }
        }
        catch (UnauthorizedAccessException)
        {
            throw new InputFileException($"{path}: permission denied; make the file readable (chmod +r) or copy it");
        }
        catch (IOException e)
        {
            throw new InputFileException($"{path}: cannot be read ({e.Message.Split('\n')[0]}); check the file and the disk");
        }
    }

    /// <summary>The whole text of a checked input file (see <see cref="RequireReadable"/>).</summary>
    public static string ReadText(string path, string what, string emptyFix)
    {
        RequireReadable(path, what, emptyFix);
        try
        {
            return File.ReadAllText(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            throw new InputFileException($"{path}: cannot be read ({e.Message.Split('\n')[0]}); check the file and the disk");
        }
    }
}

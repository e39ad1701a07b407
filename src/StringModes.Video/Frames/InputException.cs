namespace StringModes.Video.Frames;

/// <summary>
/// The clip cannot be read: missing, unreadable, corrupt, empty, or an image folder with mixed frame sizes.
/// The message is one line naming the file and the fix; the command line maps it to exit code 3.
/// </summary>
public sealed class InputException : Exception
{
    public InputException(string path, string message)
        : base(message)
    {
        Path = path;
    }

    /// <summary>The file or folder at fault.</summary>
    public string Path { get; }
}

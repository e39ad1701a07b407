namespace StringModes.Video.Files;

/// <summary>An input file (scene, rig, clip) that cannot be used. The message is one line naming the file, the field and the fix.</summary>
public sealed class InputFileException(string message) : Exception(message);

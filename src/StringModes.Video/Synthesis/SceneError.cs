namespace StringModes.Video.Synthesis;

/// <summary>A scene file that cannot be used. The message is one line naming the file, the field and the fix.</summary>
public sealed class SceneException(string message) : Exception(message);

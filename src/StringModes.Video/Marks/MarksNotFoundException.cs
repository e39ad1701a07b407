namespace StringModes.Video.Marks;

/// <summary>
/// Fewer than three moving marks were found, so no mode shape can be fitted. Carries a PNG of what was found
/// (accepted marks green, rejected blobs red, fitted line blue) for the user; the command line maps it to exit code 4.
/// </summary>
public sealed class MarksNotFoundException : Exception
{
    public MarksNotFoundException(string message, int movingFound, byte[] diagnosticPng)
        : base(message)
    {
        MovingFound = movingFound;
        DiagnosticPng = diagnosticPng;
    }

    /// <summary>Number of moving marks found.</summary>
    public int MovingFound { get; }

    /// <summary>PNG-encoded picture of the reference frame with the findings drawn on it.</summary>
    public byte[] DiagnosticPng { get; }
}

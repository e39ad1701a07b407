using StringModes.Video.Synthesis;

namespace StringModes.Video.Marks;

/// <summary>One mark found on the reference frame.</summary>
/// <param name="Position">Centroid in pixels.</param>
/// <param name="ContrastBgr">Mean colour of the mark minus the local background (B, G, R; 8-bit DN).</param>
/// <param name="RadiusPx">Equivalent radius √(area/π).</param>
public sealed record FoundMark(PixelPoint Position, (double B, double G, double R) ContrastBgr, double RadiusPx)
{
    /// <summary>Colour contrast magnitude in DN.</summary>
    public double Contrast => Math.Sqrt(ContrastBgr.B * ContrastBgr.B + ContrastBgr.G * ContrastBgr.G + ContrastBgr.R * ContrastBgr.R);
}

/// <summary>Marks ordered along the string: index 0 and the last are the ends.</summary>
/// <param name="Marks">Ordered marks.</param>
/// <param name="Rejected">Candidates that were not on the string (for the diagnostic image).</param>
/// <param name="ReferenceFrame">Index of the frame they were found on.</param>
public sealed record FoundMarks(IReadOnlyList<FoundMark> Marks, IReadOnlyList<PixelPoint> Rejected, int ReferenceFrame);

/// <summary>Too few marks were found; <see cref="DiagnosticPng"/> shows what was found.</summary>
public sealed class MarksNotFoundException(string message, byte[] diagnosticPng) : Exception(message)
{
    /// <summary>PNG of the reference frame with the candidates drawn on it.</summary>
    public byte[] DiagnosticPng { get; } = diagnosticPng;
}

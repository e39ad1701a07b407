namespace StringModes.Reporting.Data;

/// <summary>What was analysed, for the results file and the report.</summary>
/// <param name="Path">Clip path as given.</param>
/// <param name="Frames">Frames decoded.</param>
/// <param name="CaptureFps">Capture rate used for the time base, frames/s.</param>
/// <param name="DeclaredFps">Frame rate declared by the container, frames/s (NaN for image sequences without one).</param>
/// <param name="DurationS">Duration of the decoded frames in seconds.</param>
/// <param name="WidthPx">Frame width in pixels.</param>
/// <param name="HeightPx">Frame height in pixels.</param>
/// <param name="MarkCount">Marks tracked, ends included.</param>
/// <param name="Settings">Analysis settings as name → text, in a stable order.</param>
public sealed record InputSummary(string Path, int Frames, double CaptureFps, double DeclaredFps, double DurationS, int WidthPx, int HeightPx,
    int MarkCount, IReadOnlyList<KeyValuePair<string, string>> Settings);

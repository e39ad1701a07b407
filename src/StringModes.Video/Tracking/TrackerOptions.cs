namespace StringModes.Video.Tracking;

/// <summary>How marks are followed from frame to frame.</summary>
public sealed record TrackerOptions
{
    /// <summary>Measurement window radius as a multiple of the mark radius (plus 1 px); [1.2, 4]; default 1.8.</summary>
    public double WindowScale { get; init; } = 1.8;

    /// <summary>Width of the window's cosine edge in pixels; [1, 5]; default 2.</summary>
    public double TaperPx { get; init; } = 2;

    /// <summary>Soft threshold on the background-subtracted contrast in robust background standard deviations; [0, 10]; default 3.</summary>
    public double NoiseThresholdSigma { get; init; } = 3;

    /// <summary>
    /// Cap on the string-excluding threshold as a fraction of the mark's own contrast; [0, 0.8]; default 0.5.
    /// 0 lets the string contribute to the centroid.
    /// </summary>
    public double MaxStringFloorFraction { get; init; } = 0.5;

    /// <summary>Quality below which a measurement is dropped and the mark counted lost; [0, 1); default 0.25.</summary>
    public double MinQuality { get; init; } = 0.25;

    /// <summary>
    /// Largest transverse displacement searched when reacquiring a lost mark, pixels; &gt; 0; default null
    /// (0.45 of the smallest spacing between neighbouring marks).
    /// </summary>
    public double? MaxAmplitudePx { get; init; }

    /// <summary>Quality every mark must reach for the analysis window to start; (0, 1]; default 0.6.</summary>
    public double ConfidentQuality { get; init; } = 0.6;

    /// <summary>Consecutive confident frames needed before the analysis window starts; ≥ 1; default 5.</summary>
    public int ConfidentFrames { get; init; } = 5;

    /// <summary>Motion counts as ended when its windowed RMS falls below this multiple of the position noise; &gt; 1; default 4.</summary>
    public double EndNoiseMultiple { get; init; } = 4;
}

namespace StringModes.Video.Marks;

/// <summary>How marks are found on the reference frame.</summary>
public sealed record MarkFinderOptions
{
    /// <summary>Smallest mark diameter in pixels; ≥ 3; default 5. Lines thinner than about 0.8 of this (the string) are removed.</summary>
    public double MinDiameterPx { get; init; } = 5;

    /// <summary>Largest mark diameter in pixels; &gt; <see cref="MinDiameterPx"/>; default 40.</summary>
    public double MaxDiameterPx { get; init; } = 40;

    /// <summary>Detection threshold in robust standard deviations of the background-subtracted image; &gt; 0; default 6.</summary>
    public double ThresholdSigma { get; init; } = 6;

    /// <summary>Smallest contrast to the local background in grey levels (8-bit scale); ≥ 0; default 10.</summary>
    public double MinContrastDn { get; init; } = 10;

    /// <summary>
    /// Largest distance of a mark from the fitted string line, as a fraction of the distance between the outermost
    /// marks; (0, 0.5]; default 0.05. Allows for the string's displacement on the reference frame.
    /// </summary>
    public double LineToleranceFraction { get; init; } = 0.05;

    /// <summary>Smallest fill of a blob's bounding box (a disc fills π/4 ≈ 0.785); (0, 1]; default 0.45.</summary>
    public double MinFill { get; init; } = 0.45;
}

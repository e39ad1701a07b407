using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.StringModel;

/// <summary>Inputs and options of <see cref="StringEstimator"/>.</summary>
public sealed record StringModelOptions
{
    /// <summary>Vibrating length L in metres with its standard uncertainty; &gt; 0; null when unknown (no wave speed or tension then).</summary>
    public Measured? LengthM { get; init; }

    /// <summary>How the linear density is known; null when unknown (no tension or bending stiffness then).</summary>
    public LinearDensityInput? LinearDensity { get; init; }

    /// <summary>Coverage factor k of the f2/f1 = 2 check; &gt; 0; default 2.</summary>
    public double HarmonicCheckCoverageFactor { get; init; } = 2;
}

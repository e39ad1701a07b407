namespace StringModes.Analysis.Fitting;

/// <summary>Options of <see cref="ModeFitter"/>.</summary>
public sealed record ModeFitOptions
{
    /// <summary>Iteration limit of the Levenberg–Marquardt minimiser; ≥ 10; default 200.</summary>
    public int MaximumIterations { get; init; } = 200;

    /// <summary>
    /// Peak-to-median power of the mode's spectrum below which no vibration is reported; &gt; 1; default 50
    /// (17 dB). For white noise the largest of a few thousand zero-padded Hann bins is typically 10–15 times the median.
    /// </summary>
    public double DetectionThreshold { get; init; } = 50;

    /// <summary>Fewest periods of a mode in the analysis window for a fit; &gt; 0; default 3. Below 1.5 periods the mode is not fitted.</summary>
    public double MinimumPeriods { get; init; } = 3;

    /// <summary>
    /// Use the residuals' local noise level in a band of 13 Fourier bins around the mode frequency instead of their
    /// mean level when the two differ significantly (errors correlated in time; see the fitter's docs); default true.
    /// </summary>
    public bool CorrectForColouredResiduals { get; init; } = true;

    /// <summary>
    /// Coverage factor of the consistency checks (split-window decay and frequency, cross-check agreement): a
    /// difference larger than this many combined standard uncertainties is reported; &gt; 0; default 3 (a false alarm
    /// rate of about 0.3 % per check for Gaussian errors).
    /// </summary>
    public double ConsistencyCoverageFactor { get; init; } = 3;

    /// <summary>
    /// Look for the key frames of a compressed video in the fit residuals (one frame in every G with markedly smaller
    /// error) and, when found, fit the modes on the key frames alone; default true. See the fitter's docs.
    /// </summary>
    public bool DetectKeyFrames { get; init; } = true;

    /// <summary>Fewest key frames in the window for fitting on them alone; ≥ 10; default 40.</summary>
    public int MinimumKeyFrames { get; init; } = 40;

    /// <summary>Run the split-window decay and frequency-drift checks; default true.</summary>
    public bool CheckDecayShape { get; init; } = true;

    /// <summary>
    /// Add to each mode's u(f) and u(σ) the coherent tracking error at its own frequency that the other modal
    /// coordinates show (harmonics of a stronger mode's motion, which a weak mode's fit absorbs unseen); default true.
    /// </summary>
    public bool IncludeCoherentError { get; init; } = true;

    /// <summary>Run the independent matrix-pencil cross-check; default true.</summary>
    public bool CrossCheck { get; init; } = true;

    /// <summary>Parametric bootstrap draws used to estimate the matrix-pencil estimates' uncertainty; ≥ 4; default 16.</summary>
    public int CrossCheckBootstrapDraws { get; init; } = 16;

    /// <summary>Seed of the bootstrap's pseudo-random generator; default 1.</summary>
    public int Seed { get; init; } = 1;
}

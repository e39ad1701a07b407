namespace StringModes.Analysis.Fitting;

/// <summary>Outcome of fitting one mode. Values of a <see cref="ModeFit"/> are meaningful only for <see cref="Converged"/> and <see cref="IterationLimit"/>.</summary>
public enum FitStatus
{
    /// <summary>The nonlinear least-squares fit converged and its covariance is well defined.</summary>
    Converged,
    /// <summary>The iteration limit was reached; values are the last iterate and may be less accurate than stated.</summary>
    IterationLimit,
    /// <summary>The fit's normal matrix was singular or the minimiser met invalid values; no uncertainties can be given.</summary>
    Singular,
    /// <summary>No spectral peak rose clearly above the noise floor: no vibration was detected in this mode.</summary>
    NoSignal,
    /// <summary>The analysis window holds too few periods (or samples) of this mode to estimate frequency and decay.</summary>
    TooShort,
}

namespace StringModes.Analysis.Modal;

/// <summary>Options of <see cref="ModalProjector"/>.</summary>
public sealed record ModalProjectionOptions
{
    /// <summary>
    /// Number of modes to project on. 0 (default) chooses the largest M ≤ number of marks whose design matrix has a
    /// condition number below <see cref="ConditionLimit"/>; a positive value is an upper limit that is lowered
    /// (with a warning) if it exceeds the number of marks or the conditioning allows less.
    /// </summary>
    public int MaxModes { get; init; }

    /// <summary>
    /// Largest accepted 2-norm condition number of the weighted design matrix; &gt; 1; default 30.
    /// Noise in the mark positions is amplified by up to this factor in the modal amplitudes, so 30 keeps that
    /// amplification modest while still allowing a missing mark or uneven spacing.
    /// </summary>
    public double ConditionLimit { get; init; } = 30;

    /// <summary>
    /// Fraction of the total modal energy (Σ a² over valid frames) in the highest projected mode above which an
    /// aliasing warning is given; in (0, 1); default 0.01. A plucked string's energy falls like n⁻⁴, so a
    /// top mode holding over 1 % suggests that unresolved higher modes fold into the projected ones.
    /// </summary>
    public double AliasingEnergyFraction { get; init; } = 0.01;
}

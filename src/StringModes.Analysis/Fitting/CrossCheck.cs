using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Fitting;

/// <summary>
/// An independent estimate of one mode's frequency and decay rate by the multi-channel matrix pencil, and its
/// agreement with the nonlinear fit. Differences are in units of the combined standard uncertainty
/// √(u_fit² + u_pencil²); since both estimates see the same noise this overstates the spread of their difference,
/// so the check is conservative (it rarely flags agreement as disagreement). The pencil uses every frame, so it is
/// compared with the fit to every frame, also where the reported values come from the key frames of a compressed
/// video alone. Its bootstrap adds white noise; its spread is scaled by the fit's local noise level at the mode
/// frequency, on which both estimators' variances depend.
/// </summary>
/// <param name="N">Mode number.</param>
/// <param name="FrequencyHz">Matrix-pencil frequency with a parametric-bootstrap standard uncertainty.</param>
/// <param name="DecayRatePerS">Matrix-pencil decay rate with a parametric-bootstrap standard uncertainty.</param>
/// <param name="FrequencyDifference">|f_fit − f_pencil| / combined u.</param>
/// <param name="DecayRateDifference">|σ_fit − σ_pencil| / combined u.</param>
/// <param name="Agrees">Both differences are within the coverage factor of the options.</param>
public sealed record CrossCheck(int N, Measured FrequencyHz, Measured DecayRatePerS, double FrequencyDifference, double DecayRateDifference, bool Agrees);

/// <summary>All fitted modes of one analysis, the cross-checks and the warnings.</summary>
/// <param name="Modes">One fit per mode of the modal coordinates, in mode order.</param>
/// <param name="CrossChecks">Matrix-pencil cross-checks of the usable modes (empty if the check could not run).</param>
/// <param name="Warnings">Plain-language warnings, including every mode's own warnings prefixed by its number.</param>
public sealed record ModeFitResult(IReadOnlyList<ModeFit> Modes, IReadOnlyList<CrossCheck> CrossChecks, IReadOnlyList<string> Warnings);

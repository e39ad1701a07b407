using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.StringModel;

/// <summary>
/// String properties inferred from the mode frequencies. Quantities that need the length or the linear density are
/// null when that input was missing or invalid (see <see cref="Warnings"/>).
/// </summary>
/// <param name="ModesUsed">Mode numbers whose frequencies entered the estimate.</param>
/// <param name="FundamentalHz">Ideal-string fundamental f0 (intercept of the inharmonicity regression, or f1 when B is assumed 0).</param>
/// <param name="Inharmonicity">B in f_n = n·f0·√(1 + B·n²); exactly 0 with u = 0 when assumed.</param>
/// <param name="InharmonicityAssumed">True when fewer than three modes were available and B = 0 was assumed.</param>
/// <param name="RegressionReducedChiSquare">χ²/ν of the weighted regression (≈ 1 when the stiff-string law fits within the frequency uncertainties; 0 when not computed). Values above 1 widen u(f0) and u(B) by √(χ²/ν).</param>
/// <param name="HarmonicRatios">f_n/(n·f1) for every mode used.</param>
/// <param name="SecondHarmonic">The f2/f1 = 2 check; null without usable modes 1 and 2.</param>
/// <param name="LengthM">Vibrating length as given.</param>
/// <param name="LinearDensityKgPerM">Linear density as mounted (after the elastic correction, when asked for).</param>
/// <param name="WaveSpeedMPerS">c = 2·L·f0.</param>
/// <param name="TensionN">T = μ·c² = 4·μ·L²·f0².</param>
/// <param name="TensionBudget">Share of each input in u(T), largest first (JCGM 100 §5.1.3).</param>
/// <param name="BendingStiffnessNM2">E·I = B·T·L²/π² = 4·μ·L⁴·f0²·B/π², N·m²; null when B was assumed.</param>
/// <param name="Warnings">Plain-language notes and warnings.</param>
public sealed record StringEstimate(
    IReadOnlyList<int> ModesUsed,
    Measured FundamentalHz,
    Measured Inharmonicity,
    bool InharmonicityAssumed,
    double RegressionReducedChiSquare,
    IReadOnlyList<HarmonicRatio> HarmonicRatios,
    SecondHarmonicCheck? SecondHarmonic,
    Measured? LengthM,
    Measured? LinearDensityKgPerM,
    Measured? WaveSpeedMPerS,
    Measured? TensionN,
    IReadOnlyList<BudgetEntry> TensionBudget,
    Measured? BendingStiffnessNM2,
    IReadOnlyList<string> Warnings);

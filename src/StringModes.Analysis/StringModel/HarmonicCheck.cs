using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.StringModel;

/// <summary>Harmonic ratio f_n/(n·f_1) of one mode.</summary>
/// <param name="N">Mode number.</param>
/// <param name="Ratio">f_n/(n·f_1) with its standard uncertainty (the mode fits are independent).</param>
public sealed record HarmonicRatio(int N, Measured Ratio);

/// <summary>Test of f2/f1 = 2, the signature of an ideal flexible string.</summary>
/// <param name="Ratio">f2/f1 with its standard uncertainty.</param>
/// <param name="DeviationInUncertainties">(f2/f1 − 2)/u(f2/f1): positive for a stiff string (f2 &gt; 2f1).</param>
/// <param name="CoverageFactor">k used for the test.</param>
/// <param name="Passes">|f2/f1 − 2| ≤ k·u(f2/f1).</param>
public sealed record SecondHarmonicCheck(Measured Ratio, double DeviationInUncertainties, double CoverageFactor, bool Passes);

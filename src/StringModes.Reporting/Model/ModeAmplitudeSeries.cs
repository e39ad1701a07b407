namespace StringModes.Reporting.Model;

/// <summary>
/// Envelope amplitude of each modal coordinate over time: <c>AmplitudeM[modeIndex][timeIndex]</c> (≥ 0, metres).
/// </summary>
/// <param name="ModeNumbers">Mode number n of each row.</param>
/// <param name="TimesS">Sample times, seconds, ascending.</param>
/// <param name="AmplitudeM">Envelope amplitude in metres, one row per mode.</param>
public sealed record ModeAmplitudeSeries(int[] ModeNumbers, double[] TimesS, double[][] AmplitudeM)
{
    /// <summary>
    /// Envelopes from raw modal coordinates a_n(t): √2 × the RMS over a centred window of
    /// <paramref name="windowS"/> seconds (for a steady sinusoid this is its amplitude). The window should span
    /// at least one period of the lowest mode shown. Display smoothing only, not an estimator.
    /// </summary>
    public static ModeAmplitudeSeries FromModalCoordinates(int[] modeNumbers, double[] timesS, double[][] coordinatesM, double windowS)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(windowS);
        if (coordinatesM.Length != modeNumbers.Length || coordinatesM.Any(row => row.Length != timesS.Length))
        {
            throw new ArgumentException("Modal coordinates must have one row per mode and one column per time.", nameof(coordinatesM));
        }

        var half = windowS / 2;
        var envelopes = new double[modeNumbers.Length][];
        for (var m = 0; m < modeNumbers.Length; m++)
        {
            var a = coordinatesM[m];
            var prefix = new double[a.Length + 1];
            for (var i = 0; i < a.Length; i++)
            {
                var v = double.IsFinite(a[i]) ? a[i] : 0;
                prefix[i + 1] = prefix[i] + v * v;
            }

            var env = new double[a.Length];
            int lo = 0, hi = 0;
            for (var i = 0; i < a.Length; i++)
            {
                while (lo < i && timesS[lo] < timesS[i] - half)
                {
                    lo++;
                }

                while (hi < a.Length - 1 && timesS[hi + 1] <= timesS[i] + half)
                {
                    hi++;
                }

                hi = Math.Max(hi, i);
                var count = hi - lo + 1;
                env[i] = Math.Sqrt(2 * Math.Max(0, prefix[hi + 1] - prefix[lo]) / count);
            }

            envelopes[m] = env;
        }

        return new ModeAmplitudeSeries(modeNumbers, timesS, envelopes);
    }
}

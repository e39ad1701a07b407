using StringModes.Reporting.Model;

namespace StringModes.Reporting.Tests.Support;

/// <summary>
/// Invented demonstration scenario (not a measurement): a 0.65 m nylon string, f1 = 110 Hz, plucked so that
/// mode 2 carries the largest amplitude; ideal-string modes n·f1 decaying exponentially.
/// </summary>
internal static class DemoScenario
{
    public const double LengthM = 0.65;
    public const double FundamentalHz = 110;
    public static readonly int[] Modes = [1, 2, 3, 4, 5, 6];
    public static readonly double[] AmplitudesM = [0.6e-3, 1.2e-3, 0.35e-3, 0.2e-3, 0.08e-3, 0.03e-3];
    public static readonly double[] DecayRatesPerS = [0.8, 1.1, 1.6, 2.2, 3.0, 4.0];

    public static double[] Times(int count, double rateHz) => Enumerable.Range(0, count).Select(i => i / rateHz).ToArray();

    public static ModeAmplitudeSeries Envelopes(double durationS = 3, int count = 600)
    {
        var t = Times(count, count / durationS);
        var rows = Modes.Select((_, m) => t.Select(x => AmplitudesM[m] * Math.Exp(-DecayRatesPerS[m] * x)).ToArray()).ToArray();
        return new ModeAmplitudeSeries(Modes, t, rows);
    }

    /// <summary>u(s, t) = Σ a_n e^(−σ_n t) sin(nπs/L) cos(2π n f1 t) at 9 evenly spaced marks.</summary>
    public static DisplacementField Field(double rateHz = 4000, int count = 400)
    {
        var positions = Enumerable.Range(1, 9).Select(i => i * LengthM / 10).ToArray();
        var t = Times(count, rateHz);
        var u = t.Select(time => positions.Select(s => Displacement(s, time)).ToArray()).ToArray();
        return new DisplacementField(positions, t, u, LengthM);
    }

    public static double Displacement(double s, double t)
    {
        var sum = 0.0;
        for (var m = 0; m < Modes.Length; m++)
        {
            var n = Modes[m];
            sum += AmplitudesM[m] * Math.Exp(-DecayRatesPerS[m] * t) * Math.Sin(n * Math.PI * s / LengthM) * Math.Cos(2 * Math.PI * n * FundamentalHz * t);
        }

        return sum;
    }
}

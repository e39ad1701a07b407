using StringModes.Analysis.Geometry;
using StringModes.Analysis.Physics;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.Tests.TestData;

/// <summary>String coordinates sampled from a known <see cref="StringMotion"/> (the synthesiser's ground truth) plus seeded Gaussian noise.</summary>
internal static class SyntheticStrings
{
    /// <summary>Marks at s_i = iL/(N+1), frames at t_k = startS + k/fps, every sample weight 1.</summary>
    public static StringCoordinates Sample(StringMotion motion, int marks, double fps, double durationS, double noiseM, int seed, double startS = 0)
    {
        var frames = (int)Math.Round(durationS * fps);
        var positions = Enumerable.Range(1, marks).Select(i => i * motion.LengthM / (marks + 1)).ToArray();
        var times = Enumerable.Range(0, frames).Select(k => startS + k / fps).ToArray();
        var u = new double[frames, marks];
        var w = new double[frames, marks];
        var random = new Random(seed);
        for (var f = 0; f < frames; f++)
            for (var i = 0; i < marks; i++)
            {
                u[f, i] = motion.Displacement(positions[i], times[f]) + noiseM * MonteCarloPropagation.StandardNormal(random);
                w[f, i] = 1;
            }
        return new StringCoordinates(motion.LengthM, positions, times, u, w);
    }

    /// <summary>A plucked ideal-or-stiff string: modes 1..count with triangular-pluck amplitudes and a decay rate growing with n.</summary>
    public static StringMotion Plucked(double lengthM, double f0Hz, double inharmonicity, int count, double peakM, double pluckFraction,
        double decayRate1PerS, double decayGrowthPerMode = 0.3)
        => new(lengthM, Enumerable.Range(1, count).Select(n => new ModeComponent(n, StringLaw.ModeFrequency(n, f0Hz, inharmonicity),
            decayRate1PerS * (1 + decayGrowthPerMode * (n - 1)), Pluck.TriangularAmplitude(n, pluckFraction, peakM), 0.3 * n)));
}

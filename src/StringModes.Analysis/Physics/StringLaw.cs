namespace StringModes.Analysis.Physics;

/// <summary>
/// The vibrating-string law (Mersenne–Taylor) and its stiff-string extension (Fletcher 1964, JASA 36:203).
/// f_n = n·f0·√(1 + B·n²), f0 = (1/2L)·√(T/μ), c = √(T/μ) = 2·L·f0.
/// Valid for small amplitude, rigid (pinned) ends and uniform linear density.
/// </summary>
public static class StringLaw
{
    /// <summary>Ideal-string fundamental in Hz from tension (N), linear density (kg/m) and vibrating length (m).</summary>
    public static double Fundamental(double tensionN, double linearDensityKgPerM, double lengthM)
        => Math.Sqrt(tensionN / linearDensityKgPerM) / (2.0 * lengthM);

    /// <summary>Transverse wave speed in m/s, c = 2·L·f0.</summary>
    public static double WaveSpeed(double lengthM, double fundamentalHz) => 2.0 * lengthM * fundamentalHz;

    /// <summary>Tension in N, T = μ·c² = 4·μ·L²·f0².</summary>
    public static double Tension(double linearDensityKgPerM, double lengthM, double fundamentalHz)
    {
        var c = WaveSpeed(lengthM, fundamentalHz);
        return linearDensityKgPerM * c * c;
    }

    /// <summary>Frequency of mode n of a pinned stiff string: n·f0·√(1 + B·n²).</summary>
    public static double ModeFrequency(int n, double fundamentalHz, double inharmonicity)
        => n * fundamentalHz * Math.Sqrt(1.0 + inharmonicity * n * n);

    /// <summary>Inharmonicity of a solid round wire, B = π³·E·d⁴/(64·T·L²) (Fletcher 1964).</summary>
    public static double InharmonicityOfRoundWire(double youngsModulusPa, double diameterM, double tensionN, double lengthM)
        => Math.Pow(Math.PI, 3) * youngsModulusPa * Math.Pow(diameterM, 4) / (64.0 * tensionN * lengthM * lengthM);

    /// <summary>Bending stiffness E·I in N·m² from B: EI = B·T·L²/π².</summary>
    public static double BendingStiffness(double inharmonicity, double tensionN, double lengthM)
        => inharmonicity * tensionN * lengthM * lengthM / (Math.PI * Math.PI);

    /// <summary>Linear density of a solid round cord in kg/m, μ = ρ·π·d²/4.</summary>
    public static double LinearDensityOfRoundCord(double densityKgPerM3, double diameterM)
        => densityKgPerM3 * Math.PI * diameterM * diameterM / 4.0;
}

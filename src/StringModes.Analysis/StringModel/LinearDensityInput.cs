using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis.StringModel;

/// <summary>How the string's linear density μ is known. Create with one of the factory methods.</summary>
public sealed record LinearDensityInput
{
    internal enum Source { Direct, Sample, DensityAndDiameter }

    private LinearDensityInput(Source kind, Measured first, Measured second) { Kind = kind; First = first; Second = second; }

    internal Source Kind { get; }
    internal Measured First { get; }
    internal Measured Second { get; }

    /// <summary>
    /// Unstretched length L0 in metres of the vibrating segment, when the density given is that of the unstretched cord
    /// (μ0): then μ = μ0·L0/L with L the vibrating (stretched) length, mass being conserved. Null (default) when the
    /// density given is already that of the string as mounted.
    /// </summary>
    public Measured? UnstretchedLengthM { get; init; }

    /// <summary>μ given directly, kg/m.</summary>
    public static LinearDensityInput Direct(Measured linearDensityKgPerM) => new(Source.Direct, linearDensityKgPerM, default);

    /// <summary>μ = m/ℓ from a weighed sample: mass in kg, sample length in m.</summary>
    public static LinearDensityInput FromSample(Measured massKg, Measured sampleLengthM) => new(Source.Sample, massKg, sampleLengthM);

    /// <summary>μ = ρ·π·d²/4 for a solid round cord: density in kg/m³, diameter in m.</summary>
    public static LinearDensityInput FromDensityAndDiameter(Measured densityKgPerM3, Measured diameterM) => new(Source.DensityAndDiameter, densityKgPerM3, diameterM);

    /// <summary>Base inputs (name, value) with their uncertainties, in the order <see cref="Evaluate"/> consumes them.</summary>
    internal IReadOnlyList<(string Name, Measured Value)> Inputs()
    {
        var list = Kind switch
        {
            Source.Direct => new List<(string, Measured)> { ("linear density", First) },
            Source.Sample => [("sample mass", First), ("sample length", Second)],
            _ => [("material density", First), ("diameter", Second)],
        };
        if (UnstretchedLengthM is { } l0) list.Add(("unstretched length", l0));
        return list;
    }

    /// <summary>μ in kg/m from base input values (same order as <see cref="Inputs"/>) and the vibrating length.</summary>
    internal double Evaluate(ReadOnlySpan<double> x, double lengthM)
    {
        var mu = Kind switch
        {
            Source.Direct => x[0],
            Source.Sample => x[0] / x[1],
            _ => x[0] * Math.PI * x[1] * x[1] / 4.0,
        };
        return UnstretchedLengthM is null ? mu : mu * x[Kind == Source.Direct ? 1 : 2] / lengthM;
    }
}

namespace StringModes.Analysis.Units;

/// <summary>Physical dimension a user-entered quantity is expected to have; decides which units are accepted.</summary>
public enum Dimension
{
    /// <summary>Length, SI unit m.</summary>
    Length,
    /// <summary>Linear density (mass per length), SI unit kg/m.</summary>
    LinearDensity,
    /// <summary>Mass, SI unit kg.</summary>
    Mass,
    /// <summary>Volumetric density, SI unit kg/m³.</summary>
    Density,
    /// <summary>Frequency or frame rate, SI unit Hz.</summary>
    Frequency,
    /// <summary>Time, SI unit s.</summary>
    Time,
    /// <summary>Force, SI unit N.</summary>
    Force,
    /// <summary>Elastic modulus or pressure, SI unit Pa.</summary>
    Modulus,
}

using System.Globalization;

namespace StringModes.Analysis.Uncertainty;

/// <summary>
/// A measured value with its standard uncertainty (coverage factor k = 1, JCGM 100:2008 §2.3.1).
/// Both parts are finite and the uncertainty is ≥ 0 in every value this library returns.
/// </summary>
/// <param name="Value">Best estimate, in the unit stated by the owner's member name.</param>
/// <param name="StandardUncertainty">Standard uncertainty u, same unit, ≥ 0.</param>
public readonly record struct Measured(double Value, double StandardUncertainty)
{
    /// <summary>A value known exactly (u = 0).</summary>
    public static Measured Exact(double value) => new(value, 0);

    /// <summary>A value with a relative standard uncertainty u/|x|.</summary>
    public static Measured WithRelativeUncertainty(double value, double relative) => new(value, Math.Abs(value * relative));

    /// <summary>Relative standard uncertainty u/|x|; 0 when the value is 0 and u is 0, +∞ when only the value is 0.</summary>
    public double RelativeUncertainty => Value == 0 ? (StandardUncertainty == 0 ? 0 : double.PositiveInfinity) : StandardUncertainty / Math.Abs(Value);

    /// <summary>True when value and uncertainty are finite and the uncertainty is non-negative.</summary>
    public bool IsFinite => double.IsFinite(Value) && double.IsFinite(StandardUncertainty) && StandardUncertainty >= 0;

    /// <summary>"value ± u" with round-trip precision, culture invariant.</summary>
    public override string ToString()
        => string.Create(CultureInfo.InvariantCulture, $"{Value:G17} ± {StandardUncertainty:G17}");
}

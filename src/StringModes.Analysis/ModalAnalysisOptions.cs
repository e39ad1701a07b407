using StringModes.Analysis.Fitting;
using StringModes.Analysis.Modal;
using StringModes.Analysis.StringModel;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Analysis;

/// <summary>Options of <see cref="ModalAnalysis.Run"/>. Every member has a usable default except the rig values.</summary>
public sealed record ModalAnalysisOptions
{
    /// <summary>Upper limit on the number of modes; 0 (default) = as many as the marks resolve well (see <see cref="ModalProjectionOptions.MaxModes"/>).</summary>
    public int MaxModes { get; init; }

    /// <summary>
    /// Vibrating length L in metres with its standard uncertainty; &gt; 0. Null (default): the length of the string
    /// coordinates is used as exact, with a note that u(L) = 0 was assumed.
    /// </summary>
    public Measured? LengthM { get; init; }

    /// <summary>Linear density μ in kg/m with its standard uncertainty; &gt; 0; null when unknown. Ignored when <see cref="LinearDensity"/> is set.</summary>
    public Measured? LinearDensityKgPerM { get; init; }

    /// <summary>Linear density from a weighed sample or from material density and diameter, optionally with the elastic correction; overrides <see cref="LinearDensityKgPerM"/>.</summary>
    public LinearDensityInput? LinearDensity { get; init; }

    /// <summary>Coverage factor k of the f2/f1 = 2 check; &gt; 0; default 2.</summary>
    public double HarmonicCheckCoverageFactor { get; init; } = 2;

    /// <summary>Full control of the modal projection; <see cref="MaxModes"/> overrides its MaxModes when non-zero.</summary>
    public ModalProjectionOptions Projection { get; init; } = new();

    /// <summary>Full control of the mode fits.</summary>
    public ModeFitOptions Fitting { get; init; } = new();
}

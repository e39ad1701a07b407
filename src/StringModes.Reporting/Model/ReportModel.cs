namespace StringModes.Reporting.Model;

/// <summary>
/// Everything the HTML report shows, as plain values: the CLI maps analysis results onto it. Units are in
/// property names; every measured quantity carries its standard uncertainty (k = 1).
/// </summary>
public sealed record ReportModel
{
    /// <summary>Report heading; default "String modal analysis".</summary>
    public string Title { get; init; } = "String modal analysis";

    /// <summary>What was measured: clip, frames, rates, window.</summary>
    public required MeasurementSummary Measurement { get; init; }

    /// <summary>One row per fitted mode, ascending mode number.</summary>
    public IReadOnlyList<ModeRow> Modes { get; init; } = [];

    /// <summary>String properties derived from the modes; null when they could not be estimated.</summary>
    public StringProperties? StringProperties { get; init; }

    /// <summary>Uncertainty budget of the tension (or another headline quantity); null when not available.</summary>
    public UncertaintyBudget? Budget { get; init; }

    /// <summary>Plausibility checks, e.g. "2nd harmonic at 2× fundamental".</summary>
    public IReadOnlyList<CheckRow> Checks { get; init; } = [];

    /// <summary>Warnings in plain words, each with what to do about it.</summary>
    public IReadOnlyList<ReportWarning> Warnings { get; init; } = [];

    /// <summary>Analysis settings as name/value text pairs, in display order.</summary>
    public IReadOnlyList<SettingRow> Settings { get; init; } = [];

    /// <summary>Data for the figures; each figure is drawn only when its data are present.</summary>
    public ReportFigureData Figures { get; init; } = new();

    /// <summary>Program name and version for the footer, e.g. "stringmodes 0.1.0"; optional.</summary>
    public string? Generator { get; init; }

    /// <summary>Generation time shown in the footer; optional so that reports can be reproduced byte for byte.</summary>
    public DateTimeOffset? GeneratedAt { get; init; }
}

/// <summary>What was measured.</summary>
public sealed record MeasurementSummary
{
    /// <summary>Clip file or folder name as the user gave it.</summary>
    public required string ClipName { get; init; }

    /// <summary>Free-text description of the specimen, e.g. "nylon monofilament, 0.7 mm"; optional.</summary>
    public string? SpecimenDescription { get; init; }

    /// <summary>Frames decoded.</summary>
    public int Frames { get; init; }

    /// <summary>Capture frame rate, frames per second.</summary>
    public double CaptureFps { get; init; }

    /// <summary>Clip duration, seconds.</summary>
    public double DurationS { get; init; }

    /// <summary>Start of the analysis window, seconds from the clip start.</summary>
    public double AnalysisWindowStartS { get; init; }

    /// <summary>End of the analysis window, seconds from the clip start.</summary>
    public double AnalysisWindowEndS { get; init; }

    /// <summary>Number of tracked marks (ends excluded).</summary>
    public int MarkCount { get; init; }
}

/// <summary>One fitted mode. Use NaN with zero uncertainty for a quantity that is not available.</summary>
public sealed record ModeRow(
    int ModeNumber,
    MeasuredValue FrequencyHz,
    MeasuredValue DecayRatePerS,
    MeasuredValue DampingRatio,
    MeasuredValue QFactor,
    MeasuredValue AmplitudeM,
    MeasuredValue HarmonicRatio);

/// <summary>String properties derived from the mode frequencies and the rig values.</summary>
public sealed record StringProperties
{
    /// <summary>Vibrating length, metres.</summary>
    public required MeasuredValue LengthM { get; init; }

    /// <summary>Linear density, kg/m.</summary>
    public required MeasuredValue LinearDensityKgPerM { get; init; }

    /// <summary>Ideal-string fundamental f0 from the stiff-string regression, hertz.</summary>
    public required MeasuredValue FundamentalHz { get; init; }

    /// <summary>Inharmonicity coefficient B (dimensionless).</summary>
    public required MeasuredValue Inharmonicity { get; init; }

    /// <summary>Transverse wave speed, m/s.</summary>
    public required MeasuredValue WaveSpeedMPerS { get; init; }

    /// <summary>Tension, newtons.</summary>
    public required MeasuredValue TensionN { get; init; }

    /// <summary>Bending stiffness EI, N·m²; optional.</summary>
    public MeasuredValue? BendingStiffnessNM2 { get; init; }
}

/// <summary>
/// Uncertainty budget of one result: each input's estimate, standard uncertainty and sensitivity coefficient
/// (GUM, JCGM 100:2008 §5.1.3). Inputs are taken as uncorrelated, so the shares of u²(result) add to 100 %.
/// </summary>
/// <param name="Quantity">Name of the result, e.g. "Tension T".</param>
/// <param name="Unit">Unit of the result, e.g. "N".</param>
/// <param name="Result">Result and its combined standard uncertainty.</param>
/// <param name="Rows">The inputs.</param>
public sealed record UncertaintyBudget(string Quantity, string Unit, MeasuredValue Result, IReadOnlyList<BudgetRow> Rows);

/// <summary>One input of an uncertainty budget.</summary>
/// <param name="Input">Name, e.g. "Length L".</param>
/// <param name="Unit">Unit of the input, e.g. "m".</param>
/// <param name="Estimate">Input estimate and its standard uncertainty.</param>
/// <param name="SensitivityCoefficient">∂result/∂input, in result unit per input unit.</param>
public sealed record BudgetRow(string Input, string Unit, MeasuredValue Estimate, double SensitivityCoefficient)
{
    /// <summary>Contribution |c|·u(x) to the result's standard uncertainty, in the result's unit.</summary>
    public double Contribution => Math.Abs(SensitivityCoefficient * Estimate.StandardUncertainty);
}

/// <summary>A plausibility check and its outcome.</summary>
/// <param name="Name">What was checked, e.g. "2nd harmonic at 2× fundamental".</param>
/// <param name="Passed">True when the check passed; false flags it.</param>
/// <param name="Detail">The numbers behind the outcome, e.g. "f2/(2·f1) = 1.0004 ± 0.0002, limit ±0.5 %".</param>
public sealed record CheckRow(string Name, bool Passed, string Detail);

/// <summary>A warning in plain words with what the user can do about it.</summary>
public sealed record ReportWarning(string Message, string Action);

/// <summary>One analysis setting as shown to the user.</summary>
public sealed record SettingRow(string Name, string Value);

/// <summary>Data for the report's figures; a null member leaves that figure out.</summary>
public sealed record ReportFigureData
{
    /// <summary>Mode-amplitude heatmap data.</summary>
    public ModeAmplitudeSeries? ModeAmplitudes { get; init; }

    /// <summary>Space–time heatmap data.</summary>
    public DisplacementField? Displacement { get; init; }

    /// <summary>Time span of the space–time heatmap, seconds; null shows all samples.</summary>
    public (double StartS, double EndS)? DisplacementTimeRangeS { get; init; }

    /// <summary>Spectra of the modal coordinates.</summary>
    public IReadOnlyList<ModeSpectrum>? Spectra { get; init; }

    /// <summary>Decay envelopes and fits.</summary>
    public IReadOnlyList<ModeDecay>? Decays { get; init; }

    /// <summary>Harmonic ratios.</summary>
    public IReadOnlyList<HarmonicRatioPoint>? HarmonicRatios { get; init; }

    /// <summary>Inharmonicity B for the stiff-string curve on the harmonic-ratio chart; optional.</summary>
    public double? Inharmonicity { get; init; }

    /// <summary>Reference frame with marks.</summary>
    public ReferenceFrame? ReferenceFrame { get; init; }
}

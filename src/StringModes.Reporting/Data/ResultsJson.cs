using System.Text.Json;
using StringModes.Analysis;
using StringModes.Analysis.Uncertainty;

namespace StringModes.Reporting.Data;

/// <summary>
/// Writes results.json (contract in docs/output-files.md): snake_case keys with unit suffixes; a measured quantity is
/// {"value": x, "uncertainty": u} with the standard uncertainty (k = 1). Non-finite numbers are written as null, so
/// the file never holds NaN or Infinity.
/// </summary>
public static class ResultsJson
{
    /// <summary>Schema version of results.json; bumped when a key changes meaning.</summary>
    public const int SchemaVersion = 1;

    /// <summary>Writes the results of one analysis run.</summary>
    public static void Write(Stream stream, string toolVersion, InputSummary input, ModalAnalysisResult result, IReadOnlyList<string> warnings)
    {
        using var w = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true });
        w.WriteStartObject();
        w.WriteNumber("schema_version", SchemaVersion);
        w.WriteString("tool", "stringmodes " + toolVersion);

        w.WriteStartObject("input");
        w.WriteString("path", input.Path);
        w.WriteNumber("frames", input.Frames);
        Number(w, "capture_fps", input.CaptureFps);
        Number(w, "declared_fps", input.DeclaredFps);
        Number(w, "duration_s", input.DurationS);
        w.WriteNumber("width_px", input.WidthPx);
        w.WriteNumber("height_px", input.HeightPx);
        w.WriteNumber("marks", input.MarkCount);
        w.WriteEndObject();

        w.WriteStartObject("analysis_window_s");
        Number(w, "start", result.AnalysisWindowStartS);
        Number(w, "end", result.AnalysisWindowEndS);
        w.WriteEndObject();

        w.WriteStartObject("settings");
        foreach (var (key, value) in input.Settings) w.WriteString(key, value);
        w.WriteEndObject();

        w.WriteStartObject("projection");
        w.WriteStartArray("modes");
        foreach (var n in result.Modal.ModeNumbers) w.WriteNumberValue(n);
        w.WriteEndArray();
        Number(w, "condition_number", result.Modal.ConditionNumber);
        Number(w, "spatial_residual_rms_m", result.Modal.ResidualRmsM);
        w.WriteNumber("valid_frames", result.Modal.ValidFrameCount);
        w.WriteEndObject();

        var ratios = result.String?.HarmonicRatios.ToDictionary(r => r.N, r => r.Ratio) ?? [];
        w.WriteStartArray("modes");
        foreach (var m in result.Fits.Modes.OrderBy(m => m.N))
        {
            w.WriteStartObject();
            w.WriteNumber("n", m.N);
            w.WriteString("fit_status", Snake(m.Status.ToString()));
            if (m.IsUsable)
            {
                MeasuredValue(w, "frequency_hz", m.FrequencyHz);
                MeasuredValue(w, "decay_rate_per_s", m.DecayRatePerS);
                MeasuredValue(w, "damping_ratio", m.DampingRatio);
                MeasuredValue(w, "q_factor", m.QualityFactor);
                MeasuredValue(w, "t60_s", m.T60S);
                MeasuredValue(w, "logarithmic_decrement", m.LogarithmicDecrement);
                MeasuredValue(w, "amplitude_m", m.AmplitudeM);
                MeasuredValue(w, "phase_rad", m.PhaseRad);
                MeasuredValue(w, "harmonic_ratio", ratios.TryGetValue(m.N, out var r) ? r : null);
                Number(w, "residual_rms_m", m.ResidualRmsM);
                // Already inside the uncertainties above (in quadrature); listed so the budget can be read.
                w.WriteStartObject("coherent_error_uncertainty");
                Number(w, "frequency_hz", m.CoherentErrorFrequencyHz);
                Number(w, "decay_rate_per_s", m.CoherentErrorDecayRatePerS);
                w.WriteEndObject();
                var check = result.Fits.CrossChecks.FirstOrDefault(c => c.N == m.N);
                if (check is not null)
                {
                    w.WriteStartObject("cross_check");
                    w.WriteString("method", "matrix pencil");
                    MeasuredValue(w, "frequency_hz", check.FrequencyHz);
                    MeasuredValue(w, "decay_rate_per_s", check.DecayRatePerS);
                    Number(w, "frequency_difference_in_uncertainties", check.FrequencyDifference);
                    Number(w, "decay_rate_difference_in_uncertainties", check.DecayRateDifference);
                    w.WriteBoolean("agrees", check.Agrees);
                    w.WriteEndObject();
                }
            }
            w.WriteStartArray("warnings");
            foreach (var text in m.Warnings) w.WriteStringValue(text);
            w.WriteEndArray();
            w.WriteEndObject();
        }
        w.WriteEndArray();

        var s = result.String;
        w.WriteStartObject("string");
        if (s is not null)
        {
            MeasuredValue(w, "length_m", s.LengthM);
            MeasuredValue(w, "linear_density_kg_per_m", s.LinearDensityKgPerM);
            MeasuredValue(w, "fundamental_hz", s.FundamentalHz);
            MeasuredValue(w, "inharmonicity", s.Inharmonicity);
            w.WriteBoolean("inharmonicity_assumed_zero", s.InharmonicityAssumed);
            MeasuredValue(w, "wave_speed_m_per_s", s.WaveSpeedMPerS);
            MeasuredValue(w, "tension_n", s.TensionN);
            MeasuredValue(w, "bending_stiffness_n_m2", s.BendingStiffnessNM2);
            Number(w, "regression_reduced_chi_square", s.RegressionReducedChiSquare);
            w.WriteStartArray("modes_used");
            foreach (var n in s.ModesUsed) w.WriteNumberValue(n);
            w.WriteEndArray();
            w.WriteStartArray("tension_budget");
            foreach (var b in s.TensionBudget)
            {
                w.WriteStartObject();
                w.WriteString("input", b.Name);
                Number(w, "sensitivity_coefficient", b.SensitivityCoefficient);
                Number(w, "contribution_n", b.Contribution);
                Number(w, "variance_share", b.VarianceShare);
                w.WriteEndObject();
            }
            w.WriteEndArray();
        }
        w.WriteEndObject();

        w.WriteStartObject("checks");
        if (s?.SecondHarmonic is { } h)
        {
            w.WriteStartObject("second_harmonic_at_twice_fundamental");
            MeasuredValue(w, "ratio_f2_over_2f1", h.Ratio);
            Number(w, "deviation_in_uncertainties", h.DeviationInUncertainties);
            Number(w, "coverage_factor", h.CoverageFactor);
            w.WriteBoolean("passes", h.Passes);
            w.WriteEndObject();
        }
        w.WriteEndObject();

        w.WriteStartArray("warnings");
        foreach (var text in warnings) w.WriteStringValue(text);
        w.WriteEndArray();
        w.WriteEndObject();
    }

    private static void Number(Utf8JsonWriter w, string name, double v)
    {
        if (double.IsFinite(v)) w.WriteNumber(name, v);
        else w.WriteNull(name);
    }

    private static void MeasuredValue(Utf8JsonWriter w, string name, Measured? m)
    {
        if (m is not { } v || !double.IsFinite(v.Value))
        {
            w.WriteNull(name);
            return;
        }
        w.WriteStartObject(name);
        w.WriteNumber("value", v.Value);
        if (double.IsFinite(v.StandardUncertainty)) w.WriteNumber("uncertainty", v.StandardUncertainty);
        else w.WriteNull("uncertainty");
        w.WriteEndObject();
    }

    private static string Snake(string pascal)
        => string.Concat(pascal.Select((c, i) => char.IsUpper(c) && i > 0 ? "_" + char.ToLowerInvariant(c) : char.ToLowerInvariant(c).ToString()));
}

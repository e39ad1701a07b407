using StringModes.Analysis.Fitting;
using StringModes.Analysis.Modal;
using StringModes.Analysis.StringModel;

namespace StringModes.Analysis;

/// <summary>Everything <see cref="ModalAnalysis.Run"/> found. No member holds NaN or infinity.</summary>
/// <param name="IsAnalysisPossible">False when nothing could be measured (no modes, no vibration); <see cref="Error"/> then says why.</param>
/// <param name="Error">One-line reason when the analysis was not possible, else null.</param>
/// <param name="Modal">Modal coordinates a_n(t).</param>
/// <param name="Fits">Per-mode fits and matrix-pencil cross-checks.</param>
/// <param name="String">String properties; null when no mode could be fitted.</param>
/// <param name="AnalysisWindowStartS">Time of the first valid frame, s (0 when none).</param>
/// <param name="AnalysisWindowEndS">Time of the last valid frame, s (0 when none).</param>
/// <param name="FrameRateHz">Median frame rate of the string coordinates, Hz (0 with fewer than two frames).</param>
/// <param name="Warnings">All warnings of every stage in plain words, in pipeline order.</param>
public sealed record ModalAnalysisResult(
    bool IsAnalysisPossible,
    string? Error,
    ModalCoordinates Modal,
    ModeFitResult Fits,
    StringEstimate? String,
    double AnalysisWindowStartS,
    double AnalysisWindowEndS,
    double FrameRateHz,
    IReadOnlyList<string> Warnings);

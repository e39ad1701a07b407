namespace StringModes.Analysis.Geometry;

/// <summary>String coordinates plus what the conversion found.</summary>
/// <param name="Coordinates">Transverse displacement of the moving marks on the common time grid.</param>
/// <param name="LongitudinalM">Displacement along the string from each mark's rest position s_i, metres, [frame, mark]; NaN where missing.</param>
/// <param name="MetresPerUnit">Scale: metres per pixel (per plane unit with a plane calibration).</param>
/// <param name="Warnings">Findings for the user.</param>
public sealed record StringFrameResult(StringCoordinates Coordinates, double[,] LongitudinalM, double MetresPerUnit, IReadOnlyList<string> Warnings);

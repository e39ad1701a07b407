namespace StringModes.Analysis.Geometry;

/// <summary>How pixel tracks are turned into string coordinates.</summary>
public sealed record StringFrameOptions
{
    /// <summary>Vibrating length L between the two end marks in metres; &gt; 0; required.</summary>
    public required double LengthM { get; init; }

    /// <summary>
    /// Rolling-shutter readout time in seconds (top row to bottom row); ≥ 0; default 0 (global shutter).
    /// Row y is exposed at t_frame + (y/H)·t_readout.
    /// </summary>
    public double ReadoutS { get; init; }

    /// <summary>Full frame height H in pixels (rows); ≥ 1; required when <see cref="ReadoutS"/> &gt; 0.</summary>
    public int FrameHeightPx { get; init; }

    /// <summary>
    /// Optional plane calibration: four image points (pixels) and where they lie on the string's plane (any length
    /// unit, e.g. metres), no three collinear. Default null (no perspective correction).
    /// </summary>
    public PlaneCalibration? Plane { get; init; }
}

/// <summary>Four image points and their positions on the plane of the string.</summary>
/// <param name="ImagePx">Four (x, y) pixel positions.</param>
/// <param name="Plane">The same four points on the plane (x, y), any consistent length unit.</param>
public sealed record PlaneCalibration(IReadOnlyList<(double X, double Y)> ImagePx, IReadOnlyList<(double X, double Y)> Plane);

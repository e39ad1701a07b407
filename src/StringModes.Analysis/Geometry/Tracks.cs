namespace StringModes.Analysis.Geometry;

/// <summary>
/// Pixel tracks of the marks on a string, the output of tracking. Arrays are indexed [frame, mark].
/// Mark 0 and mark <see cref="MarkCount"/>−1 are the two ends; the others are ordered along the string.
/// A mark lost in a frame has NaN position and quality 0.
/// </summary>
/// <param name="TimesS">Capture time of each frame in seconds (row 0, mid-exposure), strictly increasing.</param>
/// <param name="XPx">Horizontal position in pixels (x to the right, origin at the centre of the top-left pixel).</param>
/// <param name="YPx">Vertical position in pixels (y down).</param>
/// <param name="Quality">Tracking quality in [0, 1]; 0 means no measurement.</param>
public sealed record Tracks(double[] TimesS, double[,] XPx, double[,] YPx, double[,] Quality)
{
    /// <summary>Number of frames.</summary>
    public int FrameCount => TimesS.Length;

    /// <summary>Number of marks, ends included.</summary>
    public int MarkCount => XPx.GetLength(1);
}

/// <summary>
/// Transverse displacement of the moving marks in string coordinates, on one common time grid
/// (rolling-shutter row times already resampled). Arrays are indexed [frame, mark]; the ends are not included.
/// </summary>
/// <param name="LengthM">Vibrating length L in metres.</param>
/// <param name="PositionsM">Rest position s_i of each moving mark along the string, metres from end 0, 0 &lt; s_i &lt; L.</param>
/// <param name="TimesS">Common time grid in seconds, strictly increasing.</param>
/// <param name="DisplacementM">Transverse displacement u_i(t) in metres; NaN where the mark was not measured.</param>
/// <param name="Weight">Least-squares weight of each sample, ≥ 0 (0 = missing); from tracking quality.</param>
public sealed record StringCoordinates(double LengthM, double[] PositionsM, double[] TimesS, double[,] DisplacementM, double[,] Weight)
{
    /// <summary>Number of time samples.</summary>
    public int FrameCount => TimesS.Length;

    /// <summary>Number of moving marks.</summary>
    public int MarkCount => PositionsM.Length;
}

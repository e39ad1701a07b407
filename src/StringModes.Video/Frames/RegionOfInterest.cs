namespace StringModes.Video.Frames;

/// <summary>A rectangle of the full frame in pixels (x to the right, y down, top-left pixel is (0, 0)).</summary>
/// <param name="X">Left column; ≥ 0.</param>
/// <param name="Y">Top row; ≥ 0.</param>
/// <param name="Width">Width in pixels; ≥ 1, X + Width ≤ frame width.</param>
/// <param name="Height">Height in pixels; ≥ 1, Y + Height ≤ frame height.</param>
public sealed record RegionOfInterest(int X, int Y, int Width, int Height);

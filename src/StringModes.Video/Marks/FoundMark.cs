namespace StringModes.Video.Marks;

/// <summary>A mark on the reference frame.</summary>
/// <param name="XPx">Centre x in pixels of the searched image.</param>
/// <param name="YPx">Centre y in pixels of the searched image.</param>
/// <param name="RadiusPx">Radius estimated from the second moments (a uniform disc has σ² = r²/4 per axis).</param>
/// <param name="ContrastDn">Mean contrast to the local background, grey levels on the 8-bit scale; negative for dark marks.</param>
public sealed record FoundMark(double XPx, double YPx, double RadiusPx, double ContrastDn);

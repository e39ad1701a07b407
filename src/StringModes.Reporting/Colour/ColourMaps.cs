namespace StringModes.Reporting.Colour;

/// <summary>
/// The colour maps and categorical palette used in StringModes figures. Anchors are our own choices in
/// Oklab LCh (lightness, chroma, hue°), picked so lightness alone carries the order of the data: the
/// sequential map reads correctly in grey-scale print, the diverging map is light at zero and darkens
/// equally towards both signs.
/// </summary>
public static class ColourMaps
{
    /// <summary>
    /// Sequential map for magnitudes ("Tide"): deep ink blue → sea green → dune sand → pale shell.
    /// Lightness rises strictly from 0.20 to 0.96.
    /// </summary>
    public static ColourMap Sequential { get; } = new("Tide", new[]
    {
        OklabColour.FromLch(0.20, 0.060, 268),
        OklabColour.FromLch(0.38, 0.068, 236),
        OklabColour.FromLch(0.56, 0.095, 188),
        OklabColour.FromLch(0.74, 0.110, 118),
        OklabColour.FromLch(0.87, 0.100, 85),
        OklabColour.FromLch(0.96, 0.035, 95),
    }, ColourMapKind.Sequential);

    /// <summary>
    /// Diverging map for signed values ("Slate–Brick"): slate blue (negative) → near-white (zero) → brick
    /// red (positive). Lightness is the same at ±x: 0.40 at the ends, 0.97 at the centre.
    /// </summary>
    public static ColourMap Diverging { get; } = new("Slate–Brick", new[]
    {
        OklabColour.FromLch(0.40, 0.110, 258),
        OklabColour.FromLch(0.62, 0.090, 246),
        OklabColour.FromLch(0.84, 0.045, 236),
        OklabColour.FromLch(0.97, 0.006, 90),
        OklabColour.FromLch(0.84, 0.045, 48),
        OklabColour.FromLch(0.62, 0.110, 36),
        OklabColour.FromLch(0.40, 0.120, 30),
    }, ColourMapKind.Diverging);

    /// <summary>
    /// Categorical colour for series <paramref name="index"/> (mode number order): chroma 0.10, lightness
    /// alternating 0.55 / 0.66 and hue stepped by 137.5° so neighbours in the list differ strongly while no
    /// series stands out by brightness. The first eight are clearly distinct; figures also label series
    /// directly, so later, closer hues stay readable.
    /// </summary>
    public static SrgbColour Category(int index)
    {
        var hue = (40 + 137.50776 * index) % 360;
        var lightness = index % 2 == 0 ? 0.55 : 0.66;
        return Oklab.ToSrgb(OklabColour.FromLch(lightness, 0.10, hue)).Clamped();
    }
}

using SkiaSharp;

namespace StringModes.Reporting.Figures;

/// <summary>
/// DejaVu Sans regular and bold, loaded from resources embedded in this assembly so figures render the
/// same on a machine with no fonts installed (the Linux native assets carry no fontconfig).
/// </summary>
internal static class FigureFonts
{
    private static readonly Lazy<SKTypeface> RegularFace = new(() => Load("StringModes.Reporting.Fonts.DejaVuSans.ttf"));
    private static readonly Lazy<SKTypeface> BoldFace = new(() => Load("StringModes.Reporting.Fonts.DejaVuSans-Bold.ttf"));

    public static SKTypeface Regular => RegularFace.Value;

    public static SKTypeface Bold => BoldFace.Value;

    private static SKTypeface Load(string resource)
    {
        using var source = typeof(FigureFonts).Assembly.GetManifestResourceStream(resource)
            ?? throw new InvalidOperationException($"Embedded font {resource} is missing from the assembly.");
        var copy = new MemoryStream();
        source.CopyTo(copy);
        copy.Position = 0;
        // SKTypeface takes ownership of the managed stream and disposes it with the typeface.
        return SKTypeface.FromStream(copy)
            ?? throw new InvalidOperationException($"Embedded font {resource} could not be read.");
    }
}

using StringModes.Reporting.Figures;

namespace StringModes.Reporting.Tests.Figures;

public class FigureFontsTests
{
    [Fact]
    public void EmbeddedFonts_LoadAsDejaVuSansRegularAndBold()
    {
        Assert.Equal("DejaVu Sans", FigureFonts.Regular.FamilyName);
        Assert.Equal("DejaVu Sans", FigureFonts.Bold.FamilyName);
        Assert.True(FigureFonts.Bold.FontStyle.Weight >= 700);
        // Glyphs used in figure text (minus sign, ±, subscript n, superscript minus) exist in the font.
        using var font = new SkiaSharp.SKFont(FigureFonts.Regular, 14);
        Assert.All("−±ₙ⁻·σ".ToCharArray(), c => Assert.NotEqual(0, font.GetGlyph(c)));
    }

    [Fact]
    public void SmallestFigureText_IsAtLeastElevenPixels()
    {
        // Readability floor from the design brief: ≥ 11 px at scale 1.
        Assert.True(new[] { FigureStyle.TitleSize, FigureStyle.AxisLabelSize, FigureStyle.TickLabelSize, FigureStyle.AnnotationSize }.Min() >= 11);
    }
}

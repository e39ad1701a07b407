namespace StringModes.Reporting.Colour;

/// <summary>A colour in the Oklab perceptual space: L lightness (0 black .. 1 white), a green–red, b blue–yellow.</summary>
public readonly record struct OklabColour(double L, double A, double B)
{
    /// <summary>Chroma, √(a² + b²).</summary>
    public double Chroma => Math.Sqrt(A * A + B * B);

    /// <summary>Builds a colour from the cylindrical form (lightness, chroma, hue in degrees).</summary>
    public static OklabColour FromLch(double lightness, double chroma, double hueDeg)
    {
        var h = hueDeg * Math.PI / 180.0;
        return new OklabColour(lightness, chroma * Math.Cos(h), chroma * Math.Sin(h));
    }

    /// <summary>Euclidean distance in Oklab, which the space is built to make a perceptual colour difference.</summary>
    public double DistanceTo(OklabColour other)
    {
        double dl = L - other.L, da = A - other.A, db = B - other.B;
        return Math.Sqrt(dl * dl + da * da + db * db);
    }
}

/// <summary>An sRGB colour with channels as fractions in 0..1 (gamma-encoded, IEC 61966-2-1).</summary>
public readonly record struct SrgbColour(double R, double G, double B)
{
    /// <summary>True when every channel lies in 0..1 within <paramref name="tolerance"/>.</summary>
    public bool IsInGamut(double tolerance = 1e-9) =>
        R >= -tolerance && R <= 1 + tolerance && G >= -tolerance && G <= 1 + tolerance && B >= -tolerance && B <= 1 + tolerance;

    /// <summary>Channels clamped to 0..1.</summary>
    public SrgbColour Clamped() => new(Math.Clamp(R, 0, 1), Math.Clamp(G, 0, 1), Math.Clamp(B, 0, 1));

    /// <summary>8-bit channels, rounded to nearest after clamping.</summary>
    public (byte R, byte G, byte B) ToBytes()
    {
        var c = Clamped();
        return ((byte)Math.Round(c.R * 255), (byte)Math.Round(c.G * 255), (byte)Math.Round(c.B * 255));
    }

    /// <summary>CSS hex form, e.g. "#1f2a44".</summary>
    public string ToHex()
    {
        var (r, g, b) = ToBytes();
        return string.Create(System.Globalization.CultureInfo.InvariantCulture, $"#{r:x2}{g:x2}{b:x2}");
    }

    /// <summary>From 8-bit channels.</summary>
    public static SrgbColour FromBytes(byte r, byte g, byte b) => new(r / 255.0, g / 255.0, b / 255.0);
}

/// <summary>
/// Conversion between sRGB and Oklab.
/// Method and matrices: B. Ottosson, "A perceptual color space for image processing" (2020),
/// https://bottosson.github.io/posts/oklab/ — the published linear-sRGB → LMS matrix (M1 composed with the
/// sRGB primaries), the cube-root non-linearity, and the LMS′ → Lab matrix M2, with their published inverses.
/// The sRGB transfer function is the piecewise curve of IEC 61966-2-1.
/// </summary>
public static class Oklab
{
    /// <summary>sRGB (gamma-encoded, 0..1) to Oklab.</summary>
    public static OklabColour FromSrgb(SrgbColour c) =>
        FromLinearSrgb(ToLinear(c.R), ToLinear(c.G), ToLinear(c.B));

    /// <summary>Oklab to sRGB (gamma-encoded); the result may lie outside 0..1 for colours outside the sRGB gamut.</summary>
    public static SrgbColour ToSrgb(OklabColour c)
    {
        var (r, g, b) = ToLinearSrgb(c);
        return new SrgbColour(FromLinear(r), FromLinear(g), FromLinear(b));
    }

    /// <summary>Linear-light sRGB to Oklab.</summary>
    public static OklabColour FromLinearSrgb(double r, double g, double b)
    {
        var l = 0.4122214708 * r + 0.5363325363 * g + 0.0514459929 * b;
        var m = 0.2119034982 * r + 0.6806995451 * g + 0.1073969566 * b;
        var s = 0.0883024619 * r + 0.2817188376 * g + 0.6299787005 * b;
        double l_ = Math.Cbrt(l), m_ = Math.Cbrt(m), s_ = Math.Cbrt(s);
        return new OklabColour(
            0.2104542553 * l_ + 0.7936177850 * m_ - 0.0040720468 * s_,
            1.9779984951 * l_ - 2.4285922050 * m_ + 0.4505937099 * s_,
            0.0259040371 * l_ + 0.7827717662 * m_ - 0.8086757660 * s_);
    }

    /// <summary>Oklab to linear-light sRGB.</summary>
    public static (double R, double G, double B) ToLinearSrgb(OklabColour c)
    {
        var l_ = c.L + 0.3963377774 * c.A + 0.2158037573 * c.B;
        var m_ = c.L - 0.1055613458 * c.A - 0.0638541728 * c.B;
        var s_ = c.L - 0.0894841775 * c.A - 1.2914855480 * c.B;
        double l = l_ * l_ * l_, m = m_ * m_ * m_, s = s_ * s_ * s_;
        return (
            +4.0767416621 * l - 3.3077115913 * m + 0.2309699292 * s,
            -1.2684380046 * l + 2.6097574011 * m - 0.3413193965 * s,
            -0.0041960863 * l - 0.7034186147 * m + 1.7076147010 * s);
    }

    /// <summary>sRGB decoding (IEC 61966-2-1): gamma-encoded channel → linear light. Odd-symmetric outside 0..1.</summary>
    public static double ToLinear(double encoded)
    {
        var a = Math.Abs(encoded);
        var lin = a <= 0.04045 ? a / 12.92 : Math.Pow((a + 0.055) / 1.055, 2.4);
        return Math.CopySign(lin, encoded);
    }

    /// <summary>sRGB encoding (IEC 61966-2-1): linear light → gamma-encoded channel. Odd-symmetric outside 0..1.</summary>
    public static double FromLinear(double linear)
    {
        var a = Math.Abs(linear);
        var enc = a <= 0.0031308 ? 12.92 * a : 1.055 * Math.Pow(a, 1 / 2.4) - 0.055;
        return Math.CopySign(enc, linear);
    }
}

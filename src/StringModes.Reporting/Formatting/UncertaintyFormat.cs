using System.Globalization;
using System.Text;

namespace StringModes.Reporting.Formatting;

/// <summary>
/// Display text for measured values, culture-invariant. With an uncertainty, the standard uncertainty is
/// given to two significant digits and the value is rounded to the same decimal place, as JCGM 100:2008
/// (GUM) §7.2.6 recommends ("at most two significant digits"), in the "value ± u unit" form of §7.2.2:
/// "110.0123 ± 0.0031 Hz". Very large or small numbers share a power of ten: "(3.88 ± 0.21) × 10⁻⁴".
/// Negative numbers carry the typographic minus sign U+2212.
/// </summary>
public static class UncertaintyFormat
{
    /// <summary>Text shown for a value that is not a finite number.</summary>
    public const string NotAvailable = "n/a";

    /// <summary>
    /// "value ± uncertainty unit". When <paramref name="uncertainty"/> is zero, negative or not finite, the
    /// value alone is shown with six significant digits. With <paramref name="allowExponent"/> false the
    /// shared power of ten is never used (for table columns that must line up), down to 1e-12.
    /// </summary>
    public static string Format(double value, double uncertainty, string? unit = null, bool allowExponent = true)
    {
        if (!double.IsFinite(value))
        {
            return NotAvailable;
        }

        if (!(uncertainty > 0) || !double.IsFinite(uncertainty))
        {
            return WithUnit(FormatValue(value), unit);
        }

        var magnitude = Math.Max(Math.Abs(value), uncertainty);
        var fixedPossible = !allowExponent && magnitude < 1e15 && DecimalsForUncertainty(uncertainty) <= 12;
        if ((magnitude >= 1e6 || magnitude < 1e-3) && !fixedPossible)
        {
            var exponent = (int)Math.Floor(Math.Log10(magnitude));
            var scale = Math.Pow(10, exponent);
            var (v, u) = Pair(value / scale, uncertainty / scale);
            return WithUnit($"({v} ± {u}) × 10{Superscript(exponent)}", unit);
        }

        var (vs, us) = Pair(value, uncertainty);
        return WithUnit($"{vs} ± {us}", unit);
    }

    /// <summary>The value rounded as in <see cref="Format(double, double, string?, bool)"/>, without the uncertainty or unit.</summary>
    public static string FormatValueOnly(double value, double uncertainty) =>
        !double.IsFinite(value) ? NotAvailable
        : !(uncertainty > 0) || !double.IsFinite(uncertainty) ? FormatValue(value)
        : Pair(value, uncertainty).Value;

    /// <summary>The uncertainty to two significant digits (fixed-point text), or "n/a".</summary>
    public static string FormatUncertaintyOnly(double value, double uncertainty) =>
        !(uncertainty > 0) || !double.IsFinite(uncertainty) || !double.IsFinite(value) ? NotAvailable : Pair(value, uncertainty).Uncertainty;

    /// <summary>A value without an uncertainty: <paramref name="significant"/> significant digits, no exponent for 1e-3..1e6.</summary>
    public static string FormatValue(double value, int significant = 6)
    {
        if (!double.IsFinite(value))
        {
            return NotAvailable;
        }

        if (value == 0)
        {
            return "0";
        }

        var exponent = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        if (exponent >= 6 || exponent < -3)
        {
            var mantissa = value / Math.Pow(10, exponent);
            var text = Minus(Trim(RoundToDecimals(mantissa, significant - 1).ToString("F" + (significant - 1), CultureInfo.InvariantCulture)));
            return $"{text} × 10{Superscript(exponent)}";
        }

        var decimals = Math.Clamp(significant - 1 - exponent, 0, 15);
        return Minus(Trim(RoundToDecimals(value, decimals).ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture)));
    }

    /// <summary>Decimal place (10^−d) at which a standard uncertainty is shown with two significant digits; negative for tens, hundreds….</summary>
    public static int DecimalsForUncertainty(double uncertainty)
    {
        var exponent = (int)Math.Floor(Math.Log10(uncertainty));
        var decimals = 1 - exponent;
        // 0.0996 rounds to 0.100 at three decimals, which has three significant digits: show 0.10.
        if (RoundToDecimals(uncertainty, decimals) >= Math.Pow(10, exponent + 1))
        {
            decimals--;
        }

        return decimals;
    }

    private static (string Value, string Uncertainty) Pair(double value, double uncertainty)
    {
        var decimals = DecimalsForUncertainty(uncertainty);
        return (Fixed(value, decimals), Fixed(uncertainty, decimals));
    }

    private static string Fixed(double x, int decimals)
    {
        var rounded = RoundToDecimals(x, decimals);
        var text = rounded.ToString("F" + Math.Max(0, decimals).ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        return Minus(text);
    }

    /// <summary>Half away from zero at 10^−decimals, via System.Decimal so 110.0125 rounds as written.</summary>
    private static double RoundToDecimals(double x, int decimals)
    {
        if (Math.Abs(x) < 7e27 && decimals is >= 0 and <= 20)
        {
            return (double)Math.Round((decimal)x, decimals, MidpointRounding.AwayFromZero);
        }

        var scale = Math.Pow(10, -decimals);
        return Math.Round(x / scale, MidpointRounding.AwayFromZero) * scale;
    }

    private static string Trim(string fixedText) =>
        fixedText.Contains('.') ? fixedText.TrimEnd('0').TrimEnd('.') : fixedText;

    /// <summary>Typographic minus; "−0.00" becomes "0.00".</summary>
    private static string Minus(string text)
    {
        if (!text.StartsWith('-'))
        {
            return text;
        }

        var digits = text[1..];
        return digits.All(c => c is '0' or '.') ? digits : "\u2212" + digits;
    }

    private static string WithUnit(string text, string? unit) => string.IsNullOrEmpty(unit) ? text : text + " " + unit;

    private static string Superscript(int exponent)
    {
        const string digits = "⁰¹²³⁴⁵⁶⁷⁸⁹";
        var sb = new StringBuilder();
        if (exponent < 0)
        {
            sb.Append('⁻');
        }

        foreach (var c in Math.Abs(exponent).ToString(CultureInfo.InvariantCulture))
        {
            sb.Append(digits[c - '0']);
        }

        return sb.ToString();
    }
}

using System.Globalization;

namespace StringModes.Reporting.Figures;

/// <summary>Invariant number formatting for labels drawn inside figures.</summary>
internal static class FigureText
{
    public static string Number(double value, int decimals) =>
        NiceTicks.FormatTick(value, Math.Clamp(decimals, 0, 12));

    /// <summary>Decimals needed to show <paramref name="value"/> with about <paramref name="significant"/> significant digits.</summary>
    public static int DecimalsFor(double value, int significant)
    {
        if (value == 0 || !double.IsFinite(value))
        {
            return 0;
        }

        var exponent = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        return Math.Max(0, significant - 1 - exponent);
    }

    public static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}

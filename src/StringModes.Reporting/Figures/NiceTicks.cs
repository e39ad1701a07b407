using System.Globalization;

namespace StringModes.Reporting.Figures;

/// <summary>Tick positions on one axis and the decimals that label them all alike.</summary>
internal sealed record TickSet(double[] Values, double Step, int Decimals)
{
    public string Label(double value) => NiceTicks.FormatTick(value, Decimals);
}

/// <summary>
/// "Nice" tick values: steps of 1, 2 or 5 × 10^k chosen so about <c>target</c> ticks fall in the range
/// (the loose-labelling idea of P. Heckbert, "Nice numbers for graph labels", Graphics Gems, 1990,
/// restricted to the 1–2–5 sequence and to ticks inside the range).
/// </summary>
internal static class NiceTicks
{
    public static TickSet Generate(double min, double max, int target = 6, double minimumStep = 0)
    {
        (min, max) = SafeRange(min, max);
        var rough = (max - min) / Math.Max(1, target - 1);
        var step = Math.Max(NiceStep(rough), minimumStep);
        var first = Math.Ceiling(min / step - 1e-9) * step;
        var values = new List<double>();
        for (var k = 0; k < 1000; k++)
        {
            var v = first + k * step;
            if (v > max + step * 1e-9)
            {
                break;
            }

            values.Add(Math.Abs(v) < step * 1e-9 ? 0 : v);
        }

        return new TickSet(values.ToArray(), step, DecimalsFor(step));
    }

    /// <summary>The smallest 1, 2 or 5 × 10^k not below <paramref name="rough"/>.</summary>
    public static double NiceStep(double rough)
    {
        if (!(rough > 0) || double.IsInfinity(rough))
        {
            return 1;
        }

        var exponent = Math.Floor(Math.Log10(rough));
        var power = Math.Pow(10, exponent);
        var fraction = rough / power;
        var nice = fraction <= 1 + 1e-9 ? 1 : fraction <= 2 + 1e-9 ? 2 : fraction <= 5 + 1e-9 ? 5 : 10;
        return nice * power;
    }

    /// <summary>Range widened to something drawable when empty or not finite.</summary>
    public static (double Min, double Max) SafeRange(double min, double max)
    {
        if (!double.IsFinite(min) || !double.IsFinite(max))
        {
            return (0, 1);
        }

        if (max < min)
        {
            (min, max) = (max, min);
        }

        if (max - min <= Math.Abs(max) * 1e-12 || max == min)
        {
            var pad = min == 0 ? 1 : Math.Abs(min) * 0.1;
            return (min - pad, max + pad);
        }

        return (min, max);
    }

    /// <summary>The range extended outwards to whole steps, for axes whose ends should carry ticks.</summary>
    public static (double Min, double Max) Expand(double min, double max, int target = 6)
    {
        (min, max) = SafeRange(min, max);
        var step = NiceStep((max - min) / Math.Max(1, target - 1));
        return (Math.Floor(min / step + 1e-9) * step, Math.Ceiling(max / step - 1e-9) * step);
    }

    public static int DecimalsFor(double step) =>
        step >= 1 ? 0 : (int)Math.Ceiling(-Math.Log10(step) - 1e-9);

    /// <summary>Fixed decimals, invariant culture, typographic minus sign, never "−0".</summary>
    public static string FormatTick(double value, int decimals)
    {
        var text = value.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        if (text.StartsWith('-'))
        {
            text = text.TrimStart('-').Trim('0', '.').Length == 0 ? text[1..] : "\u2212" + text[1..];
        }

        return text;
    }
}

using System.Globalization;

namespace StringModes.Analysis.Units;

/// <summary>
/// Parses a user-entered quantity ("65cm", "1.2 g/m", "0.65") to its SI value.
/// A plain number is taken as already in SI units. Unit symbols are case-sensitive where SI makes them so
/// ("mm" versus "Mm" is not accepted; "MPa" and "mPa" differ), with common spellings such as "m3" for m³ accepted.
/// Sign checks are the caller's: "-3cm" parses to −0.03.
/// </summary>
public static class Quantity
{
    // Conversion factors to SI. Imperial factors are exact by definition (international yard and pound, 1959;
    // standard gravity 9.80665 m/s² from the 3rd CGPM, 1901), lbf = 0.45359237 kg · 9.80665 m/s².
    private static readonly IReadOnlyDictionary<Dimension, (string Symbol, double Factor)[]> Units =
        new Dictionary<Dimension, (string, double)[]>
        {
            [Dimension.Length] = [("m", 1), ("cm", 1e-2), ("mm", 1e-3), ("um", 1e-6), ("µm", 1e-6), ("in", 0.0254), ("ft", 0.3048)],
            [Dimension.LinearDensity] = [("kg/m", 1), ("g/m", 1e-3), ("g/cm", 0.1), ("g/mm", 1), ("mg/mm", 1e-3), ("mg/m", 1e-6)],
            [Dimension.Mass] = [("kg", 1), ("g", 1e-3), ("mg", 1e-6)],
            [Dimension.Density] = [("kg/m3", 1), ("kg/m^3", 1), ("kg/m³", 1), ("g/cm3", 1e3), ("g/cm^3", 1e3), ("g/cm³", 1e3)],
            [Dimension.Frequency] = [("Hz", 1), ("kHz", 1e3), ("fps", 1)],
            [Dimension.Time] = [("s", 1), ("ms", 1e-3), ("us", 1e-6), ("µs", 1e-6)],
            [Dimension.Force] = [("N", 1), ("kN", 1e3), ("lbf", 0.45359237 * 9.80665), ("kgf", 9.80665)],
            [Dimension.Modulus] = [("Pa", 1), ("kPa", 1e3), ("MPa", 1e6), ("GPa", 1e9)],
        };

    /// <summary>Unit symbols accepted for <paramref name="dimension"/>, SI unit first.</summary>
    public static IReadOnlyList<string> AcceptedUnits(Dimension dimension) => Units[dimension].Select(u => u.Symbol).ToArray();

    /// <summary>SI unit symbol of <paramref name="dimension"/>.</summary>
    public static string SiUnit(Dimension dimension) => Units[dimension][0].Symbol;

    /// <summary>
    /// Parses <paramref name="text"/> as a number optionally followed by a unit of <paramref name="expected"/>.
    /// On success <paramref name="si"/> holds the value in SI units and <paramref name="error"/> is empty; on failure
    /// <paramref name="si"/> is 0 and <paramref name="error"/> is a one-line message naming the accepted units.
    /// Empty text, NaN and infinities are rejected.
    /// </summary>
    public static bool TryParse(string? text, Dimension expected, out double si, out string error)
    {
        si = 0;
        var accepted = string.Join(", ", AcceptedUnits(expected));
        var name = DimensionName(expected);
        if (string.IsNullOrWhiteSpace(text))
        {
            error = $"empty {name}: give a number in {SiUnit(expected)} or a number with one of the units {accepted}";
            return false;
        }

        var s = text.Trim();
        var split = NumberLength(s);
        if (split == 0)
        {
            error = $"'{Shown(s)}' is not a {name}: expected a number optionally followed by one of the units {accepted}";
            return false;
        }

        if (!double.TryParse(s[..split], NumberStyles.Float, CultureInfo.InvariantCulture, out var value) || !double.IsFinite(value))
        {
            error = $"'{Shown(s)}' is not a finite {name}: expected a number optionally followed by one of the units {accepted}";
            return false;
        }

        var unit = s[split..].Trim();
        if (unit.Length == 0)
        {
            si = value;
            error = "";
            return true;
        }

        foreach (var (symbol, factor) in Units[expected])
        {
            if (!string.Equals(symbol, unit, StringComparison.Ordinal)) continue;
            si = value * factor;
            if (!double.IsFinite(si))
            {
                si = 0;
                error = $"'{Shown(s)}' is out of range for a {name}";
                return false;
            }
            error = "";
            return true;
        }

        error = $"unknown unit '{Shown(unit)}' for a {name} in '{Shown(s)}': accepted units are {accepted} (a plain number is {SiUnit(expected)})";
        return false;
    }

    // What the user typed, quoted in a one-line message: control characters (a pasted newline) as \u escapes,
    // and at most 60 characters.
    private static string Shown(string text)
    {
        var clipped = text.Length > 60 ? text[..57] + "..." : text;
        return string.Concat(clipped.Select(c => char.IsControl(c) || char.GetUnicodeCategory(c) is UnicodeCategory.LineSeparator or UnicodeCategory.ParagraphSeparator
            ? "\\u" + ((int)c).ToString("X4", CultureInfo.InvariantCulture)
            : c.ToString()));
    }

    /// <summary>Length of the leading numeric part (sign, digits, decimal point, exponent) of <paramref name="s"/>.</summary>
    private static int NumberLength(string s)
    {
        var i = 0;
        if (i < s.Length && (s[i] == '+' || s[i] == '-')) i++;
        var digits = 0;
        while (i < s.Length && char.IsAsciiDigit(s[i])) { i++; digits++; }
        if (i < s.Length && s[i] == '.')
        {
            i++;
            while (i < s.Length && char.IsAsciiDigit(s[i])) { i++; digits++; }
        }
        if (digits == 0) return 0;
        // An exponent only counts when digits follow it, so "2e" or "3em" leave the 'e' to the unit.
        if (i < s.Length && (s[i] == 'e' || s[i] == 'E'))
        {
            var j = i + 1;
            if (j < s.Length && (s[j] == '+' || s[j] == '-')) j++;
            var k = j;
            while (k < s.Length && char.IsAsciiDigit(s[k])) k++;
            if (k > j) i = k;
        }
        return i;
    }

    private static string DimensionName(Dimension d) => d switch
    {
        Dimension.Length => "length",
        Dimension.LinearDensity => "linear density",
        Dimension.Mass => "mass",
        Dimension.Density => "density",
        Dimension.Frequency => "frequency",
        Dimension.Time => "time",
        Dimension.Force => "force",
        Dimension.Modulus => "modulus",
        _ => d.ToString(),
    };
}

using System.Globalization;
using CsCheck;
using StringModes.Analysis.Tests.TestData;
using StringModes.Analysis.Units;

namespace StringModes.Analysis.Tests.Units;

/// <summary>The quantity parser round-trips what it is given: a formatted number with any accepted unit and spacing.</summary>
public class QuantityProperties
{
    private static readonly Dimension[] Dimensions = Enum.GetValues<Dimension>();

    // Magnitudes over 24 decades, either sign: sign × mantissa × 10^exponent.
    private static readonly Gen<double> Values =
        from negative in Gen.Bool
        from mantissa in Gen.Double[1, 10]
        from exponent in Gen.Int[-12, 12]
        select (negative ? -1 : 1) * mantissa * Math.Pow(10, exponent);

    private static readonly Gen<(Dimension Dimension, string Unit, double Value, string Format, string Space)> Inputs =
        from d in Gen.OneOf(Dimensions)
        from unit in Gen.OneOf(Quantity.AcceptedUnits(d).ToArray())
        from value in Values
        from format in Gen.OneOf<string>("R", "E3", "F6", "G17", "0.###e+0")
        from space in Gen.OneOf<string>("", " ", "  ", "\t")
        select (d, unit, value, format, space);

    // A plain number is SI: parsing its round-trip ("R") text gives the same double exactly.
    [Fact]
    public void PlainNumber_ParsesBackExactly()
    {
        Property.ForAll(Values, 2000, 11, v =>
        {
            var text = v.ToString("R", CultureInfo.InvariantCulture);
            foreach (var d in Dimensions)
            {
                Assert.True(Quantity.TryParse(text, d, out var si, out var error), error);
                Assert.Equal(v, si);
            }
        });
    }

    // Format x in a unit, parse to SI, divide by the unit's own factor (the parse of "1 unit"): x comes back.
    // Tolerance: the decimal text holds x to the format's precision (exact for R and G17, 5e-4 relative for E3,
    // F6 to 5e-7 absolute), and the conversion is one multiplication and one division: 2 ulps (2·2⁻⁵² relative).
    [Fact]
    public void ValueWithUnit_RoundTripsThroughFormatAndParse()
    {
        Property.ForAll(Inputs, 3000, 97, t =>
        {
            var text = " " + t.Value.ToString(t.Format, CultureInfo.InvariantCulture) + t.Space + t.Unit + " ";
            var written = double.Parse(text.Trim()[..(text.Trim().Length - t.Unit.Length)], NumberStyles.Float, CultureInfo.InvariantCulture);
            Assert.True(Quantity.TryParse(text, t.Dimension, out var si, out var error), $"'{text}' as {t.Dimension}: {error}");
            Assert.True(Quantity.TryParse("1 " + t.Unit, t.Dimension, out var factor, out _));
            var back = si / factor;
            Assert.True(Math.Abs(back - written) <= 2 * Math.Pow(2, -52) * Math.Abs(written),
                FormattableString.Invariant($"'{text}' → {si:R} SI → {back:R} {t.Unit}, written {written:R}"));
            Assert.True(Math.Abs(written - t.Value) <= Precision(t.Format, t.Value), $"format {t.Format} of {t.Value:R} gave '{text}'");
        });
    }

    private static double Precision(string format, double v) => format switch
    {
        "R" or "G17" => 0,
        "E3" => 5e-4 * Math.Abs(v),
        "F6" => 5e-7 + 1e-15 * Math.Abs(v),
        _ => 5e-4 * Math.Abs(v),
    };

    // Every unit symbol is refused for every other dimension that does not also list it: no unit is silently
    // taken in the wrong dimension.
    [Fact]
    public void UnitOfAnotherDimension_IsRefused()
    {
        var gen = from a in Gen.OneOf(Dimensions) from b in Gen.OneOf(Dimensions) from value in Values select (a, b, value);
        Property.ForAll(gen, 1000, 5, t =>
        {
            foreach (var unit in Quantity.AcceptedUnits(t.a).Except(Quantity.AcceptedUnits(t.b)))
            {
                var text = t.value.ToString("R", CultureInfo.InvariantCulture) + " " + unit;
                Assert.False(Quantity.TryParse(text, t.b, out var si, out var error), $"'{text}' accepted as {t.b}");
                Assert.Equal(0.0, si);
                Assert.Contains(unit, error);
            }
        });
    }
}

using StringModes.Reporting.Formatting;

namespace StringModes.Reporting.Tests.Formatting;

public class UncertaintyFormatTests
{
    // Rule: JCGM 100:2008 (GUM) §7.2.6 [memory; the brief cites §7.2.2, which gives the "value ± u" form] —
    // give u to at most two significant digits, round the value to the
    // same place. Cases hand-worked from that rule; exact string comparison (no tolerance: text output).
    [Theory]
    // GUM §7.2.2 example: m_S = 100.021 47 g with u_c = 0.35 mg [memory].
    [InlineData(100.02147, 0.00035, "g", "100.02147 ± 0.00035 g")]
    // REFERENCES.md §8 [computed]: T = 16.900 N, u(T) = 0.18002 N.
    [InlineData(16.9, 0.18002, "N", "16.90 ± 0.18 N")]
    [InlineData(110.01234, 0.00312, "Hz", "110.0123 ± 0.0031 Hz")]
    // Half away from zero at the last kept digit: 110.01235 → 110.0124 (value exactly representable in decimal).
    [InlineData(110.01235, 0.0031, "Hz", "110.0124 ± 0.0031 Hz")]
    // u = 0.0996 → two digits would read 0.100 (three significant); shown as 0.10, value to 2 decimals.
    [InlineData(2.3456, 0.0996, null, "2.35 ± 0.10")]
    // u above 10: rounded to tens, value likewise.
    [InlineData(12345.6, 123, "N", "12350 ± 120 N")]
    [InlineData(-0.5, 0.0123, "m", "\u22120.500 ± 0.012 m")]
    // Value smaller than its uncertainty keeps the uncertainty's decimal place; −0.0000 is shown as 0.0000.
    [InlineData(-0.00001, 0.0031, null, "0.0000 ± 0.0031")]
    // Small quantity (inharmonicity, REFERENCES.md §2 [computed] B = 3.88453e-4) shares the power of ten.
    [InlineData(3.88453e-4, 2.1e-5, null, "(3.88 ± 0.21) × 10⁻⁴")]
    [InlineData(2.5e7, 3.4e5, "Pa", "(2.500 ± 0.034) × 10⁷ Pa")]
    public void ValueWithUncertainty_FollowsTwoDigitRule(double value, double u, string? unit, string expected)
    {
        Assert.Equal(expected, UncertaintyFormat.Format(value, u, unit));
    }

    [Fact]
    public void FixedNotation_WhenExponentNotAllowed()
    {
        Assert.Equal("0.000875 ± 0.000020", UncertaintyFormat.Format(8.75e-4, 2.0e-5, allowExponent: false));
        Assert.Equal("(8.75 ± 0.20) × 10⁻⁴", UncertaintyFormat.Format(8.75e-4, 2.0e-5));
    }

    [Theory]
    [InlineData(1.0, 0.0, "1")]
    [InlineData(261.63, double.NaN, "261.63")]
    [InlineData(0.000123456789, -1.0, "1.23457 × 10⁻⁴")]
    public void MissingUncertainty_ShowsValueWithSixSignificantDigits(double value, double u, string expected)
    {
        Assert.Equal(expected, UncertaintyFormat.Format(value, u));
    }

    [Fact]
    public void NonFiniteValue_IsShownAsNotAvailable()
    {
        Assert.Equal("n/a", UncertaintyFormat.Format(double.NaN, 0.1, "Hz"));
        Assert.Equal("n/a", UncertaintyFormat.Format(double.PositiveInfinity, 0.1));
    }

    [Fact]
    public void Parts_AgreeWithCombinedText()
    {
        Assert.Equal("110.0123", UncertaintyFormat.FormatValueOnly(110.01234, 0.00312));
        Assert.Equal("0.0031", UncertaintyFormat.FormatUncertaintyOnly(110.01234, 0.00312));
        Assert.Equal(4, UncertaintyFormat.DecimalsForUncertainty(0.00312));
        Assert.Equal(-1, UncertaintyFormat.DecimalsForUncertainty(123));
    }
}

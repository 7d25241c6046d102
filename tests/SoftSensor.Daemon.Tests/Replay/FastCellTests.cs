using System.Globalization;
using CsCheck;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Tests.Replay;

/// <summary>
/// The replay's fast cell paths give exactly the framework's results: <see cref="DecimalCell"/> the
/// bits of double.TryParse (NumberStyles.Float, invariant culture), <see cref="CsvRowBuilder"/> the
/// text of the plain Math.Round-and-"F" formatting it replaced, and the ISO 8601 time the text of
/// DateTime's "yyyy-MM-dd'T'HH:mm:ss.fff'Z'" format. Random inputs from CsCheck (which prints the seed of a failure).
/// </summary>
public class FastCellTests
{
    [Theory]
    [InlineData("0")]
    [InlineData("-0")]
    [InlineData("+1.5")]
    [InlineData(".5")]
    [InlineData("5.")]
    [InlineData("20.89594")]
    [InlineData("0.04251957")]
    [InlineData("123456789012345")]
    [InlineData("1234567890123456")]
    [InlineData("0.1234567890123456789")]
    [InlineData("1e-5")]
    [InlineData("2.5E+3")]
    [InlineData("NaN")]
    [InlineData("-Infinity")]
    [InlineData(" 7 ")]
    [InlineData("1,5")]
    [InlineData("1..5")]
    [InlineData("-")]
    [InlineData(".")]
    [InlineData("")]
    [InlineData("zzz")]
    public void DecimalCell_equals_double_TryParse(string cell) => SameAsFramework(cell);

    [Fact]
    public void DecimalCell_equals_double_TryParse_on_random_decimals()
    {
        Gen.Select(Gen.Long[-999_999_999_999_999, 999_999_999_999_999], Gen.Int[0, 17], Gen.Bool).Sample(t =>
        {
            var (mantissa, decimals, plus) = t;
            string digits = Math.Abs(mantissa).ToString(CultureInfo.InvariantCulture).PadLeft(decimals + 1, '0');
            string text = (mantissa < 0 ? "-" : plus ? "+" : string.Empty)
                + (decimals == 0 ? digits : digits[..^decimals] + "." + digits[^decimals..]);
            SameAsFramework(text);
        }, iter: 20_000);
    }

    [Fact]
    public void DecimalCell_equals_double_TryParse_on_random_doubles_as_text()
    {
        Gen.Double.Sample(v =>
        {
            SameAsFramework(v.ToString("R", CultureInfo.InvariantCulture));
            SameAsFramework(v.ToString("F6", CultureInfo.InvariantCulture));
        }, iter: 20_000);
    }

    [Fact]
    public void Number_equals_the_plain_round_and_format_on_random_values()
    {
        Gen.Select(Gen.Double[-1e7, 1e7], Gen.Int[0, 12]).Sample(t =>
        {
            var (v, decimals) = t;
            var b = new CsvRowBuilder();
            b.Number(v, decimals);
            Assert.Equal(Plain(v, decimals), b.Row.ToString());
        }, iter: 20_000);
    }

    [Fact]
    public void Time_equals_the_framework_custom_format()
    {
        Gen.Long[DateTime.MinValue.Ticks, DateTime.MaxValue.Ticks].Sample(ticks =>
        {
            var t = new DateTimeOffset(ticks, TimeSpan.Zero);
            var b = new CsvRowBuilder();
            b.Time(t);
            Assert.Equal(t.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", CultureInfo.InvariantCulture), b.Row.ToString());
        }, iter: 20_000);
    }

    private static void SameAsFramework(string cell)
    {
        bool expectedOk = double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out double expected);
        bool ok = DecimalCell.TryParse(cell, out double actual);
        Assert.Equal(expectedOk, ok);
        Assert.True(BitConverter.DoubleToInt64Bits(expected) == BitConverter.DoubleToInt64Bits(actual), $"'{cell}': {actual:R} vs {expected:R}");
    }

    // The formatting the builder had: round |v| x 10^d half away from zero, split by integer division,
    // whole part as an integer, fraction zero-padded; minus unless the rounded value is zero; round-trip text past 9e18.
    private static string Plain(double v, int decimals)
    {
        double scaled = Math.Round(Math.Abs(v) * Math.Pow(10, decimals), MidpointRounding.AwayFromZero);
        if (scaled >= 9e18)
        {
            return v.ToString("R", CultureInfo.InvariantCulture); // beyond the integer path
        }

        ulong digits = (ulong)scaled;
        ulong divisor = (ulong)Math.Pow(10, decimals);
        string text = (digits / divisor).ToString(CultureInfo.InvariantCulture);
        if (decimals > 0)
        {
            text += "." + (digits % divisor).ToString(CultureInfo.InvariantCulture).PadLeft(decimals, '0');
        }

        return (v < 0 && digits != 0 ? "-" : string.Empty) + text;
    }
}

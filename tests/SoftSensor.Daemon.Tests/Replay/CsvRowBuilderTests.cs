using System.Globalization;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Tests.Replay;

public class CsvRowBuilderTests
{
    [Theory]
    [InlineData(0.0, 3, "0.000")]
    [InlineData(1.23456, 4, "1.2346")]
    [InlineData(-1.23456, 2, "-1.23")]
    [InlineData(-0.0001, 2, "0.00")]
    [InlineData(12345.5, 0, "12346")]
    [InlineData(0.000123, 6, "0.000123")]
    public void Number_with_fixed_decimals_matches_the_framework_formatter(double v, int decimals, string expected)
    {
        // Reference: .NET "F" formatting, invariant culture, rounding half away from zero.
        var b = new CsvRowBuilder();
        b.Number(v, decimals);
        Assert.Equal(expected, b.Row.ToString());
        if (!(v < 0 && Math.Round(v, decimals) == 0))
        {
            Assert.Equal(Math.Round(v, decimals, MidpointRounding.AwayFromZero).ToString("F" + decimals, CultureInfo.InvariantCulture), b.Row.ToString());
        }
    }

    [Fact]
    public void Number_not_finite_leaves_the_cell_empty()
    {
        var b = new CsvRowBuilder();
        b.Text("a").Next().Number(double.NaN, 3).Next().Number(double.PositiveInfinity, 2).Next().Text("b");
        Assert.Equal("a,,,b", b.Row.ToString());
    }
}

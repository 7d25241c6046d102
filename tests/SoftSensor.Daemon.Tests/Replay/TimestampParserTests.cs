using System.Globalization;
using SoftSensor.Daemon.Replay;

namespace SoftSensor.Daemon.Tests.Replay;

public class TimestampParserTests
{
    [Theory]
    [InlineData("2026-03-02T06:00:10Z")]
    [InlineData("2026-03-02 06:00:10Z")]
    [InlineData("2026-03-02T06:00:10.5Z")]
    [InlineData("2026-03-02T06:00:10.1234567Z")]
    [InlineData("2028-02-29T23:59:59Z")]
    [InlineData("2026-03-02T07:00:10+01:00")]
    public void TryParse_iso8601_agrees_with_the_framework_parser(string text)
    {
        // Reference: the .NET ISO 8601 parser (DateTimeOffset.Parse, invariant culture).
        Assert.True(TimestampParser.TryCreate(new TimestampSpec(), out var p, out _));
        Assert.True(p!.TryParse(text, out var t));
        var expected = DateTimeOffset.Parse(text, CultureInfo.InvariantCulture, DateTimeStyles.AdjustToUniversal);
        Assert.Equal(expected.UtcTicks, t.UtcTicks);
    }

    [Theory]
    [InlineData("2026-02-29T06:00:00Z")]
    [InlineData("2026-13-02T06:00:00Z")]
    [InlineData("2026-03-02T06:60:00Z")]
    [InlineData("2026-03-02T06:00:0xZ")]
    public void TryParse_impossible_iso8601_times_fail(string text)
    {
        Assert.True(TimestampParser.TryCreate(new TimestampSpec(), out var p, out _));
        Assert.False(p!.TryParse(text, out _));
    }

    [Fact]
    public void TryParse_unix_seconds_and_milliseconds()
    {
        // 1772431200 s after 1970-01-01T00:00:00Z is 2026-03-02T06:00:00Z (POSIX time, IEEE Std 1003.1).
        Assert.True(TimestampParser.TryCreate(new TimestampSpec { Format = "unix-seconds" }, out var s, out _));
        Assert.True(s!.TryParse("1772431200", out var a));
        Assert.Equal(new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero), a);
        Assert.True(TimestampParser.TryCreate(new TimestampSpec { Format = "unix-milliseconds" }, out var ms, out _));
        Assert.True(ms!.TryParse("1772431200250", out var b));
        Assert.Equal(a.AddMilliseconds(250), b);
    }
}

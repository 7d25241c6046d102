using SoftSensor.Daemon.Demo;

namespace SoftSensor.Daemon.Tests.Demo;

public class DemoPartsTests
{
    [Theory]
    [InlineData("90s", 90)]
    [InlineData("15m", 900)]
    [InlineData("1.5h", 5400)]
    [InlineData("01:00:00", 3600)]
    public void DurationText_TryParse_accepts_units_and_clock_text(string text, double seconds)
    {
        Assert.True(DurationText.TryParse(text, out var d));
        Assert.Equal(seconds, d.TotalSeconds);
    }

    [Theory]
    [InlineData("soon")]
    [InlineData("-5m")]
    [InlineData("0s")]
    public void DurationText_TryParse_rejects_nonsense(string text) => Assert.False(DurationText.TryParse(text, out _));

    [Fact]
    public void ScaledTimeProvider_runs_faster_than_the_wall_clock_from_its_start()
    {
        var start = new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);
        var clock = new ScaledTimeProvider(start, 3600);
        var now = clock.GetUtcNow();
        Assert.InRange(now, start, start.AddHours(1)); // well under a second of real time has passed
    }

    [Fact]
    public void DemoPublisher_Topic_drops_the_reactor_prefix_and_lowercases()
    {
        Assert.Equal("demo/r1/offgas.o2", DemoPublisher.Topic("r1", "R1.OFFGAS.O2"));
    }
}

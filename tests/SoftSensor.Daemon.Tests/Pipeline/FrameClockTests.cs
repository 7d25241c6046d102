using SoftSensor.Daemon.Pipeline;

namespace SoftSensor.Daemon.Tests.Pipeline;

/// <summary>
/// Frame times: one per cycle, strictly increasing per reactor (a time-series database keeps one
/// value per series and time, InfluxDB v2 documentation "Duplicate points": a second frame at the same
/// time would overwrite the first).
/// </summary>
public class FrameClockTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Next_late_ticks_keep_their_due_time_on_the_period_grid()
    {
        var clock = new FrameClock(TimeSpan.FromSeconds(10));
        clock.StartGrid(T0);
        Assert.Equal(T0.AddSeconds(10), clock.Next(T0.AddSeconds(10.004)));
        Assert.Equal(T0.AddSeconds(20), clock.Next(T0.AddSeconds(27.9)));
        // A skipped tick (the loop was busy for two periods) takes the slot it ran in.
        Assert.Equal(T0.AddSeconds(50), clock.Next(T0.AddSeconds(51)));
        Assert.Equal(0, clock.Bumped);
    }

    [Fact]
    public void Next_two_ticks_in_one_slot_give_distinct_increasing_times()
    {
        var clock = new FrameClock(TimeSpan.FromSeconds(10));
        clock.StartGrid(T0);
        var a = clock.Next(T0.AddSeconds(10.2));
        var b = clock.Next(T0.AddSeconds(19.9));
        var c = clock.Next(T0.AddSeconds(20.1));
        Assert.True(a < b && b < c, $"{a:O} {b:O} {c:O}");
        Assert.Equal(T0.AddSeconds(20), c);
    }

    [Fact]
    public void Next_after_resume_starts_after_the_newest_stored_frame_even_with_the_clock_behind()
    {
        var clock = new FrameClock(TimeSpan.FromSeconds(10));
        var stored = T0.AddHours(5);
        clock.Resume(stored);
        clock.StartGrid(T0);
        var times = Enumerable.Range(1, 5).Select(i => clock.Next(T0.AddSeconds(10 * i))).ToList();
        Assert.Equal(stored.AddSeconds(10), times[0]);
        Assert.Equal(Enumerable.Range(1, 5).Select(i => stored.AddSeconds(10 * i)), times);
    }

    [Fact]
    public void Next_without_grid_uses_the_clock_in_whole_milliseconds_and_never_repeats()
    {
        var clock = new FrameClock(TimeSpan.FromSeconds(1));
        var a = clock.Next(T0.AddTicks(1234));
        var b = clock.Next(T0.AddTicks(5678));
        Assert.Equal(T0, a);
        Assert.Equal(T0.AddMilliseconds(1), b);
    }
}

using SoftSensor.Core.Batches;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Estimation;

/// <summary>The fed-batch start from the feed: above the threshold for the hold time (common practice: a hold ignores pump tests and spikes).</summary>
public class FeedStartDetectorTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 2, 6, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Update_feed_above_threshold_for_the_hold_time_detects_the_start()
    {
        var d = new FeedStartDetector(0.05, TimeSpan.FromMinutes(5));
        Assert.False(d.Update(T0, 0.2, SampleQuality.Good));
        Assert.False(d.Update(T0.AddMinutes(4), 0.2, SampleQuality.Good));
        Assert.True(d.Update(T0.AddMinutes(5), 0.2, SampleQuality.Good));
        Assert.Equal(T0, d.AboveSince);
    }

    [Fact]
    public void Update_a_dip_a_bad_reading_or_a_value_at_the_threshold_restarts_the_hold()
    {
        var d = new FeedStartDetector(0.05, TimeSpan.FromMinutes(5));
        d.Update(T0, 0.2, SampleQuality.Good);
        Assert.False(d.Update(T0.AddMinutes(3), 0.05, SampleQuality.Good));
        d.Update(T0.AddMinutes(4), 0.2, SampleQuality.Good);
        Assert.False(d.Update(T0.AddMinutes(8), 0.2, SampleQuality.Bad));
        Assert.False(d.Update(T0.AddMinutes(9), double.NaN, SampleQuality.Good));
        d.Update(T0.AddMinutes(10), 0.2, SampleQuality.Good);
        Assert.False(d.Update(T0.AddMinutes(14), 0.2, SampleQuality.Good));
        Assert.True(d.Update(T0.AddMinutes(15), 0.2, SampleQuality.Uncertain));
    }

    [Fact]
    public void Phases_ids_round_trip_and_unknown_ids_fail()
    {
        foreach (var p in BatchPhases.All)
        {
            Assert.True(BatchPhases.TryParse(BatchPhases.Id(p).ToUpperInvariant(), out var back));
            Assert.Equal(p, back);
        }

        Assert.False(BatchPhases.TryParse("stationary", out _));
        Assert.Equal("batch, fed-batch, induced, harvest", BatchPhases.Ids);
    }
}

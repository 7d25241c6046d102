using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Pipeline;

public class SignalStoreTests
{
    private static readonly DateTimeOffset T0 = new(2026, 12, 1, 8, 0, 0, TimeSpan.Zero);

    private static SignalStore Store(TimeSpan deadTime, TimeSpan maxAge) => new(
    [
        new TagBinding("air", SignalRole.AirFlowNlPerMin, "NL/min", 1, 0, maxAge, TimeSpan.Zero, "a", new PayloadOptions()),
        new TagBinding("o2", SignalRole.OutletO2Percent, "%", 1, 0, maxAge, deadTime, "o", new PayloadOptions()),
    ]);

    [Fact]
    public void Align_analyser_tag_with_dead_time_takes_the_value_from_dead_time_ago()
    {
        var store = Store(TimeSpan.FromSeconds(30), TimeSpan.FromSeconds(60));
        for (int s = 0; s <= 60; s += 10)
        {
            store.Accept(new Sample("o2", 20.0 - s / 10.0, T0.AddSeconds(s), SampleQuality.Good, 0));
            store.Accept(new Sample("air", 10.0 + s, T0.AddSeconds(s), SampleQuality.Good, 0));
        }

        var inputs = new AlignedInputs();
        var health = new InputHealth[2];
        store.Align(T0.AddSeconds(60), inputs, health);

        Assert.Equal(70.0, inputs[SignalRole.AirFlowNlPerMin]);
        Assert.Equal(17.0, inputs[SignalRole.OutletO2Percent]);
        Assert.Equal(T0.AddSeconds(30), inputs.SourceTimeOf(SignalRole.OutletO2Percent));
        Assert.All(health, h => Assert.Equal(InputState.Ok, h.State));
    }

    [Fact]
    public void Align_value_older_than_max_age_is_stale_and_bad()
    {
        var store = Store(TimeSpan.Zero, TimeSpan.FromSeconds(5));
        store.Accept(new Sample("air", 10, T0, SampleQuality.Good, 0));
        store.Accept(new Sample("o2", 19.5, T0.AddSeconds(4), SampleQuality.Good, 0));
        var inputs = new AlignedInputs();
        var health = new InputHealth[2];

        store.Align(T0.AddSeconds(6), inputs, health);

        Assert.Equal(InputState.Stale, health[0].State);
        Assert.Equal(SampleQuality.Bad, inputs.QualityOf(SignalRole.AirFlowNlPerMin));
        Assert.Equal(0x80310000u, health[0].StatusCode);
        Assert.Equal(InputState.Ok, health[1].State);
        Assert.Equal(SampleQuality.Good, inputs.QualityOf(SignalRole.OutletO2Percent));
    }

    [Fact]
    public void Align_before_any_sample_is_waiting_and_missing()
    {
        var store = Store(TimeSpan.Zero, TimeSpan.FromSeconds(5));
        var inputs = new AlignedInputs();
        var health = new InputHealth[2];
        store.Align(T0, inputs, health);
        Assert.False(inputs.Has(SignalRole.AirFlowNlPerMin));
        Assert.Equal(InputState.Waiting, health[0].State);
        Assert.Equal(0x80320000u, health[0].StatusCode);
    }

    [Fact]
    public void Accept_unknown_tag_or_non_finite_value_is_refused()
    {
        var store = Store(TimeSpan.Zero, TimeSpan.FromSeconds(5));
        Assert.False(store.Accept(new Sample("nope", 1, T0, SampleQuality.Good, 0)));
        Assert.False(store.Accept(new Sample("air", double.PositiveInfinity, T0, SampleQuality.Good, 0)));
        Assert.True(store.Accept(new Sample("air", 1, T0, SampleQuality.Good, 0)));
    }

    [Fact]
    public void TagHistory_late_sample_is_inserted_in_time_order()
    {
        var h = new TagHistory(4, "x");
        h.Add(new Sample("x", 1, T0, SampleQuality.Good, 0));
        h.Add(new Sample("x", 3, T0.AddSeconds(20), SampleQuality.Good, 0));
        h.Add(new Sample("x", 2, T0.AddSeconds(10), SampleQuality.Good, 0));
        Assert.Equal(2, h.AtOrBefore(T0.AddSeconds(15))!.Value.Value);
        Assert.Equal(3, h.Latest!.Value.Value);
        Assert.Equal("x", h.Latest!.Value.Tag);
    }

    [Fact]
    public void TagHistory_grows_to_its_capacity_then_drops_the_oldest_in_order()
    {
        // Starts at 8 entries and doubles: the order must survive growing from a ring that has wrapped.
        var h = new TagHistory(20, "x");
        for (int i = 0; i < 6; i++)
        {
            h.Add(new Sample("x", i, T0.AddSeconds(i), SampleQuality.Good, 0));
        }

        h.TrimBefore(T0.AddSeconds(3)); // keeps 3, 4, 5; the ring's start has moved
        for (int i = 6; i < 40; i++)
        {
            h.Add(new Sample("x", i, T0.AddSeconds(i), SampleQuality.Good, 0));
        }

        var held = new List<Sample>();
        h.CopyTo(held);
        Assert.Equal(20, h.Count);
        Assert.Equal(Enumerable.Range(20, 20).Select(i => (double)i), held.Select(s => s.Value));
        Assert.Equal(25, h.AtOrBefore(T0.AddSeconds(25.5))!.Value.Value);
    }
}

using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Alarms;

/// <summary>Drives an <see cref="AlarmEvaluator"/> with a fake clock: set signals, advance, evaluate.</summary>
internal sealed class AlarmTestKit
{
    private readonly AlarmSnapshot _snapshot = new();

    public AlarmTestKit(params AlarmRule[] rules)
    {
        Evaluator = new AlarmEvaluator(rules, TimeSpan.FromHours(8), Clock.GetUtcNow());
    }

    public FakeTimeProvider Clock { get; } = new(new DateTimeOffset(2026, 3, 1, 8, 0, 0, TimeSpan.Zero));

    public AlarmEvaluator Evaluator { get; }

    public List<AlarmTransition> Journal { get; } = [];

    public AlarmTestKit Set(string estimate, double value, SampleQuality quality = SampleQuality.Good)
    {
        _snapshot.Set(SignalRef.Estimate(estimate), value, quality);
        return this;
    }

    public AlarmTestKit Set(SignalRole role, double value, SampleQuality quality = SampleQuality.Good)
    {
        _snapshot.Set(SignalRef.Input(role), value, quality);
        return this;
    }

    public AlarmTestKit Remove() { _snapshot.Clear(); return this; }

    /// <summary>Advances the clock by <paramref name="seconds"/>, evaluates, and returns the state of the first rule.</summary>
    public AlarmState Step(double seconds = 10)
    {
        Clock.Advance(TimeSpan.FromSeconds(seconds));
        _snapshot.Time = Clock.GetUtcNow();
        Evaluator.Evaluate(_snapshot, Journal);
        return State();
    }

    public AlarmState State(int rule = 0) => Evaluator.StatusOf(Evaluator.Rules[rule].Id)!.State;

    public static AlarmRule High(double limit, double deadband = 0, double onDelayS = 0, double offDelayS = 0) => new()
    {
        Id = "rq_high",
        Kind = AlarmConditionKind.High,
        Source = SignalRef.Estimate(EstimateNames.Rq),
        Limit = limit,
        Deadband = deadband,
        OnDelay = TimeSpan.FromSeconds(onDelayS),
        OffDelay = TimeSpan.FromSeconds(offDelayS),
    };
}

using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Alarms;

/// <summary>
/// Deadband, on-delay and off-delay (ANSI/ISA-18.2-2016, detailed design of alarms: deadband and
/// on/off-delays against chattering alarms; from memory), on a fake clock: no test sleeps.
/// </summary>
public class AlarmDelayAndDeadbandTests
{
    [Fact]
    public void Evaluate_HighWithDeadband_ClearsOnlyBelowLimitMinusDeadband()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(limit: 1.2, deadband: 0.05));
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Rq, 1.20).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 1.21).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 1.19).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 1.151).Step());
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(EstimateNames.Rq, 1.149).Step());
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(EstimateNames.Rq, 1.19).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 1.2001).Step());
    }

    [Fact]
    public void Evaluate_ChatteringAroundLimitWithoutDeadband_ChattersWithDeadband_DoesNot()
    {
        var plain = new AlarmTestKit(AlarmTestKit.High(limit: 1.2));
        var damped = new AlarmTestKit(AlarmTestKit.High(limit: 1.2, deadband: 0.05));
        foreach (double v in new[] { 1.21, 1.19, 1.21, 1.19, 1.21, 1.19 })
        {
            plain.Set(EstimateNames.Rq, v).Step();
            damped.Set(EstimateNames.Rq, v).Step();
        }

        Assert.Equal(6, plain.Journal.Count);
        Assert.Single(damped.Journal);
    }

    [Fact]
    public void Evaluate_OnDelay_ActivatesOnlyAfterConditionHeldForTheDelay()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(limit: 1.2, onDelayS: 60));
        kit.Set(EstimateNames.Rq, 1.3);
        Assert.Equal(AlarmState.Normal, kit.Step(0));
        Assert.Equal(AlarmState.Normal, kit.Step(30));
        Assert.Equal(AlarmState.Normal, kit.Step(29.9));
        Assert.Equal(AlarmState.Unacknowledged, kit.Step(0.1));
        var t = Assert.Single(kit.Journal);
        Assert.Equal(kit.Clock.GetUtcNow(), t.Time);
    }

    [Fact]
    public void Evaluate_OnDelayInterruptedByAClearReading_StartsTheDelayAgain()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(limit: 1.2, onDelayS: 60));
        kit.Set(EstimateNames.Rq, 1.3).Step(0);
        kit.Set(EstimateNames.Rq, 1.3).Step(50);
        kit.Set(EstimateNames.Rq, 1.1).Step(5);
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Rq, 1.3).Step(5));
        Assert.Equal(AlarmState.Normal, kit.Step(59));
        Assert.Equal(AlarmState.Unacknowledged, kit.Step(1));
    }

    [Fact]
    public void Evaluate_OffDelay_ReturnsToNormalOnlyAfterConditionGoneForTheDelay()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(limit: 1.2, offDelayS: 120));
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 1.3).Step());
        kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.Acknowledge, "rq_high", kit.Clock.GetUtcNow(), "op"));
        kit.Set(EstimateNames.Rq, 1.0);
        Assert.Equal(AlarmState.Acknowledged, kit.Step(0));
        Assert.Equal(AlarmState.Acknowledged, kit.Step(119));
        Assert.Equal(AlarmState.Normal, kit.Step(1));
    }

    [Fact]
    public void Evaluate_OffDelayInterruptedByARepeat_KeepsTheAlarmWithoutANewActivation()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(limit: 1.2, offDelayS: 120));
        kit.Set(EstimateNames.Rq, 1.3).Step();
        kit.Set(EstimateNames.Rq, 1.0).Step(100);
        kit.Set(EstimateNames.Rq, 1.3).Step(10);
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 1.0).Step(100));
        Assert.Single(kit.Journal);
        Assert.Equal(AlarmState.Unacknowledged, kit.Step(119));
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Step(1));
    }

    [Fact]
    public void DelayFilter_NegativeDelay_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new DelayFilter(TimeSpan.FromSeconds(-1), TimeSpan.Zero));
    }

    [Fact]
    public void Evaluate_LowWithDeadband_ClearsOnlyAboveLimitPlusDeadband()
    {
        var rule = new AlarmRule
        {
            Id = "do_low", Kind = AlarmConditionKind.Low, Source = SignalRef.Input(SignalRole.DissolvedOxygenPercent),
            Limit = 20, Deadband = 2,
        };
        var kit = new AlarmTestKit(rule);
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(SignalRole.DissolvedOxygenPercent, 19.9).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(SignalRole.DissolvedOxygenPercent, 21.9).Step());
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(SignalRole.DissolvedOxygenPercent, 22.1).Step());
    }

    [Fact]
    public void Evaluate_WindowWithDeadband_ClearsOnlyInsideTheNarrowedWindow()
    {
        // An RQ window for respiro-fermentative onset: RQ near 1.0 on sugar is common practice; above
        // 1.1 means ethanol formation (Postma et al. 1989, Appl. Environ. Microbiol. 55, RQ above 1.6
        // beyond the critical dilution rate). Limits here are demo values.
        var rule = new AlarmRule
        {
            Id = "rq_window", Kind = AlarmConditionKind.Window, Source = SignalRef.Estimate(EstimateNames.Rq),
            Low = 0.9, High = 1.1, Deadband = 0.02,
        };
        var kit = new AlarmTestKit(rule);
        Assert.Equal(AlarmState.Normal, kit.Set(EstimateNames.Rq, 1.0).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 1.12).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 1.09).Step());
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(EstimateNames.Rq, 1.07).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 0.89).Step());
        Assert.Equal(AlarmState.Unacknowledged, kit.Set(EstimateNames.Rq, 0.91).Step());
        Assert.Equal(AlarmState.ReturnedUnacknowledged, kit.Set(EstimateNames.Rq, 0.93).Step());
    }
}

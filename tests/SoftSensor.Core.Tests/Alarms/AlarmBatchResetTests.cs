using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Alarms;

/// <summary>
/// A new batch clears the previous batch's alarm process states back to A (normal) of the
/// ANSI/ISA-18.2-2016 state model (from memory) while the operator's masks (shelved, out of service)
/// stay; the condition is then detected afresh, with its on-delay.
/// </summary>
public class AlarmBatchResetTests
{
    [Fact]
    public void BeginBatch_unacknowledged_alarm_returns_to_normal_with_a_new_batch_transition()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2));
        kit.Set(EstimateNames.Rq, 1.5);
        Assert.Equal(AlarmState.Unacknowledged, kit.Step());
        var t = new List<AlarmTransition>();
        Assert.Equal(1, kit.Evaluator.BeginBatch(kit.Clock.GetUtcNow(), t));
        Assert.Equal((AlarmState.Unacknowledged, AlarmState.Normal, AlarmCause.NewBatch), (t[0].From, t[0].To, t[0].Cause));
        var status = kit.Evaluator.StatusOf("rq_high")!;
        Assert.False(status.ConditionPresent);
        Assert.Equal(AlarmState.Normal, status.UnmaskedState);
    }

    [Fact]
    public void BeginBatch_normal_alarms_give_no_transition()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2));
        kit.Set(EstimateNames.Rq, 1.0).Step();
        var t = new List<AlarmTransition>();
        Assert.Equal(0, kit.Evaluator.BeginBatch(kit.Clock.GetUtcNow(), t));
    }

    [Fact]
    public void BeginBatch_keeps_a_shelve_but_clears_the_state_beneath_it()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2));
        kit.Set(EstimateNames.Rq, 1.5).Step();
        Assert.True(kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.Shelve, "rq_high", kit.Clock.GetUtcNow(), "anna", TimeSpan.FromHours(1))).Applied);
        var t = new List<AlarmTransition>();
        Assert.Equal(1, kit.Evaluator.BeginBatch(kit.Clock.GetUtcNow(), t));
        var status = kit.Evaluator.StatusOf("rq_high")!;
        Assert.Equal(AlarmState.Shelved, status.State);
        Assert.Equal(AlarmState.Normal, status.UnmaskedState);
    }

    [Fact]
    public void BeginBatch_condition_still_present_is_raised_again_only_after_its_on_delay()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2, onDelayS: 60));
        kit.Set(EstimateNames.Rq, 1.5);
        kit.Step();
        Assert.Equal(AlarmState.Unacknowledged, kit.Step(60));
        kit.Evaluator.BeginBatch(kit.Clock.GetUtcNow(), []);
        Assert.Equal(AlarmState.Normal, kit.Step(10));
        Assert.Equal(AlarmState.Normal, kit.Step(40));
        Assert.Equal(AlarmState.Unacknowledged, kit.Step(20));
    }
}

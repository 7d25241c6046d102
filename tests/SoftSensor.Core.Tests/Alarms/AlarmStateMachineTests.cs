using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Alarms;

namespace SoftSensor.Core.Tests.Alarms;

/// <summary>
/// Every transition of the alarm state model of ANSI/ISA-18.2-2016 (states A normal, B
/// unacknowledged, C acknowledged, D return-to-normal unacknowledged, F shelved, G suppressed by
/// design, H out of service; the figure of the alarm states, from memory) and of its open
/// counterpart, the OPC UA alarm model (IEC 62541 Part 9 §4.8 and §5.8: shelving is an operator
/// action with a time limit, suppression is set by the system). Time is a fake clock.
/// </summary>
public class AlarmStateMachineTests
{
    private readonly FakeTimeProvider _clock = new(new DateTimeOffset(2026, 3, 1, 8, 0, 0, TimeSpan.Zero));

    private DateTimeOffset Now => _clock.GetUtcNow();

    private AlarmStateMachine NewMachine() => new("do_low", AlarmPriority.High, Now);

    private AlarmStateMachine In(AlarmState state)
    {
        var m = NewMachine();
        switch (state)
        {
            case AlarmState.Normal:
                break;
            case AlarmState.Unacknowledged:
                m.Step(Now, true, false, 1);
                break;
            case AlarmState.Acknowledged:
                m.Step(Now, true, false, 1);
                m.Acknowledge(Now, "op", out _);
                break;
            case AlarmState.ReturnedUnacknowledged:
                m.Step(Now, true, false, 1);
                m.Step(Now, false, false, 0);
                break;
            case AlarmState.Shelved:
                m.Shelve(Now, Now.AddHours(1), "op", out _);
                break;
            case AlarmState.SuppressedByDesign:
                m.Step(Now, false, true, double.NaN);
                break;
            case AlarmState.OutOfService:
                m.RemoveFromService(Now, "tech", out _);
                break;
        }

        Assert.Equal(state, m.State);
        _clock.Advance(TimeSpan.FromSeconds(10));
        return m;
    }

    [Fact]
    public void Step_NormalWithConditionPresent_GoesUnacknowledged()
    {
        var m = In(AlarmState.Normal);
        var t = m.Step(Now, true, false, 42.0);
        Assert.NotNull(t);
        Assert.Equal((AlarmState.Normal, AlarmState.Unacknowledged, AlarmCause.Activated), (t.From, t.To, t.Cause));
        Assert.Equal(42.0, t.Value);
        Assert.Equal(Now, t.Time);
        Assert.Equal(Now, m.Since);
        Assert.Null(t.Operator);
    }

    [Fact]
    public void Step_NormalWithConditionAbsent_StaysNormalWithoutTransition()
    {
        var m = In(AlarmState.Normal);
        Assert.Null(m.Step(Now, false, false, 0));
        Assert.Equal(AlarmState.Normal, m.State);
    }

    [Fact]
    public void Acknowledge_Unacknowledged_GoesAcknowledgedAndNamesTheOperator()
    {
        var m = In(AlarmState.Unacknowledged);
        var t = m.Acknowledge(Now, "anna", out string refusal);
        Assert.NotNull(t);
        Assert.Equal((AlarmState.Unacknowledged, AlarmState.Acknowledged, AlarmCause.Acknowledged), (t.From, t.To, t.Cause));
        Assert.Equal("anna", t.Operator);
        Assert.Equal("", refusal);
    }

    [Fact]
    public void Step_UnacknowledgedConditionClears_GoesReturnedUnacknowledged()
    {
        var m = In(AlarmState.Unacknowledged);
        var t = m.Step(Now, false, false, 0);
        Assert.Equal((AlarmState.Unacknowledged, AlarmState.ReturnedUnacknowledged, AlarmCause.ReturnedToNormal), (t!.From, t.To, t.Cause));
    }

    [Fact]
    public void Step_AcknowledgedConditionClears_GoesNormal()
    {
        var m = In(AlarmState.Acknowledged);
        var t = m.Step(Now, false, false, 0);
        Assert.Equal((AlarmState.Acknowledged, AlarmState.Normal, AlarmCause.ReturnedToNormal), (t!.From, t.To, t.Cause));
    }

    [Fact]
    public void Step_AcknowledgedConditionStillPresent_StaysAcknowledged()
    {
        var m = In(AlarmState.Acknowledged);
        Assert.Null(m.Step(Now, true, false, 1));
        Assert.Equal(AlarmState.Acknowledged, m.State);
    }

    [Fact]
    public void Acknowledge_ReturnedUnacknowledged_GoesNormal()
    {
        var m = In(AlarmState.ReturnedUnacknowledged);
        var t = m.Acknowledge(Now, "anna", out _);
        Assert.Equal((AlarmState.ReturnedUnacknowledged, AlarmState.Normal, AlarmCause.Acknowledged), (t!.From, t.To, t.Cause));
    }

    [Fact]
    public void Step_ReturnedUnacknowledgedConditionBack_GoesUnacknowledgedAgain()
    {
        var m = In(AlarmState.ReturnedUnacknowledged);
        var t = m.Step(Now, true, false, 1);
        Assert.Equal((AlarmState.ReturnedUnacknowledged, AlarmState.Unacknowledged, AlarmCause.Reactivated), (t!.From, t.To, t.Cause));
    }

    [Theory]
    [InlineData(AlarmState.Normal)]
    [InlineData(AlarmState.Acknowledged)]
    [InlineData(AlarmState.Shelved)]
    [InlineData(AlarmState.SuppressedByDesign)]
    [InlineData(AlarmState.OutOfService)]
    public void Acknowledge_StateWithNothingPending_IsRefusedWithTheState(AlarmState state)
    {
        var m = In(state);
        Assert.Null(m.Acknowledge(Now, "anna", out string refusal));
        Assert.Equal($"alarm 'do_low' is {AlarmStates.Id(state)}: nothing to acknowledge", refusal);
        Assert.Equal(state, m.State);
    }

    [Theory]
    [InlineData(AlarmState.Normal)]
    [InlineData(AlarmState.Unacknowledged)]
    [InlineData(AlarmState.Acknowledged)]
    [InlineData(AlarmState.ReturnedUnacknowledged)]
    [InlineData(AlarmState.SuppressedByDesign)]
    public void Shelve_FromAnyStateInService_GoesShelvedWithExpiry(AlarmState state)
    {
        var m = In(state);
        var until = Now.AddMinutes(30);
        var t = m.Shelve(Now, until, "anna", out _);
        Assert.Equal((state, AlarmState.Shelved, AlarmCause.Shelved), (t!.From, t.To, t.Cause));
        Assert.Equal(until, t.ShelvedUntil);
        Assert.Equal(until, m.Status.ShelvedUntil);
    }

    [Fact]
    public void Shelve_AlreadyShelved_JournalsTheNewExpiry()
    {
        var m = In(AlarmState.Shelved);
        var t = m.Shelve(Now, Now.AddHours(2), "anna", out _);
        Assert.Equal((AlarmState.Shelved, AlarmState.Shelved, AlarmCause.Shelved), (t!.From, t.To, t.Cause));
        Assert.Equal(Now.AddHours(2), t.ShelvedUntil);
    }

    [Fact]
    public void Shelve_OutOfServiceOrExpiryNotInFuture_IsRefused()
    {
        var oos = In(AlarmState.OutOfService);
        Assert.Null(oos.Shelve(Now, Now.AddHours(1), "anna", out string r1));
        Assert.Equal("alarm 'do_low' is out of service: return it to service before shelving", r1);
        var normal = In(AlarmState.Normal);
        Assert.Null(normal.Shelve(Now, Now, "anna", out string r2));
        Assert.StartsWith("alarm 'do_low': shelve expiry ", r2, StringComparison.Ordinal);
    }

    [Fact]
    public void Step_ShelvedConditionComesAndGoes_StaysShelvedSilently()
    {
        var m = In(AlarmState.Shelved);
        Assert.Null(m.Step(Now, true, false, 1));
        Assert.Null(m.Step(Now, false, false, 0));
        Assert.Equal(AlarmState.Shelved, m.State);
    }

    [Fact]
    public void Step_ShelveExpiresWhileConditionPresent_GoesUnacknowledged()
    {
        var m = In(AlarmState.Shelved);
        m.Step(Now, true, false, 1);
        _clock.Advance(TimeSpan.FromHours(1));
        var t = m.Step(Now, true, false, 1);
        Assert.Equal((AlarmState.Shelved, AlarmState.Unacknowledged, AlarmCause.ShelveExpired), (t!.From, t.To, t.Cause));
    }

    [Fact]
    public void Step_ShelveExpiresWhileConditionAbsent_GoesNormal()
    {
        var m = In(AlarmState.Shelved);
        _clock.Advance(TimeSpan.FromMinutes(59));
        Assert.Null(m.Step(Now, false, false, 0));
        _clock.Advance(TimeSpan.FromMinutes(1));
        var t = m.Step(Now, false, false, 0);
        Assert.Equal((AlarmState.Shelved, AlarmState.Normal, AlarmCause.ShelveExpired), (t!.From, t.To, t.Cause));
    }

    [Fact]
    public void Unshelve_ConditionPresent_GoesUnacknowledged_Absent_GoesNormal()
    {
        var present = In(AlarmState.Shelved);
        present.Step(Now, true, false, 1);
        var t1 = present.Unshelve(Now, "anna", out _);
        Assert.Equal((AlarmState.Shelved, AlarmState.Unacknowledged, AlarmCause.Unshelved), (t1!.From, t1.To, t1.Cause));
        var absent = In(AlarmState.Shelved);
        var t2 = absent.Unshelve(Now, "anna", out _);
        Assert.Equal((AlarmState.Shelved, AlarmState.Normal, AlarmCause.Unshelved), (t2!.From, t2.To, t2.Cause));
    }

    [Fact]
    public void Unshelve_NotShelved_IsRefused()
    {
        var m = In(AlarmState.Unacknowledged);
        Assert.Null(m.Unshelve(Now, "anna", out string refusal));
        Assert.Equal("alarm 'do_low' is unacknowledged, not shelved", refusal);
    }

    [Theory]
    [InlineData(AlarmState.Normal)]
    [InlineData(AlarmState.Unacknowledged)]
    [InlineData(AlarmState.Acknowledged)]
    [InlineData(AlarmState.ReturnedUnacknowledged)]
    public void Step_SignalGoesBad_GoesSuppressedByDesign(AlarmState state)
    {
        var m = In(state);
        var t = m.Step(Now, false, true, double.NaN);
        Assert.Equal((state, AlarmState.SuppressedByDesign, AlarmCause.Suppressed), (t!.From, t.To, t.Cause));
    }

    [Fact]
    public void Step_SuppressionEnds_GoesUnacknowledgedOrNormalByCondition()
    {
        var a = In(AlarmState.SuppressedByDesign);
        var t1 = a.Step(Now, true, false, 5);
        Assert.Equal((AlarmState.SuppressedByDesign, AlarmState.Unacknowledged, AlarmCause.Unsuppressed), (t1!.From, t1.To, t1.Cause));
        var b = In(AlarmState.SuppressedByDesign);
        var t2 = b.Step(Now, false, false, 0);
        Assert.Equal((AlarmState.SuppressedByDesign, AlarmState.Normal, AlarmCause.Unsuppressed), (t2!.From, t2.To, t2.Cause));
    }

    [Fact]
    public void Step_ShelveExpiresWhileSuppressed_GoesSuppressed()
    {
        var m = In(AlarmState.Shelved);
        m.Step(Now, false, true, double.NaN);
        Assert.Equal(AlarmState.Shelved, m.State);
        _clock.Advance(TimeSpan.FromHours(1));
        var t = m.Step(Now, false, true, double.NaN);
        Assert.Equal((AlarmState.Shelved, AlarmState.SuppressedByDesign, AlarmCause.ShelveExpired), (t!.From, t.To, t.Cause));
    }

    [Theory]
    [InlineData(AlarmState.Normal)]
    [InlineData(AlarmState.Unacknowledged)]
    [InlineData(AlarmState.Acknowledged)]
    [InlineData(AlarmState.ReturnedUnacknowledged)]
    [InlineData(AlarmState.Shelved)]
    [InlineData(AlarmState.SuppressedByDesign)]
    public void RemoveFromService_FromAnyOtherState_GoesOutOfService(AlarmState state)
    {
        var m = In(state);
        var t = m.RemoveFromService(Now, "tech", out _);
        Assert.Equal((state, AlarmState.OutOfService, AlarmCause.RemovedFromService), (t!.From, t.To, t.Cause));
        Assert.Null(m.Status.ShelvedUntil);
    }

    [Fact]
    public void RemoveFromService_AlreadyOut_IsRefused()
    {
        var m = In(AlarmState.OutOfService);
        Assert.Null(m.RemoveFromService(Now, "tech", out string refusal));
        Assert.Equal("alarm 'do_low' is already out of service", refusal);
    }

    [Fact]
    public void Step_OutOfService_IgnoresConditionAndSuppression()
    {
        var m = In(AlarmState.OutOfService);
        Assert.Null(m.Step(Now, true, false, 1));
        Assert.Null(m.Step(Now, true, true, double.NaN));
        Assert.Equal(AlarmState.OutOfService, m.State);
    }

    [Fact]
    public void ReturnToService_ConditionPresent_GoesUnacknowledged_Absent_GoesNormal_Bad_GoesSuppressed()
    {
        var present = In(AlarmState.OutOfService);
        present.Step(Now, true, false, 1);
        var t1 = present.ReturnToService(Now, "tech", out _);
        Assert.Equal((AlarmState.OutOfService, AlarmState.Unacknowledged, AlarmCause.ReturnedToService), (t1!.From, t1.To, t1.Cause));
        var absent = In(AlarmState.OutOfService);
        var t2 = absent.ReturnToService(Now, "tech", out _);
        Assert.Equal((AlarmState.OutOfService, AlarmState.Normal, AlarmCause.ReturnedToService), (t2!.From, t2.To, t2.Cause));
        var bad = In(AlarmState.OutOfService);
        bad.Step(Now, false, true, double.NaN);
        var t3 = bad.ReturnToService(Now, "tech", out _);
        Assert.Equal((AlarmState.OutOfService, AlarmState.SuppressedByDesign, AlarmCause.ReturnedToService), (t3!.From, t3.To, t3.Cause));
    }

    [Fact]
    public void ReturnToService_InService_IsRefused()
    {
        var m = In(AlarmState.Normal);
        Assert.Null(m.ReturnToService(Now, "tech", out string refusal));
        Assert.Equal("alarm 'do_low' is normal, not out of service", refusal);
    }

    [Fact]
    public void Restore_SavedStatus_ContinuesFromIt()
    {
        var m = In(AlarmState.Acknowledged);
        var saved = m.Status;
        var restored = NewMachine();
        restored.Restore(saved);
        Assert.Equal(saved, restored.Status);
        var t = restored.Step(Now, false, false, 0);
        Assert.Equal((AlarmState.Acknowledged, AlarmState.Normal), (t!.From, t.To));
    }

    [Fact]
    public void Restore_MaskAsUnmaskedState_Throws()
    {
        var m = NewMachine();
        var bad = m.Status with { UnmaskedState = AlarmState.Shelved };
        var e = Assert.Throws<ArgumentException>(() => m.Restore(bad));
        Assert.StartsWith("alarm 'do_low': unmasked state Shelved must be one of A–D", e.Message, StringComparison.Ordinal);
    }
}

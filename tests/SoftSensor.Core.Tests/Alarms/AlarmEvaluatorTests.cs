using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;

namespace SoftSensor.Core.Tests.Alarms;

/// <summary>Commands, restart and configuration checks of the evaluator.</summary>
public class AlarmEvaluatorTests
{
    private static DateTimeOffset T0 => new(2026, 3, 1, 8, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Apply_ShelveThroughEvaluator_ExpiresOnTheEvaluationClock()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2));
        kit.Set(EstimateNames.Rq, 1.5).Step();
        var r = kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.Shelve, "rq_high", kit.Clock.GetUtcNow(), "anna", TimeSpan.FromMinutes(20)));
        Assert.True(r.Applied, r.Message);
        Assert.Equal(AlarmState.Shelved, kit.State());
        Assert.Equal(AlarmState.Shelved, kit.Step(1190));
        Assert.Equal(AlarmState.Unacknowledged, kit.Step(10));
        Assert.Equal(AlarmCause.ShelveExpired, kit.Journal[^1].Cause);
    }

    [Fact]
    public void Apply_ShelveLongerThanAllowed_IsRefusedWithTheLimit()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2));
        var r = kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.Shelve, "rq_high", T0, "anna", TimeSpan.FromHours(9)));
        Assert.False(r.Applied);
        Assert.Equal("alarm 'rq_high': shelve duration 09:00:00 must be above zero and at most 08:00:00", r.Message);
        var none = kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.Shelve, "rq_high", T0, "anna"));
        Assert.Equal("alarm 'rq_high': shelve duration (none) must be above zero and at most 08:00:00", none.Message);
    }

    [Fact]
    public void Apply_UnknownRule_IsRefusedNotThrown()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2));
        var r = kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.Acknowledge, "nope", T0, "anna"));
        Assert.False(r.Applied);
        Assert.Equal("no alarm rule 'nope'", r.Message);
    }

    [Fact]
    public void Apply_AcknowledgeAll_AcknowledgesEveryPendingAlarm()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2), AlarmTestKit.High(1.2) with { Id = "rq_high2" }, AlarmTestKit.High(9) with { Id = "quiet" });
        kit.Set(EstimateNames.Rq, 1.5).Step();
        var r = kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.Acknowledge, AlarmCommand.AllRules, kit.Clock.GetUtcNow(), "anna"));
        Assert.True(r.Applied);
        Assert.Equal(2, r.Transitions.Count);
        Assert.All(r.Transitions, t => Assert.Equal(AlarmState.Acknowledged, t.To));
        Assert.Equal(AlarmState.Normal, kit.State(2));
    }

    [Fact]
    public void Apply_RemoveAndReturnToService_ReenterWithCurrentCondition()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2));
        var now = kit.Clock.GetUtcNow();
        Assert.True(kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.RemoveFromService, "rq_high", now, "tech")).Applied);
        Assert.Equal(AlarmState.OutOfService, kit.Set(EstimateNames.Rq, 1.5).Step());
        var r = kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.ReturnToService, "rq_high", kit.Clock.GetUtcNow(), "tech"));
        Assert.Equal(AlarmState.Unacknowledged, Assert.Single(r.Transitions).To);
    }

    [Fact]
    public void Restore_AfterRestart_KeepsAcknowledgedAlarmWithoutReannunciating()
    {
        var kit = new AlarmTestKit(AlarmTestKit.High(1.2));
        kit.Set(EstimateNames.Rq, 1.5).Step();
        kit.Evaluator.Apply(new AlarmCommand(AlarmCommandKind.Acknowledge, "rq_high", kit.Clock.GetUtcNow(), "anna"));
        var saved = kit.Evaluator.Statuses.ToList();

        var again = new AlarmTestKit(AlarmTestKit.High(1.2));
        again.Evaluator.Restore(saved);
        Assert.Equal(AlarmState.Acknowledged, again.Set(EstimateNames.Rq, 1.5).Step());
        Assert.Empty(again.Journal);
    }

    [Fact]
    public void Constructor_BadRules_ListsEveryProblemInOneMessage()
    {
        var rules = new[]
        {
            new AlarmRule { Id = "Bad Id", Kind = AlarmConditionKind.High, Source = SignalRef.Estimate("rq") },
            new AlarmRule { Id = "w", Kind = AlarmConditionKind.Window, Source = SignalRef.Estimate("rq"), Low = 1, High = 1.1, Deadband = 0.1 },
            new AlarmRule { Id = "w", Kind = AlarmConditionKind.AboveReference, Source = SignalRef.Estimate("rq"), OnDelay = TimeSpan.FromSeconds(-1) },
        };
        var e = Assert.Throws<ArgumentException>(() => new AlarmEvaluator(rules, TimeSpan.Zero, T0));
        Assert.Equal(
            string.Join(Environment.NewLine,
                "alarm rule 'Bad Id': id must be non-empty lowercase letters, digits, '_', '-' or '.'",
                "alarm rule 'Bad Id': limit is NaN, expected a finite number",
                "alarm rule 'w': window [1, 1.1] must be wider than twice the deadband 0.1",
                "alarm rule 'w': id used twice",
                "alarm rule 'w': reference is required for kind AboveReference",
                "alarm rule 'w': onDelay is -00:00:01, expected zero or more",
                "maxShelve is 00:00:00, expected a duration above zero") + " (Parameter 'rules')",
            e.Message);
    }

    [Theory]
    [InlineData("rq", SignalOrigin.Estimate, "rq")]
    [InlineData("estimate:mu_per_h", SignalOrigin.Estimate, "mu_per_h")]
    [InlineData("input:OutletO2Percent", SignalOrigin.Input, "OutletO2Percent")]
    [InlineData("tag:PT-101", SignalOrigin.Tag, "PT-101")]
    public void SignalRefTryParse_ValidForms_Parse(string text, SignalOrigin origin, string name)
    {
        Assert.True(SignalRef.TryParse(text, out var r, out _));
        Assert.Equal(new SignalRef(origin, name), r);
        Assert.Equal(text.StartsWith("estimate:", StringComparison.Ordinal) ? name : text, r.ToString());
    }

    [Theory]
    [InlineData("", "a signal is required: an estimate id (e.g. 'rq'), 'input:<SignalRole>' or 'tag:<name>'")]
    [InlineData("input:", "'input:' names no signal after 'input:'")]
    [InlineData("sensor:x", "'sensor:x': unknown prefix 'sensor'; expected 'estimate:', 'input:' or 'tag:'")]
    [InlineData("input:7", "'input:7': '7' is not a signal role; expected one of ")]
    public void SignalRefTryParse_BadForms_NameTheText(string text, string expected)
    {
        Assert.False(SignalRef.TryParse(text, out _, out string error));
        Assert.StartsWith(expected, error, StringComparison.Ordinal);
    }

    [Fact]
    public void AlarmSnapshotAddFrame_TakesEveryEstimateAndTheFrameTime()
    {
        var frame = new EstimateFrame("r1", "b1", T0, SampleQuality.Good,
            [new EstimateValue(EstimateNames.Rq, 1.01, "1", 0.01, SampleQuality.Good, 0)]);
        var inputs = new AlignedInputs();
        inputs.Set(SignalRole.PressureKPa, 130, SampleQuality.Uncertain, T0);
        var s = new AlarmSnapshot();
        s.AddFrame(frame);
        s.AddInputs(inputs);
        s.AddSample(new Sample("PT-101", 131, T0, SampleQuality.Good, 0));
        Assert.Equal(T0, s.Time);
        Assert.Equal(3, s.Count);
        Assert.True(s.TryGet(SignalRef.Input(SignalRole.PressureKPa), out var p));
        Assert.Equal(new SignalReading(130, SampleQuality.Uncertain), p);
    }

    [Fact]
    public void AlarmStatesTryParse_EveryId_RoundTrips()
    {
        foreach (var s in Enum.GetValues<AlarmState>())
        {
            Assert.True(AlarmStates.TryParse(AlarmStates.Id(s), out var back));
            Assert.Equal(s, back);
        }

        Assert.False(AlarmStates.TryParse("latched", out _));
    }
}

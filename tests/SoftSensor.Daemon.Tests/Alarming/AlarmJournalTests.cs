using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Alarming;

namespace SoftSensor.Daemon.Tests.Alarming;

/// <summary>The journal on a real SQLite file, and the engine restoring from it after a restart.</summary>
public sealed class AlarmJournalTests : IDisposable
{
    private static readonly DateTimeOffset T = new(2026, 3, 1, 8, 0, 0, TimeSpan.Zero);
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-journal-").FullName;

    private string Db => Path.Combine(_dir, "softsensor.db");

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static AlarmRuleSet Rules() => new(
    [
        new AlarmRule { Id = "rq_high", Kind = AlarmConditionKind.High, Source = SignalRef.Estimate(EstimateNames.Rq), Limit = 1.2, Message = "RQ high" },
    ], TimeSpan.FromHours(8), []);

    private static EstimateFrame Frame(double rq, int s, SampleQuality q = SampleQuality.Good) =>
        new("r1", "b1", T.AddSeconds(s), q, [new EstimateValue(EstimateNames.Rq, rq, "1", double.NaN, q, 0)]);

    [Fact]
    public void Append_Transitions_JournaledWithCauseOperatorAndText()
    {
        using var journal = new AlarmJournal(Db);
        var engine = new AlarmEngine(Rules(), journal.Statuses);
        journal.Append("r1", engine.Evaluate(Frame(1.5, 0), null).Items);
        var (result, changes) = engine.Apply("r1", new AlarmCommand(AlarmCommandKind.Acknowledge, "rq_high", T.AddSeconds(5), "anna"));
        Assert.True(result.Applied);
        journal.Append("r1", changes.Items);
        var recent = journal.Recent("r1", 10);
        Assert.Equal(2, recent.Count);
        Assert.Equal((AlarmState.Unacknowledged, AlarmState.Acknowledged, AlarmCause.Acknowledged, "anna"),
            (recent[0].Transition.From, recent[0].Transition.To, recent[0].Transition.Cause, recent[0].Transition.Operator));
        Assert.Equal((AlarmState.Normal, AlarmState.Unacknowledged, 1.5, "RQ high", "process"),
            (recent[1].Transition.From, recent[1].Transition.To, recent[1].Transition.Value, recent[1].Message, recent[1].Category));
    }

    [Fact]
    public void Statuses_AfterRestart_RestoreTheEngineWithoutReannunciating()
    {
        using (var journal = new AlarmJournal(Db))
        {
            var engine = new AlarmEngine(Rules(), journal.Statuses);
            journal.Append("r1", engine.Evaluate(Frame(1.5, 0), null).Items);
            journal.Append("r1", engine.Apply("r1", new AlarmCommand(AlarmCommandKind.Shelve, "rq_high", T.AddSeconds(1), "anna", TimeSpan.FromMinutes(10))).Changes.Items);
        }

        using var again = new AlarmJournal(Db);
        var restarted = new AlarmEngine(Rules(), again.Statuses);
        Assert.Empty(restarted.Evaluate(Frame(1.5, 60), null).Items);
        var state = Assert.Single(restarted.States());
        Assert.Equal(("shelved", T.AddSeconds(1).AddMinutes(10)), (state.State, state.ShelvedUntil));
        var expired = restarted.Evaluate(Frame(1.5, 601), null).Items;
        Assert.Equal(AlarmCause.ShelveExpired, Assert.Single(expired).Transition.Cause);
    }

    [Fact]
    public void Apply_UnknownReactor_IsRefusedWithTheKnownOnes()
    {
        using var journal = new AlarmJournal(Db);
        var engine = new AlarmEngine(Rules(), journal.Statuses);
        engine.Evaluate(Frame(1.0, 0), null);
        var (result, _) = engine.Apply("r9", new AlarmCommand(AlarmCommandKind.Acknowledge, "rq_high", T, "anna"));
        Assert.Equal("reactor 'r9' has no alarms yet (known: r1)", result.Message);
    }
}

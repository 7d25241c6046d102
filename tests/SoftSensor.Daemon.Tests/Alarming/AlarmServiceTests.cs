using System.Text;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Alarming;

namespace SoftSensor.Daemon.Tests.Alarming;

/// <summary>
/// The shipped rules through the alarm service on a real SQLite journal, with frames as a cycle
/// would make them (invented demo values): an aeration trip turns the estimates bad, the
/// data-quality alarm fires, the estimate-based alarms are suppressed by design.
/// </summary>
public sealed class AlarmServiceTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-alarms-").FullName;
    private readonly FakeTimeProvider _clock = new(new DateTimeOffset(2026, 3, 2, 6, 0, 0, TimeSpan.Zero));
    private readonly AlignedInputs _inputs = new();
    private readonly AlarmJournal _journal;
    private readonly RecordingPublisher _published = new();
    private readonly AlarmService _service;

    public AlarmServiceTests()
    {
        _journal = new AlarmJournal(Path.Combine(_dir, "softsensor.db"));
        var rules = AlarmRuleFile.Load(Directory.GetFiles(AlarmRuleFileTests.ConfigDir, "*.json").Order(StringComparer.Ordinal));
        _service = new AlarmService(new AlarmEngine(rules, _journal.Statuses, _journal.BatchOf), _journal, [new InputsSignal(_inputs)], [_published], _clock, NullLogger<AlarmService>.Instance);
    }

    public void Dispose()
    {
        _journal.Dispose();
        Directory.Delete(_dir, recursive: true);
    }

    private async Task CycleAsync(double rq, SampleQuality quality, double airNlPerMin, double feedLPerH, int seconds = 10, string batch = "b-7")
    {
        _clock.Advance(TimeSpan.FromSeconds(seconds));
        var now = _clock.GetUtcNow();
        _inputs.Time = now;
        _inputs.Set(SignalRole.AirFlowNlPerMin, airNlPerMin, SampleQuality.Good, now);
        _inputs.Set(SignalRole.OutletO2Percent, 19.5 + (0.01 * (now.Second % 7)), SampleQuality.Good, now);
        _inputs.Set(SignalRole.OutletCo2Percent, 1.5 + (0.01 * (now.Second % 5)), SampleQuality.Good, now);
        _inputs.Set(SignalRole.PressureKPa, 150, SampleQuality.Good, now);
        _inputs.Set(SignalRole.TemperatureC, 30, SampleQuality.Good, now);
        _inputs.Set(SignalRole.FeedRateLPerH, feedLPerH, SampleQuality.Good, now);
        _inputs.Set(SignalRole.DissolvedOxygenPercent, 40, SampleQuality.Good, now);
        double v(double x) => quality == SampleQuality.Bad ? double.NaN : x;
        var frame = new EstimateFrame("r1", batch, now, quality,
        [
            new EstimateValue(EstimateNames.Our, v(40), "mmol/(L·h)", 1, quality, 0),
            new EstimateValue(EstimateNames.Rq, v(rq), "1", 0.02, quality, 0),
            new EstimateValue(EstimateNames.FeedAdvisoryLPerH, v(1.0), "L/h", double.NaN, quality, 0),
        ]);
        await _service.WriteAsync(frame, CancellationToken.None);
    }

    private string StateOf(string id) => _service.Engine.States().Single(s => s.Alarm == id).State;

    [Fact]
    public async Task WriteAsync_AerationTrip_RaisesDataQualityAlarmAndSuppressesEstimateAlarms()
    {
        for (int i = 0; i < 20; i++)
        {
            await CycleAsync(rq: 1.3, SampleQuality.Good, airNlPerMin: 45, feedLPerH: 1.3);
        }

        Assert.Equal("unacknowledged", StateOf("rq_window"));              // RQ 1.3 for 200 s > 120 s on-delay
        Assert.Equal("unacknowledged", StateOf("feed_above_advisory"));    // 1.3 L/h > 1.0 · 1.1 + 0.02
        Assert.Equal("normal", StateOf("our_bad"));

        for (int i = 0; i < 4; i++)
        {
            await CycleAsync(rq: 1.3, SampleQuality.Bad, airNlPerMin: 0, feedLPerH: 1.3);
        }

        Assert.Equal("unacknowledged", StateOf("our_bad"));                // bad for 40 s > 30 s on-delay
        Assert.Equal("suppressed", StateOf("rq_window"));
        Assert.Equal("suppressed", StateOf("feed_above_advisory"));
        Assert.Equal("suppressed", StateOf("our_above_capacity"));
        Assert.Equal("normal", StateOf("offgas_o2_enriched"));             // an input rule keeps working

        var journal = _journal.Recent("r1", 100);
        Assert.Contains(journal, e => e.Transition.RuleId == "rq_window" && e.Transition.Cause == AlarmCause.Suppressed);
        Assert.Equal(journal.Count, _published.Events.Count);              // every journaled transition was published
        Assert.Equal(_published.Events.Select(e => (e.Alarm, e.To)).Reverse(), journal.Select(e => (e.Transition.RuleId, AlarmStates.Id(e.Transition.To))));
    }

    [Fact]
    public async Task CommandAsync_AcknowledgeFromJson_JournalsTheOperatorAndPublishes()
    {
        for (int i = 0; i < 20; i++)
        {
            await CycleAsync(rq: 1.3, SampleQuality.Good, airNlPerMin: 45, feedLPerH: 0.5);
        }

        var result = await _service.CommandAsync(Encoding.UTF8.GetBytes("""{"command":"acknowledge","alarm":"rq_window","operator":"anna"}"""), "r1", CancellationToken.None);
        Assert.True(result.Applied, result.Message);
        Assert.Equal("acknowledged", StateOf("rq_window"));
        var last = _journal.Recent("r1", 1)[0];
        Assert.Equal(("anna", AlarmCause.Acknowledged), (last.Transition.Operator, last.Transition.Cause));
        Assert.Equal("acknowledged", _published.States[^1].State);

        var refused = await _service.CommandAsync(Encoding.UTF8.GetBytes("""{"command":"acknowledge","alarm":"rq_window","operator":"anna"}"""), "r1", CancellationToken.None);
        Assert.Equal("alarm 'rq_window' is acknowledged: nothing to acknowledge", refused.Message);
    }

    [Fact]
    public async Task WriteAsync_FirstFrameOfANewBatch_ReturnsEveryAlarmToNormalJournalsAndPublishesIt()
    {
        for (int i = 0; i < 20; i++)
        {
            await CycleAsync(rq: 1.3, SampleQuality.Good, airNlPerMin: 45, feedLPerH: 1.3);
        }

        Assert.Equal("unacknowledged", StateOf("rq_window"));
        Assert.Equal("unacknowledged", StateOf("feed_above_advisory"));
        int published = _published.Events.Count;

        // Same process values in the next batch: the on-delay of rq_window (120 s) starts over, so it is normal.
        await CycleAsync(rq: 1.3, SampleQuality.Good, airNlPerMin: 45, feedLPerH: 0.5, batch: "b-8");
        Assert.Equal("normal", StateOf("rq_window"));
        Assert.Equal("normal", StateOf("feed_above_advisory"));
        var resets = _journal.Recent("r1", 100).Where(e => e.Transition.Cause == AlarmCause.NewBatch).Select(e => e.Transition.RuleId).Order(StringComparer.Ordinal);
        Assert.Equal(["feed_above_advisory", "rq_window"], resets);
        Assert.Contains(_published.Events.Skip(published), e => e.Alarm == "rq_window" && e.Cause == "new_batch" && e.To == "normal");
        Assert.Equal("b-8", _journal.BatchOf("r1"));

        // A restart in batch b-8 restores the cleared states and resets nothing again.
        var rules = AlarmRuleFile.Load(Directory.GetFiles(AlarmRuleFileTests.ConfigDir, "*.json").Order(StringComparer.Ordinal));
        var restarted = new AlarmEngine(rules, _journal.Statuses, _journal.BatchOf);
        var frame = new EstimateFrame("r1", "b-8", _clock.GetUtcNow().AddSeconds(10), SampleQuality.Good, [new EstimateValue(EstimateNames.Rq, 1.0, "1", 0.02, SampleQuality.Good, 0)]);
        var changes = restarted.Evaluate(frame, null);
        Assert.Null(changes.NewBatch);
        Assert.DoesNotContain(changes.Items, c => c.Transition.Cause == AlarmCause.NewBatch);
    }

    private sealed class InputsSignal(AlignedInputs inputs) : IAlarmSignalSource
    {
        public void AddSignals(EstimateFrame frame, AlarmSnapshot snapshot) => snapshot.AddInputs(inputs);
    }

    private sealed class RecordingPublisher : IAlarmPublisher
    {
        public List<AlarmStateDocument> States { get; } = [];

        public List<AlarmEventDocument> Events { get; } = [];

        public ValueTask PublishAsync(AlarmStateDocument state, AlarmEventDocument transition, CancellationToken cancellationToken)
        {
            States.Add(state);
            Events.Add(transition);
            return ValueTask.CompletedTask;
        }
    }
}

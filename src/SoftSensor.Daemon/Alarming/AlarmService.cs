using Microsoft.Extensions.Logging;
using SoftSensor.Core.Alarms;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// Alarms in the pipeline: as an <see cref="IEstimateSink"/> it evaluates every frame (with the
/// cycle's inputs from the <see cref="IAlarmSignalSource"/>s), journals each transition durably,
/// then publishes it; operator commands from MQTT and the status page come through
/// <see cref="CommandAsync"/>. Journal first, publish second: what was published is always in the
/// journal.
/// </summary>
internal sealed class AlarmService(
    AlarmEngine engine, AlarmJournal journal, IEnumerable<IAlarmSignalSource> signals, IEnumerable<IAlarmPublisher> publishers,
    TimeProvider time, ILogger<AlarmService> log) : IEstimateSink
{
    private readonly IAlarmSignalSource[] _signals = [.. signals];
    private readonly IAlarmPublisher[] _publishers = [.. publishers];

    public string Name => "alarms";

    /// <summary>The engine (states for the status page).</summary>
    public AlarmEngine Engine => engine;

    /// <summary>The journal (recent events for the status page).</summary>
    public AlarmJournal Journal => journal;

    public async ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken)
    {
        var changes = engine.Evaluate(frame, s =>
        {
            foreach (var source in _signals)
            {
                source.AddSignals(frame, s);
            }
        });
        await CommitAsync(changes, cancellationToken);
    }

    /// <summary>
    /// Parses and applies an operator command; the result says what happened or why not. <paramref name="user"/>,
    /// the status server's authenticated user, is who the journal names (the payload's operator is then not needed and not used).
    /// </summary>
    public async ValueTask<AlarmCommandResult> CommandAsync(ReadOnlyMemory<byte> json, string? reactorFromTopic, CancellationToken cancellationToken, string? user = null)
    {
        if (!AlarmCommandPayload.TryParse(json.Span, time.GetUtcNow(), out var command, out string? reactor, out string error, user))
        {
            AlarmLog.CommandRefused(log, reactorFromTopic ?? reactor ?? "?", error);
            return AlarmCommandResult.Refused(error);
        }

        reactor = reactorFromTopic ?? reactor;
        if (reactor is null)
        {
            var known = engine.ReactorIds;
            if (known.Count != 1)
            {
                const string msg = "alarm command: reactor is missing, expected the reactor id";
                AlarmLog.CommandRefused(log, "?", msg);
                return AlarmCommandResult.Refused(msg);
            }

            reactor = known[0];
        }

        var (result, changes) = engine.Apply(reactor, command);
        if (!result.Applied)
        {
            AlarmLog.CommandRefused(log, reactor, result.Message);
            return result;
        }

        AlarmLog.CommandApplied(log, reactor, command.Kind.ToString(), command.RuleId, command.Operator, result.Transitions.Count);
        await CommitAsync(changes, cancellationToken);
        return result;
    }

    private async ValueTask CommitAsync(AlarmChanges changes, CancellationToken cancellationToken)
    {
        // Journal first (the reset transitions with the rest), then the batch the states now belong to:
        // a crash in between resets once more after the restart, which changes nothing.
        journal.Append(changes.Reactor, changes.Items);
        if (changes.NewBatch is { } batch)
        {
            journal.RecordBatch(changes.Reactor, batch, time.GetUtcNow());
            if (changes.PreviousBatch is { } previous)
            {
                AlarmLog.BatchReset(log, changes.Reactor, previous, batch, changes.Reset);
            }
        }

        foreach (var (t, rule, status) in changes.Items)
        {
            AlarmLog.Transition(log, changes.Reactor, t.RuleId, AlarmStates.Id(t.From), AlarmStates.Id(t.To), AlarmPayloads.CauseId(t.Cause), t.Value, rule.Message);
            var state = AlarmPayloads.State(changes.Reactor, rule, status);
            var evt = AlarmPayloads.Event(changes.Reactor, rule, t);
            foreach (var p in _publishers)
            {
                await p.PublishAsync(state, evt, cancellationToken);
            }
        }
    }
}

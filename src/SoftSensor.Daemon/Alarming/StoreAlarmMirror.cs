using SoftSensor.Daemon.Store;

namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// Mirrors each transition into the embedded store's <c>alarms</c> table (the status page's
/// <c>/api/alarms</c> lists the active ones from it). The full ISA-18.2 journal is
/// <c>alarm_journal</c>; this is the store's summary view of it.
/// </summary>
internal sealed class StoreAlarmMirror(SqliteStore store) : IAlarmPublisher
{
    public ValueTask PublishAsync(AlarmStateDocument state, AlarmEventDocument transition, CancellationToken cancellationToken) =>
        store.WriteAlarmAsync(new StoredAlarm(state.Reactor, state.Alarm, transition.Time, state.State, state.Priority,
            state.Active || state.AwaitingAcknowledgement, transition.Value ?? double.NaN, state.Message), cancellationToken);
}

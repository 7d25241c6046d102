namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// Where alarm states and events go besides the journal (MQTT). Threading contract: called from
/// the frame task and from command handlers, never concurrently for the same reactor; a failure to
/// deliver (broker down) is logged and counted by the implementation, never thrown.
/// </summary>
internal interface IAlarmPublisher
{
    /// <summary>Publishes the retained state of an alarm and its event.</summary>
    ValueTask PublishAsync(AlarmStateDocument state, AlarmEventDocument transition, CancellationToken cancellationToken);
}

/// <summary>Adds signals besides the frame's estimates (the cycle's inputs, the daemon's own gauges) to an alarm snapshot.</summary>
internal interface IAlarmSignalSource
{
    void AddSignals(Core.Signals.EstimateFrame frame, Core.Alarms.AlarmSnapshot snapshot);
}

using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>
/// What the client asks of one monitored item (Part 4 §5.12.1): the sampling interval, the queue
/// size at the server and an optional deadband (absolute in the value's unit, or percent of its
/// EURange; Part 4 §7.22.2). A negative sampling interval means "the publishing interval".
/// <see cref="Trigger"/> StatusValueTimestamp also reports a new source timestamp with an unchanged
/// value (a reading refreshed at the source); the default StatusValue reports changes only.
/// </summary>
public sealed record MonitoredItemSettings
{
    public TimeSpan SamplingInterval { get; init; } = TimeSpan.FromSeconds(-1);

    public uint QueueSize { get; init; } = 1;

    public DeadbandType DeadbandType { get; init; } = DeadbandType.None;

    public double DeadbandValue { get; init; }

    public DataChangeTrigger Trigger { get; init; } = DataChangeTrigger.StatusValue;

    /// <summary>The filter to send, or null when the server's default (StatusValue, no deadband) is asked for.</summary>
    public DataChangeFilter? Filter => DeadbandType == DeadbandType.None && Trigger == DataChangeTrigger.StatusValue
        ? null
        : new DataChangeFilter(Trigger, DeadbandType, DeadbandValue);
}

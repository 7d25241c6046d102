using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>
/// What the client asks of one monitored item (Part 4 §5.12.1): the sampling interval, the queue
/// size at the server and an optional deadband (absolute in the value's unit, or percent of its
/// EURange; Part 4 §7.22.2). A negative sampling interval means "the publishing interval".
/// </summary>
public sealed record MonitoredItemSettings
{
    public TimeSpan SamplingInterval { get; init; } = TimeSpan.FromSeconds(-1);

    public uint QueueSize { get; init; } = 1;

    public DeadbandType DeadbandType { get; init; } = DeadbandType.None;

    public double DeadbandValue { get; init; }

    /// <summary>The filter to send, or null when none is needed.</summary>
    public DataChangeFilter? Filter => DeadbandType == DeadbandType.None
        ? null
        : new DataChangeFilter(DataChangeTrigger.StatusValue, DeadbandType, DeadbandValue);
}

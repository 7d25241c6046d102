using Microsoft.Extensions.Logging;

namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>Log events of subscriptions and publishing (event ids 4300–4349).</summary>
internal static partial class SubscriptionLog
{
    [LoggerMessage(EventId = 4300, Level = LogLevel.Information, Message = "OPC UA subscription {SubscriptionId} created: publishing every {IntervalMs} ms, keep-alive count {KeepAlive}, {Items} items")]
    public static partial void Created(ILogger logger, uint subscriptionId, double intervalMs, uint keepAlive, int items);

    [LoggerMessage(EventId = 4301, Level = LogLevel.Warning, Message = "OPC UA node '{Reference}' not monitored: {Status}")]
    public static partial void ItemFailed(ILogger logger, string reference, string status);

    [LoggerMessage(EventId = 4302, Level = LogLevel.Information, Message = "OPC UA notification {SequenceNumber} of subscription {SubscriptionId} missed; asking for it again (Republish)")]
    public static partial void Gap(ILogger logger, uint sequenceNumber, uint subscriptionId);

    [LoggerMessage(EventId = 4303, Level = LogLevel.Warning, Message = "OPC UA notification {SequenceNumber} of subscription {SubscriptionId} is lost: {Status}")]
    public static partial void Lost(ILogger logger, uint sequenceNumber, uint subscriptionId, string status);

    [LoggerMessage(EventId = 4304, Level = LogLevel.Debug, Message = "OPC UA Publish answered {Status}; retrying")]
    public static partial void PublishRetry(ILogger logger, string status);
}

using Microsoft.Extensions.Logging;

namespace SoftSensor.OpcUa.Client;

/// <summary>Log events of the supervised client (event ids 4350–4399).</summary>
internal static partial class ClientLog
{
    [LoggerMessage(EventId = 4350, Level = LogLevel.Warning, Message = "OPC UA connection to {Endpoint} failed: {Reason}; next attempt in {DelayMs} ms")]
    public static partial void ConnectFailed(ILogger logger, string endpoint, string reason, long delayMs);

    [LoggerMessage(EventId = 4351, Level = LogLevel.Warning, Message = "OPC UA link to {Endpoint} lost: {Reason}; reconnecting")]
    public static partial void LinkLost(ILogger logger, string endpoint, string reason);

    [LoggerMessage(EventId = 4352, Level = LogLevel.Information, Message = "OPC UA subscription {SubscriptionId} transferred to the new session")]
    public static partial void Transferred(ILogger logger, uint subscriptionId);

    [LoggerMessage(EventId = 4353, Level = LogLevel.Information, Message = "OPC UA subscription {SubscriptionId} could not be transferred ({Status}); creating it again")]
    public static partial void TransferRefused(ILogger logger, uint subscriptionId, string status);

    [LoggerMessage(EventId = 4354, Level = LogLevel.Information, Message = "OPC UA client connected to {Endpoint} (session {SessionId}, connect {Count})")]
    public static partial void Connected(ILogger logger, string endpoint, string sessionId, int count);
}

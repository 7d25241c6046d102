using Microsoft.Extensions.Logging;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>Log events of the secure channel (event ids 4100–4199).</summary>
internal static partial class ChannelLog
{
    [LoggerMessage(EventId = 4100, Level = LogLevel.Warning, Message = "OPC UA channel to {Endpoint} uses SecurityPolicy None: traffic is neither signed nor encrypted")]
    public static partial void SecurityNone(ILogger logger, string endpoint);

    [LoggerMessage(EventId = 4101, Level = LogLevel.Information, Message = "OPC UA channel {ChannelId} open to {Endpoint}, token {TokenId}, lifetime {LifetimeMs} ms, security {Security}")]
    public static partial void Opened(ILogger logger, uint channelId, string endpoint, uint tokenId, uint lifetimeMs, string security);

    [LoggerMessage(EventId = 4102, Level = LogLevel.Debug, Message = "OPC UA channel {ChannelId} renewed: token {TokenId}, lifetime {LifetimeMs} ms")]
    public static partial void Renewed(ILogger logger, uint channelId, uint tokenId, uint lifetimeMs);

    [LoggerMessage(EventId = 4103, Level = LogLevel.Warning, Message = "OPC UA channel {ChannelId} to {Endpoint} failed: {Reason}")]
    public static partial void Faulted(ILogger logger, uint channelId, string endpoint, string reason);

    [LoggerMessage(EventId = 4104, Level = LogLevel.Warning, Message = "OPC UA response for request {RequestId} could not be decoded: {Reason}")]
    public static partial void UndecodableResponse(ILogger logger, uint requestId, string reason);

    [LoggerMessage(EventId = 4105, Level = LogLevel.Debug, Message = "OPC UA response for request {RequestId} arrived after its caller gave up")]
    public static partial void LateResponse(ILogger logger, uint requestId);

    [LoggerMessage(EventId = 4106, Level = LogLevel.Warning, Message = "OPC UA token renewal on channel {ChannelId} failed: {Reason}")]
    public static partial void RenewFailed(ILogger logger, uint channelId, string reason);
}

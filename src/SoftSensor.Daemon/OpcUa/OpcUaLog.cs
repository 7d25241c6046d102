using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.OpcUa;

/// <summary>Log events of the daemon's OPC UA adapter (event ids 4400–4449).</summary>
internal static partial class OpcUaLog
{
    [LoggerMessage(EventId = 4400, Level = LogLevel.Debug, Message = "OPC UA tag {Tag} ({Node}): no numeric value ({Status}); dropped")]
    public static partial void NoValue(ILogger logger, string tag, string node, string status);

    [LoggerMessage(EventId = 4401, Level = LogLevel.Warning, Message = "OPC UA write-back of {Estimate} for {Reactor} to {Node} failed: {Status}")]
    public static partial void WriteFailed(ILogger logger, string reactor, string estimate, string node, string status);
}

using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>Log messages of the MQTT adapters (event ids 1100–1199). Passwords are never logged.</summary>
internal static partial class MqttLog
{
    [LoggerMessage(1100, LogLevel.Information, "MQTT connected to {Broker} as {ClientId}; {Topics} topics subscribed; status {StatusTopic} = online")]
    public static partial void Connected(ILogger logger, string broker, string clientId, int topics, string statusTopic);

    [LoggerMessage(1101, LogLevel.Warning, "MQTT connect to {Broker} refused: {ResultCode} {Reason}")]
    public static partial void Refused(ILogger logger, string broker, string resultCode, string reason);

    [LoggerMessage(1102, LogLevel.Warning, "MQTT connect to {Broker} failed: {Reason}; next attempt in {Delay}")]
    public static partial void ConnectFailed(ILogger logger, string broker, string reason, TimeSpan delay);

    [LoggerMessage(1103, LogLevel.Warning, "MQTT link to {Broker} lost (ping failed); reconnecting")]
    public static partial void Lost(ILogger logger, string broker);

    [LoggerMessage(1104, LogLevel.Warning, "MQTT payload on {Topic} dropped: {Reason}")]
    public static partial void Malformed(ILogger logger, string topic, string reason);

    [LoggerMessage(1105, LogLevel.Warning, "MQTT publish to {Topic} failed: {Reason}")]
    public static partial void PublishFailed(ILogger logger, string topic, string reason);

    [LoggerMessage(1106, LogLevel.Warning, "MQTT TLS certificate validation is disabled for {Broker} (tlsAllowUntrusted); use it only with a test broker")]
    public static partial void UntrustedTls(ILogger logger, string broker);

    [LoggerMessage(1107, LogLevel.Information, "MQTT link to {Broker} closed; status {StatusTopic} = offline")]
    public static partial void Closed(ILogger logger, string broker, string statusTopic);

    [LoggerMessage(1108, LogLevel.Warning, "MQTT subscribe to {Topic} was not granted: {Reason}")]
    public static partial void SubscribeRefused(ILogger logger, string topic, string reason);

    [LoggerMessage(1109, LogLevel.Warning, "MQTT ping to {Broker} not answered in time, but messages are still arriving: link kept")]
    public static partial void PingLate(ILogger logger, string broker);
}

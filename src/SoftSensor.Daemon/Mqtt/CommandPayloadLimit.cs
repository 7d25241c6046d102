using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// The cap on MQTT command payloads (batch, sample, alarm topics): 4 KiB, as the status server's
/// command bodies (a command is a few hundred bytes). A larger payload is dropped before it is parsed
/// or echoed and logged by its size only.
/// </summary>
internal static partial class CommandPayloadLimit
{
    public const int MaxBytes = 4 * 1024;

    /// <summary>Whether the payload may be parsed; logs the refusal by size.</summary>
    public static bool Allows(ILogger logger, string topic, long length)
    {
        if (length <= MaxBytes)
        {
            return true;
        }

        TooLarge(logger, topic, length, MaxBytes);
        return false;
    }

    [LoggerMessage(1110, LogLevel.Warning, "MQTT command on {Topic} dropped: payload of {Bytes} bytes (at most {Max})")]
    private static partial void TooLarge(ILogger logger, string topic, long bytes, int max);
}

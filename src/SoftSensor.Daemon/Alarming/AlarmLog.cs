using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Alarming;

/// <summary>Log lines of the alarms (event ids 7200–7299).</summary>
internal static partial class AlarmLog
{
    [LoggerMessage(EventId = 7200, Level = LogLevel.Warning, Message = "alarm {Reactor}/{Alarm}: {From} -> {To} ({Cause}, value {Value}): {Text}")]
    public static partial void Transition(ILogger logger, string reactor, string alarm, string from, string to, string cause, double value, string text);

    [LoggerMessage(EventId = 7201, Level = LogLevel.Information, Message = "alarm command on {Reactor}: {Command} {Alarm} by {Operator}: {Count} transition(s)")]
    public static partial void CommandApplied(ILogger logger, string reactor, string command, string alarm, string @operator, int count);

    [LoggerMessage(EventId = 7202, Level = LogLevel.Warning, Message = "alarm command on {Reactor} refused: {Reason}")]
    public static partial void CommandRefused(ILogger logger, string reactor, string reason);

    [LoggerMessage(EventId = 7203, Level = LogLevel.Information, Message = "alarms: {Count} rule(s) from {Files}")]
    public static partial void Loaded(ILogger logger, int count, string files);

    [LoggerMessage(EventId = 7205, Level = LogLevel.Information, Message = "alarms of {Reactor}: batch {Previous} -> {Batch}, {Count} alarm(s) returned to normal for the new batch")]
    public static partial void BatchReset(ILogger logger, string reactor, string previous, string batch, int count);

    [LoggerMessage(EventId = 7204, Level = LogLevel.Warning, Message = "alarm publish to {Topic} failed: broker unreachable (the journal has it)")]
    public static partial void PublishFailed(ILogger logger, string topic);
}

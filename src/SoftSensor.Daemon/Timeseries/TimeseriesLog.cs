using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>Log lines of the time-series sink (event ids 7100–7199). None carries the token.</summary>
internal static partial class TimeseriesLog
{
    [LoggerMessage(EventId = 7100, Level = LogLevel.Information, Message = "time-series outbox at {Path}: {Depth} unsent frame(s) resumed; writing to {Url} (org {Org}, bucket {Bucket})")]
    public static partial void Started(ILogger logger, string path, long depth, string url, string org, string bucket);

    [LoggerMessage(EventId = 7101, Level = LogLevel.Warning, Message = "time-series write of {Frames} frame(s) failed ({Reason}); {Depth} unsent, retry in {DelaySeconds:F1} s")]
    public static partial void SendFailed(ILogger logger, int frames, string reason, long depth, double delaySeconds);

    [LoggerMessage(EventId = 7102, Level = LogLevel.Information, Message = "time-series database reachable again: sent {Frames} frame(s) after {Failures} failed attempt(s)")]
    public static partial void Recovered(ILogger logger, int frames, int failures);

    [LoggerMessage(EventId = 7103, Level = LogLevel.Error, Message = "time-series outbox full ({Bytes} of {Limit} bytes): frame of reactor {Reactor} at {Time:O} not queued for the database")]
    public static partial void Refused(ILogger logger, long bytes, long limit, string reactor, DateTimeOffset time);

    [LoggerMessage(EventId = 7104, Level = LogLevel.Warning, Message = "time-series outbox {Percent:F0} % full ({Bytes} of {Limit} bytes): the database has been unreachable since {Oldest:O}")]
    public static partial void Filling(ILogger logger, double percent, long bytes, long limit, DateTimeOffset? oldest);

    [LoggerMessage(EventId = 7105, Level = LogLevel.Warning, Message = "time-series outbox: {Depth} frame(s) still unsent at shutdown; they will be sent after the restart")]
    public static partial void LeftAtShutdown(ILogger logger, long depth);
}

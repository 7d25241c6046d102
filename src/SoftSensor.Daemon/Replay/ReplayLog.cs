using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Replay;

/// <summary>Log messages of the replay (stable event ids 5100-5199).</summary>
internal static partial class ReplayLog
{
    [LoggerMessage(EventId = 5101, Level = LogLevel.Warning, Message = "{File} line {Line}: row skipped ({Reason}, column '{Column}')")]
    public static partial void RowSkipped(ILogger logger, string file, long line, string reason, string column);

    [LoggerMessage(EventId = 5102, Level = LogLevel.Warning, Message = "{File}: {More} further skipped rows not logged one by one")]
    public static partial void MoreRowsSkipped(ILogger logger, string file, long more);

    [LoggerMessage(EventId = 5103, Level = LogLevel.Information, Message = "replay of {File}: {Rows} rows read, {Skipped} skipped, {Cycles} cycles, {Samples} offline samples applied")]
    public static partial void Finished(ILogger logger, string file, long rows, long skipped, long cycles, long samples);

    [LoggerMessage(EventId = 5104, Level = LogLevel.Warning, Message = "offline sample of {SampledAt:o} (line {Line}) not applied: {Outcome}")]
    public static partial void SampleNotApplied(ILogger logger, DateTimeOffset sampledAt, long line, string outcome);

    [LoggerMessage(EventId = 5105, Level = LogLevel.Information, Message = "resuming from saved state at {Time:o} ({Cycles} cycles done)")]
    public static partial void Resuming(ILogger logger, DateTimeOffset time, long cycles);

    [LoggerMessage(EventId = 5106, Level = LogLevel.Warning, Message = "{File} line {Line}: offline sample skipped ({Reason})")]
    public static partial void SampleRowSkipped(ILogger logger, string file, long line, string reason);

    [LoggerMessage(EventId = 5107, Level = LogLevel.Warning, Message = "{File} line {Line}: row skipped ({Reason})")]
    public static partial void RowSkippedAlone(ILogger logger, string file, long line, string reason);

    [LoggerMessage(EventId = 5108, Level = LogLevel.Warning, Message = "{File} line {Line}: cell of tag {Tag} is '{Text}' (expected a finite number); that cell is dropped")]
    public static partial void CellDropped(ILogger logger, string file, long line, string tag, string text);
}

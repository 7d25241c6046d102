using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Batches;

/// <summary>Log lines of the batch lifecycle (event ids 7300–7399).</summary>
internal static partial class BatchLog
{
    [LoggerMessage(EventId = 7300, Level = LogLevel.Information, Message = "Reactor {Reactor}: batch-id tag {Tag} reads '{BatchId}': batch {Action}")]
    public static partial void BatchFromTag(ILogger logger, string reactor, string tag, string batchId, string action);

    [LoggerMessage(EventId = 7301, Level = LogLevel.Warning, Message = "Reactor {Reactor}: batch-id tag {Tag} reads '{BatchId}' but the batch cannot start: {Problems}")]
    public static partial void BatchFromTagRefused(ILogger logger, string reactor, string tag, string batchId, string problems);

    [LoggerMessage(EventId = 7302, Level = LogLevel.Information, Message = "Reactor {Reactor}: batch {BatchId} enters phase {Phase} ({Source})")]
    public static partial void PhaseChanged(ILogger logger, string reactor, string batchId, string phase, string source);

    [LoggerMessage(EventId = 7303, Level = LogLevel.Warning, Message = "Reactor {Reactor}: phase tag {Tag} reads code {Code}, which batches:phaseCodes does not map (expected one of {Codes})")]
    public static partial void UnknownPhaseCode(ILogger logger, string reactor, string tag, string code, string codes);

    [LoggerMessage(EventId = 7304, Level = LogLevel.Information, Message = "Reactor {Reactor}: batch report of {BatchId} written to {Path}")]
    public static partial void ReportWritten(ILogger logger, string reactor, string batchId, string path);

    [LoggerMessage(EventId = 7305, Level = LogLevel.Error, Message = "Reactor {Reactor}: batch report of {BatchId} failed")]
    public static partial void ReportFailed(ILogger logger, Exception e, string reactor, string batchId);
}

using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>Log messages of the pipelines (event ids 1000–1099).</summary>
internal static partial class PipelineLog
{
    [LoggerMessage(1000, LogLevel.Information, "Reactor {Reactor}: pipeline started, cycle every {Period}, {Tags} tags, sources: {Sources}")]
    public static partial void Started(ILogger logger, string reactor, TimeSpan period, int tags, string sources);

    [LoggerMessage(1001, LogLevel.Information, "Reactor {Reactor}: state restored from the checkpoint of cycle {Cycle} at {Time:o}")]
    public static partial void Restored(ILogger logger, string reactor, long cycle, DateTimeOffset time);

    [LoggerMessage(1002, LogLevel.Warning, "Reactor {Reactor}: the checkpoint could not be restored, starting fresh: {Reason}")]
    public static partial void RestoreFailed(ILogger logger, string reactor, string reason);

    [LoggerMessage(1003, LogLevel.Warning, "Reactor {Reactor}: sample of unknown tag or non-finite value dropped: tag {Tag}")]
    public static partial void SampleRejected(ILogger logger, string reactor, string tag);

    [LoggerMessage(1004, LogLevel.Error, "Reactor {Reactor}: the cycle failed; frame marked bad")]
    public static partial void CycleFailed(ILogger logger, Exception exception, string reactor);

    [LoggerMessage(1005, LogLevel.Error, "Sink {Sink} failed for reactor {Reactor}")]
    public static partial void SinkFailed(ILogger logger, Exception exception, string sink, string reactor);

    [LoggerMessage(1006, LogLevel.Error, "Reactor {Reactor}: source {Source} stopped with an error")]
    public static partial void SourceFailed(ILogger logger, Exception exception, string reactor, string source);

    [LoggerMessage(1007, LogLevel.Information, "Reactor {Reactor}: pipeline stopped after {Cycles} cycles")]
    public static partial void Stopped(ILogger logger, string reactor, long cycles);

    [LoggerMessage(1008, LogLevel.Warning, "Reactor {Reactor}: cycle is behind, frame queue full; waiting")]
    public static partial void DispatchBehind(ILogger logger, string reactor);

    [LoggerMessage(1009, LogLevel.Information, "Reactor {Reactor}: batch {Batch} begins; estimator state reset to its initial conditions ({VolumeL} L, biomass {BiomassGPerL} ± {SigmaGPerL} g/L, substrate {SubstrateGPerL} g/L)")]
    public static partial void BatchBegan(ILogger logger, string reactor, string batch, double volumeL, double biomassGPerL, double sigmaGPerL, double substrateGPerL);

    [LoggerMessage(1010, LogLevel.Warning, "Reactor {Reactor}: the checkpoint of cycle {Cycle} belongs to batch '{CheckpointBatch}', not to the open batch '{OpenBatch}'; not applied")]
    public static partial void CheckpointOfOtherBatch(ILogger logger, string reactor, long cycle, string checkpointBatch, string openBatch);

    [LoggerMessage(1011, LogLevel.Error, "Reactor {Reactor}: batch {Batch} could not reset the estimator: {Reason}")]
    public static partial void BatchBeginFailed(ILogger logger, string reactor, string batch, string reason);

    [LoggerMessage(1012, LogLevel.Warning, "Sink {Sink}: writes still in flight after {Timeout} at stop; not waiting longer")]
    public static partial void SinkDrainTimedOut(ILogger logger, string sink, TimeSpan timeout);
}

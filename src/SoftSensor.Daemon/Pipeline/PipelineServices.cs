using Microsoft.Extensions.Logging;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>What every pipeline shares: clock, dispatcher, status board, checkpoints, metrics, logger.</summary>
internal sealed record PipelineServices(
    TimeProvider Time,
    FrameDispatcher Dispatcher,
    StatusBoard Board,
    ICheckpointStore? Checkpoints,
    DaemonMetrics Metrics,
    ILogger Logger,
    int CheckpointEveryCycles)
{
    /// <summary>The operator's batches: the open batch's id replaces the configured one in every frame (null in tests without it).</summary>
    public Batches.BatchBook? Batches { get; init; }

    /// <summary>The operator inputs (offline samples, withdrawals) applied on the cycle task before each cycle (null in tests without them).</summary>
    public Samples.SampleBook? Samples { get; init; }
}

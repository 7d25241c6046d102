using Microsoft.Extensions.Logging;
using SoftSensor.Daemon.Status;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>What every pipeline shares: clock, dispatcher, status board, checkpoints, metrics, logger.</summary>
internal sealed record PipelineServices(
    TimeProvider Time,
    FrameDispatcher Dispatcher,
    StatusBoard Board,
    ICheckpointStore? Checkpoints,
    DaemonMetrics Metrics,
    ILogger Logger,
    int CheckpointEveryCycles);

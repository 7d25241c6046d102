using System.Threading.Channels;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Status;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// Hands every frame of every pipeline to every registered <see cref="IEstimateSink"/> (DI:
/// <c>services.AddSingleton&lt;IEstimateSink, MySink&gt;()</c>), from one task: a sink is never
/// called concurrently, and sees each reactor's frames in cycle order. A failing sink is logged
/// and counted; the others still get the frame. Stops after draining what was queued.
/// </summary>
internal sealed class FrameDispatcher : BackgroundService
{
    private readonly Channel<(EstimateFrame Frame, long ArrivalTimestamp)> _queue =
        Channel.CreateBounded<(EstimateFrame, long)>(new BoundedChannelOptions(4096) { SingleReader = true, FullMode = BoundedChannelFullMode.Wait });

    private readonly IEstimateSink[] _sinks;
    private readonly DaemonMetrics _metrics;
    private readonly TimeProvider _time;
    private readonly ILogger<FrameDispatcher> _logger;

    public FrameDispatcher(IEnumerable<IEstimateSink> sinks, DaemonMetrics metrics, TimeProvider time, ILogger<FrameDispatcher> logger)
    {
        _sinks = [.. sinks];
        _metrics = metrics;
        _time = time;
        _logger = logger;
    }

    /// <summary>The sinks, in registration order.</summary>
    public IReadOnlyList<IEstimateSink> Sinks => _sinks;

    /// <summary>Queues a frame; waits when the sinks are behind. <paramref name="arrivalTimestamp"/> is the <see cref="TimeProvider.GetTimestamp"/> of the newest input's arrival (0 when unknown).</summary>
    public ValueTask EnqueueAsync(EstimateFrame frame, long arrivalTimestamp, CancellationToken cancellationToken)
    {
        if (_queue.Writer.TryWrite((frame, arrivalTimestamp)))
        {
            return ValueTask.CompletedTask;
        }

        PipelineLog.DispatchBehind(_logger, frame.Reactor);
        return _queue.Writer.WriteAsync((frame, arrivalTimestamp), cancellationToken);
    }

    public override async Task StopAsync(CancellationToken cancellationToken)
    {
        _queue.Writer.TryComplete();
        await base.StopAsync(cancellationToken);
    }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        // Drain until the writer completes (at stop), so frames queued before the stop reach the store.
        await foreach (var (frame, arrival) in _queue.Reader.ReadAllAsync(CancellationToken.None))
        {
            await DispatchAsync(frame, stoppingToken.IsCancellationRequested ? CancellationToken.None : stoppingToken);
            if (arrival != 0)
            {
                _metrics.TagToEstimateSeconds.Record(_time.GetElapsedTime(arrival).TotalSeconds, new KeyValuePair<string, object?>("reactor", frame.Reactor));
            }
        }
    }

    private async Task DispatchAsync(EstimateFrame frame, CancellationToken cancellationToken)
    {
        foreach (var sink in _sinks)
        {
            try
            {
                await sink.WriteAsync(frame, cancellationToken);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                // A sink must not throw (IEstimateSink's contract); one that does must not starve the others.
                _metrics.PublishFailures.Add(1, new KeyValuePair<string, object?>("sink", sink.Name));
                PipelineLog.SinkFailed(_logger, e, sink.Name, frame.Reactor);
            }
        }
    }
}

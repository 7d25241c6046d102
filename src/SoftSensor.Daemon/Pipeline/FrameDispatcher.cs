using System.Threading.Channels;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// Hands every frame of every pipeline to every registered <see cref="IEstimateSink"/> (DI:
/// <c>services.AddSingleton&lt;IEstimateSink, MySink&gt;()</c>), from one task: a sink is never
/// called concurrently, and sees each reactor's frames in cycle order. A failing sink is logged
/// and counted; the others still get the frame. Frames queued together (several reactors' cycles
/// ending at once) go to an <see cref="IEstimateBatchSink"/> in one call, up to
/// <see cref="MaxBatch"/>: one store transaction and all MQTT publishes in flight together instead
/// of one round trip each. Stops after draining what was queued.
/// </summary>
internal sealed class FrameDispatcher : BackgroundService
{
    private readonly Channel<(EstimateFrame Frame, long ArrivalTimestamp)> _queue =
        Channel.CreateBounded<(EstimateFrame, long)>(new BoundedChannelOptions(4096) { SingleReader = true, FullMode = BoundedChannelFullMode.Wait });

    /// <summary>Most frames handed to the sinks in one call.</summary>
    public const int MaxBatch = 256;

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
        var reader = _queue.Reader;
        var frames = new List<EstimateFrame>(MaxBatch);
        var arrivals = new List<long>(MaxBatch);
        while (await reader.WaitToReadAsync(CancellationToken.None))
        {
            frames.Clear();
            arrivals.Clear();
            while (frames.Count < MaxBatch && reader.TryRead(out var item))
            {
                frames.Add(item.Frame);
                arrivals.Add(item.ArrivalTimestamp);
            }

            await DispatchAsync(frames, stoppingToken.IsCancellationRequested ? CancellationToken.None : stoppingToken);
            for (int i = 0; i < frames.Count; i++)
            {
                if (arrivals[i] != 0)
                {
                    _metrics.TagToEstimateSeconds.Record(_time.GetElapsedTime(arrivals[i]).TotalSeconds, new KeyValuePair<string, object?>("reactor", frames[i].Reactor));
                }
            }
        }

        // What the pipelined sinks still have in flight completes before the links below them stop.
        foreach (var sink in _sinks.OfType<IPipelinedSink>())
        {
            try
            {
                await sink.DrainAsync(CancellationToken.None).AsTask().WaitAsync(DrainTimeout, CancellationToken.None);
            }
            catch (TimeoutException)
            {
                PipelineLog.SinkDrainTimedOut(_logger, sink.Name, DrainTimeout);
            }
        }
    }

    /// <summary>Longest wait at stop for a pipelined sink's writes in flight.</summary>
    private static readonly TimeSpan DrainTimeout = TimeSpan.FromSeconds(10);

    private async Task DispatchAsync(List<EstimateFrame> frames, CancellationToken cancellationToken)
    {
        foreach (var sink in _sinks)
        {
            // Real time, even on a scaled or stepped process clock: this is the sink's cost.
            long start = System.Diagnostics.Stopwatch.GetTimestamp();
            await WriteAsync(sink, frames, cancellationToken);
            _metrics.SinkWriteSeconds.Record(System.Diagnostics.Stopwatch.GetElapsedTime(start).TotalSeconds, new KeyValuePair<string, object?>("sink", sink.Name));
        }
    }

    private async Task WriteAsync(IEstimateSink sink, List<EstimateFrame> frames, CancellationToken cancellationToken)
    {
        if (sink is IEstimateBatchSink batch && frames.Count > 1)
        {
            try
            {
                await batch.WriteBatchAsync(frames, cancellationToken);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                Failed(sink, frames[0].Reactor, e);
            }

            return;
        }

        foreach (var frame in frames)
        {
            try
            {
                await sink.WriteAsync(frame, cancellationToken);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                Failed(sink, frame.Reactor, e);
            }
        }
    }

    private void Failed(IEstimateSink sink, string reactor, Exception e)
    {
        // A sink must not throw (IEstimateSink's contract); one that does must not starve the others.
        _metrics.PublishFailures.Add(1, new KeyValuePair<string, object?>("sink", sink.Name));
        PipelineLog.SinkFailed(_logger, e, sink.Name, reactor);
    }
}

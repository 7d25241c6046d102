using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>
/// The time-series sink: maps each frame to line protocol and commits it to the outbox (the
/// durable step; it returns once the row is on disk), then wakes the sender. When the outbox is
/// full the frame is refused, logged and counted; past the warning level it logs a warning once
/// per crossing (and the alarm rule <c>outbox_filling</c> reads <see cref="FillPercent"/>).
/// </summary>
internal sealed class TimeseriesSink(
    OutboxStore store, OutboxSender sender, TimeseriesOptions options, TimeseriesMetrics metrics, TimeProvider time, ILogger<TimeseriesSink> log)
    : IEstimateSink
{
    private bool _warned;

    public string Name => "timeseries";

    /// <summary>Fill level of the outbox bound, %.</summary>
    public double FillPercent => store.Stats.Fill * 100;

    public ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken)
    {
        string payload = string.Join('\n', LineProtocol.Lines(frame, options.Site, options.MeasurementPrefix));
        if (payload.Length == 0)
        {
            return ValueTask.CompletedTask;
        }

        if (!store.TryEnqueue(payload, time.GetUtcNow()))
        {
            var s = store.Stats;
            metrics.Refused();
            TimeseriesLog.Refused(log, s.Bytes, s.LimitBytes, frame.Reactor, frame.SourceTime);
        }
        else
        {
            sender.Ring();
        }

        var stats = store.Stats;
        bool high = stats.Fill * 100 >= options.WarnAtPercent;
        if (high && !_warned)
        {
            TimeseriesLog.Filling(log, stats.Fill * 100, stats.Bytes, stats.LimitBytes, stats.OldestEnqueued);
        }

        _warned = high;
        return ValueTask.CompletedTask;
    }
}

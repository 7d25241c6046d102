using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using Microsoft.Data.Sqlite;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Store;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>
/// The time-series sink: maps each frame to line protocol and commits it to the outbox (the
/// durable step; it returns once the row is on disk), then wakes the sender. When the outbox is
/// full the frame is refused, logged and counted; past the warning level it logs a warning once
/// per crossing (and the alarm rule <c>outbox_filling</c> reads <see cref="FillPercent"/>).
/// When the outbox lives in the daemon's store file the sink is attached to the store as an
/// <see cref="IFrameCompanion"/>: the outbox row is then committed in the same transaction as the
/// stored frame, and <see cref="WriteAsync"/> only wakes the sender.
/// </summary>
internal sealed class TimeseriesSink(
    OutboxStore store, OutboxSender sender, TimeseriesOptions options, TimeseriesMetrics metrics, TimeProvider time, ILogger<TimeseriesSink> log)
    : IEstimateSink, IFrameCompanion
{
    private bool _warned;
    private bool _attached;

    /// <summary>Attaches this sink to <paramref name="frames"/> when the outbox is in the same file; true when attached.</summary>
    public bool AttachTo(SqliteStore frames)
    {
        if (string.Equals(frames.Path, store.FullPath, StringComparison.Ordinal))
        {
            frames.Attach(this);
            _attached = true;
        }

        return _attached;
    }

    /// <inheritdoc />
    public Action? Write(EstimateFrame frame, SqliteConnection connection, SqliteTransaction transaction)
    {
        string payload = Payload(frame);
        if (payload.Length == 0)
        {
            return null;
        }

        var committed = store.EnqueueWithin(payload, time.GetUtcNow(), connection, transaction);
        if (committed is null)
        {
            Refuse(frame);
        }

        return committed;
    }

    public string Name => "timeseries";

    /// <summary>Fill level of the outbox bound, %.</summary>
    public double FillPercent => store.Stats.Fill * 100;

    public ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken)
    {
        if (_attached)
        {
            // The row was committed with the stored frame (the store sink runs first).
            sender.Ring();
        }
        else
        {
            string payload = Payload(frame);
            if (payload.Length == 0)
            {
                return ValueTask.CompletedTask;
            }

            if (!store.TryEnqueue(payload, time.GetUtcNow()))
            {
                Refuse(frame);
            }
            else
            {
                sender.Ring();
            }
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

    private string Payload(EstimateFrame frame) => string.Join('\n', LineProtocol.Lines(frame, options.Site, options.MeasurementPrefix));

    private void Refuse(EstimateFrame frame)
    {
        var s = store.Stats;
        metrics.Refused();
        TimeseriesLog.Refused(log, s.Bytes, s.LimitBytes, frame.Reactor, frame.Time);
    }
}

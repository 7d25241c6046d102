using System.Threading.Channels;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>
/// Drains the outbox: takes the oldest rows in batches, writes them, removes them only after the
/// database acknowledged, and backs off with jitter while the database is down. Rows left at a
/// stop or a crash are sent after the restart; a resent row carries the same points (same series
/// and millisecond timestamp), which the database overwrites. On stop it keeps draining for
/// <see cref="TimeseriesOptions.ShutdownFlushSeconds"/>.
/// </summary>
internal sealed class OutboxSender : BackgroundService
{
    private readonly OutboxStore _store;
    private readonly ITimeseriesWriter _writer;
    private readonly TimeseriesOptions _options;
    private readonly TimeseriesMetrics _metrics;
    private readonly TimeProvider _time;
    private readonly ILogger _log;
    private readonly RetryBackoff _backoff;
    private readonly Channel<bool> _doorbell = Channel.CreateBounded<bool>(new BoundedChannelOptions(1) { FullMode = BoundedChannelFullMode.DropWrite });

    public OutboxSender(OutboxStore store, ITimeseriesWriter writer, TimeseriesOptions options, TimeseriesMetrics metrics,
        TimeProvider time, ILogger<OutboxSender> log, Random? random = null)
    {
        _store = store;
        _writer = writer;
        _options = options;
        _metrics = metrics;
        _time = time;
        _log = log;
        _backoff = new RetryBackoff(TimeSpan.FromSeconds(options.RetryInitialSeconds), TimeSpan.FromSeconds(options.RetryMaxSeconds), random ?? Random.Shared);
    }

    /// <summary>Wakes the sender: a frame was committed.</summary>
    public void Ring() => _doorbell.Writer.TryWrite(true);

    /// <summary>Sends one batch; true when the outbox is now empty or a batch went through, false after a failure.</summary>
    public async Task<bool> SendBatchAsync(CancellationToken cancellationToken)
    {
        var batch = _store.PeekBatch(_options.BatchSize);
        if (batch.Count == 0)
        {
            return true;
        }

        var lines = new List<string>(batch.Count * 4);
        foreach (var e in batch)
        {
            lines.AddRange(e.Payload.Split('\n', StringSplitOptions.RemoveEmptyEntries));
        }

        var outcome = await _writer.WriteAsync(lines, cancellationToken);
        if (outcome.Acknowledged)
        {
            _store.MarkSent(batch);
            _metrics.Sent(lines.Count);
            if (_backoff.Failures > 0)
            {
                TimeseriesLog.Recovered(_log, batch.Count, _backoff.Failures);
            }

            _backoff.Reset();
            return true;
        }

        _metrics.SendFailed();
        _store.RecordAttempt(batch);
        LastRetryDelay = _backoff.Next();
        TimeseriesLog.SendFailed(_log, batch.Count, outcome.Reason, _store.Stats.Depth, LastRetryDelay.TotalSeconds);
        return false;
    }

    /// <summary>The delay chosen after the latest failure.</summary>
    public TimeSpan LastRetryDelay { get; private set; }

    public override async Task StopAsync(CancellationToken cancellationToken)
    {
        await base.StopAsync(cancellationToken);
        using var flush = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        flush.CancelAfter(TimeSpan.FromSeconds(_options.ShutdownFlushSeconds));
        try
        {
            while (_store.Stats.Depth > 0 && !flush.IsCancellationRequested && await SendBatchAsync(flush.Token))
            {
            }
        }
        catch (OperationCanceledException) when (flush.IsCancellationRequested)
        {
            // the flush time ran out; the rows stay in the outbox
        }

        if (_store.Stats.Depth > 0)
        {
            TimeseriesLog.LeftAtShutdown(_log, _store.Stats.Depth);
        }
    }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var idle = TimeSpan.FromSeconds(_options.IdlePollSeconds);
        try
        {
            while (!stoppingToken.IsCancellationRequested)
            {
                if (_store.Stats.Depth == 0)
                {
                    await WaitForDoorbellAsync(idle, stoppingToken);
                }
                else if (!await SendBatchAsync(stoppingToken))
                {
                    await Task.Delay(LastRetryDelay, _time, stoppingToken);
                }
            }
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
            // stopping; StopAsync flushes what it can
        }
    }

    private async Task WaitForDoorbellAsync(TimeSpan idle, CancellationToken stoppingToken)
    {
        using var timeout = new CancellationTokenSource(idle, _time);
        using var linked = CancellationTokenSource.CreateLinkedTokenSource(timeout.Token, stoppingToken);
        try
        {
            await _doorbell.Reader.WaitToReadAsync(linked.Token);
            _doorbell.Reader.TryRead(out _);
        }
        catch (OperationCanceledException) when (timeout.IsCancellationRequested && !stoppingToken.IsCancellationRequested)
        {
            // idle poll: look at the table again (rows may come from before a restart)
        }
    }
}

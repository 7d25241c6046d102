using System.Diagnostics.Metrics;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>Outbox store, sender and sink on one SQLite file, wired as the daemon wires them.</summary>
internal sealed class TimeseriesRig : IAsyncDisposable
{
    private static readonly IMeterFactory Meters = new ServiceCollection().AddMetrics().BuildServiceProvider().GetRequiredService<IMeterFactory>();
    private bool _started;

    public TimeseriesRig(string dbPath, string url, Func<ITimeseriesWriter, ITimeseriesWriter>? wrap = null, double maxMegabytes = 64)
    {
        Options = new TimeseriesOptions
        {
            Url = url, Org = "pilot", Bucket = "estimates", OutboxPath = dbPath, BatchSize = 7,
            RetryInitialSeconds = 0.05, RetryMaxSeconds = 0.4, IdlePollSeconds = 0.2, TimeoutSeconds = 2, ShutdownFlushSeconds = 2,
            MaxOutboxMegabytes = maxMegabytes,
        };
        Store = new OutboxStore(dbPath, Options.MaxOutboxBytes);
        Influx = new InfluxLineWriter(Options, "");
        Writer = wrap is null ? Influx : wrap(Influx);
        Metrics = new TimeseriesMetrics(Meters, Store, TimeProvider.System);
        Sender = new OutboxSender(Store, Writer, Options, Metrics, TimeProvider.System, NullLogger<OutboxSender>.Instance, new Random(7));
        Sink = new TimeseriesSink(Store, Sender, Options, Metrics, TimeProvider.System, NullLogger<TimeseriesSink>.Instance);
    }

    public TimeseriesOptions Options { get; }

    public OutboxStore Store { get; }

    public InfluxLineWriter Influx { get; }

    public ITimeseriesWriter Writer { get; }

    public TimeseriesMetrics Metrics { get; }

    public OutboxSender Sender { get; }

    public TimeseriesSink Sink { get; }

    public async Task StartAsync()
    {
        await Sender.StartAsync(CancellationToken.None);
        _started = true;
    }

    /// <summary>Leaves the sender as a killed process would: no stop, no flush.</summary>
    public void Abandon() => _started = false;

    public async Task StopAsync()
    {
        if (_started)
        {
            _started = false;
            await Sender.StopAsync(CancellationToken.None);
        }
    }

    /// <summary>A frame of cycle <paramref name="i"/>: three gas estimates, one growth estimate, one second apart.</summary>
    public static EstimateFrame Frame(int i, DateTimeOffset t0, string reactor = "r1") => new(reactor, "b-042", t0.AddSeconds(i), SampleQuality.Good,
    [
        new EstimateValue(EstimateNames.Our, 30 + (0.01 * i), "mmol/(L·h)", 0.8, SampleQuality.Good, 0),
        new EstimateValue(EstimateNames.Cer, 31 + (0.01 * i), "mmol/(L·h)", 0.8, SampleQuality.Good, 0),
        new EstimateValue(EstimateNames.Rq, 1.03, "1", double.NaN, SampleQuality.Good, 0),
        new EstimateValue(EstimateNames.MuPerH, 0.15, "1/h", 0.01, SampleQuality.Uncertain, 0x40950000),
    ]);

    /// <summary>Waits until the outbox is empty (true) or the time is up (false).</summary>
    public async Task<bool> DrainedAsync(TimeSpan within)
    {
        var deadline = DateTime.UtcNow + within;
        while (Store.Stats.Depth > 0)
        {
            if (DateTime.UtcNow > deadline)
            {
                return false;
            }

            await Task.Delay(20);
        }

        return true;
    }

    public async ValueTask DisposeAsync()
    {
        await StopAsync();
        Sender.Dispose();
        Influx.Dispose();
        Store.Dispose();
    }
}

/// <summary>Passes writes through and keeps every line written; counts failures.</summary>
internal sealed class RecordingWriter(ITimeseriesWriter inner) : ITimeseriesWriter
{
    private readonly List<string> _lines = [];

    public int Failures { get; private set; }

    public IReadOnlyList<string> Lines
    {
        get
        {
            lock (_lines)
            {
                return [.. _lines];
            }
        }
    }

    public async ValueTask<WriteOutcome> WriteAsync(IReadOnlyList<string> lines, CancellationToken cancellationToken)
    {
        var outcome = await inner.WriteAsync(lines, cancellationToken);
        lock (_lines)
        {
            if (outcome.Acknowledged)
            {
                _lines.AddRange(lines);
            }
            else
            {
                Failures++;
            }
        }

        return outcome;
    }
}

/// <summary>
/// Stands in for a process killed at the worst moment: once <see cref="Armed"/>, the next write
/// that the database acknowledges never returns to the sender (so the rows are never marked), and
/// nothing afterwards runs: the sender is abandoned, as after SIGKILL.
/// </summary>
internal sealed class DyingWriter(ITimeseriesWriter inner) : ITimeseriesWriter
{
    private readonly TaskCompletionSource _never = new();

    public bool Armed { get; set; }

    public TaskCompletionSource<IReadOnlyList<string>> DiedAfter { get; } = new(TaskCreationOptions.RunContinuationsAsynchronously);

    public async ValueTask<WriteOutcome> WriteAsync(IReadOnlyList<string> lines, CancellationToken cancellationToken)
    {
        if (DiedAfter.Task.IsCompleted)
        {
            await _never.Task.WaitAsync(cancellationToken);
        }

        var outcome = await inner.WriteAsync(lines, cancellationToken);
        if (Armed && outcome.Acknowledged)
        {
            DiedAfter.TrySetResult(lines);
            await _never.Task.WaitAsync(cancellationToken);
        }

        return outcome;
    }
}

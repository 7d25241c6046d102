using System.Diagnostics;
using System.Threading.Channels;
using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Sources;
using SoftSensor.Daemon.Status;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// One reactor: its sources write samples into a bounded channel, one task moves them into the
/// signal store, and a cycle runs on the reactor's period (on the injected <see cref="TimeProvider"/>)
/// with the aligned inputs; the frame goes to the dispatcher and the status board. With a
/// <c>cycleTrigger</c> tag the cycle runs as soon as that tag's sample is taken in, and at the latest
/// one period after the previous cycle. The estimator state is checkpointed every N cycles and on stop.
/// </summary>
internal sealed class ReactorPipeline
{
    private readonly ReactorOptions _options;
    private readonly SignalStore _signals;
    private readonly IReactorCycle _cycle;
    private readonly IReadOnlyList<ISampleSource> _sources;
    private readonly PipelineServices _services;
    private readonly AlignedInputs _inputs = new();
    private readonly InputHealth[] _health;
    private readonly Lock _gate = new();
    private readonly KeyValuePair<string, object?> _reactorTag;
    private readonly Channel<bool>? _trigger;
    private long _cycles;
    private long _newestArrival;
    private long _accepted;
    private volatile bool _waitingForTick;

    public ReactorPipeline(ReactorOptions options, IReadOnlyList<TagBinding> bindings, IReactorCycle cycle, IReadOnlyList<ISampleSource> sources, PipelineServices services)
    {
        _options = options;
        _signals = new SignalStore(bindings);
        _health = new InputHealth[bindings.Count];
        _cycle = cycle;
        _sources = sources;
        _services = services;
        _reactorTag = new("reactor", options.Id);
        _trigger = options.CycleTrigger.Length > 0
            ? Channel.CreateBounded<bool>(new BoundedChannelOptions(1) { FullMode = BoundedChannelFullMode.DropWrite, SingleReader = true })
            : null;
    }

    /// <summary>The reactor id.</summary>
    public string Reactor => _options.Id;

    /// <summary>The open batch's id, else the configured one.</summary>
    private string BatchId => _services.Batches?.Current(Reactor)?.BatchId ?? _options.BatchId;

    /// <summary>True while the cycle loop waits for its next tick (lets tests on a fake clock advance it safely).</summary>
    internal bool IsWaitingForTick => _waitingForTick;

    /// <summary>Samples taken into the signal store so far (lets tests wait until a step has arrived).</summary>
    internal long SamplesAccepted => Interlocked.Read(ref _accepted);

    /// <summary>Runs until cancelled, then writes a last checkpoint.</summary>
    public async Task RunAsync(CancellationToken cancellationToken)
    {
        await RestoreAsync(cancellationToken);
        var channel = Channel.CreateBounded<Sample>(new BoundedChannelOptions(8192)
        {
            SingleReader = true,
            FullMode = BoundedChannelFullMode.Wait,
        });
        PipelineLog.Started(_services.Logger, Reactor, _options.CyclePeriod, _signals.Bindings.Count, string.Join(", ", _sources.Select(s => s.Name)));
        var tasks = new List<Task> { IngestAsync(channel.Reader, cancellationToken), _trigger is null ? CycleLoopAsync(cancellationToken) : TriggeredLoopAsync(_trigger.Reader, cancellationToken) };
        tasks.AddRange(_sources.Select(s => RunSourceAsync(s, channel.Writer, cancellationToken)));
        try
        {
            await Task.WhenAll(tasks);
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            // Normal stop.
        }

        await CheckpointAsync(CancellationToken.None);
        PipelineLog.Stopped(_services.Logger, Reactor, Interlocked.Read(ref _cycles));
    }

    /// <summary>Takes one sample (in the role's unit), as the ingest task does; for sources that run inside the pipeline's task and for tests.</summary>
    public bool Accept(in Sample sample)
    {
        bool ok;
        lock (_gate)
        {
            ok = _signals.Accept(sample);
        }

        if (ok)
        {
            Volatile.Write(ref _newestArrival, _services.Time.GetTimestamp());
            Interlocked.Increment(ref _accepted);
            if (_trigger is not null && string.Equals(sample.Tag, _options.CycleTrigger, StringComparison.Ordinal))
            {
                _trigger.Writer.TryWrite(true);
            }
            _services.Metrics.SamplesIn.Add(1, _reactorTag);
        }
        else
        {
            _services.Metrics.SamplesRejected.Add(1, _reactorTag);
            PipelineLog.SampleRejected(_services.Logger, Reactor, sample.Tag);
        }

        return ok;
    }

    /// <summary>Runs one cycle at the clock's current time and dispatches its frame.</summary>
    public async ValueTask<EstimateFrame> RunCycleAsync(CancellationToken cancellationToken)
    {
        long start = Stopwatch.GetTimestamp();
        var now = _services.Time.GetUtcNow();
        long arrival;
        lock (_gate)
        {
            _signals.Align(now, _inputs, _health);
            arrival = Volatile.Read(ref _newestArrival);
        }

        var frame = Compute(now);
        long n = Interlocked.Increment(ref _cycles);
        _services.Board.Publish(new ReactorSnapshot(Reactor, n, now, frame, [.. _health]));
        await _services.Dispatcher.EnqueueAsync(frame, arrival, cancellationToken);
        _services.Metrics.Cycles.Add(1, _reactorTag);
        _services.Metrics.CycleSeconds.Record(Stopwatch.GetElapsedTime(start).TotalSeconds, _reactorTag);
        if (n % _services.CheckpointEveryCycles == 0)
        {
            await CheckpointAsync(cancellationToken);
        }

        return frame;
    }

    private EstimateFrame Compute(DateTimeOffset now)
    {
        try
        {
            var output = _cycle.Run(_inputs, _health);
            var quality = SampleQuality.Good;
            foreach (var v in output.Values)
            {
                quality = SampleQualities.Worst(quality, v.Quality);
            }

            var sourceTime = output.SourceTime == default ? now : output.SourceTime;
            return new EstimateFrame(Reactor, BatchId, sourceTime, quality, output.Values);
        }
        catch (Exception e) when (e is ArithmeticException or InvalidOperationException or ArgumentException)
        {
            // A cycle reports everyday failures as results; an exception here is a programming or model
            // error. Publish a Bad frame rather than stop the reactor's pipeline, and log it.
            PipelineLog.CycleFailed(_services.Logger, e, Reactor);
            return new EstimateFrame(Reactor, BatchId, now, SampleQuality.Bad, []);
        }
    }

    private async Task CycleLoopAsync(CancellationToken cancellationToken)
    {
        using var timer = new PeriodicTimer(_options.CyclePeriod, _services.Time);
        while (true)
        {
            _waitingForTick = true;
            bool ticked = await timer.WaitForNextTickAsync(cancellationToken);
            _waitingForTick = false;
            if (!ticked)
            {
                return;
            }

            await RunCycleAsync(cancellationToken);
        }
    }

    private async Task TriggeredLoopAsync(ChannelReader<bool> trigger, CancellationToken cancellationToken)
    {
        while (true)
        {
            using (var wait = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken))
            {
                var arrived = trigger.WaitToReadAsync(wait.Token).AsTask();
                var fallback = Task.Delay(_options.CyclePeriod, _services.Time, wait.Token);
                _waitingForTick = true;
                await Task.WhenAny(arrived, fallback);
                _waitingForTick = false;
                await wait.CancelAsync();
            }

            cancellationToken.ThrowIfCancellationRequested();
            trigger.TryRead(out _);
            await RunCycleAsync(cancellationToken);
        }
    }

    private async Task IngestAsync(ChannelReader<Sample> reader, CancellationToken cancellationToken)
    {
        while (await reader.WaitToReadAsync(cancellationToken))
        {
            while (reader.TryRead(out var sample))
            {
                Accept(sample);
            }
        }
    }

    private async Task RunSourceAsync(ISampleSource source, ChannelWriter<Sample> writer, CancellationToken cancellationToken)
    {
        try
        {
            await source.RunAsync(writer, cancellationToken);
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            // Normal stop.
        }
        catch (Exception e)
        {
            // A source owns its reconnect loop; one that still fails is logged, and its inputs go stale
            // (the estimates turn Bad) instead of the whole daemon stopping.
            PipelineLog.SourceFailed(_services.Logger, e, Reactor, source.Name);
        }
    }

    private async Task RestoreAsync(CancellationToken cancellationToken)
    {
        if (_services.Checkpoints is not { } store)
        {
            return;
        }

        var checkpoint = await store.LatestCheckpointAsync(Reactor, cancellationToken);
        if (checkpoint is null)
        {
            return;
        }

        try
        {
            _cycle.RestoreState(checkpoint.State);
            Interlocked.Exchange(ref _cycles, checkpoint.Cycle);
            PipelineLog.Restored(_services.Logger, Reactor, checkpoint.Cycle, checkpoint.Time);
        }
        catch (Exception e) when (e is FormatException or System.Text.Json.JsonException or ArgumentException or InvalidOperationException)
        {
            PipelineLog.RestoreFailed(_services.Logger, Reactor, e.Message);
        }
    }

    private async ValueTask CheckpointAsync(CancellationToken cancellationToken)
    {
        if (_services.Checkpoints is not { } store || _cycle.SaveState() is not { } state)
        {
            return;
        }

        await store.WriteCheckpointAsync(new Checkpoint(Reactor, Interlocked.Read(ref _cycles), _services.Time.GetUtcNow(), state), cancellationToken);
    }
}

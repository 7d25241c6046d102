using System.Diagnostics;
using System.Threading.Channels;
using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Sources;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>
/// One reactor: its sources hand samples to the pipeline (its <see cref="ISampleIntake"/>), which
/// takes them into the signal store on the source's own thread, and a cycle runs on the reactor's period (on the injected <see cref="TimeProvider"/>)
/// with the aligned inputs; the frame goes to the dispatcher and the status board. With a
/// <c>cycleTrigger</c> tag the cycle runs as soon as that tag's sample is taken in, and at the latest
/// one period after the previous cycle. The estimator
/// state is checkpointed every N cycles and on stop, with the batch it belongs to.
/// Batches: at each cycle the pipeline reads the reactor's open batch
/// (<see cref="Batches.BatchBook.Current"/>); when it is not the batch the estimator state belongs
/// to, it calls <see cref="IReactorCycle.BeginBatch"/> with the batch's initial conditions before
/// the cycle runs, and checkpoints right after it. A checkpoint of another batch is not restored.
/// </summary>
internal sealed partial class ReactorPipeline : ISampleIntake
{
    private readonly ReactorOptions _options;
    private readonly SignalStore _signals;
    private readonly Batches.BatchSignals _batchSignals;
    private readonly IReactorCycle _cycle;
    private readonly IReadOnlyList<ISampleSource> _sources;
    private readonly PipelineServices _services;
    private readonly AlignedInputs _inputs = new();
    private readonly InputHealth[] _health;
    private readonly Lock _gate = new();
    private readonly KeyValuePair<string, object?> _reactorTag;
    private readonly Channel<bool>? _trigger;
    private string _stateBatch = string.Empty;
    private long _cycles;
    private long _newestArrival;
    private long _accepted;
    private volatile bool _waitingForTick;

    public ReactorPipeline(ReactorOptions options, IReadOnlyList<TagBinding> bindings, IReactorCycle cycle, IReadOnlyList<ISampleSource> sources, PipelineServices services)
    {
        _options = options;
        var process = TagBinding.Process(bindings);
        _signals = new SignalStore(process);
        _batchSignals = new Batches.BatchSignals(options, bindings);
        _health = new InputHealth[process.Count];
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

    /// <summary>The operator batch the estimator state belongs to (empty before the first batch).</summary>
    public string StateBatch => Volatile.Read(ref _stateBatch);

    /// <summary>True while the cycle loop waits for its next tick (lets tests on a fake clock advance it safely).</summary>
    internal bool IsWaitingForTick => _waitingForTick;

    /// <summary>Samples taken into the signal store so far (lets tests wait until a step has arrived).</summary>
    internal long SamplesAccepted => Interlocked.Read(ref _accepted);

    /// <summary>Runs until cancelled, then writes a last checkpoint.</summary>
    public async Task RunAsync(CancellationToken cancellationToken)
    {
        await RestoreAsync(cancellationToken);
        PipelineLog.Started(_services.Logger, Reactor, _options.CyclePeriod, _signals.Bindings.Count, string.Join(", ", _sources.Select(s => s.Name)));
        var tasks = new List<Task> { _trigger is null ? CycleLoopAsync(cancellationToken) : TriggeredLoopAsync(_trigger.Reader, cancellationToken) };
        tasks.AddRange(_sources.Select(s => RunSourceAsync(s, cancellationToken)));
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

    /// <inheritdoc/>
    bool ISampleIntake.Take(in Sample sample) => Accept(sample);

    /// <summary>Takes one sample (in the role's unit) from any thread: what the sources hand to the intake; for tests too.</summary>
    public bool Accept(in Sample sample)
    {
        bool ok;
        if (_batchSignals.Handles(sample.Tag))
        {
            ok = _batchSignals.Accept(sample);
        }
        else
        {
            lock (_gate)
            {
                ok = _signals.Accept(sample);
            }
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

        if (_services.Batches is { } book)
        {
            _batchSignals.Apply(now, _inputs, book, _services.Logger);
        }

        var open = _services.Batches?.Current(Reactor);
        bool began = open is not null && open.BatchId != _stateBatch && BeginBatch(open);
        string batchId = open?.BatchId ?? _options.BatchId;
        if (_services.Samples is { } samples)
        {
            // Operator inputs go to the estimator here, on the cycle task (after a batch start reset it), so they never race a cycle.
            Samples.SampleApplier.ApplyPending(samples, Reactor, batchId, _cycle,
                state => state is null ? null : NewCheckpoint(state, now), _services.Logger);
        }

        var frame = Compute(now, batchId) with { Phase = open?.Phase ?? string.Empty };
        long n = Interlocked.Increment(ref _cycles);
        _services.Board.Publish(new ReactorSnapshot(Reactor, n, now, frame, [.. _health]));
        await _services.Dispatcher.EnqueueAsync(frame, arrival, cancellationToken);
        _services.Metrics.Cycles.Add(1, _reactorTag);
        _services.Metrics.CycleSeconds.Record(Stopwatch.GetElapsedTime(start).TotalSeconds, _reactorTag);
        if (began || n % _services.CheckpointEveryCycles == 0)
        {
            await CheckpointAsync(cancellationToken);
        }

        return frame;
    }

    private bool BeginBatch(Batches.BatchRun open)
    {
        var initial = open.Initial;
        try
        {
            _cycle.BeginBatch(initial);
            PipelineLog.BatchBegan(_services.Logger, Reactor, open.BatchId, initial.VolumeL, initial.BiomassGPerL, initial.BiomassSigmaGPerL, initial.SubstrateGPerL);
        }
        catch (ArgumentException e)
        {
            // The batch book validates every start; a failure here is a programming error. The batch keeps
            // running on the previous state rather than retrying every cycle.
            PipelineLog.BatchBeginFailed(_services.Logger, Reactor, open.BatchId, e.Message);
        }

        Volatile.Write(ref _stateBatch, open.BatchId);
        return true;
    }

    private EstimateFrame Compute(DateTimeOffset now, string batchId)
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
            return new EstimateFrame(Reactor, batchId, sourceTime, quality, output.Values);
        }
        catch (Exception e) when (e is ArithmeticException or InvalidOperationException or ArgumentException)
        {
            // A cycle reports everyday failures as results; an exception here is a programming or model
            // error. Publish a Bad frame rather than stop the reactor's pipeline, and log it.
            PipelineLog.CycleFailed(_services.Logger, e, Reactor);
            return new EstimateFrame(Reactor, batchId, now, SampleQuality.Bad, []);
        }
    }
}

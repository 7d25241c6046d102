using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>Checkpoints of the pipeline: the cycle's state, the batch it belongs to and the input samples still held.</summary>
internal sealed partial class ReactorPipeline
{
    /// <summary>Restores the newest checkpoint when it belongs to the open batch (RunAsync does it first; internal for tests).</summary>
    internal async Task RestoreAsync(CancellationToken cancellationToken)
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

        var open = _services.Batches?.Current(Reactor);
        if (!BelongsToOpenBatch(checkpoint, open))
        {
            PipelineLog.CheckpointOfOtherBatch(_services.Logger, Reactor, checkpoint.Cycle, checkpoint.Batch ?? "(unrecorded)", open?.BatchId ?? "(none)");
            return;
        }

        try
        {
            _cycle.RestoreState(checkpoint.State);
            Volatile.Write(ref _stateBatch, open?.BatchId ?? string.Empty);
            RestoreInputs(checkpoint.Inputs);
            Interlocked.Exchange(ref _cycles, checkpoint.Cycle);
            PipelineLog.Restored(_services.Logger, Reactor, checkpoint.Cycle, checkpoint.Time);
        }
        catch (Exception e) when (e is FormatException or System.Text.Json.JsonException or ArgumentException or InvalidOperationException)
        {
            PipelineLog.RestoreFailed(_services.Logger, Reactor, e.Message);
        }
    }

    /// <summary>The samples the stopped pipeline still held (its analyser dead-time window), so alignment continues without a gap.</summary>
    private void RestoreInputs(string? json)
    {
        if (json is null)
        {
            return;
        }

        var samples = HeldSamples.Decode(json, out string? error);
        if (error is not null)
        {
            PipelineLog.RestoreFailed(_services.Logger, Reactor, "checkpoint inputs: " + error);
        }

        lock (_gate)
        {
            foreach (var s in samples)
            {
                _signals.Accept(s);
            }
        }
    }

    /// <summary>
    /// A checkpoint resumes the open batch only when it was written in it (or, with no batch open, outside
    /// any batch); one written before batches were recorded counts when the open batch had already started.
    /// </summary>
    private static bool BelongsToOpenBatch(Checkpoint checkpoint, Batches.BatchRun? open) => checkpoint.Batch switch
    {
        null => open is null || open.StartedAt <= checkpoint.Time,
        var batch => batch == (open?.BatchId ?? string.Empty),
    };

    private async ValueTask CheckpointAsync(CancellationToken cancellationToken)
    {
        if (_services.Checkpoints is not { } store || _cycle.SaveState() is not { } state)
        {
            return;
        }

        await store.WriteCheckpointAsync(NewCheckpoint(state, _services.Time.GetUtcNow()), cancellationToken);
    }

    /// <summary>A checkpoint of <paramref name="state"/> now: the cycle count, the batch it belongs to and the held input samples.</summary>
    private Checkpoint NewCheckpoint(string state, DateTimeOffset time)
    {
        string inputs;
        lock (_gate)
        {
            inputs = HeldSamples.Encode(_signals.Held());
        }

        return new Checkpoint(Reactor, Interlocked.Read(ref _cycles), time, state, StateBatch) { Inputs = inputs };
    }
}

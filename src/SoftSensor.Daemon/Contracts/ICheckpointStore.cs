namespace SoftSensor.Daemon.Contracts;

/// <summary>An estimator state checkpoint of one reactor.</summary>
/// <param name="Reactor">Reactor id.</param>
/// <param name="Cycle">Cycle number at which it was taken.</param>
/// <param name="Time">Cycle time (UTC).</param>
/// <param name="State">The state as the cycle wrote it (JSON).</param>
/// <param name="Batch">The operator batch the state belongs to: its id, empty when no batch was open, null in a checkpoint written before batches were recorded.</param>
internal sealed record Checkpoint(string Reactor, long Cycle, DateTimeOffset Time, string State, string? Batch = null)
{
    /// <summary>The input samples the pipeline still held (JSON, <see cref="HeldSamples"/>), so that dead-time alignment continues after a restart; null when none were saved.</summary>
    public string? Inputs { get; init; }
}

/// <summary>Durable storage of checkpoints (the embedded store). Thread-safe.</summary>
internal interface ICheckpointStore
{
    /// <summary>The newest checkpoint of a reactor, or null.</summary>
    ValueTask<Checkpoint?> LatestCheckpointAsync(string reactor, CancellationToken cancellationToken);

    /// <summary>Writes a checkpoint durably before returning.</summary>
    ValueTask WriteCheckpointAsync(Checkpoint checkpoint, CancellationToken cancellationToken);
}

using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Sources;

/// <summary>
/// A source of plant samples (MQTT, OPC UA, simulator, CSV replay). Threading contract:
/// <see cref="RunAsync"/> is called once per source by its pipeline and runs until cancelled; it
/// owns its own reconnect loop, hands samples already converted to the tag's engineering unit to
/// <paramref name="samples"/> (from any thread: the intake is thread-safe and never waits), and
/// never throws for a malformed payload (it logs and counts it). It returns when
/// <paramref name="cancellationToken"/> is cancelled.
/// </summary>
internal interface ISampleSource
{
    /// <summary>A short name for logs and metrics, e.g. <c>mqtt</c>.</summary>
    string Name { get; }

    /// <summary>Delivers samples until cancelled.</summary>
    Task RunAsync(ISampleIntake samples, CancellationToken cancellationToken);
}

/// <summary>
/// Where a source hands its samples: the pipeline's signal store, taken in on the caller's thread
/// under the pipeline's lock (no queue, no task hop: a tag costs no thread wake-up, and only the
/// cycle trigger wakes the cycle). Rejected samples are logged and counted by the intake.
/// </summary>
internal interface ISampleIntake
{
    /// <summary>Takes one sample; false when the signal store refused it (logged and counted).</summary>
    bool Take(in Sample sample);
}

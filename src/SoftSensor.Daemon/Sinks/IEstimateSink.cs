using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Sinks;

/// <summary>
/// A consumer of estimate frames (embedded store, time-series outbox, MQTT, OPC UA write-back).
/// Threading contract: <see cref="WriteAsync"/> is called from one pipeline task at a time, in
/// cycle order; a sink that talks to the network must not block the cycle for long (queue, or
/// rely on the durable outbox) and must not throw for a transient outage (it logs and counts).
/// </summary>
internal interface IEstimateSink
{
    /// <summary>A short name for logs and metrics.</summary>
    string Name { get; }

    /// <summary>Takes one frame.</summary>
    ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken);
}

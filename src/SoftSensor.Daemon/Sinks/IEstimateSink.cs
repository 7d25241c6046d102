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

/// <summary>
/// A sink that takes the frames the dispatcher has queued together in one call (in dispatch order,
/// each reactor's in cycle order): the store commits them in one transaction, MQTT keeps all their
/// publishes in flight at once. Same threading and failure contract as <see cref="IEstimateSink"/>.
/// </summary>
internal interface IEstimateBatchSink : IEstimateSink
{
    /// <summary>Takes several frames.</summary>
    ValueTask WriteBatchAsync(IReadOnlyList<EstimateFrame> frames, CancellationToken cancellationToken);
}

/// <summary>
/// A sink whose writes complete after it returned (MQTT QoS 1: the broker's acknowledgements come
/// back while the dispatcher goes on with the next frames, up to a bounded window). The dispatcher
/// calls <see cref="DrainAsync"/> once, after its last frames at stop, so nothing in flight is cut
/// off by the shutdown.
/// </summary>
internal interface IPipelinedSink : IEstimateSink
{
    /// <summary>Waits until every write handed over so far has completed (or failed and been counted).</summary>
    ValueTask DrainAsync(CancellationToken cancellationToken);
}

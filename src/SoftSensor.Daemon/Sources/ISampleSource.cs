using System.Threading.Channels;
using SoftSensor.Core.Signals;

namespace SoftSensor.Daemon.Sources;

/// <summary>
/// A source of plant samples (MQTT, OPC UA, simulator, CSV replay). Threading contract:
/// <see cref="RunAsync"/> is called once per source by its pipeline and runs until cancelled; it
/// owns its own reconnect loop, writes samples already converted to the tag's engineering unit
/// into <paramref name="samples"/> (a bounded channel: it waits when the cycle is behind), and
/// never throws for a malformed payload (it logs and counts it). It returns when
/// <paramref name="cancellationToken"/> is cancelled.
/// </summary>
internal interface ISampleSource
{
    /// <summary>A short name for logs and metrics, e.g. <c>mqtt</c>.</summary>
    string Name { get; }

    /// <summary>Delivers samples until cancelled.</summary>
    Task RunAsync(ChannelWriter<Sample> samples, CancellationToken cancellationToken);
}

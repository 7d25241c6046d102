using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Sources;

namespace SoftSensor.Daemon.Contracts;

/// <summary>
/// Makes the sample sources of a reactor. Every factory registered in DI is asked; each returns the
/// source that serves the tags it knows (MQTT topics, OPC UA nodes), or null.
/// </summary>
internal interface ISampleSourceFactory
{
    /// <summary>A source for <paramref name="reactor"/>, or null when none of its tags is for this kind of source.</summary>
    ISampleSource? Create(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings);
}

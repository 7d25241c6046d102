using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// The daemon's output topics in the plant hierarchy (docs/daemon.md: lowercase, no leading
/// slash, separate subtrees for estimates, alarms and status):
/// <c>{prefix}/{site}/{area}/{reactor}/estimate/{name}</c>, <c>{prefix}/{site}/{area}/{reactor}/batch</c>, <c>{prefix}/{site}/{area}/{reactor}/alarm/{id}</c>,
/// <c>{prefix}/{site}/{area}/daemon/{clientId}/status</c>.
/// </summary>
internal sealed class MqttTopics
{
    private readonly string _base;
    private readonly System.Collections.Concurrent.ConcurrentDictionary<(string Reactor, string Name), string> _estimates = new();

    public MqttTopics(SoftSensorOptions options)
    {
        _base = $"{options.Mqtt.TopicPrefix}/{options.Site}/{options.Area}";
        Status = $"{_base}/daemon/{options.Mqtt.ClientId.ToLowerInvariant()}/status";
    }

    /// <summary>The daemon's retained online/offline topic (also the last will's).</summary>
    public string Status { get; }

    /// <summary>The topic of one estimate of one reactor (made once per pair: the sink asks for it every cycle).</summary>
    public string Estimate(string reactor, string name) =>
        _estimates.TryGetValue((reactor, name), out var topic) ? topic : _estimates.GetOrAdd((reactor, name), k => $"{_base}/{k.Reactor}/estimate/{k.Name}");

    /// <summary>The retained topic of a reactor's batch and phase: <c>{prefix}/{site}/{area}/{reactor}/batch</c>.</summary>
    public string Batch(string reactor) => $"{_base}/{reactor}/batch";

    /// <summary>The topic of one alarm of one reactor.</summary>
    public string Alarm(string reactor, string alarmId) => $"{_base}/{reactor}/alarm/{alarmId.ToLowerInvariant()}";
}

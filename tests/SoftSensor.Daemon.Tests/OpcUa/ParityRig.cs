using System.Collections.Concurrent;
using System.Globalization;
using Microsoft.Extensions.Configuration;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Sinks;
using SoftSensor.OpcUa.Tests.Peers;

namespace SoftSensor.Daemon.Tests.OpcUa;

/// <summary>
/// The configuration of the OPC UA / MQTT parity test: the shipped demo reactor (config/demo.json,
/// full estimator, invented demo scenario) twice in one daemon, once fed by MQTT topics and once by
/// the peer's Objects/Plant variables, with the same model, settings and tag names.
/// </summary>
internal static class ParityRig
{
    public const string MqttReactor = "mqtt-fed";
    public const string OpcUaReactor = "opcua-fed";

    /// <summary>The demo reactor's tag names (R1.AIR.FLOW, ...), in the order of config/demo.json.</summary>
    public static IReadOnlyList<string> TagNames()
    {
        var demo = Demo();
        return [.. demo.GetSection("reactors:0:tags").GetChildren().Select(c => c.Key)];
    }

    public static string Topic(string tag) => $"parity/{MqttReactor}/{tag.ToLowerInvariant()}";

    public static string Node(string tag) => $"nsu={OpcUaPeerServer.NamespaceUri};s=Plant.{tag}";

    /// <summary>Flat configuration keys: reactor 0 as in the demo but fed by MQTT, reactor 1 a copy fed by OPC UA.</summary>
    public static Dictionary<string, string?> Config(int brokerPort, string opcUaEndpoint)
    {
        var demo = Demo();
        string modelDir = Path.GetDirectoryName(DemoFiles.Find(DemoFiles.Config))!;
        var c = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        foreach (var (key, value) in demo.AsEnumerable())
        {
            if (value is null || key.StartsWith("mqtt:", StringComparison.OrdinalIgnoreCase) || key.StartsWith("store:", StringComparison.OrdinalIgnoreCase) || key.StartsWith("status:", StringComparison.OrdinalIgnoreCase)
                || key.StartsWith("alarms:", StringComparison.OrdinalIgnoreCase))
            {
                continue;
            }

            c[key] = value;
            if (key.StartsWith("reactors:0:", StringComparison.OrdinalIgnoreCase))
            {
                c["reactors:1:" + key["reactors:0:".Length..]] = value;
            }
        }

        foreach (int i in new[] { 0, 1 })
        {
            c[$"reactors:{i}:id"] = i == 0 ? MqttReactor : OpcUaReactor;
            c[$"reactors:{i}:modelFile"] = Path.Combine(modelDir, demo["reactors:0:modelFile"]!);
        }

        foreach (var tag in TagNames())
        {
            c[$"reactors:0:tags:{tag}:topic"] = Topic(tag);
            c.Remove($"reactors:1:tags:{tag}:topic");
            c[$"reactors:1:tags:{tag}:opcUaNode"] = Node(tag);
        }

        c["area"] = "parity";
        c["mqtt:host"] = "127.0.0.1";
        c["mqtt:port"] = brokerPort.ToString(CultureInfo.InvariantCulture);
        c["mqtt:clientId"] = "parity-daemon";
        c["mqtt:topicPrefix"] = "softsensor";
        c["store:checkpointEveryCycles"] = "1000";
        c["opcUa:endpoint"] = opcUaEndpoint;
        // Fast subscription so that a written step reaches the daemon in tens of milliseconds.
        c["opcUa:publishingInterval"] = "00:00:00.050";
        c["opcUa:samplingInterval"] = "00:00:00";
        c["opcUa:queueSize"] = "10";
        return c;
    }

    private static IConfigurationRoot Demo() =>
        new ConfigurationBuilder().AddJsonFile(DemoFiles.Find(DemoFiles.Config) ?? throw new FileNotFoundException(DemoFiles.Config)).Build();
}

/// <summary>A sink that keeps every frame per reactor, in dispatch order (it runs after the store and MQTT sinks).</summary>
internal sealed class RecordingSink : IEstimateSink
{
    private readonly ConcurrentDictionary<string, ConcurrentQueue<EstimateFrame>> _frames = new(StringComparer.Ordinal);

    public string Name => "test-recorder";

    public IReadOnlyList<EstimateFrame> Frames(string reactor) => _frames.TryGetValue(reactor, out var q) ? [.. q] : [];

    public int Count(string reactor) => _frames.TryGetValue(reactor, out var q) ? q.Count : 0;

    public ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken)
    {
        _frames.GetOrAdd(frame.Reactor, _ => new ConcurrentQueue<EstimateFrame>()).Enqueue(frame);
        return ValueTask.CompletedTask;
    }
}

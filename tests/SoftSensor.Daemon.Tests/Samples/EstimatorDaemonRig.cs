using System.Globalization;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Status;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Samples;

/// <summary>
/// The daemon with the full estimator of config/demo.json on a fake process clock, fed the virtual glycerol
/// reactor's tags (invented demo data) over a real mosquitto as a plant gateway would publish them; one cycle
/// per <see cref="CycleAsync"/>, run only after the daemon ingested that instant's tags.
/// </summary>
internal sealed class EstimatorDaemonRig : IAsyncDisposable
{
    public static readonly TimeSpan Period = TimeSpan.FromSeconds(10);
    public static readonly TimeSpan Wait = TimeSpan.FromSeconds(10);
    private readonly Dictionary<string, string?> _config;
    private readonly HashSet<string> _topics;
    private long _published;
    private long _baseline;

    public EstimatorDaemonRig(int brokerPort, string area, string storePath)
    {
        string demo = DemoFiles.Find(DemoFiles.Config) ?? throw new FileNotFoundException(DemoFiles.Config);
        Scenario = ScenarioLoader.Load(DemoFiles.Find(DemoFiles.Scenario) ?? throw new FileNotFoundException(DemoFiles.Scenario));
        Sim = VirtualReactor.Create(Scenario, Scenario.Seed);
        Clock = new FakeTimeProvider(Sim.Time);
        var c = new ConfigurationBuilder().AddJsonFile(demo).Build();
        _config = c.AsEnumerable().Where(kv => kv.Value is not null).ToDictionary(kv => kv.Key, kv => kv.Value, StringComparer.OrdinalIgnoreCase);
        _config["site"] = "pilot";
        _config["area"] = area;
        _config["mqtt:port"] = brokerPort.ToString(CultureInfo.InvariantCulture);
        _config["mqtt:clientId"] = area;
        _config["reactors:0:modelFile"] = Path.Combine(Path.GetDirectoryName(demo)!, _config["reactors:0:modelFile"]!);
        _config["store:path"] = storePath;
        _config.Remove("status:url");
        // The demo's alarm rules are named beside its file; these tests are about samples, not alarms.
        foreach (var key in _config.Keys.Where(k => k.StartsWith("alarms:", StringComparison.OrdinalIgnoreCase)).ToList())
        {
            _config.Remove(key);
        }

        _topics = _config.Where(kv => kv.Key.EndsWith(":topic", StringComparison.OrdinalIgnoreCase)).Select(kv => kv.Value!).ToHashSet(StringComparer.Ordinal);
        Commands = $"softsensor/pilot/{area}/r1/command";
    }

    public Scenario Scenario { get; }

    public VirtualReactor Sim { get; }

    public FakeTimeProvider Clock { get; }

    /// <summary>The reactor's command subtree.</summary>
    public string Commands { get; }

    public TestDaemon Daemon { get; private set; } = null!;

    public TestMqttClient Client { get; private set; } = null!;

    /// <summary>Cycles run by the current daemon.</summary>
    public long Cycles => Daemon.Get<StatusBoard>().Get("r1")?.Cycle ?? 0;

    /// <summary>Starts (or restarts) the daemon on the same store and clock, and the test's MQTT client.</summary>
    public async Task StartAsync()
    {
        Daemon = await TestDaemon.StartAsync(new(_config, StringComparer.OrdinalIgnoreCase), s => s.AddSingleton<TimeProvider>(Clock));
        _published = 0;
        _baseline = SamplesIn();
        Client ??= await TestMqttClient.ConnectAsync(int.Parse(_config["mqtt:port"]!, CultureInfo.InvariantCulture), _config["mqtt:clientId"] + "-client");
        await Client.SubscribeAsync(Commands + "/+/result");
        var link = Daemon.Get<MqttLink>();
        await Until(() => link.IsSubscribed(Commands + "/batch") && link.IsSubscribed(Commands + "/sample"), "command topics subscribed");
    }

    /// <summary>Stops the daemon (its last checkpoint is written on stop); the store stays.</summary>
    public async Task StopAsync()
    {
        await Daemon.DisposeAsync();
        Daemon = null!;
    }

    /// <summary>Steps the simulator one period, publishes its tags, waits until they are in, and runs one cycle at the simulator's time.</summary>
    public async Task CycleAsync()
    {
        Sim.Step(Period);
        string time = Sim.Time.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture);
        var sends = new List<Task>();
        foreach (var (name, value) in Sim.ReadTags())
        {
            string topic = DemoPublisher.Topic("r1", name);
            if (_topics.Contains(topic))
            {
                sends.Add(Client.PublishAsync(topic, string.Create(CultureInfo.InvariantCulture, $$"""{"value":{{value:R}},"timestamp":"{{time}}","quality":"good"}""")));
                _published++;
            }
        }

        await Task.WhenAll(sends);
        await Until(() => SamplesIn() - _baseline >= _published, $"tags of {time} ingested");
        var pipeline = Daemon.Get<PipelineSupervisor>().Pipelines[0];
        await Until(() => pipeline.IsWaitingForTick, "cycle loop waiting");
        long before = Cycles;
        Clock.SetUtcNow(Sim.Time);
        await Until(() => Cycles > before, $"cycle at {time}");
    }

    public static async Task Until(Func<bool> condition, string what)
    {
        var until = DateTime.UtcNow + Wait;
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, $"not within {Wait}: {what}");
            await Task.Delay(2);
        }
    }

    public async ValueTask DisposeAsync()
    {
        if (Client is not null)
        {
            await Client.DisposeAsync();
        }

        if (Daemon is not null)
        {
            await Daemon.DisposeAsync();
        }
    }

    // This daemon's own count (the Prometheus text would also sum other daemons of the test process: one MeterListener sees every meter).
    private long SamplesIn() => Daemon.Get<PipelineSupervisor>().Pipelines[0].SamplesAccepted;
}

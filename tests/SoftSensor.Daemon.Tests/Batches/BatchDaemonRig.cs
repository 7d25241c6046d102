using System.Globalization;
using System.Text.Json;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Batches;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Daemon.Tests.OpcUa;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Batches;

/// <summary>
/// An in-process daemon running the shipped demo reactor (config/demo.json, full estimator) as r1,
/// fed the virtual reactor's tags (config/scenarios/glycerol.json, invented demo data) over a real
/// mosquitto, on a fake clock advanced one cycle period per step once the daemon took in all of the
/// step's tags (as the OPC UA / MQTT parity test does). The store folder outlives a daemon, so a
/// test can stop one and start the next on the same data; the simulator and the clock run on.
/// </summary>
internal sealed class BatchDaemonRig : IAsyncDisposable
{
    public static readonly TimeSpan Period = TimeSpan.FromSeconds(10);

    private readonly int _port;
    private readonly string _name;
    private readonly Dictionary<string, string?> _extra;
    private readonly IReadOnlyList<string> _tags;
    private TestMqttClient? _plant;
    private long _accepted;

    public BatchDaemonRig(int brokerPort, string name, Dictionary<string, string?>? extra = null)
    {
        _port = brokerPort;
        _name = name;
        _extra = extra ?? [];
        var scenario = ScenarioLoader.Load(DemoFiles.Find(DemoFiles.Scenario) ?? throw new FileNotFoundException(DemoFiles.Scenario));
        Sim = VirtualReactor.Create(scenario, scenario.Seed);
        Clock = new FakeTimeProvider(Sim.Time);
        _tags = ParityRig.TagNames();
        Dir = Directory.CreateTempSubdirectory("softsensor-batchrig-").FullName;
    }

    public VirtualReactor Sim { get; }

    public FakeTimeProvider Clock { get; }

    public RecordingSink Frames { get; } = new();

    public string Dir { get; }

    public TestDaemon? Daemon { get; private set; }

    public BatchBook Book => Daemon!.Get<BatchBook>();

    public ReactorPipeline Pipeline => Daemon!.Get<PipelineSupervisor>().Pipelines.Single();

    public string Topic(string tag) => $"batchrig/{_name}/{tag.ToLowerInvariant()}";

    public string CommandTopic => $"softsensor/pilot/{_name}/r1/command/batch";

    /// <summary>Flat configuration keys of the daemon.</summary>
    public Dictionary<string, string?> Config()
    {
        var demo = new ConfigurationBuilder().AddJsonFile(DemoFiles.Find(DemoFiles.Config)!).Build();
        string modelDir = Path.GetDirectoryName(DemoFiles.Find(DemoFiles.Config))!;
        var c = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        foreach (var (key, value) in demo.AsEnumerable())
        {
            if (value is not null && key.StartsWith("reactors:0:", StringComparison.OrdinalIgnoreCase))
            {
                c[key] = value;
            }
        }

        c["site"] = "pilot";
        c["area"] = _name;
        c["reactors:0:id"] = "r1";
        c["reactors:0:modelFile"] = Path.Combine(modelDir, demo["reactors:0:modelFile"]!);
        foreach (var tag in _tags)
        {
            c[$"reactors:0:tags:{tag}:topic"] = Topic(tag);
        }

        c["mqtt:host"] = "127.0.0.1";
        c["mqtt:port"] = _port.ToString(CultureInfo.InvariantCulture);
        c["mqtt:clientId"] = _name;
        c["mqtt:topicPrefix"] = "softsensor";
        c["store:path"] = Path.Combine(Dir, "store.db");
        c["store:checkpointEveryCycles"] = "6";
        foreach (var (k, v) in _extra)
        {
            c[k] = v;
        }

        return c;
    }

    public async Task StartDaemonAsync()
    {
        Daemon = await TestDaemon.StartAsync(Config(), s =>
        {
            s.AddSingleton<TimeProvider>(Clock);
            s.AddSingleton<IEstimateSink>(Frames);
        });
        _accepted = 0;
        _plant ??= await TestMqttClient.ConnectAsync(_port, _name + "-plant");
    }

    /// <summary>Stops the daemon gracefully (its last checkpoint is written); the store folder stays.</summary>
    public async Task StopDaemonAsync()
    {
        await Daemon!.DisposeAsync();
        Daemon = null;
        SqliteConnection.ClearAllPools();
    }

    /// <summary>Publishes a non-simulated tag (batch id, phase code) and waits until the pipeline took it.</summary>
    public async Task PublishAsync(string tag, object value)
    {
        await _plant!.PublishAsync(Topic(tag), JsonSerializer.Serialize(new { value, timestamp = Clock.GetUtcNow().ToString("O", CultureInfo.InvariantCulture) }));
        _accepted++;
        await WaitUntilAsync(() => Pipeline.SamplesAccepted >= _accepted, () => $"{tag} not taken in");
    }

    /// <summary>Steps the simulator and the daemon <paramref name="steps"/> cycles; <paramref name="overrides"/> replaces tag values.</summary>
    public async Task<EstimateFrame> StepAsync(int steps = 1, IReadOnlyDictionary<string, double>? overrides = null)
    {
        EstimateFrame last = null!;
        for (int i = 0; i < steps; i++)
        {
            Sim.Step(Period);
            var values = Sim.ReadTags();
            var stamp = Sim.Time;
            foreach (var t in _tags)
            {
                double v = overrides is not null && overrides.TryGetValue(t, out var o) ? o : values[t];
                await _plant!.PublishAsync(Topic(t), JsonSerializer.Serialize(new { value = v, timestamp = stamp.ToString("O", CultureInfo.InvariantCulture) }));
            }

            _accepted += _tags.Count;
            var pipeline = Pipeline;
            int before = Frames.Count("r1");
            await WaitUntilAsync(() => pipeline.SamplesAccepted >= _accepted && pipeline.IsWaitingForTick, () => $"accepted {pipeline.SamplesAccepted} of {_accepted}");
            Clock.SetUtcNow(stamp);
            await WaitUntilAsync(() => Frames.Count("r1") > before, () => "no frame after the tick");
            last = Frames.Frames("r1")[^1];
        }

        return last;
    }

    public static double Value(EstimateFrame f, string name) => f.Values.Single(v => v.Name == name).Value;

    public static async Task WaitUntilAsync(Func<bool> condition, Func<string> what, double seconds = 15)
    {
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(seconds);
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, what());
            await Task.Delay(5);
        }
    }

    public async ValueTask DisposeAsync()
    {
        if (Daemon is not null)
        {
            await StopDaemonAsync();
        }

        if (_plant is not null)
        {
            await _plant.DisposeAsync();
        }

        SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(Dir, recursive: true);
        }
        catch (IOException)
        {
            // A leftover temp folder is harmless.
        }
    }
}

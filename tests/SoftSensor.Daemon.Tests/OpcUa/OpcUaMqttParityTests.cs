using System.Globalization;
using System.Text.Json;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Tests.Peers;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.OpcUa;

/// <summary>
/// End to end (issue 8): one daemon, two reactors with the same model and settings; one reads its
/// tags from a real mosquitto, the other from a real node-opcua server (tests/peers). The virtual
/// reactor's tag values (invented demo scenario) are written each step, with the same source
/// timestamps, to both: by MQTT publish and by OPC UA Write. The daemon's clock is a fake one,
/// advanced one cycle period per step only after both reactors took in all of that step's tags,
/// so both cycles see identical inputs and the estimates must agree cycle by cycle. The second
/// test does the same against a server with secure endpoints only (issue 18): the daemon's OPC UA
/// source signs and encrypts (Basic256Sha256 SignAndEncrypt) and logs in with a user name.
/// </summary>
[Collection(SecureOpcUaPeerCollection.Name)]
public sealed class OpcUaMqttParityTests : IClassFixture<MosquittoFixture>, IAsyncLifetime
{
    private static readonly TimeSpan Period = TimeSpan.FromSeconds(10);
    private const int Steps = 36; // 6 min of process time: past the analysers' 45 s dead time and the estimator's warm-up.

    // Both transports carry the value as an IEEE 754 binary64: UA Binary Double (IEC 62541-6 §5.2.2.3) and
    // JSON text in System.Text.Json's shortest round-trip form; source times as 100 ns ticks (Part 6 §5.2.2.5)
    // and ISO 8601 text with 7 fraction digits. So the two cycles see bit-identical inputs; the tolerance
    // below only allows for nothing but rounding noise, were any to appear.

    private const string PasswordVariable = "SOFTSENSOR_TEST_PARITY_OPCUA_PASSWORD";

    private readonly MosquittoFixture _broker;
    private readonly SecureOpcUaPeer _secure;
    private readonly OpcUaPeerServer _peer = new(new Dictionary<string, string> { ["OPCUA_PLANT_TAGS"] = string.Join(",", ParityRig.TagNames()) });

    public OpcUaMqttParityTests(MosquittoFixture broker, SecureOpcUaPeer secure)
    {
        _broker = broker;
        _secure = secure;
    }

    public Task InitializeAsync() => _peer.StartAsync(CancellationToken.None);

    public Task DisposeAsync() => _peer.StopAsync();

    [Fact]
    public Task Daemon_fed_the_same_steps_by_OPC_UA_and_by_MQTT_gives_the_same_estimates_every_cycle() =>
        RunParityAsync(_peer.EndpointUrl, c => c["opcUa:security"] = "none", new SessionOptions { EndpointUrl = _peer.EndpointUrl });

    [Fact]
    public async Task Daemon_reading_a_secure_only_server_signed_and_encrypted_gives_the_same_estimates_as_MQTT()
    {
        Environment.SetEnvironmentVariable(PasswordVariable, SecureOpcUaPeer.Password);
        try
        {
            await RunParityAsync(_secure.Server.EndpointUrl, c =>
            {
                c["opcUa:security"] = "sign-encrypt";
                c["opcUa:policy"] = "Basic256Sha256";
                c["opcUa:pki"] = _secure.TrustingPki;
                c["opcUa:user"] = SecureOpcUaPeer.User;
                c["opcUa:passwordVariable"] = PasswordVariable;
            }, _secure.Options("Aes256_Sha256_RsaPss", SecurityChoice.Sign));
        }
        finally
        {
            Environment.SetEnvironmentVariable(PasswordVariable, null);
        }
    }

    private async Task RunParityAsync(string endpointUrl, Action<Dictionary<string, string?>> configure, SessionOptions writer)
    {
        var config = ParityRig.Config(_broker.Port, endpointUrl);
        configure(config);
        var scenario = ScenarioLoader.Load(DemoFiles.Find(DemoFiles.Scenario) ?? throw new FileNotFoundException(DemoFiles.Scenario));
        var sim = VirtualReactor.Create(scenario, scenario.Seed);
        var clock = new FakeTimeProvider(sim.Time);
        var recorder = new RecordingSink();
        await using var daemon = await TestDaemon.StartAsync(config, s =>
        {
            s.AddSingleton<TimeProvider>(clock);
            s.AddSingleton<IEstimateSink>(recorder);
        });
        var pipelines = daemon.Get<PipelineSupervisor>().Pipelines;
        var viaMqtt = pipelines.Single(p => p.Reactor == ParityRig.MqttReactor);
        var viaOpcUa = pipelines.Single(p => p.Reactor == ParityRig.OpcUaReactor);

        await using var mqtt = await TestMqttClient.ConnectAsync(_broker.Port, "parity-publisher");
        await using var ua = await UaConnection.OpenAsync(writer, TimeProvider.System, NullLogger.Instance, CancellationToken.None);
        var tags = ParityRig.TagNames();
        var nodes = tags.ToDictionary(t => t, t => ua.Session.Namespaces.Resolve(ExpandedNodeId.Parse(ParityRig.Node(t))) ?? throw new InvalidOperationException($"peer has no {ParityRig.Node(t)}"));

        for (int step = 1; step <= Steps; step++)
        {
            sim.Step(Period);
            var values = sim.ReadTags();
            var stamp = sim.Time;
            var writes = tags.Select(t => new WriteValue(nodes[t], new DataValue { Value = Variant.From(values[t]), SourceTimestamp = stamp.UtcDateTime })).ToList();
            var results = await ua.Session.WriteAsync(writes, CancellationToken.None);
            Assert.All(results, r => Assert.True(r.IsGood, $"peer refused a write: {r}"));
            foreach (var t in tags)
            {
                await mqtt.PublishAsync(ParityRig.Topic(t), JsonSerializer.Serialize(new { value = values[t], timestamp = stamp.ToString("O", CultureInfo.InvariantCulture) }));
            }

            // Hold the clock until both reactors took in every tag of this step and wait for their tick.
            long expected = (long)step * tags.Count;
            await WaitUntilAsync(() => viaMqtt.SamplesAccepted >= expected && viaOpcUa.SamplesAccepted >= expected && viaMqtt.IsWaitingForTick && viaOpcUa.IsWaitingForTick,
                () => $"step {step}: accepted mqtt {viaMqtt.SamplesAccepted}, opcua {viaOpcUa.SamplesAccepted} of {expected}");
            Assert.Equal(expected, viaMqtt.SamplesAccepted);
            Assert.Equal(expected, viaOpcUa.SamplesAccepted);
            clock.SetUtcNow(stamp);
            await WaitUntilAsync(() => recorder.Count(ParityRig.MqttReactor) == step && recorder.Count(ParityRig.OpcUaReactor) == step,
                () => $"step {step}: frames mqtt {recorder.Count(ParityRig.MqttReactor)}, opcua {recorder.Count(ParityRig.OpcUaReactor)}");
        }

        var a = recorder.Frames(ParityRig.MqttReactor);
        var b = recorder.Frames(ParityRig.OpcUaReactor);
        for (int k = 0; k < Steps; k++)
        {
            ParityAssert.SameFrame(a[k], b[k], k + 1, "MQTT", "OPC UA");
        }

        // The comparison means something only if the estimates exist: after the warm-up OUR, CER, RQ, mu
        // and biomass are finite numbers (their quality is whatever the estimator judged, the same on both).
        foreach (var name in new[] { EstimateNames.Our, EstimateNames.Cer, EstimateNames.Rq, EstimateNames.MuPerH, EstimateNames.BiomassGPerL })
        {
            Assert.True(double.IsFinite(a[^1].Values.Single(v => v.Name == name).Value), $"{name} of the last cycle is not a number");
        }

        Assert.Equal(SampleQuality.Good, a[^1].Values.Single(v => v.Name == EstimateNames.Our).Quality);

        // What the store kept (the durable record behind the status page and the outbox) agrees too.
        var store = daemon.Get<SqliteStore>();
        var storedA = await store.QueryEstimatesAsync(ParityRig.MqttReactor, null, DateTimeOffset.MinValue, DateTimeOffset.MaxValue, 100_000, CancellationToken.None);
        var storedB = await store.QueryEstimatesAsync(ParityRig.OpcUaReactor, null, DateTimeOffset.MinValue, DateTimeOffset.MaxValue, 100_000, CancellationToken.None);
        Assert.Equal(storedA.Count, storedB.Count);
        Assert.True(storedA.Count >= Steps * 5, $"store holds {storedA.Count} estimates of {ParityRig.MqttReactor}");
        for (int i = 0; i < storedA.Count; i++)
        {
            var (x, y) = (storedA[i], storedB[i]);
            Assert.Equal((x.Name, x.Time, x.Quality, x.StatusCode), (y.Name, y.Time, y.Quality, y.StatusCode));
            Assert.True(ParityAssert.Close(x.Value, y.Value), $"stored {x.Name} at {x.Time:O}: {x.Value} (MQTT) vs {y.Value} (OPC UA)");
        }
    }



    private static async Task WaitUntilAsync(Func<bool> condition, Func<string> what)
    {
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(10);
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, "waited 10 s: " + what());
            await Task.Delay(5);
        }
    }
}

using System.Globalization;
using System.Text;
using System.Text.Json;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Hosting;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Sinks;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Daemon.Tests.OpcUa;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Replay;

/// <summary>
/// One definition, one pipeline: the demo reactor (config/demo.json, full estimator, invented demo
/// scenario) is fed the virtual reactor's tag values step by step through a real mosquitto into a
/// running daemon (<c>run</c>, fake clock advanced one period per step once every tag arrived), and
/// the same values, with the same source times, are written as a historian export and replayed with
/// the same definition (<c>replay</c>). The estimate frames must agree cycle by cycle.
/// </summary>
public sealed class ReplayRunParityTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    private static readonly TimeSpan Period = TimeSpan.FromSeconds(10);
    private const int Steps = 36; // 6 min of process time: past the analysers' dead time and the estimator's warm-up.

    // JSON numbers in System.Text.Json's shortest round-trip form and the export's cells in "R" form
    // are both exact for an IEEE 754 binary64; times are ISO 8601 with 7 fraction digits (100 ns ticks)
    // in both. Identical inputs give identical frames; the tolerance only admits rounding noise.

    [Fact]
    public async Task The_same_inputs_through_MQTT_into_run_and_through_replay_give_the_same_frames()
    {
        var config = Config(broker.Port);
        var scenario = ScenarioLoader.Load(DemoFiles.Find(DemoFiles.Scenario) ?? throw new FileNotFoundException(DemoFiles.Scenario));
        var sim = VirtualReactor.Create(scenario, scenario.Seed);
        var clock = new FakeTimeProvider(sim.Time);
        var live = new RecordingSink();
        var tags = ParityRig.TagNames();
        var export = new StringBuilder("timestamp," + string.Join(',', tags) + "\n");

        await using (var daemon = await TestDaemon.StartAsync(config, s =>
        {
            s.AddSingleton<TimeProvider>(clock);
            s.AddSingleton<IEstimateSink>(live);
        }))
        {
            var pipeline = daemon.Get<PipelineSupervisor>().Pipelines.Single();
            await using var mqtt = await TestMqttClient.ConnectAsync(broker.Port, "replay-parity-publisher");
            for (int step = 1; step <= Steps; step++)
            {
                sim.Step(Period);
                var values = sim.ReadTags();
                var stamp = sim.Time;
                string time = stamp.ToString("O", CultureInfo.InvariantCulture);
                foreach (var t in tags)
                {
                    await mqtt.PublishAsync(ParityRig.Topic(t), JsonSerializer.Serialize(new { value = values[t], timestamp = time }));
                }

                export.Append(time).Append(',').AppendJoin(',', tags.Select(t => values[t].ToString("R", CultureInfo.InvariantCulture))).Append('\n');
                long expected = (long)step * tags.Count;
                await WaitUntilAsync(() => pipeline.SamplesAccepted >= expected && pipeline.IsWaitingForTick, () => $"step {step}: accepted {pipeline.SamplesAccepted} of {expected}");
                clock.SetUtcNow(stamp);
                await WaitUntilAsync(() => live.Count(ParityRig.MqttReactor) == step, () => $"step {step}: {live.Count(ParityRig.MqttReactor)} frames");
            }
        }

        string folder = Directory.CreateTempSubdirectory("softsensor-parity-").FullName;
        try
        {
            string history = Path.Combine(folder, "history.csv");
            await File.WriteAllTextAsync(history, export.ToString());
            var options = new SoftSensorOptions();
            new ConfigurationBuilder().AddInMemoryCollection(config).Build().Bind(options);
            var replayed = new RecordingSink();
            var outcome = await ReplayHost.RunAsync(options.Reactors[0], new ConfigLocation(folder), history, [replayed], NullLogger.Instance, TimeProvider.System, CancellationToken.None);

            var a = live.Frames(ParityRig.MqttReactor);
            var b = replayed.Frames(ParityRig.MqttReactor);
            Assert.Equal(Steps, outcome.Cycles);
            Assert.True(a.Count == b.Count, $"live {a.Count}, replay {b.Count} frames; replayed reactor '{options.Reactors[0].Id}', {outcome.Good} good, {outcome.Bad} bad");
            for (int k = 0; k < a.Count; k++)
            {
                ParityAssert.SameFrame(a[k], b[k], k + 1, "run", "replay");
            }

            // The comparison means something only once the estimates exist.
            foreach (var name in new[] { EstimateNames.Our, EstimateNames.Cer, EstimateNames.Rq, EstimateNames.BiomassGPerL })
            {
                Assert.True(double.IsFinite(b[^1].Values.Single(v => v.Name == name).Value), $"{name} of the last replayed cycle is not a number");
            }
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    /// <summary>The parity rig's MQTT-fed demo reactor alone.</summary>
    private static Dictionary<string, string?> Config(int port) =>
        ParityRig.Config(port, "opc.tcp://127.0.0.1:1")
            .Where(kv => !kv.Key.StartsWith("reactors:1:", StringComparison.OrdinalIgnoreCase) && !kv.Key.StartsWith("opcUa:", StringComparison.OrdinalIgnoreCase))
            .ToDictionary(kv => kv.Key, kv => kv.Value, StringComparer.OrdinalIgnoreCase);



    private static async Task WaitUntilAsync(Func<bool> condition, Func<string> what)
    {
        var until = DateTime.UtcNow + TimeSpan.FromSeconds(20);
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, "waited 20 s: " + what());
            await Task.Delay(5);
        }
    }
}

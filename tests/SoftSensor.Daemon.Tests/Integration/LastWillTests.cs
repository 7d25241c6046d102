using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.Status;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Integration;

/// <summary>The retained status when the daemon's link dies without a clean disconnect (crash, cable pulled).</summary>
public sealed class LastWillTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    [Fact]
    public async Task MqttLink_dropped_without_disconnect_broker_publishes_the_offline_last_will()
    {
        var options = new SoftSensorOptions { Site = "pilot", Area = "it-will" };
        options.Mqtt.Port = broker.Port;
        options.Mqtt.ClientId = "it-will";
        using var sp = new ServiceCollection().AddMetrics().BuildServiceProvider();
        using var metrics = new DaemonMetrics(sp.GetRequiredService<System.Diagnostics.Metrics.IMeterFactory>());
        var topics = new MqttTopics(options);
        var link = new MqttLink(Options.Create(options), topics, metrics, TimeProvider.System, NullLogger<MqttLink>.Instance);
        await using var observer = await TestMqttClient.ConnectAsync(broker.Port, "it-will-observer");
        await observer.SubscribeAsync(topics.Status);

        await link.StartAsync(default);
        await observer.WaitForAsync((_, p) => p == "online", TimeSpan.FromSeconds(10), "online");
        await link.DisposeAsync(); // no StopAsync: the socket closes without a DISCONNECT packet

        // MQTT 3.1.1 §3.1.2.5: the server publishes the will when the connection closes without DISCONNECT.
        await observer.WaitForAsync((_, p) => p == "offline", TimeSpan.FromSeconds(10), "the last will 'offline'");
    }
}

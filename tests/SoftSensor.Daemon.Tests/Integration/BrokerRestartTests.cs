using System.Collections.Concurrent;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Integration;

/// <summary>A broker outage in the middle of a run (own broker: the others must not see the restart).</summary>
public sealed class BrokerRestartTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    private static readonly TimeSpan Wait = TimeSpan.FromSeconds(15);

    [Fact]
    public async Task Run_broker_restart_mid_run_is_survived_status_goes_offline_then_online_and_estimates_resume()
    {
        await using var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "it-restart"));
        var link = daemon.Get<MqttLink>();
        var changes = new ConcurrentQueue<bool>();
        link.OnlineChanged += changes.Enqueue;

        await using (var client = await TestMqttClient.ConnectAsync(broker.Port, "it-restart-1"))
        {
            await client.SubscribeAsync(TestConfigs.Subtree("it-restart") + "/#");
            await client.WaitForAsync((t, p) => t.EndsWith("/status", StringComparison.Ordinal) && p == "online", Wait, "retained status online");
            await DaemonMqttTests.PublishHandCaseAsync(client, "it-restart");
            await client.WaitForAsync((t, p) => t.EndsWith("/estimate/our", StringComparison.Ordinal) && DaemonMqttTests.IsGood(p), Wait, "a good OUR before the outage");
        }

        await broker.StopAsync();
        await WaitUntilAsync(() => !link.IsOnline, Wait, "the link noticing the outage");
        await broker.StartAsync();
        await WaitUntilAsync(() => link.IsOnline, Wait, "the link coming back");
        await daemon.WaitSubscribedAsync(TestConfigs.HandCase(broker.Port, "it-restart"));

        await using var after = await TestMqttClient.ConnectAsync(broker.Port, "it-restart-2");
        await after.SubscribeAsync(TestConfigs.Subtree("it-restart") + "/#");
        await after.WaitForAsync((t, p) => t.EndsWith("/daemon/it-restart/status", StringComparison.Ordinal) && p == "online", Wait, "status online republished after the restart");
        await DaemonMqttTests.PublishHandCaseAsync(after, "it-restart");
        await after.WaitForAsync((t, p) => t.EndsWith("/estimate/our", StringComparison.Ordinal) && DaemonMqttTests.IsGood(p), Wait, "a good OUR after the restart (resubscribed)");

        Assert.Equal([false, true], changes.SkipWhile(online => online).ToArray()); // the first 'true' may come before the handler was attached
        Assert.Equal(2, link.Connections);
    }

    [Fact]
    public async Task Stop_publishes_offline_status_retained()
    {
        var daemon = await TestDaemon.StartAsync(TestConfigs.HandCase(broker.Port, "it-stop"));
        await using var client = await TestMqttClient.ConnectAsync(broker.Port, "it-stop-client");
        await client.SubscribeAsync(TestConfigs.Subtree("it-stop") + "/daemon/it-stop/status");
        await client.WaitForAsync((_, p) => p == "online", Wait, "online");

        await daemon.DisposeAsync();

        await client.WaitForAsync((_, p) => p == "offline", Wait, "offline after a clean stop");
    }

    private static async Task WaitUntilAsync(Func<bool> condition, TimeSpan timeout, string what)
    {
        var until = DateTime.UtcNow + timeout;
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, "timed out waiting for " + what);
            await Task.Delay(50);
        }
    }
}

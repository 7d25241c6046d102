using System.Collections.Concurrent;
using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.OpcUa.Client;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Subscriptions;
using SoftSensor.OpcUa.Tests.Peers;

namespace SoftSensor.OpcUa.Tests.Subscriptions;

/// <summary>
/// The keep-alive supervision (Part 4 §5.13.1: a server with nothing to report still answers a
/// Publish once per keep-alive period) against a node-opcua server that hangs: the process is
/// frozen with SIGSTOP, its sockets stay open, nothing answers. The client must declare the link
/// dead after one keep-alive period plus its margin, and once the server runs again reconnect as
/// Part 4 §6.7 describes: a new channel, then ActivateSession on the session the server kept.
/// </summary>
public sealed class KeepAliveTimeoutTests : IAsyncLifetime
{
    private readonly OpcUaPeerServer _server = new(new Dictionary<string, string> { ["OPCUA_UPDATE_MS"] = "100" });

    public Task InitializeAsync() => _server.StartAsync(CancellationToken.None);

    public async Task DisposeAsync()
    {
        await _server.ResumeAsync().ContinueWith(_ => { }, TaskScheduler.Default);
        await _server.StopAsync();
    }

    [Fact]
    public async Task RunAsync_server_frozen_past_the_keep_alive_timeout_counts_a_link_loss_and_reactivates_the_session()
    {
        var changes = new ConcurrentQueue<ItemChange>();
        var options = new ClientOptions
        {
            Session = new SessionOptions { EndpointUrl = _server.EndpointUrl, Channel = new SoftSensor.OpcUa.SecureChannel.ChannelOptions { ConnectTimeout = TimeSpan.FromSeconds(2) } },
            // Keep-alive period 200 ms × 5 = 1 s; the client's limit is that plus max(2 s, half of it) = 3 s.
            Subscription = new SubscriptionSettings { PublishingInterval = TimeSpan.FromMilliseconds(200), MaxKeepAliveCount = 5 },
            ReconnectMinDelay = TimeSpan.FromMilliseconds(200),
            ReconnectMaxDelay = TimeSpan.FromSeconds(1),
        };
        var item = new MonitoredItemSettings { SamplingInterval = TimeSpan.FromMilliseconds(100) };
        var client = new UaSubscriptionClient(options, [new MonitoredNode(1, new NodeReference("Objects/Reactor1/Counter"), item)], (c, _) =>
        {
            changes.Enqueue(c);
            return ValueTask.CompletedTask;
        }, TimeProvider.System, NullLogger.Instance);
        using var cts = new CancellationTokenSource();
        var run = client.RunAsync(cts.Token);
        await WaitUntil(() => changes.Count >= 3 && client.State == ClientState.Connected, TimeSpan.FromSeconds(20), "first data changes");

        var frozenAt = DateTime.UtcNow;
        await _server.PauseAsync();
        await WaitUntil(() => client.Counters.LinkLosses >= 1, TimeSpan.FromSeconds(15), "the link declared dead while the server is frozen");
        var detected = DateTime.UtcNow - frozenAt;
        await _server.ResumeAsync();

        changes.Clear();
        await WaitUntil(() => changes.Count >= 3 && client.State == ClientState.Connected, TimeSpan.FromSeconds(30), "data changes after the server runs again");
        await cts.CancelAsync();
        await run.WaitAsync(TimeSpan.FromSeconds(10));

        // Not before the keep-alive limit (3 s), and within it plus the watchdog's step (≤ 1 s) and scheduling slack.
        Assert.InRange(detected.TotalSeconds, 2.9, 8);
        Assert.Equal(ClientState.Stopped, client.State);
        // The server kept the session (its timeout is minutes): reactivated on a new channel, not created anew.
        Assert.True(client.Counters.SessionsReactivated >= 1, client.Counters.ToString());
        Assert.Equal(1, client.Counters.SessionsCreated);
        Assert.All(changes, c => Assert.True(c.Value.Status.IsGood));
    }

    private static async Task WaitUntil(Func<bool> condition, TimeSpan timeout, string what)
    {
        var until = DateTime.UtcNow + timeout;
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < until, $"not within {timeout.TotalSeconds:0} s: {what}");
            await Task.Delay(50);
        }
    }
}

using System.Collections.Concurrent;
using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.OpcUa.Client;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Subscriptions;
using SoftSensor.OpcUa.Tests.Peers;

namespace SoftSensor.OpcUa.Tests.Subscriptions;

/// <summary>
/// Subscriptions (Part 4 §5.12, §5.13) and the reconnect procedure (Part 4 §6.7) of the
/// supervised client against node-opcua. The peer's invented signals change every 100 ms.
/// </summary>
[Collection(PeerCollection.Name)]
public sealed class SubscriptionIntegrationTests(PeerFixture peer)
{
    private const string Ns = "nsu=" + OpcUaPeerServer.NamespaceUri + ";";

    [Fact]
    public async Task RunAsync_SamplingEvery250Ms_DeliversChangesAtThatRate()
    {
        var changes = new ConcurrentQueue<ItemChange>();
        var item = new MonitoredItemSettings { SamplingInterval = TimeSpan.FromMilliseconds(250), QueueSize = 10 };
        var (client, run, cts) = Start([new MonitoredNode(1, new NodeReference(Ns + "s=Reactor1.Counter"), item)], changes);

        await WaitUntil(() => changes.Count >= 1, TimeSpan.FromSeconds(10));
        int before = changes.Count;
        await Task.Delay(TimeSpan.FromSeconds(3));
        int during = changes.Count - before;
        await StopAsync(run, cts);

        // 3 s at one sample per 250 ms gives 12; allow for the server's scheduling (±4).
        Assert.InRange(during, 8, 16);
        Assert.All(changes, c => Assert.True(c.Value.Status.IsGood));
        Assert.Equal(1, client.Counters.SubscriptionsCreated);
    }

    [Fact]
    public async Task RunAsync_AbsoluteDeadbandWiderThanSignal_DeliversOnlyTheFirstValue()
    {
        // OffgasO2 moves ±0.3 around 20.2: an absolute deadband of 5 suppresses every change after the first (Part 4 §7.22.2).
        var changes = new ConcurrentQueue<ItemChange>();
        var item = new MonitoredItemSettings { SamplingInterval = TimeSpan.FromMilliseconds(100), DeadbandType = DeadbandType.Absolute, DeadbandValue = 5 };
        var (_, run, cts) = Start([new MonitoredNode(1, new NodeReference("Objects/Reactor1/OffgasO2"), item)], changes);

        await WaitUntil(() => changes.Count >= 1, TimeSpan.FromSeconds(10));
        await Task.Delay(TimeSpan.FromSeconds(2));
        await StopAsync(run, cts);

        Assert.Single(changes);
        Assert.InRange(changes.Single().Value.Value.AsDouble()!.Value, 19.8, 20.6);
    }

    [Fact]
    public async Task RunAsync_UnknownNode_ReportsBadNodeIdUnknownAndMonitorsTheRest()
    {
        var changes = new ConcurrentQueue<ItemChange>();
        var (_, run, cts) = Start(
            [
                new MonitoredNode(1, new NodeReference(Ns + "s=Reactor1.NoSuchTag"), new MonitoredItemSettings()),
                new MonitoredNode(2, new NodeReference(Ns + "s=Reactor1.AirFlow"), new MonitoredItemSettings { SamplingInterval = TimeSpan.FromMilliseconds(100) }),
            ],
            changes);

        await WaitUntil(() => changes.Any(c => c.Handle == 2), TimeSpan.FromSeconds(10));
        await StopAsync(run, cts);

        var bad = Assert.Single(changes, c => c.Handle == 1);
        Assert.True(bad.Value.Status.IsBad);
    }

    [Fact]
    public async Task WriteAsync_ThroughConnectedClient_IsReadBackByAnotherSession()
    {
        var changes = new ConcurrentQueue<ItemChange>();
        var (client, run, cts) = Start([new MonitoredNode(1, new NodeReference(Ns + "s=Reactor1.AirFlow"), new MonitoredItemSettings())], changes);
        await WaitUntil(() => client.CurrentSession is not null, TimeSpan.FromSeconds(10));
        var stamp = new DateTime(2026, 5, 6, 7, 8, 9, DateTimeKind.Utc);

        var results = await client.WriteAsync([(new NodeReference("Objects/Reactor1/Estimates/RQ"), new DataValue { Value = Variant.From(1.05), Status = new StatusCode(StatusCodes.UncertainInitialValue), SourceTimestamp = stamp })], CancellationToken.None);
        await StopAsync(run, cts);

        Assert.True(results[0].IsGood, results[0].ToString());
        var (channel, session) = await peer.ConnectAsync();
        await using var _ = channel;
        var back = await session.ReadValueAsync(session.Namespaces.Resolve(ExpandedNodeId.Parse(Ns + "s=Reactor1.Estimates.RQ"))!, CancellationToken.None);
        Assert.Equal(1.05, back.Value.AsDouble());
        Assert.Equal(StatusCodes.UncertainInitialValue, back.Status.Code);
        Assert.Equal(stamp, back.SourceTimestamp);
    }

    [Fact]
    public async Task RunAsync_ServerRestartMidSubscription_ReconnectsWithNewSessionAndDataFlowsAgain()
    {
        var changes = new ConcurrentQueue<ItemChange>();
        var item = new MonitoredItemSettings { SamplingInterval = TimeSpan.FromMilliseconds(100) };
        var (client, run, cts) = Start([new MonitoredNode(1, new NodeReference("Objects/Reactor1/Counter"), item)], changes);
        await WaitUntil(() => changes.Count >= 3, TimeSpan.FromSeconds(10));

        await peer.Server.StopAsync();
        await WaitUntil(() => client.State == ClientState.Reconnecting, TimeSpan.FromSeconds(15));
        await peer.Server.StartAsync(CancellationToken.None);
        changes.Clear();
        await WaitUntil(() => changes.Count >= 3, TimeSpan.FromSeconds(30));
        await StopAsync(run, cts);

        // The restarted server has forgotten the session: a new one, and the subscription created again (Part 4 §6.7).
        Assert.True(client.Counters.SessionsCreated >= 2, client.Counters.ToString());
        Assert.True(client.Counters.SubscriptionsCreated >= 2, client.Counters.ToString());
        Assert.True(client.Counters.LinkLosses >= 1);
        Assert.All(changes, c => Assert.True(c.Value.Status.IsGood));
        Assert.True(run.IsCompletedSuccessfully);
    }

    private (UaSubscriptionClient Client, Task Run, CancellationTokenSource Cts) Start(IReadOnlyList<MonitoredNode> nodes, ConcurrentQueue<ItemChange> changes)
    {
        var options = new ClientOptions
        {
            Session = new SessionOptions { EndpointUrl = peer.Server.EndpointUrl },
            Subscription = new SubscriptionSettings { PublishingInterval = TimeSpan.FromMilliseconds(200), MaxKeepAliveCount = 5 },
            ReconnectMinDelay = TimeSpan.FromMilliseconds(200),
            ReconnectMaxDelay = TimeSpan.FromSeconds(1),
        };
        var client = new UaSubscriptionClient(options, nodes, (c, _) =>
        {
            changes.Enqueue(c);
            return ValueTask.CompletedTask;
        }, TimeProvider.System, NullLogger.Instance);
        var cts = new CancellationTokenSource();
        return (client, client.RunAsync(cts.Token), cts);
    }

    private static async Task StopAsync(Task run, CancellationTokenSource cts)
    {
        await cts.CancelAsync();
        await run.WaitAsync(TimeSpan.FromSeconds(10));
        cts.Dispose();
    }

    private static async Task WaitUntil(Func<bool> condition, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (!condition())
        {
            Assert.True(DateTime.UtcNow < deadline, $"condition not met within {timeout.TotalSeconds} s");
            await Task.Delay(50);
        }
    }
}

using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;

namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>
/// The client's record of one subscription: what it asked for, what the server revised, the
/// monitored nodes by client handle and the last sequence number seen (Part 4 §5.13). It can be
/// created again on a new session with every node resolved anew.
/// </summary>
public sealed class ClientSubscription(SubscriptionSettings settings, IReadOnlyList<MonitoredNode> nodes)
{
    private readonly Dictionary<uint, MonitoredNode> byHandle = nodes.ToDictionary(n => unchecked((uint)n.Handle));

    public SubscriptionSettings Settings { get; } = settings;

    public IReadOnlyList<MonitoredNode> Nodes { get; } = nodes;

    /// <summary>The server's id, 0 until created.</summary>
    public uint ServerId { get; private set; }

    public TimeSpan RevisedPublishingInterval { get; private set; }

    public uint RevisedKeepAliveCount { get; private set; }

    /// <summary>Sequence number of the last notification message handled, 0 for none.</summary>
    public uint LastSequenceNumber { get; set; }

    /// <summary>Longest silence of the server before the link counts as dead: one keep-alive period plus a margin.</summary>
    public TimeSpan KeepAliveTimeout
    {
        get
        {
            var period = RevisedPublishingInterval * Math.Max(1u, RevisedKeepAliveCount);
            return period + TimeSpan.FromTicks(Math.Max(TimeSpan.FromSeconds(2).Ticks, period.Ticks / 2));
        }
    }

    public MonitoredNode? NodeOf(uint clientHandle) => byHandle.GetValueOrDefault(clientHandle);

    /// <summary>
    /// CreateSubscription then CreateMonitoredItems (Reporting) for every node that resolves.
    /// Returns one Bad change per node that could not be resolved or created, so the caller
    /// sees its quality fall instead of silence.
    /// </summary>
    public async Task<IReadOnlyList<ItemChange>> CreateOnServerAsync(UaSession session, TimeProvider time, CancellationToken cancellationToken)
    {
        var created = await session.CreateSubscriptionAsync(new CreateSubscriptionRequest
        {
            RequestedPublishingIntervalMs = Settings.PublishingInterval.TotalMilliseconds,
            RequestedLifetimeCount = Settings.EffectiveLifetimeCount,
            RequestedMaxKeepAliveCount = Settings.MaxKeepAliveCount,
            MaxNotificationsPerPublish = Settings.MaxNotificationsPerPublish,
            Priority = Settings.Priority,
        }, cancellationToken);
        Adopt(created.SubscriptionId, TimeSpan.FromMilliseconds(created.RevisedPublishingIntervalMs), created.RevisedMaxKeepAliveCount);

        var failures = new List<ItemChange>();
        var requests = new List<MonitoredItemCreateRequest>();
        var requested = new List<MonitoredNode>();
        foreach (var node in Nodes)
        {
            var resolved = await node.Reference.ResolveAsync(session, cancellationToken);
            if (!resolved.IsFound)
            {
                failures.Add(Failure(node, StatusCodes.BadNodeIdUnknown, time));
                continue;
            }

            requested.Add(node);
            requests.Add(new MonitoredItemCreateRequest(new ReadValueId(resolved.Node!), unchecked((uint)node.Handle))
            {
                SamplingIntervalMs = node.Settings.SamplingInterval.TotalMilliseconds,
                QueueSize = node.Settings.QueueSize,
                Filter = node.Settings.Filter,
            });
        }

        if (requests.Count > 0)
        {
            var results = await session.CreateMonitoredItemsAsync(ServerId, requests, cancellationToken);
            for (int i = 0; i < results.Length; i++)
            {
                if (results[i].Status.IsBad)
                {
                    failures.Add(Failure(requested[i], results[i].Status.Code, time));
                }
            }
        }

        return failures;
    }

    /// <summary>Takes over the server's id and revised values (after creation or a transfer).</summary>
    public void Adopt(uint serverId, TimeSpan publishingInterval, uint keepAliveCount)
    {
        ServerId = serverId;
        RevisedPublishingInterval = publishingInterval;
        RevisedKeepAliveCount = keepAliveCount;
        LastSequenceNumber = 0;
    }

    private static ItemChange Failure(MonitoredNode node, uint status, TimeProvider time) =>
        new(node.Handle, node.Reference.Text, new DataValue { Status = new StatusCode(status), ServerTimestamp = time.GetUtcNow().UtcDateTime });
}

using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Subscriptions;

namespace SoftSensor.OpcUa.Client;

/// <summary>
/// A supervised OPC UA client that monitors a set of nodes and survives outages, following the
/// reconnect procedure of Part 4 §6.7 from one supervising loop: open a new channel; re-activate
/// the old session on it; if the server no longer knows the session, create a new one and
/// transfer the subscription to it, or create the subscription again (resolving every node anew,
/// since namespace indexes may have changed); then publish again, filling gaps with Republish.
/// Threading contract: <see cref="RunAsync"/> is called once; <see cref="WriteAsync"/> may be
/// called from any thread while it runs.
/// </summary>
public sealed partial class UaSubscriptionClient(ClientOptions options, IReadOnlyList<MonitoredNode> nodes, Func<ItemChange, CancellationToken, ValueTask> onChange, TimeProvider time, ILogger logger)
{
    private readonly ClientSubscription subscription = new(options.Subscription, nodes);
    private volatile UaSession? session;
    private UaSecureChannel? channel;
    private bool subscriptionValid;

    public ClientState State { get; private set; } = ClientState.Connecting;

    public ClientCounters Counters { get; private set; } = new();

    /// <summary>The session in use, or null while disconnected.</summary>
    public UaSession? CurrentSession => State == ClientState.Connected ? session : null;

    /// <summary>Connects, monitors and reconnects until cancelled; then closes the session and the channel.</summary>
    public async Task RunAsync(CancellationToken cancellationToken)
    {
        var backoff = new ReconnectBackoff(options.ReconnectMinDelay, options.ReconnectMaxDelay);
        try
        {
            while (!cancellationToken.IsCancellationRequested)
            {
                string reason;
                try
                {
                    await ConnectAsync(cancellationToken);
                    backoff.Reset();
                    reason = await MonitorAsync(cancellationToken);
                }
                catch (Exception e) when (e is ServiceResultException or SubscriptionLostException)
                {
                    reason = e.Message;
                }

                if (cancellationToken.IsCancellationRequested)
                {
                    break;
                }

                State = ClientState.Reconnecting;
                await DropChannelAsync();
                var delay = backoff.Next();
                ClientLog.ConnectFailed(logger, options.Session.EndpointUrl, reason, (long)delay.TotalMilliseconds);
                await Task.Delay(delay, time, cancellationToken);
            }
        }
        catch (OperationCanceledException) when (cancellationToken.IsCancellationRequested)
        {
            // Stopping.
        }
        finally
        {
            await ShutdownAsync();
        }
    }

    /// <summary>Writes values to nodes; BadNotConnected for each while there is no session.</summary>
    public async Task<StatusCode[]> WriteAsync(IReadOnlyList<(NodeReference Node, DataValue Value)> items, CancellationToken cancellationToken)
    {
        var current = CurrentSession;
        if (current is null)
        {
            return [.. items.Select(_ => new StatusCode(StatusCodes.BadNotConnected))];
        }

        var results = new StatusCode[items.Count];
        var writes = new List<WriteValue>();
        var positions = new List<int>();
        for (int i = 0; i < items.Count; i++)
        {
            var resolved = await ResolveCachedAsync(current, items[i].Node, cancellationToken);
            if (resolved is null)
            {
                results[i] = new StatusCode(StatusCodes.BadNodeIdUnknown);
                continue;
            }

            writes.Add(new WriteValue(resolved, items[i].Value));
            positions.Add(i);
        }

        if (writes.Count > 0)
        {
            try
            {
                var written = await current.WriteAsync(writes, cancellationToken);
                for (int k = 0; k < written.Length; k++)
                {
                    results[positions[k]] = written[k];
                }
            }
            catch (ServiceResultException e)
            {
                foreach (int p in positions)
                {
                    results[p] = e.Status;
                }
            }
        }

        return results;
    }

    private async Task ConnectAsync(CancellationToken cancellationToken)
    {
        var security = await EndpointSelector.ResolveAsync(options.Session, time, logger, cancellationToken);
        var newChannel = await UaSecureChannel.OpenAsync(options.Session.EndpointUrl, options.Session.Channel, security, time, logger, cancellationToken);
        channel = newChannel;
        Counters = Counters with { Connects = Counters.Connects + 1 };
        resolvedWrites.Clear();
        if (session is { } old && await old.ReactivateAsync(newChannel, cancellationToken))
        {
            Counters = Counters with { SessionsReactivated = Counters.SessionsReactivated + 1 };
        }
        else
        {
            var previous = session;
            session = await UaSession.CreateAsync(newChannel, options.Session, time, logger, cancellationToken);
            Counters = Counters with { SessionsCreated = Counters.SessionsCreated + 1 };
            subscriptionValid = previous is not null && subscriptionValid && await TransferAsync(session, cancellationToken);
        }

        if (!subscriptionValid)
        {
            await CreateSubscriptionAsync(session!, cancellationToken);
        }

        State = ClientState.Connected;
        ClientLog.Connected(logger, options.Session.EndpointUrl, session!.SessionId.ToString(), Counters.Connects);
    }

    private async Task<bool> TransferAsync(UaSession target, CancellationToken cancellationToken)
    {
        try
        {
            var result = (await target.TransferSubscriptionsAsync([subscription.ServerId], true, cancellationToken))[0];
            if (result.Status.IsGood)
            {
                Counters = Counters with { SubscriptionsTransferred = Counters.SubscriptionsTransferred + 1 };
                ClientLog.Transferred(logger, subscription.ServerId);
                return true;
            }

            ClientLog.TransferRefused(logger, subscription.ServerId, result.Status.ToString());
        }
        catch (ServiceResultException e)
        {
            ClientLog.TransferRefused(logger, subscription.ServerId, e.Status.ToString());
        }

        return false;
    }

    private async Task CreateSubscriptionAsync(UaSession target, CancellationToken cancellationToken)
    {
        var failures = await subscription.CreateOnServerAsync(target, time, cancellationToken);
        subscriptionValid = true;
        Counters = Counters with { SubscriptionsCreated = Counters.SubscriptionsCreated + 1 };
        SubscriptionLog.Created(logger, subscription.ServerId, subscription.RevisedPublishingInterval.TotalMilliseconds, subscription.RevisedKeepAliveCount, nodes.Count - failures.Count);
        foreach (var failure in failures)
        {
            SubscriptionLog.ItemFailed(logger, failure.Reference, failure.Value.Status.ToString());
            await onChange(failure, cancellationToken);
        }
    }
}

using System.Collections.Concurrent;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Subscriptions;

namespace SoftSensor.OpcUa.Client;

/// <summary>The connected phase of the supervisor: publishing until the link, the session or the subscription is lost.</summary>
public sealed partial class UaSubscriptionClient
{
    private readonly ConcurrentDictionary<string, NodeId> resolvedWrites = new(StringComparer.Ordinal);

    /// <summary>Runs the publish engine until something ends it; returns the reason.</summary>
    private async Task<string> MonitorAsync(CancellationToken cancellationToken)
    {
        using var cts = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        var engine = new PublishEngine(session!, subscription, onChange, time, logger);
        var publishing = engine.RunAsync(cts.Token);
        var ended = await Task.WhenAny(publishing, channel!.Completion);
        await cts.CancelAsync();
        await publishing.ConfigureAwait(ConfigureAwaitOptions.SuppressThrowing);
        if (cancellationToken.IsCancellationRequested)
        {
            return "stopping";
        }

        Counters = Counters with { LinkLosses = Counters.LinkLosses + 1 };
        string reason = ended == publishing && publishing.Exception?.InnerException is { } e
            ? e.Message
            : $"channel closed ({channel.Completion.Result})";
        if (publishing.Exception?.InnerException is SubscriptionLostException)
        {
            subscriptionValid = false;
        }
        else if (publishing.Exception?.InnerException is ServiceResultException s && (s.Status.Is(StatusCodes.BadSessionIdInvalid) || s.Status.Is(StatusCodes.BadSessionClosed)))
        {
            session = null;
        }

        ClientLog.LinkLost(logger, options.Session.EndpointUrl, reason);
        return reason;
    }

    private async Task<NodeId?> ResolveCachedAsync(UaSession current, NodeReference reference, CancellationToken cancellationToken)
    {
        if (resolvedWrites.TryGetValue(reference.Text, out var cached))
        {
            return cached;
        }

        var resolved = await reference.ResolveAsync(current, cancellationToken);
        if (resolved.Node is { } node)
        {
            resolvedWrites[reference.Text] = node;
        }

        return resolved.Node;
    }

    private async Task DropChannelAsync()
    {
        if (channel is { } old)
        {
            channel = null;
            await old.DisposeAsync();
        }
    }

    private async Task ShutdownAsync()
    {
        State = ClientState.Stopped;
        using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(5));
        if (session is { } s && channel is { IsOpen: true })
        {
            await s.CloseAsync(true, cts.Token);
        }

        if (channel is { } c)
        {
            await c.CloseAsync(cts.Token);
        }

        channel = null;
        session = null;
    }
}

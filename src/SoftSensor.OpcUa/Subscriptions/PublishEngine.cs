using System.Collections.Concurrent;
using Microsoft.Extensions.Logging;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Session;

namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>
/// Keeps several Publish requests outstanding for one subscription (Part 4 §5.13.5), acknowledges
/// each notification message in the next request, fills gaps in the sequence numbers with
/// Republish (§5.13.6), hands data changes on, and watches for silence: no response within one
/// keep-alive period plus a margin ends the run with BadNoCommunication. Ends with an exception
/// when the session, the channel or the subscription is lost; the supervisor decides what next.
/// </summary>
public sealed class PublishEngine(UaSession session, ClientSubscription subscription, Func<ItemChange, CancellationToken, ValueTask> deliver, TimeProvider time, ILogger logger)
{
    private readonly ConcurrentQueue<SubscriptionAcknowledgement> acknowledgements = new();
    private readonly SemaphoreSlim processing = new(1, 1);
    private long lastResponseTicks = time.GetTimestamp();

    /// <summary>Notification messages handled so far (data and keep-alive).</summary>
    public int MessagesHandled { get; private set; }

    public async Task RunAsync(CancellationToken cancellationToken)
    {
        using var cts = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        var loops = Enumerable.Range(0, Math.Max(1, subscription.Settings.OutstandingPublishRequests))
            .Select(_ => PublishLoopAsync(cts.Token))
            .Append(WatchdogAsync(cts.Token))
            .ToList();
        var first = await Task.WhenAny(loops);
        await cts.CancelAsync();
        await Task.WhenAll(loops).ConfigureAwait(ConfigureAwaitOptions.SuppressThrowing);
        await first; // rethrows the reason the run ended
    }

    private async Task PublishLoopAsync(CancellationToken cancellationToken)
    {
        var timeout = (subscription.RevisedPublishingInterval * Math.Max(1u, subscription.RevisedKeepAliveCount) * 2) + TimeSpan.FromSeconds(10);
        while (!cancellationToken.IsCancellationRequested)
        {
            var acks = new List<SubscriptionAcknowledgement>();
            while (acknowledgements.TryDequeue(out var ack))
            {
                acks.Add(ack);
            }

            PublishResponse response;
            try
            {
                response = await session.PublishAsync(acks, timeout, cancellationToken);
            }
            catch (ServiceResultException e) when (e.Status.Is(StatusCodes.BadTimeout) || e.Status.Is(StatusCodes.BadTooManyPublishRequests))
            {
                SubscriptionLog.PublishRetry(logger, e.Status.ToString());
                await Task.Delay(subscription.RevisedPublishingInterval, time, cancellationToken);
                continue;
            }
            catch (ServiceResultException e) when (e.Status.Is(StatusCodes.BadNoSubscription))
            {
                throw new SubscriptionLostException("The server has no subscription for this session", e);
            }

            Interlocked.Exchange(ref lastResponseTicks, time.GetTimestamp());
            await HandleAsync(response, cancellationToken);
        }
    }

    private async Task HandleAsync(PublishResponse response, CancellationToken cancellationToken)
    {
        await processing.WaitAsync(cancellationToken);
        try
        {
            MessagesHandled++;
            if (response.SubscriptionId != subscription.ServerId)
            {
                return;
            }

            var message = response.Message;
            bool keepAlive = message.NotificationData.Length == 0;
            uint last = subscription.LastSequenceNumber;
            // A keep-alive carries the number the next message will have (Part 4 §7.24).
            uint firstMissing = last + 1;
            if (last != 0 && message.SequenceNumber > firstMissing)
            {
                await RepublishAsync(firstMissing, message.SequenceNumber, cancellationToken);
            }

            if (keepAlive)
            {
                return;
            }

            acknowledgements.Enqueue(new SubscriptionAcknowledgement(subscription.ServerId, message.SequenceNumber));
            if (message.SequenceNumber <= subscription.LastSequenceNumber)
            {
                return; // already handled through Republish
            }

            subscription.LastSequenceNumber = message.SequenceNumber;
            await DeliverAsync(message, cancellationToken);
        }
        finally
        {
            processing.Release();
        }
    }

    private async Task RepublishAsync(uint from, uint toExclusive, CancellationToken cancellationToken)
    {
        for (uint n = from; n < toExclusive && n - from < 100; n++)
        {
            SubscriptionLog.Gap(logger, n, subscription.ServerId);
            try
            {
                var message = await session.RepublishAsync(subscription.ServerId, n, cancellationToken);
                acknowledgements.Enqueue(new SubscriptionAcknowledgement(subscription.ServerId, n));
                await DeliverAsync(message, cancellationToken);
            }
            catch (ServiceResultException e) when (e.Status.Is(StatusCodes.BadMessageNotAvailable) || e.Status.Is(StatusCodes.BadSequenceNumberUnknown))
            {
                SubscriptionLog.Lost(logger, n, subscription.ServerId, e.Status.ToString());
            }

            subscription.LastSequenceNumber = Math.Max(subscription.LastSequenceNumber, n);
        }

        subscription.LastSequenceNumber = Math.Max(subscription.LastSequenceNumber, toExclusive - 1);
    }

    private async Task DeliverAsync(NotificationMessage message, CancellationToken cancellationToken)
    {
        foreach (var data in message.NotificationData)
        {
            if (Notifications.ReadStatusChange(data) is { IsBad: true } status)
            {
                throw new SubscriptionLostException($"The server ended subscription {subscription.ServerId}: {status}");
            }

            foreach (var change in Notifications.ReadDataChanges(data))
            {
                if (subscription.NodeOf(change.ClientHandle) is { } node)
                {
                    await deliver(new ItemChange(node.Handle, node.Reference.Text, change.Value), cancellationToken);
                }
            }
        }
    }

    private async Task WatchdogAsync(CancellationToken cancellationToken)
    {
        var limit = subscription.KeepAliveTimeout;
        var step = TimeSpan.FromMilliseconds(Math.Clamp(limit.TotalMilliseconds / 4, 100, 1000));
        while (true)
        {
            await Task.Delay(step, time, cancellationToken);
            var silence = time.GetElapsedTime(Interlocked.Read(ref lastResponseTicks));
            if (silence > limit)
            {
                throw new ServiceResultException(new StatusCode(StatusCodes.BadNoCommunication), $"No Publish response for {silence.TotalSeconds:0.#} s (limit {limit.TotalSeconds:0.#} s)");
            }
        }
    }
}

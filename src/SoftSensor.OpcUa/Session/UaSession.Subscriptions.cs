using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>Subscription and monitored-item services (Part 4 §5.12, §5.13).</summary>
public sealed partial class UaSession
{
    public Task<CreateSubscriptionResponse> CreateSubscriptionAsync(CreateSubscriptionRequest request, CancellationToken cancellationToken) =>
        CallAsync<CreateSubscriptionResponse>(request, cancellationToken);

    public async Task<MonitoredItemCreateResult[]> CreateMonitoredItemsAsync(uint subscriptionId, IReadOnlyList<MonitoredItemCreateRequest> items, CancellationToken cancellationToken)
    {
        var request = new CreateMonitoredItemsRequest { SubscriptionId = subscriptionId, ItemsToCreate = items };
        var response = await CallAsync<CreateMonitoredItemsResponse>(request, cancellationToken);
        return CheckCount(response.Results, items.Count, "CreateMonitoredItems");
    }

    /// <summary>One Publish; the server holds it until a notification or keep-alive is due, so the time-out is long.</summary>
    public Task<PublishResponse> PublishAsync(IReadOnlyList<SubscriptionAcknowledgement> acknowledgements, TimeSpan timeout, CancellationToken cancellationToken) =>
        CallAsync<PublishResponse>(new PublishRequest { Acknowledgements = acknowledgements }, cancellationToken, timeout);

    public async Task<NotificationMessage> RepublishAsync(uint subscriptionId, uint sequenceNumber, CancellationToken cancellationToken) =>
        (await CallAsync<RepublishResponse>(new RepublishRequest { SubscriptionId = subscriptionId, RetransmitSequenceNumber = sequenceNumber }, cancellationToken)).Message;

    public async Task<TransferResult[]> TransferSubscriptionsAsync(IReadOnlyList<uint> subscriptionIds, bool sendInitialValues, CancellationToken cancellationToken)
    {
        var request = new TransferSubscriptionsRequest { SubscriptionIds = subscriptionIds, SendInitialValues = sendInitialValues };
        var response = await CallAsync<TransferSubscriptionsResponse>(request, cancellationToken);
        return CheckCount(response.Results, subscriptionIds.Count, "TransferSubscriptions");
    }

    public async Task<Encoding.StatusCode[]> DeleteSubscriptionsAsync(IReadOnlyList<uint> subscriptionIds, CancellationToken cancellationToken)
    {
        var response = await CallAsync<StatusResultsResponse>(new DeleteSubscriptionsRequest { SubscriptionIds = subscriptionIds }, cancellationToken);
        return CheckCount(response.Results, subscriptionIds.Count, "DeleteSubscriptions");
    }
}

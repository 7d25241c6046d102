namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>
/// What the client asks of a subscription (Part 4 §5.13.2). The lifetime count is kept at least
/// three times the keep-alive count, as Part 4 §5.13.2.2 requires of the server's revision.
/// </summary>
public sealed record SubscriptionSettings
{
    public TimeSpan PublishingInterval { get; init; } = TimeSpan.FromSeconds(1);

    public uint MaxKeepAliveCount { get; init; } = 10;

    public uint LifetimeCount { get; init; } = 60;

    public uint MaxNotificationsPerPublish { get; init; }

    public byte Priority { get; init; }

    /// <summary>Publish requests kept outstanding at the server (2–3 covers the round trip).</summary>
    public int OutstandingPublishRequests { get; init; } = 3;

    /// <summary>The lifetime count actually requested: at least 3 × the keep-alive count.</summary>
    public uint EffectiveLifetimeCount => Math.Max(LifetimeCount, 3 * MaxKeepAliveCount);
}

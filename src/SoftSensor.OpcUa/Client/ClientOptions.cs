using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Subscriptions;

namespace SoftSensor.OpcUa.Client;

/// <summary>Settings of a supervised client: the session, the subscription and the reconnect back-off.</summary>
public sealed record ClientOptions
{
    public required SessionOptions Session { get; init; }

    public SubscriptionSettings Subscription { get; init; } = new();

    /// <summary>First wait before reconnecting; doubled after each failure up to <see cref="ReconnectMaxDelay"/>.</summary>
    public TimeSpan ReconnectMinDelay { get; init; } = TimeSpan.FromSeconds(1);

    public TimeSpan ReconnectMaxDelay { get; init; } = TimeSpan.FromSeconds(30);
}

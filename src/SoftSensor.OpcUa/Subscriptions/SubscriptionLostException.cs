namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>
/// The server no longer has the subscription (BadNoSubscription, a StatusChangeNotification with
/// a Bad status such as BadTimeout after its lifetime ran out; Part 4 §5.13.1.1): it must be created again.
/// </summary>
public sealed class SubscriptionLostException : Exception
{
    public SubscriptionLostException(string message)
        : base(message)
    {
    }

    public SubscriptionLostException(string message, Exception innerException)
        : base(message, innerException)
    {
    }

    public SubscriptionLostException()
        : base("The subscription is gone.")
    {
    }
}

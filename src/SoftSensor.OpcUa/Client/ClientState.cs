namespace SoftSensor.OpcUa.Client;

/// <summary>Where the supervised client stands, for health reporting.</summary>
public enum ClientState
{
    Connecting = 0,
    Connected = 1,
    Reconnecting = 2,
    Stopped = 3,
}

/// <summary>Counts of what the supervisor did, for health reporting and tests.</summary>
public sealed record ClientCounters
{
    public int Connects { get; init; }

    public int SessionsCreated { get; init; }

    public int SessionsReactivated { get; init; }

    public int SubscriptionsCreated { get; init; }

    public int SubscriptionsTransferred { get; init; }

    public int LinkLosses { get; init; }
}

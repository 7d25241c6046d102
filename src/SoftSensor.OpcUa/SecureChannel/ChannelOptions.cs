using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.SecureChannel;

/// <summary>Settings of one secure channel.</summary>
public sealed record ChannelOptions
{
    /// <summary>Token lifetime asked for in OpenSecureChannel; the server revises it.</summary>
    public TimeSpan RequestedLifetime { get; init; } = TimeSpan.FromHours(1);

    /// <summary>Time allowed for TCP connect plus Hello/Acknowledge plus OpenSecureChannel.</summary>
    public TimeSpan ConnectTimeout { get; init; } = TimeSpan.FromSeconds(10);

    /// <summary>Default time allowed for one request when the caller gives none.</summary>
    public TimeSpan RequestTimeout { get; init; } = TimeSpan.FromSeconds(15);

    /// <summary>The limits declared in Hello.</summary>
    public TransportLimits Limits { get; init; } = TransportLimits.ClientDefault;

    /// <summary>Fraction of the revised lifetime after which the token is renewed (Part 6 §6.7.4: a new token after 75 % of the lifetime).</summary>
    public double RenewAtFraction { get; init; } = 0.75;
}

using SoftSensor.OpcUa.SecureChannel;

namespace SoftSensor.OpcUa.Session;

/// <summary>Settings of a client session (Part 4 §5.6.2).</summary>
public sealed record SessionOptions
{
    public required string EndpointUrl { get; init; }

    public string ApplicationName { get; init; } = "SoftSensor OPC UA client";

    public string ApplicationUri { get; init; } = "urn:softsensor:opcua-client";

    public string ProductUri { get; init; } = "urn:softsensor";

    public string SessionName { get; init; } = "softsensor";

    public TimeSpan SessionTimeout { get; init; } = TimeSpan.FromMinutes(2);

    public UserIdentity Identity { get; init; } = UserIdentity.Anonymous;

    public ChannelOptions Channel { get; init; } = new();

    /// <summary>Message security and PKI; the library's default is SecurityPolicy None without discovery.</summary>
    public SecuritySettings Security { get; init; } = SecuritySettings.None;
}

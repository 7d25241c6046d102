namespace SoftSensor.Daemon.Configuration;

/// <summary>
/// Section <c>opcUa</c>: the OPC UA server the tags with an <c>opcUaNode</c> are read from, and the
/// nodes the estimates are written back to for the HMI. Empty <see cref="Endpoint"/>: no OPC UA.
/// </summary>
internal sealed class OpcUaOptions
{
    /// <summary>Endpoint URL, <c>opc.tcp://host:port[/path]</c> (SecurityPolicy None only, for now).</summary>
    public string Endpoint { get; set; } = "";

    /// <summary>User name; empty for anonymous. The password is read from <see cref="PasswordVariable"/>.</summary>
    public string User { get; set; } = "";

    /// <summary>Environment variable holding the password (never in a configuration file).</summary>
    public string PasswordVariable { get; set; } = "SOFTSENSOR_OPCUA_PASSWORD";

    /// <summary>Publishing interval of the subscription.</summary>
    public TimeSpan PublishingInterval { get; set; } = TimeSpan.FromSeconds(1);

    /// <summary>Sampling interval of every monitored item.</summary>
    public TimeSpan SamplingInterval { get; set; } = TimeSpan.FromMilliseconds(500);

    /// <summary>Queue size of every monitored item at the server.</summary>
    public uint QueueSize { get; set; } = 5;

    /// <summary>Absolute deadband in the tag's plant unit (0: every change).</summary>
    public double AbsoluteDeadband { get; set; }

    /// <summary>Write-back: reactor id → estimate name (e.g. <c>our</c>) → node (<c>nsu=...;s=...</c> or browse path).</summary>
    public Dictionary<string, Dictionary<string, string>> WriteBack { get; set; } = new(StringComparer.Ordinal);
}

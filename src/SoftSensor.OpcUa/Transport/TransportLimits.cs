namespace SoftSensor.OpcUa.Transport;

/// <summary>
/// The buffer and message limits exchanged in Hello and Acknowledge (Part 6 §7.1.2.3, §7.1.2.4).
/// Buffer sizes are at least 8192 bytes; 0 for MaxMessageSize or MaxChunkCount means no limit.
/// </summary>
public sealed record TransportLimits
{
    /// <summary>The smallest buffer size a peer may declare (Part 6 §7.1.2.3).</summary>
    public const uint MinBufferSize = 8192;

    public uint ReceiveBufferSize { get; init; } = 65535;

    public uint SendBufferSize { get; init; } = 65535;

    public uint MaxMessageSize { get; init; } = 16 * 1024 * 1024;

    public uint MaxChunkCount { get; init; } = 512;

    public static TransportLimits ClientDefault { get; } = new();
}

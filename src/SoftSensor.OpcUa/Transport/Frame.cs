namespace SoftSensor.OpcUa.Transport;

/// <summary>One frame as received: its header and the bytes after the header.</summary>
public sealed record Frame(FrameHeader Header, ReadOnlyMemory<byte> Body);

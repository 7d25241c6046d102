using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Transport;

/// <summary>
/// Hello, Acknowledge and Error of the OPC UA Connection Protocol (Part 6 §7.1.2.3 to §7.1.2.5),
/// each after the 8-byte header (MessageType, 'F', MessageSize).
/// </summary>
public static class ConnectionMessages
{
    /// <summary>Largest EndpointUrl a Hello may carry (Part 6 §7.1.2.3: 4096 bytes).</summary>
    public const int MaxEndpointUrlBytes = 4096;

    public static byte[] EncodeHello(TransportLimits limits, string endpointUrl)
    {
        var w = new UaBinaryWriter(64 + endpointUrl.Length);
        FrameHeader.Write(w, MessageTypes.Hello, ChunkType.Final);
        w.WriteUInt32(0); // ProtocolVersion
        w.WriteUInt32(limits.ReceiveBufferSize);
        w.WriteUInt32(limits.SendBufferSize);
        w.WriteUInt32(limits.MaxMessageSize);
        w.WriteUInt32(limits.MaxChunkCount);
        w.WriteString(endpointUrl);
        FrameHeader.PatchSize(w);
        return w.ToArray();
    }

    /// <summary>Reads an Acknowledge body (after the header) into the server's limits.</summary>
    public static (uint ProtocolVersion, TransportLimits Limits) DecodeAcknowledge(ReadOnlyMemory<byte> body)
    {
        var r = new UaBinaryReader(body);
        uint version = r.ReadUInt32();
        var limits = new TransportLimits
        {
            ReceiveBufferSize = r.ReadUInt32(),
            SendBufferSize = r.ReadUInt32(),
            MaxMessageSize = r.ReadUInt32(),
            MaxChunkCount = r.ReadUInt32(),
        };
        if (limits.ReceiveBufferSize < TransportLimits.MinBufferSize || limits.SendBufferSize < TransportLimits.MinBufferSize)
        {
            throw new UaDecodeException($"Acknowledge declares buffers of {limits.ReceiveBufferSize}/{limits.SendBufferSize} bytes; expected at least {TransportLimits.MinBufferSize}.");
        }

        return (version, limits);
    }

    /// <summary>Reads an Error body: the StatusCode and the reason.</summary>
    public static (StatusCode Error, string? Reason) DecodeError(ReadOnlyMemory<byte> body)
    {
        var r = new UaBinaryReader(body);
        return (r.ReadStatusCode(), r.ReadString());
    }
}

using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>OpenSecureChannel request (Part 4 §5.5.2.2).</summary>
public sealed record OpenSecureChannelRequest : IServiceRequest
{
    public uint BinaryEncodingId => 446;

    public RequestHeader Header { get; set; } = new();

    public uint ClientProtocolVersion { get; init; }

    public SecurityTokenRequestType RequestType { get; init; }

    public MessageSecurityMode SecurityMode { get; init; } = MessageSecurityMode.None;

    public byte[]? ClientNonce { get; init; }

    public uint RequestedLifetimeMs { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteUInt32(ClientProtocolVersion);
        w.WriteInt32((int)RequestType);
        w.WriteInt32((int)SecurityMode);
        w.WriteByteString(ClientNonce);
        w.WriteUInt32(RequestedLifetimeMs);
    }
}

/// <summary>The security token of a channel (Part 4 §5.5.2.2, ChannelSecurityToken).</summary>
public sealed record ChannelSecurityToken(uint ChannelId, uint TokenId, DateTime CreatedAt, uint RevisedLifetimeMs)
{
    public static ChannelSecurityToken Decode(UaBinaryReader r) => new(r.ReadUInt32(), r.ReadUInt32(), r.ReadDateTime(), r.ReadUInt32());
}

/// <summary>OpenSecureChannel response (Part 4 §5.5.2.2).</summary>
public sealed record OpenSecureChannelResponse(ResponseHeader Header, uint ServerProtocolVersion, ChannelSecurityToken SecurityToken, byte[]? ServerNonce) : IServiceResponse
{
    public const uint EncodingId = 449;

    public static OpenSecureChannelResponse Decode(UaBinaryReader r) =>
        new(ResponseHeader.Decode(r), r.ReadUInt32(), ChannelSecurityToken.Decode(r), r.ReadByteString());
}

/// <summary>CloseSecureChannel request (Part 4 §5.5.3.2); the server sends no response.</summary>
public sealed record CloseSecureChannelRequest : IServiceRequest
{
    public uint BinaryEncodingId => 452;

    public RequestHeader Header { get; set; } = new();

    public void Encode(UaBinaryWriter w) => Header.Encode(w);
}

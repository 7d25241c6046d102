using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>The response a server sends instead when a service fails as a whole (Part 4 §7.35).</summary>
public sealed record ServiceFault(ResponseHeader Header) : IServiceResponse
{
    public const uint EncodingId = 397;

    public static ServiceFault Decode(UaBinaryReader r) => new(ResponseHeader.Decode(r));
}

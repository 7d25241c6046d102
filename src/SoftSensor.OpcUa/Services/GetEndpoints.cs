using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>GetEndpoints request (Part 4 §5.4.4.2).</summary>
public sealed record GetEndpointsRequest : IServiceRequest
{
    public uint BinaryEncodingId => 428;

    public RequestHeader Header { get; set; } = new();

    public string? EndpointUrl { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteString(EndpointUrl);
        w.WriteInt32(-1); // LocaleIds: none
        w.WriteInt32(-1); // ProfileUris: all
    }
}

/// <summary>GetEndpoints response (Part 4 §5.4.4.2).</summary>
public sealed record GetEndpointsResponse(ResponseHeader Header, EndpointDescription[] Endpoints) : IServiceResponse
{
    public const uint EncodingId = 431;

    public static GetEndpointsResponse Decode(UaBinaryReader r) =>
        new(ResponseHeader.Decode(r), r.ReadArrayOrEmpty(EndpointDescription.Decode));
}

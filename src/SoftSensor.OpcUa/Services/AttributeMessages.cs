using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>ReadValueId (Part 4 §7.29).</summary>
public sealed record ReadValueId(NodeId NodeId, uint AttributeId = AttributeIds.Value, string? IndexRange = null)
{
    public void Encode(UaBinaryWriter w)
    {
        w.WriteNodeId(NodeId);
        w.WriteUInt32(AttributeId);
        w.WriteString(IndexRange);
        w.WriteQualifiedName(QualifiedName.Null); // DataEncoding: default
    }
}

/// <summary>Read request (Part 4 §5.10.2.2).</summary>
public sealed record ReadRequest : IServiceRequest
{
    public uint BinaryEncodingId => 631;

    public RequestHeader Header { get; set; } = new();

    public double MaxAgeMs { get; init; }

    public TimestampsToReturn TimestampsToReturn { get; init; } = TimestampsToReturn.Both;

    public required IReadOnlyList<ReadValueId> NodesToRead { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteDouble(MaxAgeMs);
        w.WriteInt32((int)TimestampsToReturn);
        w.WriteArray(NodesToRead, static (x, n) => n.Encode(x));
    }
}

/// <summary>Read response (Part 4 §5.10.2.2).</summary>
public sealed record ReadResponse(ResponseHeader Header, DataValue[] Results) : IServiceResponse
{
    public const uint EncodingId = 634;

    public static ReadResponse Decode(UaBinaryReader r)
    {
        var response = new ReadResponse(ResponseHeader.Decode(r), r.ReadArrayOrEmpty(static x => x.ReadDataValue()));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}

/// <summary>WriteValue (Part 4 §5.10.4.2).</summary>
public sealed record WriteValue(NodeId NodeId, DataValue Value, uint AttributeId = AttributeIds.Value, string? IndexRange = null)
{
    public void Encode(UaBinaryWriter w)
    {
        w.WriteNodeId(NodeId);
        w.WriteUInt32(AttributeId);
        w.WriteString(IndexRange);
        w.WriteDataValue(Value);
    }
}

/// <summary>Write request (Part 4 §5.10.4.2).</summary>
public sealed record WriteRequest : IServiceRequest
{
    public uint BinaryEncodingId => 673;

    public RequestHeader Header { get; set; } = new();

    public required IReadOnlyList<WriteValue> NodesToWrite { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteArray(NodesToWrite, static (x, n) => n.Encode(x));
    }
}

/// <summary>Write response (Part 4 §5.10.4.2).</summary>
public sealed record WriteResponse(ResponseHeader Header, StatusCode[] Results) : IServiceResponse
{
    public const uint EncodingId = 676;

    public static WriteResponse Decode(UaBinaryReader r)
    {
        var response = new WriteResponse(ResponseHeader.Decode(r), r.ReadArrayOrEmpty(static x => x.ReadStatusCode()));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}

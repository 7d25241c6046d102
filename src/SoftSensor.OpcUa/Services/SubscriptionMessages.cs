using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>CreateSubscription request (Part 4 §5.13.2.2).</summary>
public sealed record CreateSubscriptionRequest : IServiceRequest
{
    public uint BinaryEncodingId => 787;

    public RequestHeader Header { get; set; } = new();

    public double RequestedPublishingIntervalMs { get; init; }

    public uint RequestedLifetimeCount { get; init; }

    public uint RequestedMaxKeepAliveCount { get; init; }

    public uint MaxNotificationsPerPublish { get; init; }

    public bool PublishingEnabled { get; init; } = true;

    public byte Priority { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteDouble(RequestedPublishingIntervalMs);
        w.WriteUInt32(RequestedLifetimeCount);
        w.WriteUInt32(RequestedMaxKeepAliveCount);
        w.WriteUInt32(MaxNotificationsPerPublish);
        w.WriteBoolean(PublishingEnabled);
        w.WriteByte(Priority);
    }
}

/// <summary>CreateSubscription response (Part 4 §5.13.2.2).</summary>
public sealed record CreateSubscriptionResponse(ResponseHeader Header, uint SubscriptionId, double RevisedPublishingIntervalMs, uint RevisedLifetimeCount, uint RevisedMaxKeepAliveCount) : IServiceResponse
{
    public const uint EncodingId = 790;

    public static CreateSubscriptionResponse Decode(UaBinaryReader r) =>
        new(ResponseHeader.Decode(r), r.ReadUInt32(), r.ReadDouble(), r.ReadUInt32(), r.ReadUInt32());
}

/// <summary>DeleteSubscriptions request (Part 4 §5.13.8.2).</summary>
public sealed record DeleteSubscriptionsRequest : IServiceRequest
{
    public uint BinaryEncodingId => 847;

    public RequestHeader Header { get; set; } = new();

    public required IReadOnlyList<uint> SubscriptionIds { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteArray(SubscriptionIds, static (x, id) => x.WriteUInt32(id));
    }
}

/// <summary>Responses made of a header and one StatusCode per operation (DeleteSubscriptions, Part 4 §5.13.8.2).</summary>
public sealed record StatusResultsResponse(ResponseHeader Header, StatusCode[] Results) : IServiceResponse
{
    public const uint DeleteSubscriptionsEncodingId = 850;

    public static StatusResultsResponse Decode(UaBinaryReader r)
    {
        var response = new StatusResultsResponse(ResponseHeader.Decode(r), r.ReadArrayOrEmpty(static x => x.ReadStatusCode()));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}

/// <summary>TransferSubscriptions request (Part 4 §5.13.7.2).</summary>
public sealed record TransferSubscriptionsRequest : IServiceRequest
{
    public uint BinaryEncodingId => 841;

    public RequestHeader Header { get; set; } = new();

    public required IReadOnlyList<uint> SubscriptionIds { get; init; }

    public bool SendInitialValues { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteArray(SubscriptionIds, static (x, id) => x.WriteUInt32(id));
        w.WriteBoolean(SendInitialValues);
    }
}

/// <summary>TransferResult (Part 4 §5.13.7.2).</summary>
public sealed record TransferResult(StatusCode Status, uint[] AvailableSequenceNumbers)
{
    public static TransferResult Decode(UaBinaryReader r) => new(r.ReadStatusCode(), r.ReadArrayOrEmpty(static x => x.ReadUInt32()));
}

/// <summary>TransferSubscriptions response (Part 4 §5.13.7.2).</summary>
public sealed record TransferSubscriptionsResponse(ResponseHeader Header, TransferResult[] Results) : IServiceResponse
{
    public const uint EncodingId = 844;

    public static TransferSubscriptionsResponse Decode(UaBinaryReader r)
    {
        var response = new TransferSubscriptionsResponse(ResponseHeader.Decode(r), r.ReadArrayOrEmpty(TransferResult.Decode));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}

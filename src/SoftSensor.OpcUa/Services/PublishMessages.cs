using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>SubscriptionAcknowledgement (Part 4 §5.13.5.2).</summary>
public readonly record struct SubscriptionAcknowledgement(uint SubscriptionId, uint SequenceNumber);

/// <summary>NotificationMessage (Part 4 §7.24); an empty NotificationData is a keep-alive.</summary>
public sealed record NotificationMessage(uint SequenceNumber, DateTime PublishTime, ExtensionObject[] NotificationData)
{
    public static NotificationMessage Decode(UaBinaryReader r) =>
        new(r.ReadUInt32(), r.ReadDateTime(), r.ReadArrayOrEmpty(static x => x.ReadExtensionObject()));
}

/// <summary>Publish request (Part 4 §5.13.5.2).</summary>
public sealed record PublishRequest : IServiceRequest
{
    public uint BinaryEncodingId => 826;

    public RequestHeader Header { get; set; } = new();

    public IReadOnlyList<SubscriptionAcknowledgement> Acknowledgements { get; init; } = [];

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteArray(Acknowledgements, static (x, a) =>
        {
            x.WriteUInt32(a.SubscriptionId);
            x.WriteUInt32(a.SequenceNumber);
        });
    }
}

/// <summary>Publish response (Part 4 §5.13.5.2); Results hold the outcome of each acknowledgement.</summary>
public sealed record PublishResponse : IServiceResponse
{
    public const uint EncodingId = 829;

    public required ResponseHeader Header { get; init; }

    public uint SubscriptionId { get; init; }

    public uint[] AvailableSequenceNumbers { get; init; } = [];

    public bool MoreNotifications { get; init; }

    public required NotificationMessage Message { get; init; }

    public StatusCode[] Results { get; init; } = [];

    public static PublishResponse Decode(UaBinaryReader r)
    {
        var response = new PublishResponse
        {
            Header = ResponseHeader.Decode(r),
            SubscriptionId = r.ReadUInt32(),
            AvailableSequenceNumbers = r.ReadArrayOrEmpty(static x => x.ReadUInt32()),
            MoreNotifications = r.ReadBoolean(),
            Message = NotificationMessage.Decode(r),
            Results = r.ReadArrayOrEmpty(static x => x.ReadStatusCode()),
        };
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}

/// <summary>Republish request (Part 4 §5.13.6.2).</summary>
public sealed record RepublishRequest : IServiceRequest
{
    public uint BinaryEncodingId => 832;

    public RequestHeader Header { get; set; } = new();

    public uint SubscriptionId { get; init; }

    public uint RetransmitSequenceNumber { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteUInt32(SubscriptionId);
        w.WriteUInt32(RetransmitSequenceNumber);
    }
}

/// <summary>Republish response (Part 4 §5.13.6.2).</summary>
public sealed record RepublishResponse(ResponseHeader Header, NotificationMessage Message) : IServiceResponse
{
    public const uint EncodingId = 835;

    public static RepublishResponse Decode(UaBinaryReader r) => new(ResponseHeader.Decode(r), NotificationMessage.Decode(r));
}

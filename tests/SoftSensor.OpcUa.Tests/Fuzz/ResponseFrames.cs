using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.SecureChannel;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Transport;

namespace SoftSensor.OpcUa.Tests.Fuzz;

/// <summary>
/// Well-formed server frames built field by field from Part 4 and Part 6 (ACK, ERR, OPN and MSG
/// responses of the services this client uses, an abort chunk): the seeds of the fuzz test.
/// </summary>
internal static class ResponseFrames
{
    public static List<byte[]> All() =>
    [
        Acknowledge(),
        Error(),
        Secure(MessageTypes.OpenChannel, OpenResponse()),
        Secure(MessageTypes.Message, ReadResponse()),
        Secure(MessageTypes.Message, BrowseResponse()),
        Secure(MessageTypes.Message, PublishResponse()),
        Secure(MessageTypes.Message, Fault()),
        Secure(MessageTypes.Message, AbortBody(), ChunkType.Abort),
    ];

    public static byte[] Acknowledge()
    {
        var w = new UaBinaryWriter();
        FrameHeader.Write(w, MessageTypes.Acknowledge, ChunkType.Final);
        foreach (uint v in new uint[] { 0, 65535, 65535, 1 << 24, 512 })
        {
            w.WriteUInt32(v);
        }

        FrameHeader.PatchSize(w);
        return w.ToArray();
    }

    public static byte[] Error()
    {
        var w = new UaBinaryWriter();
        FrameHeader.Write(w, MessageTypes.Error, ChunkType.Final);
        w.WriteUInt32(StatusCodes.BadTcpMessageTooLarge);
        w.WriteString("too large");
        FrameHeader.PatchSize(w);
        return w.ToArray();
    }

    public static byte[] Secure(uint type, byte[] body, ChunkType chunk = ChunkType.Final)
    {
        var w = new UaBinaryWriter();
        FrameHeader.Write(w, type, chunk);
        if (type == MessageTypes.OpenChannel)
        {
            ChunkHeaders.WriteAsymmetric(w, 7);
        }
        else
        {
            ChunkHeaders.WriteSymmetric(w, 7, 1);
        }

        w.WriteUInt32(2); // SequenceNumber
        w.WriteUInt32(3); // RequestId
        w.WriteRaw(body);
        FrameHeader.PatchSize(w);
        return w.ToArray();
    }

    private static UaBinaryWriter Begin(uint encodingId)
    {
        var w = new UaBinaryWriter();
        w.WriteNodeId(NodeId.Numeric(encodingId));
        new ResponseHeader { Timestamp = DateTime.UnixEpoch, RequestHandle = 3, StringTable = ["a", null] }.Encode(w);
        return w;
    }

    private static byte[] OpenResponse()
    {
        var w = Begin(OpenSecureChannelResponse.EncodingId);
        w.WriteUInt32(0);
        w.WriteUInt32(7);
        w.WriteUInt32(1);
        w.WriteDateTime(DateTime.UnixEpoch);
        w.WriteUInt32(60000);
        w.WriteByteString([]);
        return w.ToArray();
    }

    private static byte[] ReadResponse()
    {
        var w = Begin(Services.ReadResponse.EncodingId);
        var values = new[]
        {
            new DataValue { Value = Variant.From(20.9), SourceTimestamp = DateTime.UnixEpoch, ServerTimestamp = DateTime.UnixEpoch },
            new DataValue { Value = Variant.Array(BuiltInType.String, new[] { "x", "y" }) },
            new DataValue { Value = Variant.Array(BuiltInType.Int16, new short[] { 1, 2, 3, 4, 5, 6 }, [2, 3]) },
            new DataValue { Value = Variant.Scalar(BuiltInType.LocalizedText, new LocalizedText("en", "t")), Status = new StatusCode(StatusCodes.UncertainLastUsableValue) },
            new DataValue { Value = Variant.Scalar(BuiltInType.ExpandedNodeId, ExpandedNodeId.Parse("nsu=u;s=A")) },
            new DataValue { Value = Variant.Array(BuiltInType.Variant, new[] { Variant.From(1u), Variant.Scalar(BuiltInType.Guid, Guid.Empty) }) },
            new DataValue { Value = Variant.Scalar(BuiltInType.DiagnosticInfo, new DiagnosticInfo { SymbolicId = 1, InnerDiagnosticInfo = new DiagnosticInfo { AdditionalInfo = "z" } }) },
            new DataValue { Value = Variant.Scalar(BuiltInType.DataValue, new DataValue { Value = Variant.From(true) }) },
        };
        w.WriteArray(values, static (x, v) => x.WriteDataValue(v));
        w.WriteArray(new DiagnosticInfo?[] { null }, static (x, d) => x.WriteDiagnosticInfo(d));
        return w.ToArray();
    }

    private static byte[] BrowseResponse()
    {
        var w = Begin(Services.BrowseResponse.EncodingId);
        w.WriteInt32(1);
        w.WriteStatusCode(StatusCode.Good);
        w.WriteByteString([1, 2, 3, 4]);
        w.WriteInt32(1);
        w.WriteNodeId(NodeId.Numeric(35));
        w.WriteBoolean(true);
        w.WriteExpandedNodeId(new ExpandedNodeId(NodeId.String(2, "Reactor1")));
        w.WriteQualifiedName(new QualifiedName(2, "Reactor1"));
        w.WriteLocalizedText(new LocalizedText(null, "Reactor1"));
        w.WriteInt32((int)NodeClass.Object);
        w.WriteExpandedNodeId(new ExpandedNodeId(NodeId.Numeric(61)));
        w.WriteInt32(-1);
        return w.ToArray();
    }

    private static byte[] PublishResponse()
    {
        var notification = new UaBinaryWriter();
        notification.WriteInt32(2);
        notification.WriteUInt32(1);
        notification.WriteDataValue(new DataValue { Value = Variant.From(0.8), SourceTimestamp = DateTime.UnixEpoch });
        notification.WriteUInt32(2);
        notification.WriteDataValue(new DataValue { Status = new StatusCode(StatusCodes.BadNoCommunication) });
        notification.WriteInt32(-1);

        var w = Begin(Services.PublishResponse.EncodingId);
        w.WriteUInt32(5); // SubscriptionId
        w.WriteArray(new uint[] { 1, 2 }, static (x, n) => x.WriteUInt32(n));
        w.WriteBoolean(false);
        w.WriteUInt32(2); // SequenceNumber
        w.WriteDateTime(DateTime.UnixEpoch);
        w.WriteInt32(1);
        w.WriteExtensionObject(new ExtensionObject(NodeId.Numeric(Notifications.DataChangeEncodingId), ExtensionObjectBody.Binary, notification.ToArray()));
        w.WriteArray(new[] { StatusCode.Good }, static (x, s) => x.WriteStatusCode(s));
        w.WriteInt32(-1);
        return w.ToArray();
    }

    private static byte[] Fault()
    {
        var w = new UaBinaryWriter();
        w.WriteNodeId(NodeId.Numeric(ServiceFault.EncodingId));
        new ResponseHeader { ServiceResult = new StatusCode(StatusCodes.BadSessionIdInvalid), ServiceDiagnostics = new DiagnosticInfo { SymbolicId = 0 } }.Encode(w);
        return w.ToArray();
    }

    private static byte[] AbortBody()
    {
        var w = new UaBinaryWriter();
        w.WriteUInt32(StatusCodes.BadResponseTooLarge);
        w.WriteString("aborted");
        return w.ToArray();
    }
}

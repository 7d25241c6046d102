using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>BrowseDescription (Part 4 §5.8.2.2); ResultMask 0x3F asks for every field.</summary>
public sealed record BrowseDescription(NodeId NodeId, BrowseDirection Direction = BrowseDirection.Forward)
{
    public NodeId ReferenceTypeId { get; init; } = WellKnownNodes.HierarchicalReferences;

    public bool IncludeSubtypes { get; init; } = true;

    public uint NodeClassMask { get; init; }

    public uint ResultMask { get; init; } = 0x3F;

    public void Encode(UaBinaryWriter w)
    {
        w.WriteNodeId(NodeId);
        w.WriteInt32((int)Direction);
        w.WriteNodeId(ReferenceTypeId);
        w.WriteBoolean(IncludeSubtypes);
        w.WriteUInt32(NodeClassMask);
        w.WriteUInt32(ResultMask);
    }
}

/// <summary>ReferenceDescription (Part 4 §7.30).</summary>
public sealed record ReferenceDescription
{
    public NodeId ReferenceTypeId { get; init; } = Encoding.NodeId.Null;

    public bool IsForward { get; init; }

    public ExpandedNodeId NodeId { get; init; } = Encoding.ExpandedNodeId.Null;

    public QualifiedName BrowseName { get; init; } = QualifiedName.Null;

    public LocalizedText DisplayName { get; init; } = LocalizedText.Null;

    public NodeClass NodeClass { get; init; }

    public ExpandedNodeId TypeDefinition { get; init; } = Encoding.ExpandedNodeId.Null;

    public static ReferenceDescription Decode(UaBinaryReader r) => new()
    {
        ReferenceTypeId = r.ReadNodeId(),
        IsForward = r.ReadBoolean(),
        NodeId = r.ReadExpandedNodeId(),
        BrowseName = r.ReadQualifiedName(),
        DisplayName = r.ReadLocalizedText(),
        NodeClass = (NodeClass)r.ReadInt32(),
        TypeDefinition = r.ReadExpandedNodeId(),
    };
}

/// <summary>BrowseResult (Part 4 §7.6).</summary>
public sealed record BrowseResult(StatusCode Status, byte[]? ContinuationPoint, ReferenceDescription[] References)
{
    public static BrowseResult Decode(UaBinaryReader r) =>
        new(r.ReadStatusCode(), r.ReadByteString(), r.ReadArrayOrEmpty(ReferenceDescription.Decode));
}

/// <summary>Browse request (Part 4 §5.8.2.2) with the default view.</summary>
public sealed record BrowseRequest : IServiceRequest
{
    public uint BinaryEncodingId => 527;

    public RequestHeader Header { get; set; } = new();

    public uint RequestedMaxReferencesPerNode { get; init; }

    public required IReadOnlyList<BrowseDescription> NodesToBrowse { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteNodeId(NodeId.Null); // View.ViewId
        w.WriteDateTime(DateTime.MinValue); // View.Timestamp
        w.WriteUInt32(0); // View.ViewVersion
        w.WriteUInt32(RequestedMaxReferencesPerNode);
        w.WriteArray(NodesToBrowse, static (x, n) => n.Encode(x));
    }
}

/// <summary>Browse response and BrowseNext response share this layout (Part 4 §5.8.2.2, §5.8.3.2).</summary>
public sealed record BrowseResponse(ResponseHeader Header, BrowseResult[] Results) : IServiceResponse
{
    public const uint EncodingId = 530;
    public const uint NextEncodingId = 536;

    public static BrowseResponse Decode(UaBinaryReader r)
    {
        var response = new BrowseResponse(ResponseHeader.Decode(r), r.ReadArrayOrEmpty(BrowseResult.Decode));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}

/// <summary>BrowseNext request (Part 4 §5.8.3.2).</summary>
public sealed record BrowseNextRequest : IServiceRequest
{
    public uint BinaryEncodingId => 533;

    public RequestHeader Header { get; set; } = new();

    public bool ReleaseContinuationPoints { get; init; }

    public required IReadOnlyList<byte[]> ContinuationPoints { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteBoolean(ReleaseContinuationPoints);
        w.WriteArray(ContinuationPoints, static (x, c) => x.WriteByteString(c));
    }
}

using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Services;

/// <summary>RelativePathElement (Part 4 §7.31): one step by browse name along hierarchical references.</summary>
public sealed record RelativePathElement(QualifiedName TargetName)
{
    public NodeId ReferenceTypeId { get; init; } = WellKnownNodes.HierarchicalReferences;

    public bool IsInverse { get; init; }

    public bool IncludeSubtypes { get; init; } = true;

    public void Encode(UaBinaryWriter w)
    {
        w.WriteNodeId(ReferenceTypeId);
        w.WriteBoolean(IsInverse);
        w.WriteBoolean(IncludeSubtypes);
        w.WriteQualifiedName(TargetName);
    }
}

/// <summary>BrowsePath (Part 4 §5.8.4.2): a start node and a RelativePath.</summary>
public sealed record BrowsePath(NodeId StartingNode, IReadOnlyList<RelativePathElement> Elements)
{
    public void Encode(UaBinaryWriter w)
    {
        w.WriteNodeId(StartingNode);
        w.WriteArray(Elements, static (x, e) => e.Encode(x));
    }
}

/// <summary>BrowsePathTarget (Part 4 §5.8.4.2); RemainingPathIndex UInt32.MaxValue means fully resolved.</summary>
public sealed record BrowsePathTarget(ExpandedNodeId TargetId, uint RemainingPathIndex)
{
    public static BrowsePathTarget Decode(UaBinaryReader r) => new(r.ReadExpandedNodeId(), r.ReadUInt32());
}

/// <summary>BrowsePathResult (Part 4 §5.8.4.2).</summary>
public sealed record BrowsePathResult(StatusCode Status, BrowsePathTarget[] Targets)
{
    public static BrowsePathResult Decode(UaBinaryReader r) => new(r.ReadStatusCode(), r.ReadArrayOrEmpty(BrowsePathTarget.Decode));
}

/// <summary>TranslateBrowsePathsToNodeIds request (Part 4 §5.8.4.2).</summary>
public sealed record TranslateBrowsePathsRequest : IServiceRequest
{
    public uint BinaryEncodingId => 554;

    public RequestHeader Header { get; set; } = new();

    public required IReadOnlyList<BrowsePath> BrowsePaths { get; init; }

    public void Encode(UaBinaryWriter w)
    {
        Header.Encode(w);
        w.WriteArray(BrowsePaths, static (x, p) => p.Encode(x));
    }
}

/// <summary>TranslateBrowsePathsToNodeIds response (Part 4 §5.8.4.2).</summary>
public sealed record TranslateBrowsePathsResponse(ResponseHeader Header, BrowsePathResult[] Results) : IServiceResponse
{
    public const uint EncodingId = 557;

    public static TranslateBrowsePathsResponse Decode(UaBinaryReader r)
    {
        var response = new TranslateBrowsePathsResponse(ResponseHeader.Decode(r), r.ReadArrayOrEmpty(BrowsePathResult.Decode));
        r.ReadArray(static x => x.ReadDiagnosticInfo());
        return response;
    }
}

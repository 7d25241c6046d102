namespace SoftSensor.OpcUa.Encoding;

/// <summary>
/// An ExpandedNodeId (Part 3 §8.3, Part 6 §5.2.2.10): a NodeId that may name its namespace by URI
/// instead of by index, and may point to another server. Text form <c>nsu=URI;s=Reactor1</c>.
/// </summary>
public sealed record ExpandedNodeId(NodeId NodeId, string? NamespaceUri = null, uint ServerIndex = 0)
{
    public static ExpandedNodeId Null { get; } = new(NodeId.Null);

    /// <summary>True when the namespace is given by URI (the index is then to be ignored).</summary>
    public bool HasNamespaceUri => !string.IsNullOrEmpty(NamespaceUri);

    /// <summary>Parses <c>nsu=URI;s=...</c> or any NodeId text form.</summary>
    public static ExpandedNodeId Parse(string text) => NodeIdText.ParseExpanded(text);

    public override string ToString()
    {
        var prefix = ServerIndex != 0 ? $"svr={ServerIndex};" : string.Empty;
        return HasNamespaceUri ? $"{prefix}nsu={NamespaceUri};{NodeId.IdentifierText}" : prefix + NodeId;
    }
}

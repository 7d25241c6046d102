using SoftSensor.OpcUa.Encoding;

namespace SoftSensor.OpcUa.Session;

/// <summary>
/// The server's NamespaceArray (Server_NamespaceArray, i=2255; Part 5 §6.3.1): index → URI.
/// Read again on every connect, since a server may renumber its namespaces (Part 4 §6.7).
/// </summary>
public sealed class NamespaceTable(IReadOnlyList<string> uris)
{
    public IReadOnlyList<string> Uris { get; } = uris;

    /// <summary>The index of a namespace URI, or null when the server does not have it.</summary>
    public ushort? IndexOf(string uri)
    {
        for (int i = 0; i < Uris.Count && i <= ushort.MaxValue; i++)
        {
            if (string.Equals(Uris[i], uri, StringComparison.Ordinal))
            {
                return (ushort)i;
            }
        }

        return null;
    }

    /// <summary>The URI of an index, or null when out of range.</summary>
    public string? UriOf(ushort index) => index < Uris.Count ? Uris[index] : null;

    /// <summary>Turns an <c>nsu=</c> id into a NodeId with this server's index; null when the URI is unknown.</summary>
    public NodeId? Resolve(ExpandedNodeId id)
    {
        if (!id.HasNamespaceUri)
        {
            return id.NodeId;
        }

        if (IndexOf(id.NamespaceUri!) is not { } index)
        {
            return null;
        }

        var n = id.NodeId;
        return n.IdType switch
        {
            NodeIdType.Numeric => NodeId.Numeric(index, n.NumericId),
            NodeIdType.String => NodeId.String(index, n.StringId!),
            NodeIdType.Guid => NodeId.FromGuid(index, n.GuidId),
            _ => NodeId.Opaque(index, n.OpaqueId),
        };
    }

    /// <summary>The <c>nsu=URI;...</c> form of a NodeId (ns 0 stays as is).</summary>
    public ExpandedNodeId ToExpanded(NodeId id) =>
        id.NamespaceIndex == 0 || UriOf(id.NamespaceIndex) is not { } uri
            ? new ExpandedNodeId(id)
            : new ExpandedNodeId(id, uri);

    /// <summary>A NodeId from a browse result: resolved from its URI or taken with its index.</summary>
    public NodeId? Local(ExpandedNodeId id) => id.ServerIndex != 0 ? null : Resolve(id);
}

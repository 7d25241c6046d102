using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>One child node as listed for an engineer building a tag map.</summary>
public sealed record BrowsedNode(string BrowseName, ExpandedNodeId NodeId, NodeClass NodeClass, string? DataType, DataValue? Value);

/// <summary>
/// Lists the children of a node with, for variables, their data type and current value (Browse,
/// then one Read of Value and DataType for all variables, then one Read of the BrowseName of the
/// data types that are not built-in; Part 4 §5.8.2, §5.10.2).
/// </summary>
public static class NodeBrowser
{
    public static async Task<IReadOnlyList<BrowsedNode>> ListChildrenAsync(UaSession session, NodeId parent, CancellationToken cancellationToken)
    {
        var references = await session.BrowseAsync(parent, cancellationToken);
        var variables = references.Where(r => r.NodeClass == NodeClass.Variable && session.Namespaces.Local(r.NodeId) is not null).ToList();
        var reads = variables.SelectMany(v => new[] { new ReadValueId(session.Namespaces.Local(v.NodeId)!), new ReadValueId(session.Namespaces.Local(v.NodeId)!, AttributeIds.DataType) }).ToList();
        var values = reads.Count == 0 ? [] : await session.ReadAsync(reads, cancellationToken);
        var typeNames = await DataTypeNamesAsync(session, values.Where((_, i) => i % 2 == 1).Select(v => v.Value.Value as NodeId), cancellationToken);

        var list = new List<BrowsedNode>(references.Count);
        foreach (var r in references)
        {
            int index = variables.IndexOf(r);
            DataValue? value = index >= 0 ? values[2 * index] : null;
            string? type = index >= 0 && values[(2 * index) + 1].Value.Value is NodeId t ? typeNames.GetValueOrDefault(t, t.ToString()) : null;
            var id = r.NodeId.HasNamespaceUri ? r.NodeId : session.Namespaces.ToExpanded(r.NodeId.NodeId);
            list.Add(new BrowsedNode(r.BrowseName.Name ?? string.Empty, id, r.NodeClass, type, value));
        }

        return list;
    }

    private static async Task<Dictionary<NodeId, string>> DataTypeNamesAsync(UaSession session, IEnumerable<NodeId?> types, CancellationToken cancellationToken)
    {
        var names = new Dictionary<NodeId, string>();
        var unknown = new List<NodeId>();
        foreach (var t in types.OfType<NodeId>().Distinct())
        {
            if (t.NamespaceIndex == 0 && t.IdType == NodeIdType.Numeric && t.NumericId is >= 1 and <= 25)
            {
                names[t] = ((BuiltInType)t.NumericId).ToString();
            }
            else
            {
                unknown.Add(t);
            }
        }

        if (unknown.Count > 0)
        {
            var read = await session.ReadAsync([.. unknown.Select(t => new ReadValueId(t, AttributeIds.BrowseName))], cancellationToken);
            for (int i = 0; i < unknown.Count; i++)
            {
                if (read[i].Value.Value is QualifiedName q && q.Name is not null)
                {
                    names[unknown[i]] = q.Name;
                }
            }
        }

        return names;
    }
}

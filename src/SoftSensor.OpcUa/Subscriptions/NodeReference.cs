using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Session;

namespace SoftSensor.OpcUa.Subscriptions;

/// <summary>
/// A node as configured: an id with its namespace URI (<c>nsu=...;s=...</c>, or any NodeId text)
/// or a browse path from the root (<c>Objects/Reactor1/OffgasO2</c>). Resolved to the server's
/// NodeId on every connect, since namespace indexes can change between sessions (Part 4 §6.7).
/// </summary>
public sealed record NodeReference(string Text)
{
    /// <summary>True when the text is a node id rather than a browse path.</summary>
    public bool IsNodeId => Text.StartsWith("nsu=", StringComparison.Ordinal) || Text.StartsWith("ns=", StringComparison.Ordinal)
        || Text.StartsWith("svr=", StringComparison.Ordinal) || (Text.Length > 2 && Text[1] == '=' && "isgb".Contains(Text[0], StringComparison.Ordinal));

    /// <summary>Checks the text's form without a server; null when fine, else the reason.</summary>
    public string? Validate()
    {
        if (string.IsNullOrWhiteSpace(Text))
        {
            return "empty; expected nsu=URI;s=Id or a browse path such as Objects/Reactor1/OffgasO2";
        }

        if (!IsNodeId)
        {
            return Text.Contains('/', StringComparison.Ordinal) ? null : $"'{Text}' is neither a node id (nsu=URI;s=Id) nor a browse path (Objects/...)";
        }

        try
        {
            ExpandedNodeId.Parse(Text);
            return null;
        }
        catch (FormatException e)
        {
            return e.Message;
        }
    }

    /// <summary>The server's NodeId, or why there is none (unknown namespace URI, no such path).</summary>
    public async Task<PathResolution> ResolveAsync(UaSession session, CancellationToken cancellationToken)
    {
        if (!IsNodeId)
        {
            return await BrowsePathResolver.ResolveAsync(session, Text, cancellationToken);
        }

        var id = ExpandedNodeId.Parse(Text);
        return session.Namespaces.Resolve(id) is { } node
            ? PathResolution.Found(Text, node)
            : PathResolution.Failed(Text, $"the server has no namespace '{id.NamespaceUri}'");
    }
}

using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>
/// Resolves a slash-separated path of browse names from the root, such as
/// <c>Objects/Reactor1/OffgasO2</c>, to a NodeId. Each step may name the namespace
/// (<c>2:Reactor1</c>) or not (then the name must be unique among the children). The names are
/// qualified by browsing level by level, then the whole path is confirmed with
/// TranslateBrowsePathsToNodeIds (Part 4 §5.8.4). Everyday failures are results.
/// </summary>
public static class BrowsePathResolver
{
    /// <summary>The node of a path, or the reason it has none.</summary>
    public static async Task<PathResolution> ResolveAsync(UaSession session, string path, CancellationToken cancellationToken)
    {
        var steps = path.Split('/', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
        if (steps.Length == 0)
        {
            return PathResolution.Failed(path, "the path is empty; expected browse names separated by '/', e.g. Objects/Reactor1/OffgasO2");
        }

        var current = WellKnownNodes.RootFolder;
        var qualified = new List<RelativePathElement>(steps.Length);
        foreach (string step in steps)
        {
            var (ns, name) = SplitStep(step);
            var children = await session.BrowseAsync(current, cancellationToken);
            var matches = children.Where(c => string.Equals(c.BrowseName.Name, name, StringComparison.Ordinal) && (ns is null || c.BrowseName.NamespaceIndex == ns)).ToList();
            if (matches.Count == 0)
            {
                return PathResolution.Failed(path, $"no child '{step}' under {current}");
            }

            if (matches.Count > 1)
            {
                return PathResolution.Failed(path, $"'{step}' is ambiguous under {current} ({matches.Count} children); write it as index:name");
            }

            if (session.Namespaces.Local(matches[0].NodeId) is not { } next)
            {
                return PathResolution.Failed(path, $"'{step}' points to another server ({matches[0].NodeId})");
            }

            qualified.Add(new RelativePathElement(matches[0].BrowseName));
            current = next;
        }

        var confirmed = (await session.TranslateAsync([new BrowsePath(WellKnownNodes.RootFolder, qualified)], cancellationToken))[0];
        if (confirmed.Status.IsBad || confirmed.Targets.Length == 0)
        {
            return PathResolution.Failed(path, $"the server does not confirm the path ({confirmed.Status})");
        }

        return PathResolution.Found(path, session.Namespaces.Local(confirmed.Targets[0].TargetId) ?? current);
    }

    private static (ushort? Namespace, string Name) SplitStep(string step)
    {
        int colon = step.IndexOf(':', StringComparison.Ordinal);
        if (colon > 0 && ushort.TryParse(step.AsSpan(0, colon), System.Globalization.NumberStyles.None, System.Globalization.CultureInfo.InvariantCulture, out var ns))
        {
            return (ns, step[(colon + 1)..]);
        }

        return (null, step);
    }
}

/// <summary>The outcome of resolving a browse path: the node, or why there is none.</summary>
public sealed record PathResolution(string Path, NodeId? Node, string? Error)
{
    public bool IsFound => Node is not null;

    public static PathResolution Found(string path, NodeId node) => new(path, node, null);

    public static PathResolution Failed(string path, string error) => new(path, null, error);
}

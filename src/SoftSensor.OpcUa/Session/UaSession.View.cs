using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>View services: Browse, BrowseNext and TranslateBrowsePathsToNodeIds (Part 4 §5.8).</summary>
public sealed partial class UaSession
{
    /// <summary>
    /// All forward hierarchical references of a node, following continuation points with
    /// BrowseNext until the server has given everything (Part 4 §5.8.3).
    /// </summary>
    public async Task<IReadOnlyList<ReferenceDescription>> BrowseAsync(NodeId node, CancellationToken cancellationToken, uint maxReferencesPerRequest = 0)
    {
        var request = new BrowseRequest { RequestedMaxReferencesPerNode = maxReferencesPerRequest, NodesToBrowse = [new BrowseDescription(node)] };
        var result = CheckCount((await CallAsync<BrowseResponse>(request, cancellationToken)).Results, 1, "Browse")[0];
        var all = new List<ReferenceDescription>();
        while (true)
        {
            if (result.Status.IsBad)
            {
                throw new ServiceResultException(result.Status, $"Browse of {node} failed");
            }

            all.AddRange(result.References);
            if (result.ContinuationPoint is not { Length: > 0 } continuation)
            {
                return all;
            }

            var next = new BrowseNextRequest { ContinuationPoints = [continuation] };
            result = CheckCount((await CallAsync<BrowseResponse>(next, cancellationToken)).Results, 1, "BrowseNext")[0];
        }
    }

    /// <summary>Translates browse paths to node ids; one result per path (Part 4 §5.8.4).</summary>
    public async Task<BrowsePathResult[]> TranslateAsync(IReadOnlyList<BrowsePath> paths, CancellationToken cancellationToken)
    {
        var response = await CallAsync<TranslateBrowsePathsResponse>(new TranslateBrowsePathsRequest { BrowsePaths = paths }, cancellationToken);
        return CheckCount(response.Results, paths.Count, "TranslateBrowsePathsToNodeIds");
    }
}

using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Services;

namespace SoftSensor.OpcUa.Session;

/// <summary>Attribute services: Read and Write (Part 4 §5.10).</summary>
public sealed partial class UaSession
{
    /// <summary>Reads attributes; one DataValue per item, in order (each with its own status).</summary>
    public async Task<DataValue[]> ReadAsync(IReadOnlyList<ReadValueId> items, CancellationToken cancellationToken)
    {
        var response = await CallAsync<ReadResponse>(new ReadRequest { NodesToRead = items }, cancellationToken);
        return CheckCount(response.Results, items.Count, "Read");
    }

    /// <summary>Reads the Value attribute of one node.</summary>
    public async Task<DataValue> ReadValueAsync(NodeId node, CancellationToken cancellationToken) =>
        (await ReadAsync([new ReadValueId(node)], cancellationToken))[0];

    /// <summary>Writes attributes; one StatusCode per item, in order.</summary>
    public async Task<StatusCode[]> WriteAsync(IReadOnlyList<WriteValue> items, CancellationToken cancellationToken)
    {
        var response = await CallAsync<WriteResponse>(new WriteRequest { NodesToWrite = items }, cancellationToken);
        return CheckCount(response.Results, items.Count, "Write");
    }

    private async Task<NamespaceTable> ReadNamespacesAsync(CancellationToken cancellationToken)
    {
        var value = await ReadValueAsync(WellKnownNodes.NamespaceArray, cancellationToken);
        if (value.Status.IsBad || value.Value.Value is not string?[] uris)
        {
            throw new ServiceResultException(value.Status.IsBad ? value.Status : new StatusCode(StatusCodes.BadTypeMismatch), "The server's NamespaceArray (i=2255) could not be read as String[]");
        }

        return new NamespaceTable([.. uris.Select(u => u ?? string.Empty)]);
    }

    private static T[] CheckCount<T>(T[] results, int expected, string service) =>
        results.Length == expected
            ? results
            : throw new ServiceResultException(new StatusCode(StatusCodes.BadUnknownResponse), $"{service} returned {results.Length} results for {expected} items");
}

using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Subscriptions;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;
using StatusCodes = SoftSensor.OpcUa.Encoding.StatusCodes;

namespace SoftSensor.Daemon.OpcUa;

/// <summary>
/// Writes the configured estimates of each frame to OPC UA nodes for the HMI: the value as Double,
/// its quality as the StatusCode (Part 8 §7.3.2, the code the cycle chose) and the frame's source
/// time as the source timestamp. While the link is down the writes fail fast (BadNotConnected),
/// are counted and skipped: the next frame after the reconnect replaces the values.
/// </summary>
internal sealed class OpcUaEstimateSink(IOptions<OpcUaOptions> options, OpcUaWriteBackLink link, DaemonMetrics metrics, ILogger<OpcUaEstimateSink> logger) : IEstimateSink
{
    public string Name => "opcua";

    public async ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken)
    {
        if (link.Client is not { } client || !options.Value.WriteBack.TryGetValue(frame.Reactor, out var map) || map.Count == 0)
        {
            return;
        }

        var items = new List<(NodeReference Node, DataValue Value)>();
        var names = new List<string>();
        foreach (var v in frame.Values)
        {
            if (map.TryGetValue(v.Name, out var node))
            {
                items.Add((new NodeReference(node), ToDataValue(v, frame.SourceTime)));
                names.Add(v.Name);
            }
        }

        if (items.Count == 0)
        {
            return;
        }

        using var cts = CancellationTokenSource.CreateLinkedTokenSource(cancellationToken);
        cts.CancelAfter(TimeSpan.FromSeconds(5));
        StatusCode[] results;
        try
        {
            results = await client.WriteAsync(items, cts.Token);
        }
        catch (OperationCanceledException) when (!cancellationToken.IsCancellationRequested)
        {
            results = [.. items.Select(_ => new StatusCode(StatusCodes.BadTimeout))];
        }

        for (int i = 0; i < results.Length; i++)
        {
            if (results[i].IsBad)
            {
                metrics.PublishFailures.Add(1);
                OpcUaLog.WriteFailed(logger, frame.Reactor, names[i], items[i].Node.Text, results[i].ToString());
            }
        }
    }

    /// <summary>An estimate as a DataValue: NaN is written as no value with its Bad status.</summary>
    public static DataValue ToDataValue(EstimateValue v, DateTimeOffset sourceTime) => new()
    {
        Value = double.IsFinite(v.Value) ? Variant.From(v.Value) : Variant.Null,
        Status = new StatusCode(v.StatusCode != 0 || v.Quality == SampleQuality.Good ? v.StatusCode : v.Quality == SampleQuality.Uncertain ? StatusCodes.Uncertain : StatusCodes.Bad),
        SourceTimestamp = sourceTime.UtcDateTime,
    };
}

using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Sources;
using SoftSensor.OpcUa.Services;
using SoftSensor.OpcUa.Subscriptions;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.OpcUa;

/// <summary>
/// The OPC UA tags of one reactor: one monitored item per tag on a supervised client (which
/// reconnects by itself), each data change scaled to the role's unit and written as a sample with
/// the quality of its status code (Part 4 §7.39) and the code kept. A change without a numeric
/// value (a Bad status alone) is counted and dropped: the tag then goes stale in the signal store.
/// Items use the trigger StatusValueTimestamp (Part 4 §7.22.2), so a reading the server refreshes
/// with an unchanged value still arrives and keeps the tag fresh. The link itself (time-outs,
/// keep-alive, back-off) runs on real time, like the MQTT link, even when the process clock is
/// scaled (demo) or stepped (tests); <paramref name="time"/> stamps a change that has no timestamp.
/// </summary>
internal sealed class OpcUaSampleSource(string reactor, OpcUaOptions options, IReadOnlyList<TagBinding> bindings, DaemonMetrics metrics, TimeProvider time, ILogger logger) : ISampleSource
{
    private readonly KeyValuePair<string, object?> reactorTag = new("reactor", reactor);

    public string Name => "opcua";

    public async Task RunAsync(ISampleIntake samples, CancellationToken cancellationToken)
    {
        var item = new MonitoredItemSettings
        {
            SamplingInterval = options.SamplingInterval,
            QueueSize = options.QueueSize,
            DeadbandType = options.AbsoluteDeadband > 0 ? DeadbandType.Absolute : DeadbandType.None,
            DeadbandValue = options.AbsoluteDeadband,
            Trigger = DataChangeTrigger.StatusValueTimestamp,
        };
        var nodes = bindings.Select((b, i) => new MonitoredNode(i, new NodeReference(b.OpcUaNode), item)).ToList();
        var client = OpcUaClientFactory.Create(options, nodes, (change, _) => OnChange(change, samples), TimeProvider.System, logger);
        await client.RunAsync(cancellationToken);
    }

    private ValueTask OnChange(ItemChange change, ISampleIntake samples)
    {
        var b = bindings[change.Handle];
        var dv = change.Value;
        double raw = dv.Value.AsDouble() ?? double.NaN;
        double value = b.ToRoleUnit(raw);
        if (!double.IsFinite(value))
        {
            metrics.SamplesRejected.Add(1, reactorTag);
            OpcUaLog.NoValue(logger, b.Tag, b.OpcUaNode, dv.Status.ToString());
            return ValueTask.CompletedTask;
        }

        var stamp = dv.SourceTimestamp != DateTime.MinValue ? dv.SourceTimestamp
            : dv.ServerTimestamp != DateTime.MinValue ? dv.ServerTimestamp
            : time.GetUtcNow().UtcDateTime;
        var sample = new Sample(b.Tag, value, new DateTimeOffset(stamp, TimeSpan.Zero), SampleQualities.FromStatusCode(dv.Status.Code), dv.Status.Code);
        samples.Take(sample);
        return ValueTask.CompletedTask;
    }
}

/// <summary>
/// Makes an <see cref="OpcUaSampleSource"/> for every reactor with OPC UA tags. A tag with an
/// <c>opcUaNode</c> and no <c>opcUa:endpoint</c> is refused by the validator at start, so an empty
/// endpoint here means the reactor has no OPC UA tags.
/// </summary>
internal sealed class OpcUaSampleSourceFactory(IOptions<OpcUaOptions> options, DaemonMetrics metrics, TimeProvider time, ILogger<OpcUaSampleSource> logger) : ISampleSourceFactory
{
    public ISampleSource? Create(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings)
    {
        var opcua = bindings.Where(b => b.OpcUaNode.Length > 0).ToList();
        return opcua.Count == 0 || options.Value.Endpoint.Length == 0 ? null : new OpcUaSampleSource(reactor.Id, options.Value, opcua, metrics, time, logger);
    }
}

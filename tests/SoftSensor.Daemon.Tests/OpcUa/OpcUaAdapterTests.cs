using System.Diagnostics.Metrics;
using System.Threading.Channels;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Options;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.OpcUa;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Status;
using SoftSensor.OpcUa.Encoding;
using SoftSensor.OpcUa.Session;
using SoftSensor.OpcUa.Tests.Peers;
using SoftSensor.Daemon.Contracts;
using StatusCodes = SoftSensor.OpcUa.Encoding.StatusCodes;

namespace SoftSensor.Daemon.Tests.OpcUa;

/// <summary>The daemon's OPC UA source and write-back sink against a real node-opcua server (tests/peers).</summary>
public sealed class OpcUaAdapterTests(OpcUaPeerFixture peer) : IClassFixture<OpcUaPeerFixture>, IDisposable
{
    private const string Ns = "nsu=" + OpcUaPeerServer.NamespaceUri + ";";
    private readonly OpcUaPeerServer server = peer.Server;
    private readonly ServiceProvider services = new ServiceCollection().AddMetrics().BuildServiceProvider();

    public void Dispose() => services.Dispose();

    [Fact]
    public async Task RunAsync_TagsByNodeIdAndBrowsePath_WriteScaledGoodSamples()
    {
        using var metrics = new DaemonMetrics(services.GetRequiredService<IMeterFactory>());
        var options = new OpcUaOptions { Endpoint = server.EndpointUrl, PublishingInterval = TimeSpan.FromMilliseconds(200), SamplingInterval = TimeSpan.FromMilliseconds(100) };
        // O2 in % with an invented scale of 0.01 to show scaling; air flow by browse path, unscaled.
        var bindings = new[]
        {
            new TagBinding("qi101", SignalRole.OutletO2Percent, "%", 0.01, 0, TimeSpan.FromMinutes(1), TimeSpan.Zero, "", new PayloadOptions(), Ns + "s=Reactor1.OffgasO2"),
            new TagBinding("fi101", SignalRole.AirFlowNlPerMin, "NL/min", 1, 0, TimeSpan.FromMinutes(1), TimeSpan.Zero, "", new PayloadOptions(), "Objects/Reactor1/AirFlow"),
        };
        var source = new OpcUaSampleSourceFactory(Options.Create(options), metrics, TimeProvider.System, NullLogger<OpcUaSampleSource>.Instance)
            .Create(new ReactorOptions { Id = "r1" }, bindings);
        Assert.NotNull(source);
        var channel = Channel.CreateBounded<Sample>(1000);
        using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        var run = source.RunAsync(new ChannelIntake(channel.Writer), cts.Token);

        var seen = new Dictionary<string, Sample>();
        while (seen.Count < 2)
        {
            var s = await channel.Reader.ReadAsync(cts.Token);
            seen[s.Tag] = s;
        }

        await cts.CancelAsync();
        await run.WaitAsync(TimeSpan.FromSeconds(10));
        Assert.InRange(seen["qi101"].Value, 0.198, 0.206); // peer: 20.2 ± 0.3 %
        Assert.InRange(seen["fi101"].Value, 9.4, 10.6);    // peer: 10 ± 0.5 NL/min
        Assert.All(seen.Values, s => Assert.Equal(SampleQuality.Good, s.Quality));
        Assert.All(seen.Values, s => Assert.Equal(0u, s.StatusCode));
    }

    [Fact]
    public async Task WriteAsync_FrameWithConfiguredEstimates_WritesValueStatusAndSourceTime()
    {
        using var metrics = new DaemonMetrics(services.GetRequiredService<IMeterFactory>());
        var options = Options.Create(new OpcUaOptions
        {
            Endpoint = server.EndpointUrl,
            WriteBack = new() { ["r1"] = new() { [EstimateNames.Our] = Ns + "s=Reactor1.Estimates.OUR", [EstimateNames.Rq] = "Objects/Reactor1/Estimates/RQ" } },
        });
        var link = new OpcUaWriteBackLink(options, NullLogger<OpcUaWriteBackLink>.Instance);
        var sink = new OpcUaEstimateSink(options, link, metrics, NullLogger<OpcUaEstimateSink>.Instance);
        using var cts = new CancellationTokenSource();
        await link.StartAsync(cts.Token);
        var deadline = DateTime.UtcNow.AddSeconds(15);
        while (link.Client!.CurrentSession is null && DateTime.UtcNow < deadline)
        {
            await Task.Delay(50);
        }

        var stamp = new DateTimeOffset(2026, 12, 1, 9, 30, 0, TimeSpan.Zero);
        var frame = new EstimateFrame("r1", "b1", stamp, SampleQuality.Uncertain,
        [
            new EstimateValue(EstimateNames.Our, 42.5, "mmol/(L·h)", 1.0, SampleQuality.Good, 0),
            new EstimateValue(EstimateNames.Rq, 1.02, "", 0.05, SampleQuality.Uncertain, SoftSensor.OpcUa.Encoding.StatusCodes.UncertainSubNormal),
            new EstimateValue(EstimateNames.Cer, 43.4, "mmol/(L·h)", 1.0, SampleQuality.Good, 0),
        ]);
        await sink.WriteAsync(frame, CancellationToken.None);
        await link.StopAsync(CancellationToken.None);

        await using var check = await UaConnection.OpenAsync(new SessionOptions { EndpointUrl = server.EndpointUrl }, TimeProvider.System, NullLogger.Instance, CancellationToken.None);
        var our = await check.Session.ReadValueAsync(check.Session.Namespaces.Resolve(ExpandedNodeId.Parse(Ns + "s=Reactor1.Estimates.OUR"))!, CancellationToken.None);
        var rq = await check.Session.ReadValueAsync(check.Session.Namespaces.Resolve(ExpandedNodeId.Parse(Ns + "s=Reactor1.Estimates.RQ"))!, CancellationToken.None);
        Assert.Equal(42.5, our.Value.AsDouble());
        Assert.True(our.Status.IsGood);
        Assert.Equal(stamp.UtcDateTime, our.SourceTimestamp);
        Assert.Equal(1.02, rq.Value.AsDouble());
        Assert.Equal(SoftSensor.OpcUa.Encoding.StatusCodes.UncertainSubNormal, rq.Status.Code); // Part 8 §7.3.2
    }

    /// <summary>Hands what the source takes in to a channel the test reads.</summary>
    private sealed class ChannelIntake(ChannelWriter<Sample> writer) : SoftSensor.Daemon.Sources.ISampleIntake
    {
        public bool Take(in Sample sample) => writer.TryWrite(sample);
    }
}

/// <summary>One node-opcua peer shared by the adapter tests.</summary>
public sealed class OpcUaPeerFixture : IAsyncLifetime
{
    public OpcUaPeerServer Server { get; } = new();

    public Task InitializeAsync() => Server.StartAsync(CancellationToken.None);

    public Task DisposeAsync() => Server.StopAsync();
}

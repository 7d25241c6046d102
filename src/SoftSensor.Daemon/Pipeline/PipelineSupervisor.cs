using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Pipeline;

/// <summary>Builds one <see cref="ReactorPipeline"/> per configured reactor and runs them all until the host stops.</summary>
internal sealed class PipelineSupervisor : BackgroundService
{
    private readonly IReadOnlyList<ReactorPipeline> _pipelines;

    public PipelineSupervisor(
        IOptions<SoftSensorOptions> options,
        IReactorCycleFactory cycles,
        IEnumerable<ISampleSourceFactory> sourceFactories,
        FrameDispatcher dispatcher,
        StatusBoard board,
        ICheckpointStore checkpoints,
        DaemonMetrics metrics,
        TimeProvider time,
        ILogger<PipelineSupervisor> logger,
        Batches.BatchBook? batches = null,
        Samples.SampleBook? samples = null)
    {
        var o = options.Value;
        var services = new PipelineServices(time, dispatcher, board, checkpoints, metrics, logger, o.Store.CheckpointEveryCycles) { Batches = batches, Samples = samples };
        var factories = sourceFactories.ToList();
        _pipelines = o.Reactors.Select(r =>
        {
            var bindings = TagBinding.FromOptions(r);
            var sources = factories.Select(f => f.Create(r, bindings)).OfType<Sources.ISampleSource>().ToList();
            return new ReactorPipeline(r, bindings, cycles.Create(r, TagBinding.Process(bindings)), sources, services);
        }).ToList();
    }

    /// <summary>The pipelines, in configuration order.</summary>
    public IReadOnlyList<ReactorPipeline> Pipelines => _pipelines;

    protected override Task ExecuteAsync(CancellationToken stoppingToken) =>
        Task.WhenAll(_pipelines.Select(p => p.RunAsync(stoppingToken)));
}

using System.Diagnostics.Metrics;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Status;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Pipeline;

/// <summary>
/// The first reactor of the shipped config/demo.json with its estimator, fed in-process by the virtual
/// reactor of config/scenarios/glycerol.json (invented demo data) on a fake clock: what the pipeline
/// tests of the estimator, the batches and the operator inputs share.
/// </summary>
internal sealed class DemoEstimatorRig : IDisposable
{
    /// <summary>The demo reactor's cycle period.</summary>
    public static readonly TimeSpan Period = TimeSpan.FromSeconds(10);

    private readonly ServiceProvider _sp = new ServiceCollection().AddMetrics().BuildServiceProvider();

    /// <param name="adjust">Changes the reactor's options before its tags are bound (e.g. a shorter history).</param>
    public DemoEstimatorRig(Action<ReactorOptions>? adjust = null)
    {
        Metrics = new DaemonMetrics(_sp.GetRequiredService<IMeterFactory>());
        string config = DemoFiles.Find(DemoFiles.Config) ?? throw new FileNotFoundException(DemoFiles.Config);
        var o = new SoftSensorOptions();
        new ConfigurationBuilder().AddJsonFile(config).Build().Bind(o);
        Reactor = o.Reactors[0];
        adjust?.Invoke(Reactor);
        Bindings = TagBinding.FromOptions(Reactor);
        var scenario = ScenarioLoader.Load(DemoFiles.Find(DemoFiles.Scenario) ?? throw new FileNotFoundException(DemoFiles.Scenario));
        Sim = VirtualReactor.Create(scenario, scenario.Seed);
        Time = new FakeTimeProvider(Sim.Time);
        Factory = new ReactorCycleFactory(new ConfigLocation(Path.GetDirectoryName(config)!));
    }

    public DaemonMetrics Metrics { get; }

    public ReactorOptions Reactor { get; }

    public IReadOnlyList<TagBinding> Bindings { get; }

    public VirtualReactor Sim { get; }

    public FakeTimeProvider Time { get; }

    public ReactorCycleFactory Factory { get; }

    /// <summary>Services with no sinks; add batches or operator inputs with <c>with { ... }</c>.</summary>
    public PipelineServices Services(ICheckpointStore? checkpoints = null, int checkpointEveryCycles = 1_000_000) =>
        new(Time, new FrameDispatcher([], Metrics, Time, NullLogger<FrameDispatcher>.Instance), new StatusBoard(), checkpoints, Metrics,
            NullLogger.Instance, checkpointEveryCycles);

    /// <summary>A pipeline of the demo reactor with a new cycle from <see cref="Factory"/>.</summary>
    public (ReactorPipeline Pipeline, IReactorCycle Cycle) NewPipeline(PipelineServices services)
    {
        var cycle = Factory.Create(Reactor, Bindings);
        return (new ReactorPipeline(Reactor, Bindings, cycle, [], services), cycle);
    }

    /// <summary>Steps the simulator one cycle period, hands its mapped tags to every pipeline (the same inputs each), and moves the clock.</summary>
    public void Step(params ReactorPipeline[] pipelines)
    {
        Sim.Step(Period);
        foreach (var (name, value) in Sim.ReadTags())
        {
            if (Reactor.Tags.ContainsKey(name))
            {
                foreach (var p in pipelines)
                {
                    p.Accept(new Sample(name, value, Sim.Time, SampleQuality.Good, 0));
                }
            }
        }

        Time.SetUtcNow(Sim.Time);
    }

    public void Dispose()
    {
        Metrics.Dispose();
        _sp.Dispose();
    }
}

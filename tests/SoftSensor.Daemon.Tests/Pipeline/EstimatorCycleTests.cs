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

namespace SoftSensor.Daemon.Tests.Pipeline;

/// <summary>
/// The estimator cycle in the in-process pipeline on a fake clock, fed the virtual reactor's tags
/// (config/scenarios/glycerol.json, invented demo data) through the shipped config/demo.json.
/// </summary>
public sealed class EstimatorCycleTests : IDisposable
{
    private static readonly TimeSpan Period = TimeSpan.FromSeconds(10);
    private readonly ServiceProvider _sp = new ServiceCollection().AddMetrics().BuildServiceProvider();
    private readonly DaemonMetrics _metrics;
    private readonly ReactorOptions _reactor;
    private readonly IReadOnlyList<TagBinding> _bindings;
    private readonly VirtualReactor _sim;
    private readonly FakeTimeProvider _time;
    private readonly ReactorCycleFactory _factory;

    public EstimatorCycleTests()
    {
        _metrics = new DaemonMetrics(_sp.GetRequiredService<IMeterFactory>());
        string config = DemoFiles.Find(DemoFiles.Config) ?? throw new FileNotFoundException(DemoFiles.Config);
        var o = new SoftSensorOptions();
        new ConfigurationBuilder().AddJsonFile(config).Build().Bind(o);
        _reactor = o.Reactors[0];
        _bindings = TagBinding.FromOptions(_reactor);
        var scenario = ScenarioLoader.Load(DemoFiles.Find(DemoFiles.Scenario) ?? throw new FileNotFoundException(DemoFiles.Scenario));
        _sim = VirtualReactor.Create(scenario, scenario.Seed);
        _time = new FakeTimeProvider(_sim.Time);
        _factory = new ReactorCycleFactory(new ConfigLocation(Path.GetDirectoryName(config)!));
    }

    public void Dispose()
    {
        _metrics.Dispose();
        _sp.Dispose();
    }

    private (ReactorPipeline Pipeline, IReactorCycle Cycle) NewPipeline()
    {
        var cycle = _factory.Create(_reactor, _bindings);
        var dispatcher = new FrameDispatcher([], _metrics, _time, NullLogger<FrameDispatcher>.Instance);
        var services = new PipelineServices(_time, dispatcher, new StatusBoard(), null, _metrics, NullLogger.Instance, 1_000_000);
        return (new ReactorPipeline(_reactor, _bindings, cycle, [], services), cycle);
    }

    /// <summary>Steps the simulator one cycle period, hands its tags to every pipeline, and moves the clock.</summary>
    private void Step(params ReactorPipeline[] pipelines)
    {
        _sim.Step(Period);
        var tags = _sim.ReadTags();
        foreach (var (name, value) in tags)
        {
            if (_reactor.Tags.ContainsKey(name))
            {
                foreach (var p in pipelines)
                {
                    p.Accept(new Sample(name, value, _sim.Time, SampleQuality.Good, 0));
                }
            }
        }

        _time.SetUtcNow(_sim.Time);
    }

    private static EstimateValue Value(EstimateFrame f, string name) => f.Values.Single(v => v.Name == name);

    [Fact]
    public void Create_reactor_with_model_file_gets_the_estimator_cycle_and_without_one_the_off_gas_cycle()
    {
        Assert.IsType<EstimatorCycle>(_factory.Create(_reactor, _bindings));
        var offGas = new ReactorOptions { Id = "r1", Gas = _reactor.Gas, Tags = _reactor.Tags };
        Assert.IsType<OffGasCycle>(_factory.Create(offGas, _bindings));
    }

    [Fact]
    public void Create_missing_model_file_names_the_reactor_and_the_key()
    {
        var bad = new ReactorOptions { Id = "r9", ModelFile = "no-such-model.json", Gas = _reactor.Gas, Tags = _reactor.Tags };
        var e = Assert.Throws<InvalidOperationException>(() => _factory.Create(bad, _bindings));
        Assert.Contains("reactor 'r9' modelFile is 'no-such-model.json'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_bad_estimator_setting_names_the_reactor_key_and_the_field()
    {
        var o = new SoftSensorOptions();
        o.Reactors.Add(_reactor);
        _reactor.Estimator = _reactor.Estimator with { InitialVolumeL = -1 };
        var result = new SoftSensorOptionsValidator().Validate(null, o);
        Assert.True(result.Failed);
        Assert.Contains("reactors:0:estimator/balance: InitialVolumeL is -1", result.FailureMessage, StringComparison.Ordinal);
    }

    [Fact]
    public async Task RunCycle_simulated_tags_give_good_biomass_and_mu_near_the_simulator_truth()
    {
        var (pipeline, _) = NewPipeline();
        EstimateFrame? frame = null;
        for (int i = 0; i < 180; i++)
        {
            Step(pipeline);
            frame = await pipeline.RunCycleAsync(default);
        }

        var truth = _sim.Truth();
        var x = Value(frame!, EstimateNames.BiomassGPerL);
        var mu = Value(frame!, EstimateNames.MuPerH);
        Assert.Equal(SampleQuality.Good, x.Quality);
        Assert.Equal(SampleQuality.Good, mu.Quality);
        Assert.Equal(0u, x.StatusCode);
        Assert.Equal("g/L", x.Unit);
        Assert.True(x.Sigma > 0);

        // Checked against the simulator's own state (invented demo scenario; the estimator never sees it):
        // after 30 min the integrated biomass and the smoothed mu must track it.
        Assert.InRange(x.Value, truth.BiomassGPerL * 0.8, truth.BiomassGPerL * 1.2);
        Assert.InRange(mu.Value, truth.MuPerH * 0.7, truth.MuPerH * 1.3);
        Assert.Equal(x.Value * Value(frame!, EstimateNames.LiquidVolumeL).Value, Value(frame!, EstimateNames.BiomassG).Value, 1e-9);
        foreach (var name in new[] { EstimateNames.Our, EstimateNames.Cer, EstimateNames.Rq, EstimateNames.OutletFlow, EstimateNames.MuRawPerH, EstimateNames.ConsistencyH, EstimateNames.ConsistencyCritical, EstimateNames.FeedAdvisoryLPerH, EstimateNames.FeedCapLPerH })
        {
            Assert.True(double.IsFinite(Value(frame!, name).Value), name);
        }
    }

    [Fact]
    public async Task RunCycle_before_any_input_is_bad_waiting_for_initial_data()
    {
        var (pipeline, _) = NewPipeline();
        var frame = await pipeline.RunCycleAsync(default);
        Assert.Equal(SampleQuality.Bad, Value(frame, EstimateNames.Our).Quality);
        Assert.Equal(0x80320000u, Value(frame, EstimateNames.Our).StatusCode); // BadWaitingForInitialData (OPC UA Part 8 §7.3.2)
    }

    [Fact]
    public async Task RestoreState_saved_state_in_a_new_cycle_continues_identically()
    {
        var (a, cycleA) = NewPipeline();
        var (b, cycleB) = NewPipeline();
        for (int i = 0; i < 90; i++)
        {
            Step(a, b);
            await a.RunCycleAsync(default);
        }

        cycleB.RestoreState(cycleA.SaveState()!);
        for (int i = 0; i < 30; i++)
        {
            Step(a, b);
            var fa = await a.RunCycleAsync(default);
            var fb = await b.RunCycleAsync(default);
            Assert.Equal(fa.Values.Count, fb.Values.Count);
            for (int k = 0; k < fa.Values.Count; k++)
            {
                var (va, vb) = (fa.Values[k], fb.Values[k]);
                Assert.Equal(va.Name, vb.Name);
                Assert.Equal(va.Quality, vb.Quality);
                Assert.Equal(va.StatusCode, vb.StatusCode);
                Assert.True(Same(va.Value, vb.Value), $"{va.Name}: {va.Value} vs {vb.Value}");
                Assert.True(Same(va.Sigma, vb.Sigma), $"{va.Name} sigma: {va.Sigma} vs {vb.Sigma}");
            }
        }
    }

    private static bool Same(double a, double b) => (double.IsNaN(a) && double.IsNaN(b)) || Math.Abs(a - b) <= 1e-9 * Math.Max(1, Math.Abs(a));
}

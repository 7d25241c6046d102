using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Pipeline;

/// <summary>
/// The estimator cycle in the in-process pipeline on a fake clock, fed the virtual reactor's tags
/// (config/scenarios/glycerol.json, invented demo data) through the shipped config/demo.json.
/// </summary>
public sealed class EstimatorCycleTests : IDisposable
{
    private readonly DemoEstimatorRig _rig = new();

    public void Dispose() => _rig.Dispose();

    private (ReactorPipeline Pipeline, IReactorCycle Cycle) NewPipeline() => _rig.NewPipeline(_rig.Services());

    private void Step(params ReactorPipeline[] pipelines) => _rig.Step(pipelines);

    private static EstimateValue Value(EstimateFrame f, string name) => f.Values.Single(v => v.Name == name);

    [Fact]
    public void Create_reactor_with_model_file_gets_the_estimator_cycle_and_without_one_the_off_gas_cycle()
    {
        Assert.IsType<EstimatorCycle>(_rig.Factory.Create(_rig.Reactor, _rig.Bindings));
        var offGas = new ReactorOptions { Id = "r1", Gas = _rig.Reactor.Gas, Tags = _rig.Reactor.Tags };
        Assert.IsType<OffGasCycle>(_rig.Factory.Create(offGas, _rig.Bindings));
    }

    [Fact]
    public void Create_missing_model_file_names_the_reactor_and_the_key()
    {
        var bad = new ReactorOptions { Id = "r9", ModelFile = "no-such-model.json", Gas = _rig.Reactor.Gas, Tags = _rig.Reactor.Tags };
        var e = Assert.Throws<InvalidOperationException>(() => _rig.Factory.Create(bad, _rig.Bindings));
        Assert.Contains("reactor 'r9' modelFile is 'no-such-model.json'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_bad_estimator_setting_names_the_reactor_key_and_the_field()
    {
        var o = new SoftSensorOptions();
        o.Reactors.Add(_rig.Reactor);
        _rig.Reactor.Estimator = _rig.Reactor.Estimator with { InitialVolumeL = -1 };
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

        var truth = _rig.Sim.Truth();
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

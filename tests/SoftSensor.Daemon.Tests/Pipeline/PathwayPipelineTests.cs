using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;
using SoftSensor.Daemon.Pipeline;

namespace SoftSensor.Daemon.Tests.Pipeline;

/// <summary>
/// The pathway model in the daemon's pipeline: the demo reactor of config/demo.json (invented demo
/// data) naming config/models/glycerol-bacterium.json, fed by the virtual reactor on a fake clock.
/// The estimates are in every frame (the frames the sinks store and publish), and the tracked energy
/// parameters survive a restart from a checkpoint.
/// </summary>
public sealed class PathwayPipelineTests : IDisposable
{
    private readonly DemoEstimatorRig _rig = new(r => r.PathwayModelFile = "models/glycerol-bacterium.json");

    public void Dispose() => _rig.Dispose();

    [Fact]
    public async Task Frames_carry_the_pathway_estimates_and_a_restored_state_continues_identically()
    {
        var (a, cycleA) = _rig.NewPipeline(_rig.Services());
        var (b, cycleB) = _rig.NewPipeline(_rig.Services());
        EstimateFrame? fa = null;
        for (int i = 0; i < 90; i++)
        {
            _rig.Step(a, b);
            fa = await a.RunCycleAsync(default);
        }

        foreach (var name in new[] { EstimateNames.PathwayMuPerH, EstimateNames.PathwayOur, EstimateNames.PathwayCer, EstimateNames.PathwayStatistic, EstimateNames.PathwayCritical, EstimateNames.PoRatio, EstimateNames.MaintenanceAtp })
        {
            var v = fa!.Values.Single(x => x.Name == name);
            Assert.True(double.IsFinite(v.Value), name);
        }

        Assert.Equal(2.0, fa!.Values.Single(x => x.Name == EstimateNames.PoRatio).Value, 1e-9); // batch phase: OUR basis, P/O held at the model's value

        cycleB.RestoreState(cycleA.SaveState()!);
        for (int i = 0; i < 20; i++)
        {
            _rig.Step(a, b);
            var x = await a.RunCycleAsync(default);
            var y = await b.RunCycleAsync(default);
            Assert.Equal(x.Values.Count, y.Values.Count);
            for (int k = 0; k < x.Values.Count; k++)
            {
                Assert.Equal(x.Values[k].Name, y.Values[k].Name);
                Assert.True(Same(x.Values[k].Value, y.Values[k].Value), $"{x.Values[k].Name}: {x.Values[k].Value} vs {y.Values[k].Value}");
            }
        }
    }

    [Fact]
    public void Create_missing_pathway_model_or_heat_roles_names_the_reactor_and_the_key()
    {
        var bad = _rig.Reactor;
        bad.PathwayModelFile = "no-such-network.json";
        var e = Assert.Throws<InvalidOperationException>(() => _rig.Factory.Create(bad, _rig.Bindings));
        Assert.Contains("reactor 'r1' pathwayModelFile is 'no-such-network.json'", e.Message, StringComparison.Ordinal);
        bad.PathwayModelFile = "";
        bad.Heat = new Core.Estimation.HeatBalanceSettings();
        e = Assert.Throws<InvalidOperationException>(() => _rig.Factory.Create(bad, _rig.Bindings));
        Assert.Contains("reactor 'r1' heat is set; expected tags with the roles CoolantFlowLPerH", e.Message, StringComparison.Ordinal);
    }

    private static bool Same(double a, double b) => (double.IsNaN(a) && double.IsNaN(b)) || Math.Abs(a - b) <= 1e-9 * Math.Max(1, Math.Abs(a));
}

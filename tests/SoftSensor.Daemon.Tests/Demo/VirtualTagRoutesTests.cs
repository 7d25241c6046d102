using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Demo;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Demo;

/// <summary>
/// <c>demo --config</c>: each tag of another definition is fed the virtual reactor's signal of its role,
/// in the tag's own plant unit (the inverse of its scale and offset). Scenario: the shipped glycerol demo (invented data).
/// </summary>
public sealed class VirtualTagRoutesTests
{
    private static readonly VirtualReactor Reactor = VirtualReactor.Create(ScenarioLoader.Load(Path.Combine(Fixtures.RepositoryRoot.Path, "config", "scenarios", "glycerol.json")), 42);

    private static int Index(SignalRole role) => Reactor.Tags.Select((t, i) => (t, i)).First(x => x.t.Role == role).i;

    [Fact]
    public void A_gauge_pressure_tag_in_bar_gets_the_absolute_kPa_signal_back_in_bar_gauge()
    {
        // bar(g) → kPa absolute: value = raw × 100 + 101.325 (1 bar = 100 kPa exactly; standard atmosphere 101.325 kPa).
        var (routes, unfed) = VirtualTagRoutes.For([new("PI-101", "PressureKPa", "plant/pi101", 100, 101.325)], Reactor);
        Assert.Empty(unfed);
        Span<double> readings = stackalloc double[ReactorTags.Count];
        Reactor.ReadTags(readings);
        double kPa = readings[Index(SignalRole.PressureKPa)];
        Assert.Equal((kPa - 101.325) / 100, routes[0].Raw(readings), 12);
        Assert.Equal(kPa, (routes[0].Raw(readings) * 100) + 101.325, 9);
    }

    [Fact]
    public void A_volume_tag_is_fed_from_the_load_cell_through_the_scenario_broth_density_and_unknown_roles_are_named()
    {
        var (routes, unfed) = VirtualTagRoutes.For(
        [
            new("LI-1", "LiquidVolumeL", "plant/li1", 1, 0),
            new("TI-9", "AnalyserTemperatureC", "plant/ti9", 1, 0),
            new("OPC", "OutletO2Percent", "", 1, 0),
        ], Reactor);
        Span<double> readings = stackalloc double[ReactorTags.Count];
        Reactor.ReadTags(readings);
        Assert.Equal(readings[Index(SignalRole.WeightKg)] / Reactor.Scenario.Vessel.BrothDensityKgPerL, Assert.Single(routes).Raw(readings), 12);
        Assert.Equal(["TI-9 (role AnalyserTemperatureC: the virtual reactor has no such signal)", "OPC (not an MQTT tag)"], unfed);
    }
}

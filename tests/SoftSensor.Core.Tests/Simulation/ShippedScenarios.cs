using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Core.Tests.Simulation;

/// <summary>Loads the scenarios shipped in config/scenarios (found by walking up to SoftSensor.sln).</summary>
internal static class ShippedScenarios
{
    private static readonly Lazy<string> Root = new(() =>
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SoftSensor.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("SoftSensor.sln not found above " + AppContext.BaseDirectory);
    });

    public static string PathOf(string name) => Path.Combine(Root.Value, "config", "scenarios", name + ".json");

    public static Scenario Load(string name) => ScenarioLoader.Load(PathOf(name));
}

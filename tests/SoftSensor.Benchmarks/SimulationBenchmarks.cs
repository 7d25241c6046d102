using BenchmarkDotNet.Attributes;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Benchmarks;

/// <summary>The virtual reactor: one simulated day of the shipped scenarios, tags read every 10 s as the simulate verb does.</summary>
[MemoryDiagnoser]
public class SimulationBenchmarks
{
    private Scenario _glycerol = null!;
    private Scenario _yeast = null!;
    private readonly double[] _tags = new double[ReactorTags.Count];

    [GlobalSetup]
    public void Setup()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SoftSensor.sln")))
        {
            dir = dir.Parent;
        }

        string root = dir?.FullName ?? throw new InvalidOperationException("SoftSensor.sln not found above " + AppContext.BaseDirectory);
        _glycerol = ScenarioLoader.Load(Path.Combine(root, "config", "scenarios", "glycerol.json"));
        _yeast = ScenarioLoader.Load(Path.Combine(root, "config", "scenarios", "yeast.json"));
    }

    [Benchmark]
    public double Glycerol24h() => Day(_glycerol);

    [Benchmark]
    public double Yeast24h() => Day(_yeast);

    private double Day(Scenario s)
    {
        var r = VirtualReactor.Create(s, 1);
        var step = TimeSpan.FromSeconds(10);
        for (int i = 0; i < 8640; i++)
        {
            r.Step(step);
            r.ReadTags(_tags);
        }

        return _tags[0];
    }
}

using System.Globalization;
using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.Core.Estimation;
using SoftSensor.Daemon.Replay;
using SoftSensor.Simulation.Output;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Replay;

/// <summary>The tests that share one simulation of the glycerol scenario.</summary>
[CollectionDefinition(Name)]
public sealed class GlycerolReplayCollection : ICollectionFixture<GlycerolReplayFixture>
{
    public const string Name = "glycerol replay";
}

/// <summary>
/// Simulates the shipped glycerol scenario (24 h, seed 42) once, with and without an injected
/// +5 % CO2-analyser offset from 14 h to 20 h, into a temporary folder shared by the replay tests.
/// </summary>
public sealed class GlycerolReplayFixture : IDisposable
{
    public const int Seed = 42;
    public const double FaultFromH = 14, FaultToH = 20;

    public GlycerolReplayFixture()
    {
        Root = FindRoot();
        Dir = Directory.CreateTempSubdirectory("softsensor-replay-").FullName;
        var scenario = ScenarioLoader.Load(Path.Combine(Root, "config", "scenarios", "glycerol.json"));
        CleanDir = Path.Combine(Dir, "clean");
        FaultDir = Path.Combine(Dir, "co2-offset");
        Directory.CreateDirectory(CleanDir);
        Directory.CreateDirectory(FaultDir);
        SimulationRun.Run(scenario, Seed, 24, CleanDir);
        var faulty = scenario with
        {
            Faults = [new FaultSpec { Kind = "analyser_offset", Gas = "co2", RelativePercent = 5, FromH = FaultFromH, ToH = FaultToH }],
        };
        SimulationRun.Run(faulty, Seed, 24, FaultDir);
        ConfigPath = Path.Combine(Root, "config", "replay-glycerol.json");
        Start = scenario.StartTime;
    }

    public string Root { get; }
    public string Dir { get; }
    public string CleanDir { get; }
    public string FaultDir { get; }
    public string ConfigPath { get; }
    public DateTimeOffset Start { get; }

    /// <summary>Replays a folder's history.csv with its offline.csv through the shipped configuration.</summary>
    internal ReplayResult Replay(string dir, ReplayOptions? options = null, EstimatesCsvWriter? estimates = null, Func<CycleSettings, CycleSettings>? adapt = null)
    {
        Assert.True(ReplayConfigLoader.TryLoad(ConfigPath, out var config, out var cycle, out var error), error);
        if (adapt is not null)
        {
            var model = Core.Stoichiometry.ModelReader.Parse(File.ReadAllText(Path.Combine(Root, "config", config!.Model)));
            cycle = new Cycle(model, adapt(cycle!.Settings));
        }

        var samples = new List<ScheduledSample>();
        Assert.True(OfflineSampleFile.TryRead(Path.Combine(dir, "offline.csv"), config!.Offline!, samples, [], out var e2), e2);
        using var history = File.OpenRead(Path.Combine(dir, "history.csv"));
        var runner = new ReplayRunner(cycle!, NullLogger.Instance);
        return runner.Run("history.csv", history, config.History, samples, estimates, new ReplaySeries(config.ReportPoints),
            options ?? new ReplayOptions(), CancellationToken.None);
    }

    /// <summary>truth.csv of a folder: time (h since start) with biomass and mu.</summary>
    public static (double[] H, double[] Biomass, double[] Mu) Truth(string dir, DateTimeOffset start)
    {
        var lines = File.ReadAllLines(Path.Combine(dir, "truth.csv"));
        var head = lines[0].Split(',');
        int ti = Array.IndexOf(head, "time"), xi = Array.IndexOf(head, "biomass_g_per_l"), mi = Array.IndexOf(head, "mu_per_h");
        var rows = lines.Skip(1).Select(l => l.Split(',')).ToArray();
        return (
            rows.Select(r => (DateTimeOffset.Parse(r[ti], CultureInfo.InvariantCulture) - start).TotalHours).ToArray(),
            rows.Select(r => double.Parse(r[xi], CultureInfo.InvariantCulture)).ToArray(),
            rows.Select(r => double.Parse(r[mi], CultureInfo.InvariantCulture)).ToArray());
    }

    /// <summary>Linear interpolation of a truth column at <paramref name="h"/>.</summary>
    public static double At(double[] hs, double[] ys, double h)
    {
        int i = Array.BinarySearch(hs, h);
        if (i >= 0)
        {
            return ys[i];
        }

        i = ~i;
        if (i == 0 || i >= hs.Length)
        {
            return double.NaN;
        }

        double f = (h - hs[i - 1]) / (hs[i] - hs[i - 1]);
        return ys[i - 1] + (f * (ys[i] - ys[i - 1]));
    }

    public void Dispose()
    {
        try
        {
            Directory.Delete(Dir, recursive: true);
        }
        catch (IOException)
        {
            // A temporary folder left behind is harmless.
        }
    }

    private static string FindRoot()
    {
        var d = new DirectoryInfo(AppContext.BaseDirectory);
        while (d is not null && !File.Exists(Path.Combine(d.FullName, "SoftSensor.sln")))
        {
            d = d.Parent;
        }

        return d?.FullName ?? throw new InvalidOperationException("repository root not found");
    }
}

using BenchmarkDotNet.Attributes;
using Microsoft.Extensions.Logging.Abstractions;
using SoftSensor.Daemon.Replay;
using SoftSensor.Simulation.Output;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Benchmarks.Cycle;

/// <summary>
/// The whole replay from CSV: parse each row of the simulator's 24 h glycerol history (8,641 rows,
/// 13 tags), align for the analyser dead time, run the cycle, format the estimates.csv row (to a
/// null stream, so the disk is not measured) and keep the report series. Rows per second =
/// rows / mean time. Run: dotnet run -c Release --project tests/SoftSensor.Benchmarks -- --filter '*ReplayBenchmarks*'
/// </summary>
[MemoryDiagnoser]
[InProcess]
public class ReplayBenchmarks
{
    private byte[] _history = [];
    private ReplayConfig _config = null!;
    private List<ScheduledSample> _samples = [];

    [GlobalSetup]
    public void Setup()
    {
        string root = GlycerolCycleFixture.RepoRoot();
        string dir = Directory.CreateTempSubdirectory("softsensor-bench-").FullName;
        SimulationRun.Run(ScenarioLoader.Load(Path.Combine(root, "config", "scenarios", "glycerol.json")), 42, 24, dir);
        _history = File.ReadAllBytes(Path.Combine(dir, "history.csv"));
        if (!ReplayConfigLoader.TryLoad(Path.Combine(root, "config", "replay-glycerol.json"), out var config, out _, out var error))
        {
            throw new InvalidOperationException(error);
        }

        _config = config!;
        OfflineSampleFile.TryRead(Path.Combine(dir, "offline.csv"), _config.Offline!, _samples, [], out _);
        Directory.Delete(dir, recursive: true);
    }

    /// <summary>Rows in the history file (the benchmark's unit of work).</summary>
    public int Rows => _history.Count(b => b == (byte)'\n') - 1;

    [Benchmark]
    public long ReplayGlycerolDay()
    {
        ReplayConfigLoader.TryLoad(Path.Combine(GlycerolCycleFixture.RepoRoot(), "config", "replay-glycerol.json"), out _, out var cycle, out _);
        using var input = new MemoryStream(_history, writable: false);
        using var sink = new StreamWriter(Stream.Null);
        using var estimates = new EstimatesCsvWriter(sink);
        var result = new ReplayRunner(cycle!, NullLogger.Instance).Run("history.csv", input, _config.History, _samples, estimates,
            new ReplaySeries(_config.ReportPoints), new ReplayOptions(), CancellationToken.None);
        return result.Cycles;
    }
}

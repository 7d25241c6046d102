using System.Text;
using SoftSensor.Daemon.Replay;
using SoftSensor.Simulation.Output;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Benchmarks.Cycle;

/// <summary>
/// An in-memory historian export of about 100,000 rows for the replay benchmarks: the simulator's
/// 24 h glycerol history (seed 42, 8,641 rows of 13 tags at 10 s) written 12 times one after the
/// other with the timestamps running on (103,692 rows, about 10 MB). Each repeat starts the culture
/// again, so the estimator sees a new batch every day: throughput data, not a process.
/// </summary>
internal sealed class ReplayHistory
{
    private ReplayHistory(byte[] csv, int rows, ReplayConfig config, List<ScheduledSample> samples)
    {
        Csv = csv;
        Rows = rows;
        Config = config;
        Samples = samples;
    }

    public byte[] Csv { get; }

    public int Rows { get; }

    public ReplayConfig Config { get; }

    public List<ScheduledSample> Samples { get; }

    public static string ConfigPath => Path.Combine(GlycerolCycleFixture.RepoRoot(), "config", "replay-glycerol.json");

    public static ReplayHistory Create(int repeats = 12)
    {
        string root = GlycerolCycleFixture.RepoRoot();
        string dir = Directory.CreateTempSubdirectory("softsensor-bench-").FullName;
        try
        {
            SimulationRun.Run(ScenarioLoader.Load(Path.Combine(root, "config", "scenarios", "glycerol.json")), 42, 24, dir);
            string[] lines = File.ReadAllLines(Path.Combine(dir, "history.csv"));
            if (!ReplayConfigLoader.TryLoad(ConfigPath, out var config, out _, out var error))
            {
                throw new InvalidOperationException(error);
            }

            var samples = new List<ScheduledSample>();
            OfflineSampleFile.TryRead(Path.Combine(dir, "offline.csv"), config!.Offline!, samples, [], out _);
            var start = DateTimeOffset.Parse(lines[1].AsSpan(0, lines[1].IndexOf(',', StringComparison.Ordinal)), System.Globalization.CultureInfo.InvariantCulture);
            var text = new StringBuilder(lines[0]).Append('\n');
            int rows = 0;
            for (int k = 0; k < repeats; k++)
            {
                for (int i = 1; i < lines.Length; i++)
                {
                    var t = start.AddSeconds(10.0 * rows++);
                    text.Append(t.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", System.Globalization.CultureInfo.InvariantCulture))
                        .Append(lines[i].AsSpan(lines[i].IndexOf(',', StringComparison.Ordinal))).Append('\n');
                }
            }

            return new ReplayHistory(Encoding.UTF8.GetBytes(text.ToString()), rows, config, samples);
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }
}

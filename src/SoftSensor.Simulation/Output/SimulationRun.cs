using System.Text;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Simulation.Output;

/// <summary>
/// Runs a scenario to the end and writes what a historian would hold (history.csv: timestamp and
/// one column per tag), what really happened (truth.csv) and the offline assays (offline.csv).
/// </summary>
public static class SimulationRun
{
    /// <summary>Runs <paramref name="scenario"/> for <paramref name="hours"/> (null: the scenario's duration) into <paramref name="outDir"/>.</summary>
    public static SimulationSummary Run(Scenario scenario, int seed, double? hours, string outDir, CancellationToken cancellationToken = default)
    {
        double duration = hours ?? scenario.DurationH;
        Directory.CreateDirectory(outDir);
        string historyPath = Path.Combine(outDir, "history.csv");
        string truthPath = Path.Combine(outDir, "truth.csv");
        string offlinePath = Path.Combine(outDir, "offline.csv");
        var reactor = VirtualReactor.Create(scenario, seed);
        var interval = TimeSpan.FromSeconds(scenario.OutputIntervalS);
        long rows = (long)Math.Floor((duration * 3600.0 / scenario.OutputIntervalS) + 1e-9) + 1;
        var tagValues = new double[reactor.Tags.Count];
        double maxOur = 0, maxCer = 0;
        ReactorTruth last;
        using (var history = new StreamWriter(historyPath, false, new UTF8Encoding(false)))
        using (var truth = new StreamWriter(truthPath, false, new UTF8Encoding(false)))
        {
            history.WriteLine("timestamp," + string.Join(',', reactor.Tags.Select(t => t.Name)));
            truth.WriteLine(TruthCsv.Header(scenario));
            var sb = new StringBuilder(512);
            last = reactor.Truth();
            for (long i = 0; i < rows; i++)
            {
                cancellationToken.ThrowIfCancellationRequested();
                if (i > 0)
                {
                    reactor.Step(interval);
                    last = reactor.Truth();
                }

                reactor.ReadTags(tagValues);
                sb.Clear().Append(CsvFormat.Time(reactor.Time));
                foreach (double v in tagValues)
                {
                    sb.Append(',').Append(CsvFormat.Tag(v));
                }

                history.WriteLine(sb);
                truth.WriteLine(TruthCsv.Row(last, sb.Clear()));
                maxOur = Math.Max(maxOur, last.OurMmolPerLh);
                maxCer = Math.Max(maxCer, last.CerMmolPerLh);
            }
        }

        OfflineCsv.Write(offlinePath, reactor.OfflineSamples);
        return new SimulationSummary(
            scenario.Name, seed, reactor.ElapsedH, (int)rows, last.BiomassGPerL, last.VolumeL, maxOur, maxCer,
            last.CarbonRecovery, reactor.OfflineSamples.Count, historyPath, truthPath, offlinePath);
    }
}

using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Estimation;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Demo;
using SoftSensor.Daemon.Mqtt;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Samples;
using SoftSensor.Daemon.Status;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Simulation;
using SoftSensor.Simulation.Scenarios;

namespace SoftSensor.Daemon.Tests.Samples;

/// <summary>
/// The running daemon with the full estimator (config/demo.json, the virtual glycerol reactor, invented demo
/// data) against a real mosquitto on a fake process clock: a batch started over MQTT, the simulator's tags
/// published over MQTT as a plant gateway would, a dry-weight sample dated in the past entered over MQTT.
/// </summary>
public sealed class OfflineSampleEndToEndTests(MosquittoFixture broker, Xunit.Abstractions.ITestOutputHelper output) : IClassFixture<MosquittoFixture>
{
    private static readonly TimeSpan Wait = EstimatorDaemonRig.Wait;

    [Fact]
    public async Task DcwSample_dated_in_the_past_pulls_biomass_by_the_Kalman_gain_and_the_corrected_trajectory_is_stored_beside_the_history()
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-offline-e2e-").FullName;
        try
        {
            await RunAsync(Path.Combine(dir, "store.db"));
        }
        finally
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            Directory.Delete(dir, recursive: true);
        }
    }

    private async Task RunAsync(string storePath)
    {
        await using var rig = new EstimatorDaemonRig(broker.Port, "offline-e2e", storePath);
        await rig.StartAsync();
        var (daemon, client, board, commands, scenario) = (rig.Daemon, rig.Client, rig.Daemon.Get<StatusBoard>(), rig.Commands, rig.Scenario);

        // Batch start over MQTT with the initial conditions (inoculum 0.3 ± 0.05 g/L in 30 L, invented demo values).
        await client.PublishAsync(commands + "/batch", """{"command":"start","batchId":"gly-e2e-1","initialVolumeL":30,"inoculumBiomassGPerL":0.3,"inoculumBiomassSigmaGPerL":0.05,"initialSubstrateGPerL":15}""");
        await client.WaitForAsync((t, p) => t == commands + "/batch/result" && p.Contains("\"applied\":true", StringComparison.Ordinal), Wait, "batch started");

        // 90 cycles of 10 s (15 min of the batch), each after the simulator's tags of that instant reached the daemon.
        double truthAt600 = double.NaN;
        for (int n = 1; n <= 90; n++)
        {
            await rig.CycleAsync();
            if (n == 60)
            {
                truthAt600 = rig.Sim.Truth().BiomassGPerL;
            }
        }

        // The assay of the broth taken 5 min 5 s ago reads 0.2 g/L above the simulator's truth (invented), sigma 0.05 g/L.
        var t0 = scenario.StartTime;
        var sampledAt = t0.AddSeconds(605);
        double y = truthAt600 + 0.2, sigma = 0.05;
        client.Clear();
        await client.PublishAsync(commands + "/sample", string.Create(CultureInfo.InvariantCulture,
            $$"""{"kind":"dcw","sampledAt":"{{sampledAt.UtcDateTime:yyyy-MM-ddTHH:mm:ssZ}}","valueGPerL":{{y:R}},"sigmaGPerL":{{sigma:R}},"operator":"e2e"}"""));
        var (_, entered) = await client.WaitForAsync((t, p) => t == commands + "/sample/result" && p.Contains("\"outcome\":\"pending\"", StringComparison.Ordinal), Wait, "sample stored as pending");
        long id = JsonDocument.Parse(entered).RootElement.GetProperty("sample").GetProperty("id").GetInt64();

        // The next cycle applies it on the cycle task.
        await rig.CycleAsync();
        await client.WaitForAsync((t, p) => t == commands + "/sample/result" && p.Contains("\"outcome\":\"applied\"", StringComparison.Ordinal), Wait, "sample applied");

        // Prior X- and P at the sampling time from the stored history: the frame of the newest cycle at or before it
        // (cycle 60, its inputs of t0 + 600 s), value and standard uncertainty as published.
        var store = daemon.Get<SqliteStore>();
        var history = await store.QueryEstimatesAsync("r1", EstimateNames.BiomassGPerL, t0.AddSeconds(590), sampledAt, 10, default);
        var prior = history[^1];
        Assert.Equal(t0.AddSeconds(600), prior.Time);
        double xPrior = prior.Value, p0 = prior.Sigma * prior.Sigma, r = sigma * sigma;

        // Scalar Kalman update (Kalman 1960, J. Basic Eng. 82, 35-45; Simon 2006, Optimal State Estimation, ch. 5,
        // the discrete-time filter with H = 1; from memory): K = P/(P+R), X+ = X- + K (y - X-), P+ = (1 - K) P.
        double k = p0 / (p0 + r);
        double xPosterior = xPrior + (k * (y - xPrior));
        output.WriteLine(string.Create(CultureInfo.InvariantCulture, $"prior X- = {xPrior:G6} g/L, sigma {prior.Sigma:G4}; y = {y:G6} ± {sigma} g/L; K = {k:G4}; X+ = {xPosterior:G6} g/L"));
        Assert.InRange(k, 0.01, 0.99); // both uncertainties matter: the gain is neither 0 nor 1

        var book = daemon.Get<SampleBook>();
        var trajectory = book.Trajectory("r1", id);
        Assert.Equal(t0.AddSeconds(600), trajectory[0].Time);
        Assert.Equal("gly-e2e-1", trajectory[0].Batch);
        // Tolerance 1e-9 g/L: the same double arithmetic, only rounding of the stored sigma (sqrt(P)·V / V) differs.
        Assert.Equal(xPosterior, trajectory[0].BiomassGPerL, 1e-9);
        Assert.Equal(Math.Sqrt((1 - k) * p0), trajectory[0].BiomassSigmaGPerL, 1e-9);
        Assert.Equal(31, trajectory.Count); // cycles 60..90 re-propagated
        var record = book.Get(id)!;
        Assert.Equal(SampleOutcomes.Applied, record.Outcome);
        Assert.Equal(xPrior, record.PriorGPerL!.Value, 1e-12);

        // The stored history is unchanged; the estimate published after the update moved toward the assay.
        var again = await store.QueryEstimatesAsync("r1", EstimateNames.BiomassGPerL, t0.AddSeconds(600), t0.AddSeconds(600), 10, default);
        Assert.Equal(xPrior, Assert.Single(again).Value);
        var before = (await store.QueryEstimatesAsync("r1", EstimateNames.BiomassGPerL, t0.AddSeconds(900), t0.AddSeconds(900), 10, default))[0].Value;
        Assert.Equal(before + (k * (y - xPrior)), trajectory[^1].BiomassGPerL, Math.Abs(k * (y - xPrior)) * 0.05); // the correction carried forward (growth re-run on the corrected state)
        await Until(() => board.Get("r1")?.Frame?.Values.First(v => v.Name == EstimateNames.BiomassGPerL).Value is { } now && Math.Abs(now - before) > 0.5 * Math.Abs(k * (y - xPrior)), "published estimate corrected");

        // The checkpoint written with the update holds the corrected state.
        var checkpoint = (await store.LatestCheckpointAsync("r1", default))!;
        Assert.True(EstimatorStateCodec.TryDecode(SoftSensor.Daemon.Pipeline.CheckpointCompression.Unpack(checkpoint.State), out var state, out var error), error);
        int at = state!.History.IndexAtOrBefore(t0.AddSeconds(600).UtcTicks);
        Assert.Equal(xPosterior, state.History[at].States.BiomassG / state.History[at].Inputs.VolumeL, 1e-9);

        // The status API serves the corrected trajectory and the trend carries it beside the published biomass.
        using var http = new HttpClient { BaseAddress = new Uri(daemon.StatusAddress) };
        using var corrected = JsonDocument.Parse(await http.GetStringAsync(new Uri($"/api/corrected/r1/{id}", UriKind.Relative)));
        Assert.Equal(xPosterior, corrected.RootElement[0].GetProperty("biomassGPerL").GetDouble(), 1e-9);
        using var trends = JsonDocument.Parse(await http.GetStringAsync(new Uri("/api/trends?reactor=r1", UriKind.Relative)));
        Assert.Equal(31, trends.RootElement.GetProperty("correctedBiomass").GetProperty("t").GetArrayLength());

        // As a browser shows it: the biomass trend carries the corrected trajectory as its own (dashed) line.
        string dom = await HeadlessChromium.DumpDomAsync(daemon.StatusAddress + "/");
        Assert.Contains("class=\"corrected\"", dom, StringComparison.Ordinal);
        Assert.Contains("dashed: corrected by offline samples", dom, StringComparison.Ordinal);
    }

    private static Task Until(Func<bool> condition, string what) => EstimatorDaemonRig.Until(condition, what);
}

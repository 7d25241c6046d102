using System.Globalization;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Samples;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Fixtures;

namespace SoftSensor.Daemon.Tests.Samples;

/// <summary>
/// Nothing entered is lost on a restart (real mosquitto, the virtual glycerol reactor over MQTT, fake clock):
/// a sample with a withdrawal, entered for a time the estimator has not reached, waits in the store through
/// a daemon restart and is applied once a cycle reaches it; a substrate assay is recorded at once.
/// </summary>
public sealed class OfflineSampleRestartTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>
{
    [Fact]
    public async Task Pending_sample_with_withdrawal_survives_a_restart_and_is_applied_when_reached()
    {
        string dir = Directory.CreateTempSubdirectory("softsensor-offline-restart-").FullName;
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
        await using var rig = new EstimatorDaemonRig(broker.Port, "offline-restart", storePath);
        await rig.StartAsync();
        await rig.Client.PublishAsync(rig.Commands + "/batch", """{"command":"start","batchId":"gly-rs-1","initialVolumeL":30,"inoculumBiomassGPerL":0.3,"inoculumBiomassSigmaGPerL":0.05,"initialSubstrateGPerL":15}""");
        await rig.Client.WaitForAsync((t, p) => t == rig.Commands + "/batch/result" && p.Contains("\"applied\":true", StringComparison.Ordinal), EstimatorDaemonRig.Wait, "batch started");
        for (int n = 0; n < 12; n++)
        {
            await rig.CycleAsync();
        }

        // Sampled 2 min after the estimator's last cycle (inside the daemon's 5 min clock tolerance): it must wait.
        var sampledAt = rig.Sim.Time.AddMinutes(2);
        string at = sampledAt.UtcDateTime.ToString("yyyy-MM-ddTHH:mm:ssZ", CultureInfo.InvariantCulture);
        rig.Client.Clear();
        await rig.Client.PublishAsync(rig.Commands + "/sample", $$"""{"kind":"dcw","sampledAt":"{{at}}","valueGPerL":0.5,"sigmaGPerL":0.05,"withdrawnMl":300}""");
        await rig.Client.PublishAsync(rig.Commands + "/sample", $$"""{"kind":"substrate","sampledAt":"{{at}}","valueGPerL":14.1,"sigmaGPerL":0.3,"analyte":"glycerol"}""");
        await rig.Client.WaitForAsync((t, p) => t.EndsWith("/sample/result", StringComparison.Ordinal) && p.Contains("\"outcome\":\"recorded\"", StringComparison.Ordinal), EstimatorDaemonRig.Wait, "assay recorded");
        var book = rig.Daemon.Get<SampleBook>();
        await EstimatorDaemonRig.Until(() => book.List("r1").Count == 2, "both inputs stored");
        long id = book.List("r1").Single(s => s.Kind == "dcw").Id;
        await rig.CycleAsync();
        Assert.Equal(SampleOutcomes.Pending, book.Get(id)!.Outcome);

        await rig.StopAsync();
        await rig.StartAsync();
        book = rig.Daemon.Get<SampleBook>();
        Assert.Equal(id, Assert.Single(book.Pending("r1")).Id);
        for (int n = 0; n < 14 && book.Get(id)!.Outcome == SampleOutcomes.Pending; n++)
        {
            await rig.CycleAsync();
        }

        var applied = book.Get(id)!;
        Assert.Equal(SampleOutcomes.Applied, applied.Outcome);
        Assert.Equal("gly-rs-1", applied.Batch);
        Assert.Contains("300 mL withdrawn taken out", applied.Detail, StringComparison.Ordinal);
        Assert.True(applied.AppliedAtCycle <= sampledAt && applied.AppliedAtCycle > sampledAt - EstimatorDaemonRig.Period);

        // The withdrawal came first: the simulator's level did not drop (its operator took nothing), so with the
        // measured volume the balance now holds the biomass of 300 mL less broth at the same volume, X·(1 - f) with
        // f = ΔV/(V + ΔV) (docs/methods.md §4; the growth of that one 10 s step is below the 1e-4 tolerance).
        var store = rig.Daemon.Get<SqliteStore>();
        var cycle = applied.AppliedAtCycle!.Value;
        var published = Assert.Single(await store.QueryEstimatesAsync("r1", EstimateNames.BiomassGPerL, cycle, cycle, 10, default));
        double v = Assert.Single(await store.QueryEstimatesAsync("r1", EstimateNames.LiquidVolumeL, cycle, cycle, 10, default)).Value;
        double f = 0.3 / (v + 0.3);
        Assert.Equal(published.Value * (1 - f), applied.PriorGPerL!.Value, published.Value * 1e-4);
        Assert.NotEqual(published.Value, applied.PriorGPerL.Value);
        Assert.Equal(applied.PosteriorGPerL!.Value, book.Trajectory("r1", id)[0].BiomassGPerL, 1e-12);
        Assert.InRange(applied.PosteriorGPerL.Value, Math.Min(applied.PriorGPerL.Value, 0.5), Math.Max(applied.PriorGPerL.Value, 0.5));
    }
}

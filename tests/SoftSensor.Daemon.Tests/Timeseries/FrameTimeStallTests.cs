using System.Globalization;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Tests.Fixtures;
using SoftSensor.Daemon.Tests.Integration;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>
/// The stalls that used to give many frames one timestamp (a frame took its newest input's time):
/// inputs that stop arriving, and a broker outage. A real daemon reads a real mosquitto and writes
/// a real VictoriaMetrics (no deduplication, so two frames at one time would show); every frame must
/// have its own time, after the one before, in the store and in the database. Time-scaled: at a 0.2 s
/// cycle a 3 s stall is 15 cycles and a 2 s outage 10 cycles, as many or more cycles than the plant
/// report's 90 s stall and 20 s outage at a 10 s cycle, and longer than the tags' 1 s maximum age.
/// </summary>
public sealed class FrameTimeStallTests(MosquittoFixture broker) : IClassFixture<MosquittoFixture>, IAsyncLifetime
{
    private readonly VictoriaMetricsServer _vm = new(dedup: false);

    public Task InitializeAsync() => _vm.StartAsync();

    public async Task DisposeAsync() => await _vm.DisposeAsync();

    private Dictionary<string, string?> Config(string id)
    {
        var c = TestConfigs.HandCase(broker.Port, id, maxAge: TimeSpan.FromSeconds(1));
        c["timeseries:url"] = _vm.Url;
        c["timeseries:retryInitialSeconds"] = "0.05";
        c["timeseries:retryMaxSeconds"] = "0.3";
        c["timeseries:idlePollSeconds"] = "0.1";
        return c;
    }

    /// <summary>Publishes the hand case every 100 ms until <paramref name="stop"/> (reconnecting after a broker outage).</summary>
    private async Task FeedAsync(string id, CancellationToken stop)
    {
        while (!stop.IsCancellationRequested)
        {
            try
            {
                await using var plant = await TestMqttClient.ConnectAsync(broker.Port, id + "-plant-" + Guid.NewGuid().ToString("N")[..6]);
                while (!stop.IsCancellationRequested)
                {
                    await DaemonMqttTests.PublishHandCaseAsync(plant, id);
                    await Task.Delay(100, CancellationToken.None);
                }
            }
            catch (Exception e) when (e is not OperationCanceledException || !stop.IsCancellationRequested)
            {
                await Task.Delay(100, CancellationToken.None);
            }
        }
    }

    private async Task<List<long>> StopAndReadAsync(TestDaemon daemon, string storePath)
    {
        await daemon.App.StopAsync();
        return FrameTimeChecks.StoredFrameTimes(storePath);
    }

    [Fact]
    public async Task Run_inputs_stall_longer_than_their_max_age_every_frame_has_its_own_increasing_time_in_store_and_database()
    {
        var config = Config("it-stall");
        await using var daemon = await TestDaemon.StartAsync(config);
        string path = config["store:path"]!;
        var store = daemon.Get<SqliteStore>();
        using (var feeding = new CancellationTokenSource())
        {
            var feed = FeedAsync("it-stall", feeding.Token);
            await FrameTimeChecks.WaitUntilAsync(() => FrameTimeChecks.StoredFrameTimes(path).Count >= 8, TimeSpan.FromSeconds(30), "8 frames before the stall");
            await feeding.CancelAsync();
            await feed;
        }

        int before = FrameTimeChecks.StoredFrameTimes(path).Count;
        // The stall: no input for 15 cycles (3 s; the tags' maximum age is 1 s, so the later frames are Bad).
        await FrameTimeChecks.WaitUntilAsync(() => FrameTimeChecks.StoredFrameTimes(path).Count >= before + 15, TimeSpan.FromSeconds(30), "15 frames during the stall");
        using (var feeding = new CancellationTokenSource())
        {
            var feed = FeedAsync("it-stall", feeding.Token);
            int during = FrameTimeChecks.StoredFrameTimes(path).Count;
            await FrameTimeChecks.WaitUntilAsync(() => FrameTimeChecks.StoredFrameTimes(path).Count >= during + 8, TimeSpan.FromSeconds(30), "8 frames after the stall");
            await feeding.CancelAsync();
            await feed;
        }

        var stored = await StopAndReadAsync(daemon, path);
        FrameTimeChecks.AssertStrictlyIncreasing(stored, "store after an input stall");
        Assert.Contains(await store.QueryEstimatesAsync("r1", Core.Signals.EstimateNames.Our, DateTimeOffset.UnixEpoch, DateTimeOffset.MaxValue, 100_000, default),
            e => e.Quality == Core.Signals.SampleQuality.Bad);
        await FrameTimeChecks.AssertEachFrameOnceInDatabaseAsync(_vm, stored);
    }

    [Fact]
    public async Task Run_broker_outage_every_frame_has_its_own_increasing_time_in_store_and_database()
    {
        var config = Config("it-outage");
        await using var daemon = await TestDaemon.StartAsync(config);
        string path = config["store:path"]!;
        using var feeding = new CancellationTokenSource();
        var feed = FeedAsync("it-outage", feeding.Token);
        await FrameTimeChecks.WaitUntilAsync(() => FrameTimeChecks.StoredFrameTimes(path).Count >= 8, TimeSpan.FromSeconds(30), "8 frames before the outage");
        await broker.StopAsync();
        int before = FrameTimeChecks.StoredFrameTimes(path).Count;
        // The outage: 2 s (10 cycles) with the broker down, then it comes back and the plant publishes again.
        await FrameTimeChecks.WaitUntilAsync(() => FrameTimeChecks.StoredFrameTimes(path).Count >= before + 10, TimeSpan.FromSeconds(30), "10 frames during the outage");
        await broker.StartAsync();
        int during = FrameTimeChecks.StoredFrameTimes(path).Count;
        await FrameTimeChecks.WaitUntilAsync(() => FrameTimeChecks.StoredFrameTimes(path).Count >= during + 10, TimeSpan.FromSeconds(30), "10 frames after the outage");
        await feeding.CancelAsync();
        await feed;

        var stored = await StopAndReadAsync(daemon, path);
        FrameTimeChecks.AssertStrictlyIncreasing(stored, "store across a broker outage");
        Assert.True(stored.Count >= 28, stored.Count.ToString(CultureInfo.InvariantCulture));
        await FrameTimeChecks.AssertEachFrameOnceInDatabaseAsync(_vm, stored);
    }
}

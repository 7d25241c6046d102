using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>
/// The zero-loss outbox against a real VictoriaMetrics through the InfluxDB v2 write API: the
/// database stops (gracefully) while frames keep coming, starts again, and every cycle is stored
/// exactly once. Without deduplication in the database, so a resent or repeated write would show
/// as a duplicate timestamp.
/// </summary>
public sealed class OutboxVictoriaMetricsTests : IAsyncLifetime
{
    private readonly VictoriaMetricsServer _vm = new(dedup: false);
    private readonly string _db = Path.Combine(Directory.CreateTempSubdirectory("softsensor-outbox-").FullName, "softsensor.db");

    public Task InitializeAsync() => _vm.StartAsync();

    public async Task DisposeAsync()
    {
        await _vm.DisposeAsync();
        Directory.Delete(Path.GetDirectoryName(_db)!, recursive: true);
    }

    /// <summary>Series per frame of <see cref="TimeseriesRig.Frame"/>: gas our/cer (value, quality, sigma) + rq (value, quality); growth mu (value, quality, sigma).</summary>
    private static int Expected => 8 + 3;

    [Fact]
    public async Task Sender_DatabaseStoppedAndRestarted_StoresEveryCycleExactlyOnce()
    {
        var t0 = DateTimeOffset.UtcNow.AddHours(-1);
        var recorder = (RecordingWriter?)null;
        await using var rig = new TimeseriesRig(_db, _vm.Url, w => recorder = new RecordingWriter(w));
        await rig.StartAsync();
        for (int i = 0; i < 20; i++)
        {
            await rig.Sink.WriteAsync(TimeseriesRig.Frame(i, t0), CancellationToken.None);
        }

        Assert.True(await rig.DrainedAsync(TimeSpan.FromSeconds(15)), "outbox did not drain while the database was up");

        await _vm.StopGracefullyAsync();
        for (int i = 20; i < 45; i++)
        {
            await rig.Sink.WriteAsync(TimeseriesRig.Frame(i, t0), CancellationToken.None);
            await Task.Delay(10);
        }

        await Task.Delay(300);
        Assert.True(rig.Store.Stats.Depth > 0, "frames must wait in the outbox while the database is down");
        Assert.True(recorder!.Failures > 0, "the sender must have tried and failed");

        await _vm.StartAsync();
        for (int i = 45; i < 60; i++)
        {
            await rig.Sink.WriteAsync(TimeseriesRig.Frame(i, t0), CancellationToken.None);
        }

        Assert.True(await rig.DrainedAsync(TimeSpan.FromSeconds(15)), "outbox did not drain after the database came back");
        var stored = await _vm.ExportWhenCompleteAsync("softsensor_.*", Expected, 60);
        Assert.Equal(Expected, stored.Count);
        foreach (var (series, stamps) in stored)
        {
            Assert.True(stamps.Count == 60, $"{series}: {stamps.Count} samples, expected 60");
            Assert.Equal(60, stamps.Distinct().Count());
        }

        var expectedStamps = Enumerable.Range(0, 60).Select(i => t0.AddSeconds(i).ToUnixTimeMilliseconds()).ToHashSet();
        Assert.All(stored.Values, s => Assert.True(expectedStamps.SetEquals(s)));
    }

    [Fact]
    public async Task Sender_RestartedOnTheSameFile_SendsWhatThePreviousRunLeft()
    {
        var t0 = DateTimeOffset.UtcNow.AddHours(-2);
        await _vm.StopGracefullyAsync();
        await using (var first = new TimeseriesRig(_db, _vm.Url))
        {
            await first.StartAsync();
            for (int i = 0; i < 12; i++)
            {
                await first.Sink.WriteAsync(TimeseriesRig.Frame(i, t0, "r2"), CancellationToken.None);
            }

            await first.StopAsync();
            Assert.Equal(12, first.Store.Stats.Depth);
        }

        await _vm.StartAsync();
        await using var second = new TimeseriesRig(_db, _vm.Url);
        Assert.Equal(12, second.Store.Stats.Depth);
        await second.StartAsync();
        Assert.True(await second.DrainedAsync(TimeSpan.FromSeconds(15)));
        var stored = await _vm.ExportWhenCompleteAsync("softsensor_.*", Expected, 12);
        var r2 = stored.Where(kv => kv.Key.Contains("unit=r2", StringComparison.Ordinal)).ToList();
        Assert.Equal(Expected, r2.Count);
        Assert.All(r2, kv => Assert.Equal(12, kv.Value.Count));
    }
}

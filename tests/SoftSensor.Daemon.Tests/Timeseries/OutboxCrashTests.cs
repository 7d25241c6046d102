namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>
/// A writer killed during an outage, at the worst moment (the database acknowledged a batch, the
/// rows were never marked sent): the next run resends that batch. The resent points are the same
/// series and millisecond timestamps, so a database that overwrites on (series, time) stores each
/// cycle once: InfluxDB does by design; VictoriaMetrics does with -dedup.minScrapeInterval=1ms,
/// as started here (docs/daemon.md).
/// </summary>
public sealed class OutboxCrashTests : IAsyncLifetime
{
    private readonly VictoriaMetricsServer _vm = new(dedup: true);
    private readonly string _db = Path.Combine(Directory.CreateTempSubdirectory("softsensor-crash-").FullName, "softsensor.db");

    public Task InitializeAsync() => _vm.StartAsync();

    public async Task DisposeAsync()
    {
        await _vm.DisposeAsync();
        Directory.Delete(Path.GetDirectoryName(_db)!, recursive: true);
    }

    [Fact]
    public async Task Sender_KilledAfterAckBeforeMarkDuringOutage_NextRunStoresEveryCycleExactlyOnce()
    {
        var t0 = DateTimeOffset.UtcNow.AddHours(-1);
        DyingWriter? dying = null;
        var first = new TimeseriesRig(_db, _vm.Url, w => dying = new DyingWriter(w));
        await first.StartAsync();
        for (int i = 0; i < 15; i++)
        {
            await first.Sink.WriteAsync(TimeseriesRig.Frame(i, t0), CancellationToken.None);
        }

        Assert.True(await first.DrainedAsync(TimeSpan.FromSeconds(15)));

        await _vm.StopGracefullyAsync();
        for (int i = 15; i < 40; i++)
        {
            await first.Sink.WriteAsync(TimeseriesRig.Frame(i, t0), CancellationToken.None);
        }

        dying!.Armed = true;
        await _vm.StartAsync();
        var resentLater = await dying.DiedAfter.Task.WaitAsync(TimeSpan.FromSeconds(15));
        long left = first.Store.Stats.Depth;
        Assert.Equal(25, left); // acknowledged by the database, never marked
        first.Abandon();

        RecordingWriter? recorder = null;
        await using var second = new TimeseriesRig(_db, _vm.Url, w => recorder = new RecordingWriter(w));
        Assert.Equal(25, second.Store.Stats.Depth);
        await second.StartAsync();
        for (int i = 40; i < 50; i++)
        {
            await second.Sink.WriteAsync(TimeseriesRig.Frame(i, t0), CancellationToken.None);
        }

        Assert.True(await second.DrainedAsync(TimeSpan.FromSeconds(15)));
        Assert.Subset(recorder!.Lines.ToHashSet(), resentLater.ToHashSet()); // the resend is byte-identical: same series, same timestamps

        var stored = await _vm.ExportWhenCompleteAsync("softsensor_.*", 11, 50);
        Assert.Equal(11, stored.Count);
        foreach (var (series, stamps) in stored)
        {
            Assert.True(stamps.Count == 50 && stamps.Distinct().Count() == 50, $"{series}: {stamps.Count} samples ({stamps.Distinct().Count()} distinct), expected 50 once each");
        }

        first.Sender.Dispose();
        first.Store.Dispose();
    }
}

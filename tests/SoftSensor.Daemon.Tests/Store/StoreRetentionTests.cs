using System.Diagnostics.Metrics;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging.Abstractions;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;
using SoftSensor.Daemon.Store;

namespace SoftSensor.Daemon.Tests.Store;

/// <summary>
/// Retention, checkpoint pruning, incremental vacuum (SQLite documentation, "PRAGMA auto_vacuum" and
/// "PRAGMA incremental_vacuum": with auto_vacuum=INCREMENTAL the freed pages leave the file only when
/// incremental_vacuum runs) and the low-disk rule of the embedded store.
/// </summary>
public sealed class StoreRetentionTests : IDisposable
{
    private static readonly DateTimeOffset T0 = new(2026, 1, 1, 0, 0, 0, TimeSpan.Zero);
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-retention-").FullName;
    private readonly ServiceProvider _sp = new ServiceCollection().AddMetrics().BuildServiceProvider();

    public void Dispose()
    {
        _sp.Dispose();
        SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }

    private static EstimateFrame Frame(string reactor, DateTimeOffset t) => new(reactor, "b1", t, SampleQuality.Good,
        [.. Enumerable.Range(0, 20).Select(i => new EstimateValue("e" + i, i + 0.5, "1", 0.1, SampleQuality.Good, 0))]);

    private (StoreMaintenance Maintenance, StoreHealth Health) Maintenance(SqliteStore store, FakeTimeProvider time, Action<StoreOptions>? adjust = null)
    {
        var o = new SoftSensorOptions();
        o.Store.Path = store.Path;
        o.Store.Retention = TimeSpan.FromDays(2);
        adjust?.Invoke(o.Store);
        var health = new StoreHealth(_sp.GetRequiredService<IMeterFactory>());
        return (new StoreMaintenance(store, health, Microsoft.Extensions.Options.Options.Create(o), time, NullLogger<StoreMaintenance>.Instance, []), health);
    }

    private static async Task WriteDaysAsync(SqliteStore store, string reactor, int days, TimeSpan step)
    {
        var frames = new List<EstimateFrame>();
        for (var t = T0; t < T0.AddDays(days); t += step)
        {
            frames.Add(Frame(reactor, t));
            if (frames.Count == 500)
            {
                await store.WriteFramesAsync(frames, default);
                frames.Clear();
            }
        }

        await store.WriteFramesAsync(frames, default);
    }

    private static long Scalar(string path, string sql)
    {
        using var c = new SqliteConnection($"Data Source={path};Pooling=false");
        c.Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = sql;
        return (long)cmd.ExecuteScalar()!;
    }

    [Fact]
    public async Task RunOnce_deletes_frames_past_retention_with_their_estimates_and_the_file_shrinks()
    {
        string path = Path.Combine(_dir, "r.db");
        using var store = new SqliteStore(path, TimeProvider.System);
        await WriteDaysAsync(store, "r1", 5, TimeSpan.FromMinutes(1));
        await WriteDaysAsync(store, "r2", 1, TimeSpan.FromMinutes(10));
        store.TruncateWal();
        long before = store.SizeBytes;
        var time = new FakeTimeProvider(T0.AddDays(5));
        var (maintenance, health) = Maintenance(store, time);

        await maintenance.RunOnceAsync(default);

        Assert.Equal(2, Scalar(path, "PRAGMA auto_vacuum")); // INCREMENTAL
        Assert.Equal(0, Scalar(path, "SELECT COUNT(*) FROM frames WHERE time_ms < " + T0.AddDays(3).ToUnixTimeMilliseconds()));
        Assert.Equal(2 * 1440, Scalar(path, "SELECT COUNT(*) FROM frames WHERE reactor = 'r1'"));
        Assert.Equal(0, Scalar(path, "SELECT COUNT(*) FROM frames WHERE reactor = 'r2'"));
        Assert.Equal(0, Scalar(path, "SELECT COUNT(*) FROM estimates e WHERE NOT EXISTS (SELECT 1 FROM frames f WHERE f.id = e.frame_id)"));
        Assert.Equal(0, Scalar(path, "PRAGMA freelist_count"));
        Assert.True(store.SizeBytes < before * 0.6, $"store {before} → {store.SizeBytes} bytes after deleting three of five days");
        Assert.Equal(3 * 1440 + 144, health.Current.PrunedFrames);
        Assert.Equal(store.SizeBytes, health.Current.StoreBytes);
        Assert.False(health.Current.DiskLow);
    }

    [Fact]
    public async Task WriteCheckpoint_keeps_only_the_newest_per_reactor_and_the_newest_resumes()
    {
        using var store = new SqliteStore(Path.Combine(_dir, "c.db"), TimeProvider.System, checkpointsKept: 3);
        for (int i = 1; i <= 50; i++)
        {
            await store.WriteCheckpointAsync(new Checkpoint("r1", i, T0.AddSeconds(i), "state-" + i), default);
            await store.WriteCheckpointAsync(new Checkpoint("r2", i, T0.AddSeconds(i), "other-" + i), default);
        }

        Assert.Equal(3, store.CheckpointCount("r1"));
        Assert.Equal(3, store.CheckpointCount("r2"));
        Assert.Equal("state-50", (await store.LatestCheckpointAsync("r1", default))!.State);
    }

    [Fact]
    public async Task Open_converts_a_store_made_without_incremental_vacuum_once()
    {
        string path = Path.Combine(_dir, "old.db");
        using (var c = new SqliteConnection($"Data Source={path};Pooling=false"))
        {
            c.Open();
            using var cmd = c.CreateCommand();
            cmd.CommandText = "CREATE TABLE frames (id INTEGER PRIMARY KEY, reactor TEXT NOT NULL, batch TEXT NOT NULL, time_ms INTEGER NOT NULL, quality INTEGER NOT NULL); INSERT INTO frames VALUES (1, 'r1', 'b', 5, 0);";
            cmd.ExecuteNonQuery();
        }

        Assert.Equal(0, Scalar(path, "PRAGMA auto_vacuum"));
        using (var store = new SqliteStore(path, TimeProvider.System))
        {
            Assert.Equal(DateTimeOffset.FromUnixTimeMilliseconds(5), await store.LatestFrameTimeAsync("r1", default));
        }

        Assert.Equal(2, Scalar(path, "PRAGMA auto_vacuum"));
    }

    [Fact]
    public async Task RunOnce_below_the_free_space_threshold_deletes_the_oldest_day_keeps_the_newest_and_reports_disk_low()
    {
        string path = Path.Combine(_dir, "low.db");
        using var store = new SqliteStore(path, TimeProvider.System);
        await WriteDaysAsync(store, "r1", 4, TimeSpan.FromMinutes(5));
        var time = new FakeTimeProvider(T0.AddDays(4));
        // A threshold no disk meets: the rule acts as on a full disk.
        var (maintenance, health) = Maintenance(store, time, s => { s.Retention = TimeSpan.FromDays(365); s.MinFreeDiskMegabytes = 1e12; });

        await maintenance.RunOnceAsync(default);
        Assert.True(health.Current.DiskLow);
        Assert.True(health.Current.FreeMarginMegabytes < 0);
        Assert.Equal(T0.AddDays(1), store.OldestFrameTime("r1"));
        for (int i = 0; i < 5; i++)
        {
            await maintenance.RunOnceAsync(default);
        }

        // Never the newest day.
        Assert.Equal(T0.AddDays(3).AddMinutes(-5), store.OldestFrameTime("r1"));
        Assert.Equal(T0.AddDays(4).AddMinutes(-5), await store.LatestFrameTimeAsync("r1", default));
    }
}

using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Store;

/// <summary>
/// Keeps the store bounded, off the cycle path, every <c>store:maintenanceIntervalSeconds</c> of real
/// time: deletes all but the newest <c>store:checkpointsKept</c> checkpoints per reactor; deletes frames
/// (with their estimates) and unsent outbox rows older than <c>store:retention</c> (by the process
/// clock), <see cref="BatchFrames"/> frames per transaction so a cycle never waits long for the store;
/// gives the freed pages back with an incremental vacuum; measures the store and its disk
/// (<see cref="StoreHealth"/>). Below <c>store:minFreeDiskMegabytes</c> it also deletes each reactor's
/// oldest day of frames per pass, never its newest day: the newest data are kept.
/// </summary>
internal sealed class StoreMaintenance(
    SqliteStore store, StoreHealth health, IOptions<SoftSensorOptions> options, TimeProvider time, ILogger<StoreMaintenance> log, IEnumerable<IRetainedRows> retained)
    : BackgroundService
{
    /// <summary>Frames deleted per transaction (each with its estimates).</summary>
    public const int BatchFrames = 200;

    /// <summary>Free pages given back per vacuum step.</summary>
    private const int VacuumPages = 2048;

    private readonly IRetainedRows[] _retained = [.. retained];
    private long _prunedFrames;
    private long _prunedCheckpoints;

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var period = TimeSpan.FromSeconds(options.Value.Store.MaintenanceIntervalSeconds);
        // Real time whatever the process clock: this is file upkeep, as the WAL checkpointer.
        using var timer = new PeriodicTimer(period, TimeProvider.System);
        try
        {
            do
            {
                try
                {
                    await RunOnceAsync(stoppingToken);
                }
                catch (Microsoft.Data.Sqlite.SqliteException e)
                {
                    StoreLog.MaintenanceFailed(log, e.Message);
                }
            }
            while (await timer.WaitForNextTickAsync(stoppingToken));
        }
        catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
        {
            // Normal stop.
        }
    }

    /// <summary>One pass (internal for tests).</summary>
    internal async Task RunOnceAsync(CancellationToken cancellationToken)
    {
        var o = options.Value.Store;
        _prunedCheckpoints += await store.PruneCheckpointsAsync(o.CheckpointsKept, cancellationToken);
        var cutoff = time.GetUtcNow() - o.Retention;
        long deleted = 0;
        foreach (string reactor in store.StoredReactors())
        {
            deleted += await DeleteBeforeAsync(reactor, cutoff, cancellationToken);
        }

        foreach (var rows in _retained)
        {
            while (rows.DropOlderThan(cutoff, BatchFrames) > 0)
            {
                await Task.Yield();
            }
        }

        var reading = Measure(o);
        if (reading.DiskLow)
        {
            StoreLog.DiskLow(log, reading.FreeBytes / 1e6, o.MinFreeDiskMegabytes, store.Path);
            foreach (string reactor in store.StoredReactors())
            {
                if (store.OldestFrameTime(reactor) is { } oldest && await store.LatestFrameTimeAsync(reactor, cancellationToken) is { } newest)
                {
                    var day = TimeSpan.FromDays(1);
                    var emergency = oldest + day < newest - day ? oldest + day : newest - day;
                    deleted += await DeleteBeforeAsync(reactor, emergency, cancellationToken);
                }
            }
        }

        if (deleted > 0)
        {
            _prunedFrames += deleted;
            StoreLog.Pruned(log, deleted, cutoff);
        }

        while (await store.IncrementalVacuumAsync(VacuumPages, cancellationToken) > 0)
        {
            await Task.Yield();
        }

        if (deleted > 0)
        {
            store.TruncateWal();
        }

        health.Update(Measure(o));
    }

    private async Task<long> DeleteBeforeAsync(string reactor, DateTimeOffset cutoff, CancellationToken cancellationToken)
    {
        long total = 0;
        int n;
        do
        {
            n = await store.DeleteFramesBeforeAsync(reactor, cutoff, BatchFrames, cancellationToken);
            total += n;
            await Task.Yield();
        }
        while (n == BatchFrames);
        return total;
    }

    private StoreHealth.Reading Measure(StoreOptions o)
    {
        long free;
        try
        {
            free = new DriveInfo(System.IO.Path.GetDirectoryName(store.Path)!).AvailableFreeSpace;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException)
        {
            free = long.MaxValue;
        }

        return new StoreHealth.Reading(store.SizeBytes, free, (long)(o.MinFreeDiskMegabytes * 1e6), _prunedFrames, _prunedCheckpoints, time.GetUtcNow());
    }
}

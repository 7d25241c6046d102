using System.Diagnostics.Metrics;

namespace SoftSensor.Daemon.Store;

/// <summary>
/// What the last maintenance pass measured of the store and its disk: the store's size (file and
/// write-ahead log), the free space of its file system, and whether that is below
/// <c>store:minFreeDiskMegabytes</c>. Shown on the status page (<c>store</c> in /api/status), exported
/// as <c>softsensor_store_bytes</c> and <c>softsensor_disk_free_bytes</c>, and read by the alarm
/// rule <c>disk_low</c> (<c>tag:softsensor.disk_free_margin_mb</c>). Thread-safe (values are swapped whole).
/// </summary>
internal sealed class StoreHealth
{
    private Reading _now = new(0, long.MaxValue, 0, 0, 0, null);

    public StoreHealth(IMeterFactory meters)
    {
        var meter = meters.Create(Contracts.DaemonMetrics.MeterName);
        meter.CreateObservableGauge("softsensor_store_bytes", () => Current.StoreBytes, "By", "Size of the embedded store on disk (database file and write-ahead log)");
        meter.CreateObservableGauge("softsensor_disk_free_bytes", () => Current.FreeBytes == long.MaxValue ? 0 : Current.FreeBytes, "By", "Free space on the file system that holds the store");
        meter.CreateObservableGauge("softsensor_store_pruned_frames_total", () => Current.PrunedFrames, "{frame}", "Frames deleted by retention since start (and, when the disk is low, the oldest beyond it)");
    }

    /// <summary>One measurement.</summary>
    /// <param name="StoreBytes">Database file plus write-ahead log, bytes.</param>
    /// <param name="FreeBytes">Free bytes available to the daemon on the store's file system.</param>
    /// <param name="ThresholdBytes">The configured free-space threshold, bytes.</param>
    /// <param name="PrunedFrames">Frames deleted since start.</param>
    /// <param name="PrunedCheckpoints">Checkpoints deleted since start.</param>
    /// <param name="MeasuredAt">When it was measured (process clock), null before the first pass.</param>
    internal sealed record Reading(long StoreBytes, long FreeBytes, long ThresholdBytes, long PrunedFrames, long PrunedCheckpoints, DateTimeOffset? MeasuredAt)
    {
        /// <summary>True when the free space is below the threshold.</summary>
        public bool DiskLow => FreeBytes < ThresholdBytes;

        /// <summary>Free space above the threshold, MB (negative when below): the alarm rule's signal.</summary>
        public double FreeMarginMegabytes => FreeBytes == long.MaxValue ? double.NaN : (FreeBytes - ThresholdBytes) / 1e6;
    }

    /// <summary>The newest reading.</summary>
    public Reading Current => Volatile.Read(ref _now);

    /// <summary>Replaces the reading (the maintenance pass).</summary>
    public void Update(Reading reading) => Volatile.Write(ref _now, reading);
}

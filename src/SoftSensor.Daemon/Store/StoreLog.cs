using Microsoft.Extensions.Logging;

namespace SoftSensor.Daemon.Store;

/// <summary>Log lines of the store's maintenance (event ids 7600–7699).</summary>
internal static partial class StoreLog
{
    [LoggerMessage(EventId = 7600, Level = LogLevel.Information, Message = "store retention: {Frames} frame(s) older than {Cutoff:O} deleted (or the oldest, the disk being low)")]
    public static partial void Pruned(ILogger logger, long frames, DateTimeOffset cutoff);

    [LoggerMessage(EventId = 7601, Level = LogLevel.Warning, Message = "disk low: {FreeMb:F0} MB free below store:minFreeDiskMegabytes {ThresholdMb:F0} MB for {Path}; deleting the oldest data first, keeping the newest")]
    public static partial void DiskLow(ILogger logger, double freeMb, double thresholdMb, string path);

    [LoggerMessage(EventId = 7602, Level = LogLevel.Warning, Message = "store maintenance pass failed ({Reason}); the next pass tries again")]
    public static partial void MaintenanceFailed(ILogger logger, string reason);
}

namespace SoftSensor.Daemon.Store;

/// <summary>
/// Rows kept by another component in the store's file (the time-series outbox) that
/// <c>store:retention</c> also bounds: <see cref="StoreMaintenance"/> calls it each pass.
/// Threading contract: called from the maintenance task, beside the component's own use.
/// </summary>
internal interface IRetainedRows
{
    /// <summary>Removes at most <paramref name="limit"/> of the oldest rows written before <paramref name="cutoff"/>; returns how many.</summary>
    int DropOlderThan(DateTimeOffset cutoff, int limit);
}

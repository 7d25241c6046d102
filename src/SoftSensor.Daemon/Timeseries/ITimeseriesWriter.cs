namespace SoftSensor.Daemon.Timeseries;

/// <summary>The outcome of one write: acknowledged, or failed with a reason fit for a log line (no secrets).</summary>
internal readonly record struct WriteOutcome(bool Acknowledged, string Reason)
{
    public static WriteOutcome Ok { get; } = new(true, "");

    public static WriteOutcome Failed(string reason) => new(false, reason);
}

/// <summary>
/// Writes line-protocol lines to a time-series database. Threading contract: one call at a time
/// (the outbox sender); a failure of the database or the network is a result, not an exception;
/// only cancellation of <paramref name="cancellationToken"/> throws.
/// </summary>
internal interface ITimeseriesWriter
{
    ValueTask<WriteOutcome> WriteAsync(IReadOnlyList<string> lines, CancellationToken cancellationToken);
}

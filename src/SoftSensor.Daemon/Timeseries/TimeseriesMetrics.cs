using System.Diagnostics.Metrics;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>
/// Metrics of the outbox (System.Diagnostics.Metrics, meter <c>SoftSensor.Timeseries</c>): depth,
/// payload size, fill of the bound, age of the oldest unsent frame, send failures, points sent,
/// frames refused when full.
/// </summary>
internal sealed class TimeseriesMetrics
{
    public const string MeterName = "SoftSensor.Timeseries";

    private readonly Counter<long> _failures;
    private readonly Counter<long> _sent;
    private readonly Counter<long> _refused;

    public TimeseriesMetrics(IMeterFactory meters, OutboxStore store, TimeProvider time)
    {
        var meter = meters.Create(MeterName);
        meter.CreateObservableGauge("softsensor.outbox.depth", () => store.Stats.Depth, "{frame}", "Frames committed to the outbox and not yet acknowledged by the database");
        meter.CreateObservableGauge("softsensor.outbox.size", () => store.Stats.Bytes, "By", "Unsent payload held in the outbox");
        meter.CreateObservableGauge("softsensor.outbox.fill", () => store.Stats.Fill, "1", "Unsent payload as a fraction of the configured bound");
        meter.CreateObservableGauge("softsensor.outbox.oldest_unsent_age", () =>
            store.Stats.OldestEnqueued is { } t ? Math.Max(0, (time.GetUtcNow() - t).TotalSeconds) : 0.0, "s", "Age of the oldest unsent frame");
        _failures = meter.CreateCounter<long>("softsensor.outbox.send_failures", "{write}", "Writes the database did not acknowledge");
        _sent = meter.CreateCounter<long>("softsensor.outbox.points_sent", "{point}", "Points the database acknowledged");
        _refused = meter.CreateCounter<long>("softsensor.outbox.refused", "{frame}", "Frames refused because the outbox was full");
    }

    public void SendFailed() => _failures.Add(1);

    public void Sent(int points) => _sent.Add(points);

    public void Refused() => _refused.Add(1);
}

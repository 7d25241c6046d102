using System.Diagnostics.Metrics;

namespace SoftSensor.Daemon.Contracts;

/// <summary>
/// The daemon's instruments (System.Diagnostics.Metrics), exported as Prometheus text at /metrics by
/// <see cref="PrometheusExporter"/>. Every instrument carries a <c>reactor</c> tag where it has one.
/// </summary>
internal sealed class DaemonMetrics : IDisposable
{
    /// <summary>Name of the meter.</summary>
    public const string MeterName = "SoftSensor.Daemon";

    private readonly Meter _meter;

    public DaemonMetrics(IMeterFactory factory)
    {
        _meter = factory.Create(MeterName);
        CycleSeconds = _meter.CreateHistogram<double>("softsensor_cycle_seconds", "s", "Time spent computing and dispatching one cycle");
        SamplesIn = _meter.CreateCounter<long>("softsensor_samples_in_total", null, "Samples accepted into the signal store");
        SamplesRejected = _meter.CreateCounter<long>("softsensor_samples_rejected_total", null, "Payloads or samples dropped (malformed, unknown tag, non-finite)");
        PayloadsRejected = _meter.CreateCounter<long>("softsensor_payloads_rejected_total", null, "Tag and command payloads refused, by reactor and reason (boolean, not_a_number, trailing_data, duplicate_key, timestamp_outside_window, too_large, ...)");
        PublishFailures = _meter.CreateCounter<long>("softsensor_publish_failures_total", null, "Publishes or sink writes that failed");
        Cycles = _meter.CreateCounter<long>("softsensor_cycles_total", null, "Cycles run");
        Reconnects = _meter.CreateCounter<long>("softsensor_mqtt_reconnects_total", null, "MQTT connections established after the first");
        SinkWriteSeconds = _meter.CreateHistogram<double>("softsensor_sink_write_seconds", "s", "Time one sink took for the frames the dispatcher handed it together (its _sum per second of wall time: the share of the dispatcher's time it takes)");
        TagToEstimateSeconds = _meter.CreateHistogram<double>("softsensor_tag_to_estimate_seconds", "s", "Arrival of the newest input to the frame leaving the dispatcher");
    }

    /// <summary>The meter factory the instruments came from (tells this daemon's meter from another host's of the same name in one process).</summary>
    public object? Scope => _meter.Scope;

    public Histogram<double> CycleSeconds { get; }

    public Counter<long> SamplesIn { get; }

    public Counter<long> SamplesRejected { get; }

    /// <summary>Refused payloads (tags <c>reactor</c>, <c>reason</c>).</summary>
    public Counter<long> PayloadsRejected { get; }

    public Counter<long> PublishFailures { get; }

    public Counter<long> Cycles { get; }

    public Counter<long> Reconnects { get; }

    public Histogram<double> TagToEstimateSeconds { get; }

    /// <summary>Seconds per sink call of the dispatcher (tag <c>sink</c>).</summary>
    public Histogram<double> SinkWriteSeconds { get; }

    public void Dispose() => _meter.Dispose();
}

using System.Collections.Concurrent;
using System.Diagnostics.Metrics;
using System.Globalization;
using System.Text;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Status;

/// <summary>
/// Listens to the daemon's meters (<c>SoftSensor.Daemon</c> and the outbox's <c>SoftSensor.Timeseries</c>)
/// and renders the Prometheus text exposition format (version 0.0.4): counters as <c>_total</c> sums,
/// observable gauges as their value at the scrape, histograms as cumulative <c>_bucket</c>, <c>_sum</c>,
/// <c>_count</c>, one series per tag set. Instrument names become Prometheus names with dots turned into
/// underscores (the exposition format allows <c>[a-zA-Z_:][a-zA-Z0-9_:]*</c>). Thread-safe.
/// </summary>
internal sealed class PrometheusExporter : IDisposable
{
    private static readonly double[] Bounds = [0.0005, 0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10];
    private readonly MeterListener _listener = new();
    private readonly ConcurrentDictionary<(string Name, string Labels), Series> _series = new();
    private readonly ConcurrentDictionary<string, (string Kind, string Help)> _meta = new(StringComparer.Ordinal);

    public PrometheusExporter(DaemonMetrics metrics)
    {
        ArgumentNullException.ThrowIfNull(metrics);
        _listener.InstrumentPublished = (instrument, listener) =>
        {
            // Only this daemon's meters: a MeterListener sees every meter of the process, and tests host several daemons in one.
            bool ours = instrument.Meter.Name is DaemonMetrics.MeterName or Timeseries.TimeseriesMetrics.MeterName;
            if (ours && ReferenceEquals(instrument.Meter.Scope, metrics.Scope))
            {
                var info = new InstrumentInfo(NameOf(instrument), KindOf(instrument));
                _meta[info.Name] = (info.Kind, instrument.Description ?? instrument.Name);
                listener.EnableMeasurementEvents(instrument, info);
            }
        };
        _listener.SetMeasurementEventCallback<int>((_, v, tags, state) => Record((InstrumentInfo)state!, v, tags));
        _listener.SetMeasurementEventCallback<long>((_, v, tags, state) => Record((InstrumentInfo)state!, v, tags));
        _listener.SetMeasurementEventCallback<double>((_, v, tags, state) => Record((InstrumentInfo)state!, v, tags));
        _listener.Start();
    }

    /// <summary>The content type of <see cref="Render"/>.</summary>
    public const string ContentType = "text/plain; version=0.0.4; charset=utf-8";

    /// <summary>Renders every series.</summary>
    public string Render()
    {
        _listener.RecordObservableInstruments();
        var sb = new StringBuilder();
        foreach (var group in _series.OrderBy(s => s.Key.Name, StringComparer.Ordinal).ThenBy(s => s.Key.Labels, StringComparer.Ordinal).GroupBy(s => s.Key.Name))
        {
            var (kind, help) = _meta.TryGetValue(group.Key, out var m) ? m : ("counter", group.Key);
            sb.Append("# HELP ").Append(group.Key).Append(' ').Append(help).Append('\n');
            sb.Append("# TYPE ").Append(group.Key).Append(' ').Append(kind).Append('\n');
            foreach (var (key, series) in group)
            {
                series.Write(sb, key.Name, key.Labels, kind == "histogram");
            }
        }

        return sb.ToString();
    }

    public void Dispose() => _listener.Dispose();

    private static string KindOf(Instrument instrument) => instrument switch
    {
        Histogram<double> => "histogram",
        ObservableGauge<int> or ObservableGauge<long> or ObservableGauge<double> => "gauge",
        _ => "counter",
    };

    private static string NameOf(Instrument instrument)
    {
        string name = instrument.Name.Replace('.', '_');
        return KindOf(instrument) == "counter" && !name.EndsWith("_total", StringComparison.Ordinal) ? name + "_total" : name;
    }

    private void Record(InstrumentInfo instrument, double value, ReadOnlySpan<KeyValuePair<string, object?>> tags)
    {
        var series = Get(instrument, tags);
        switch (instrument.Kind)
        {
            case "histogram":
                series.Observe(value);
                break;
            case "gauge":
                series.Set(value);
                break;
            default:
                series.Add(value);
                break;
        }
    }

    /// <summary>
    /// The series of a tag set. Measurements come at the tag rate (tens of thousands a second under
    /// load), so the usual one-tag case is a lookup on the tag's key and value, with the labels
    /// text built once per series.
    /// </summary>
    private Series Get(InstrumentInfo instrument, ReadOnlySpan<KeyValuePair<string, object?>> tags)
    {
        if (tags.Length == 1)
        {
            var key = (tags[0].Key, tags[0].Value);
            if (instrument.ByOneTag.TryGetValue(key, out var cached))
            {
                return cached;
            }

            return instrument.ByOneTag.GetOrAdd(key, _series.GetOrAdd((instrument.Name, Labels(tags)), _ => new Series()));
        }

        return _series.GetOrAdd((instrument.Name, Labels(tags)), _ => new Series());
    }

    private static string Labels(ReadOnlySpan<KeyValuePair<string, object?>> tags)
    {
        if (tags.Length == 0)
        {
            return "";
        }

        var parts = new List<string>(tags.Length);
        foreach (var t in tags)
        {
            parts.Add($"{t.Key}=\"{Escape(Convert.ToString(t.Value, CultureInfo.InvariantCulture) ?? "")}\"");
        }

        parts.Sort(StringComparer.Ordinal);
        return string.Join(",", parts);
    }

    private static string Escape(string v) => v.Replace("\\", "\\\\", StringComparison.Ordinal).Replace("\"", "\\\"", StringComparison.Ordinal).Replace("\n", "\\n", StringComparison.Ordinal);

    private static string Num(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    /// <summary>An instrument's Prometheus name and kind, computed once, with its one-tag series.</summary>
    private sealed record InstrumentInfo(string Name, string Kind)
    {
        public ConcurrentDictionary<(string Key, object? Value), Series> ByOneTag { get; } = new();
    }

    private sealed class Series
    {
        private readonly long[] _buckets = new long[Bounds.Length];
        private readonly Lock _gate = new();
        private long _count;
        private double _sum;

        public void Set(double v)
        {
            lock (_gate)
            {
                _sum = v;
                _count = 1;
            }
        }

        public void Add(double v)
        {
            lock (_gate)
            {
                _sum += v;
                _count++;
            }
        }

        public void Observe(double v)
        {
            lock (_gate)
            {
                _sum += v;
                _count++;
                for (int i = 0; i < Bounds.Length; i++)
                {
                    if (v <= Bounds[i])
                    {
                        _buckets[i]++;
                    }
                }
            }
        }

        public void Write(StringBuilder sb, string name, string labels, bool histogram)
        {
            lock (_gate)
            {
                if (!histogram)
                {
                    sb.Append(name).Append(Braces(labels)).Append(' ').Append(Num(_sum)).Append('\n');
                    return;
                }

                string sep = labels.Length > 0 ? "," : "";
                for (int i = 0; i < Bounds.Length; i++)
                {
                    sb.Append(name).Append("_bucket{").Append(labels).Append(sep).Append("le=\"").Append(Num(Bounds[i])).Append("\"} ").Append(_buckets[i]).Append('\n');
                }

                sb.Append(name).Append("_bucket{").Append(labels).Append(sep).Append("le=\"+Inf\"} ").Append(_count).Append('\n');
                sb.Append(name).Append("_sum").Append(Braces(labels)).Append(' ').Append(Num(_sum)).Append('\n');
                sb.Append(name).Append("_count").Append(Braces(labels)).Append(' ').Append(_count).Append('\n');
            }
        }

        private static string Braces(string labels) => labels.Length == 0 ? "" : "{" + labels + "}";
    }
}

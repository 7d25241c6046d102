using System.Buffers;
using Microsoft.Extensions.Logging;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Sources;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// The MQTT tags of one reactor: registers a handler per tag topic on the shared <see cref="MqttLink"/>,
/// decodes each payload by the tag's layout, scales it to the role's unit and hands the sample to
/// the pipeline's intake on MQTTnet's receive task. Malformed payloads are dropped, counted
/// and logged with their topic. A payload without a timestamp gets its arrival time.
/// </summary>
internal sealed class MqttSampleSource : ISampleSource
{
    private readonly MqttLink _link;
    private readonly IReadOnlyList<TagBinding> _bindings;
    private readonly DaemonMetrics _metrics;
    private readonly TimeProvider _time;
    private readonly ILogger _logger;
    private readonly KeyValuePair<string, object?> _reactorTag;
    private readonly string _reactor;
    private readonly TimeSpan _past;
    private readonly TimeSpan _future;
    private readonly RateLimitedLog _rejectLog;

    public MqttSampleSource(string reactor, MqttLink link, IReadOnlyList<TagBinding> bindings, DaemonMetrics metrics, TimeProvider time, ILogger logger,
        TimeSpan? timestampPast = null, TimeSpan? timestampFuture = null)
    {
        _reactor = reactor;
        _past = timestampPast ?? TimeSpan.MaxValue;
        _future = timestampFuture ?? TimeSpan.MaxValue;
        _rejectLog = new RateLimitedLog(TimeProvider.System, TimeSpan.FromSeconds(10));
        _link = link;
        _bindings = bindings;
        _metrics = metrics;
        _time = time;
        _logger = logger;
        _reactorTag = new("reactor", reactor);
    }

    public string Name => "mqtt";

    public async Task RunAsync(ISampleIntake samples, CancellationToken cancellationToken)
    {
        foreach (var b in _bindings)
        {
            _link.Subscribe(b.Topic, (topic, payload) => OnPayload(b, topic, payload, samples));
        }

        try
        {
            await Task.Delay(Timeout.Infinite, cancellationToken);
        }
        finally
        {
            foreach (var b in _bindings)
            {
                _link.Unsubscribe(b.Topic);
            }
        }
    }

    private ValueTask OnPayload(TagBinding b, string topic, ReadOnlySequence<byte> payload, ISampleIntake samples)
    {
        bool text = b.Role == SignalRole.BatchId;
        if (!PayloadDecoder.TryDecode(payload, b.Payload, new TimestampWindow(_time.GetUtcNow(), _past, _future), out var r, out string error, out var reason, text))
        {
            _metrics.SamplesRejected.Add(1, _reactorTag);
            _metrics.PayloadsRejected.Add(1, _reactorTag, new("reason", PayloadRejections.Id(reason)));
            // Rate-limited per topic: a misconfigured publisher at 10 Hz writes one line per 10 s with the count since.
            if (_rejectLog.ShouldLog(topic, out long suppressed))
            {
                MqttLog.Malformed(_logger, topic, suppressed > 0 ? $"{error} ({suppressed} more refused since the last line)" : error);
            }

            return ValueTask.CompletedTask;
        }

        if (text)
        {
            var id = new Sample(b.Tag, double.NaN, r.SourceTime ?? _time.GetUtcNow(), r.Quality, r.StatusCode) { Text = r.Text };
            samples.Take(id);
            return ValueTask.CompletedTask;
        }

        double value = b.ToRoleUnit(r.Value);
        if (!double.IsFinite(value))
        {
            _metrics.SamplesRejected.Add(1, _reactorTag);
            MqttLog.Malformed(_logger, topic, $"scaled value {value} is not finite");
            return ValueTask.CompletedTask;
        }

        var sample = new Sample(b.Tag, value, r.SourceTime ?? _time.GetUtcNow(), r.Quality, r.StatusCode);
        samples.Take(sample);
        return ValueTask.CompletedTask;
    }
}

/// <summary>Makes an <see cref="MqttSampleSource"/> for every reactor with MQTT tags.</summary>
internal sealed class MqttSampleSourceFactory(MqttLink link, DaemonMetrics metrics, TimeProvider time, ILogger<MqttSampleSource> logger,
    Microsoft.Extensions.Options.IOptions<SoftSensorOptions> options) : ISampleSourceFactory
{
    public ISampleSource? Create(ReactorOptions reactor, IReadOnlyList<TagBinding> bindings)
    {
        var mqtt = bindings.Where(b => b.Topic.Length > 0).ToList();
        return mqtt.Count == 0 ? null : new MqttSampleSource(reactor.Id, link, mqtt, metrics, time, logger,
            options.Value.Mqtt.TimestampWindowPast, options.Value.Mqtt.TimestampWindowFuture);
    }
}

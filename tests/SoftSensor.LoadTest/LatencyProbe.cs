using System.Buffers;
using System.Text.Json;
using MQTTnet;
using MQTTnet.Protocol;

namespace SoftSensor.LoadTest;

/// <summary>
/// Subscribes to every reactor's published OUR and records, per estimate, arrival time minus the
/// estimate's timestamp (the source time of the newest input the cycle used: the trigger tag's
/// publish time). The payload's timestamp has millisecond resolution and is truncated, so each
/// figure is high by less than 1 ms.
/// </summary>
internal sealed class LatencyProbe(int port) : IAsyncDisposable
{
    private readonly IMqttClient _client = new MqttClientFactory().CreateMqttClient();
    private readonly Lock _gate = new();
    private readonly List<double> _latencyMs = [];
    private readonly HashSet<string> _reactorsSeen = new(StringComparer.Ordinal);
    private volatile bool _recording;

    public int ReactorsSeen
    {
        get
        {
            lock (_gate)
            {
                return _reactorsSeen.Count;
            }
        }
    }

    public long Received { get; private set; }

    public async Task StartAsync()
    {
        _client.ApplicationMessageReceivedAsync += e =>
        {
            var m = e.ApplicationMessage;
            if (m.Retain)
            {
                return Task.CompletedTask;
            }

            var now = DateTimeOffset.UtcNow;
            if (!TryTimestamp(m.Payload, out var stamp))
            {
                return Task.CompletedTask;
            }

            lock (_gate)
            {
                _reactorsSeen.Add(m.Topic);
                if (_recording)
                {
                    Received++;
                    _latencyMs.Add((now - stamp).TotalMilliseconds);
                }
            }

            return Task.CompletedTask;
        };
        var r = await _client.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", port).WithClientId("softsensor-load-probe").WithCleanSession().Build());
        if (r.ResultCode != MqttClientConnectResultCode.Success)
        {
            throw new InvalidOperationException($"probe: broker refused the connection: {r.ResultCode}");
        }

        await _client.SubscribeAsync(new MqttClientSubscribeOptionsBuilder().WithTopicFilter(LoadConfig.EstimateFilter, MqttQualityOfServiceLevel.AtMostOnce).Build());
    }

    public void Record(bool on)
    {
        lock (_gate)
        {
            _recording = on;
        }
    }

    public double[] Latencies()
    {
        lock (_gate)
        {
            return [.. _latencyMs];
        }
    }

    private static bool TryTimestamp(ReadOnlySequence<byte> payload, out DateTimeOffset stamp)
    {
        stamp = default;
        var reader = new Utf8JsonReader(payload);
        while (reader.Read())
        {
            if (reader.TokenType == JsonTokenType.PropertyName && reader.ValueTextEquals("timestamp"u8) && reader.Read() && reader.TokenType == JsonTokenType.String)
            {
                return reader.TryGetDateTimeOffset(out stamp);
            }
        }

        return false;
    }

    public async ValueTask DisposeAsync()
    {
        if (_client.IsConnected)
        {
            await _client.DisconnectAsync();
        }

        _client.Dispose();
    }
}

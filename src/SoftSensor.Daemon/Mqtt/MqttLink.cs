using System.Buffers;
using System.Collections.Concurrent;
using System.Text;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using MQTTnet;
using MQTTnet.Protocol;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>A message handler: topic and payload (valid only during the call).</summary>
internal delegate ValueTask MqttMessageHandler(string topic, ReadOnlySequence<byte> payload);

/// <summary>
/// The daemon's one connection to the broker, kept up by a supervising loop (never from a
/// disconnect handler): connect and check the CONNACK result code, subscribe every registered
/// topic, publish the retained <c>online</c> status (the last will says <c>offline</c>), then ping
/// on its own interval (MQTTnet 5 may not notice a dead link while publishes fail) and reconnect
/// with exponential back-off and jitter when a ping fails. On stop it publishes <c>offline</c> and
/// disconnects cleanly. Threading: <see cref="Subscribe"/>, <see cref="PublishAsync"/> are
/// thread-safe; handlers run on MQTTnet's receive task, one at a time.
/// </summary>
internal sealed partial class MqttLink : IHostedService, IAsyncDisposable
{
    private const int SubscribeBatch = 200;
    private readonly MqttOptions _options;
    private readonly MqttTopics _topics;
    private readonly DaemonMetrics _metrics;
    private readonly TimeProvider _time;
    private readonly ILogger<MqttLink> _logger;
    private readonly MqttClientFactory _factory = new();
    private readonly BrokerStreamProvider _streams = new();
    private readonly IMqttClient _client;
    private readonly ConcurrentDictionary<string, MqttMessageHandler> _handlers = new(StringComparer.Ordinal);
    private readonly ConcurrentDictionary<string, byte> _subscribed = new(StringComparer.Ordinal);
    private readonly string _broker;
    private CancellationTokenSource? _stop;
    private Task? _loop;
    private int _connections;
    private long _lastReceived;
    private int _disposed;
    private volatile bool _online;

    public MqttLink(IOptions<SoftSensorOptions> options, MqttTopics topics, DaemonMetrics metrics, TimeProvider time, ILogger<MqttLink> logger)
    {
        _options = options.Value.Mqtt;
        _topics = topics;
        _metrics = metrics;
        _time = time;
        _logger = logger;
        _broker = $"mqtt{(_options.Tls ? "s" : "")}://{_options.Host}:{_options.Port}";
        _client = _factory.CreateMqttClient();
        _client.ApplicationMessageReceivedAsync += OnMessageAsync;
    }

    /// <summary>True while connected and the status says online.</summary>
    public bool IsOnline => _online;

    /// <summary>Number of successful connections so far (1 after the first).</summary>
    public int Connections => Volatile.Read(ref _connections);

    /// <summary>True when the broker granted the subscription to <paramref name="topic"/> on the current connection.</summary>
    public bool IsSubscribed(string topic) => _online && _subscribed.ContainsKey(topic);

    /// <summary>Raised with true when the link comes up and false when it goes down.</summary>
    public event Action<bool>? OnlineChanged;

    /// <summary>Registers a handler for an exact topic and subscribes at once when connected.</summary>
    public void Subscribe(string topic, MqttMessageHandler handler)
    {
        _handlers[topic] = handler;
        if (_online)
        {
            _ = SubscribeAsync([topic], CancellationToken.None);
        }
    }

    /// <summary>Removes a handler (the subscription stays until the next reconnect; messages are ignored).</summary>
    public void Unsubscribe(string topic) => _handlers.TryRemove(topic, out _);

    /// <summary>
    /// Holds this connection's writes back (gathered, not sent) until <see cref="ReleaseWritesAsync"/>:
    /// for a burst of publishes. Nothing that waits for the broker's answer may be awaited meanwhile.
    /// </summary>
    public void HoldWrites() => _streams.Current?.Hold();

    /// <summary>Sends the writes held back and lets writes through again.</summary>
    public ValueTask ReleaseWritesAsync(CancellationToken cancellationToken) =>
        _streams.Current is { } stream ? stream.ReleaseAsync(cancellationToken) : ValueTask.CompletedTask;

    /// <summary>Publishes with QoS 1; false (counted and logged) when offline or the broker did not accept it.</summary>
    public async ValueTask<bool> PublishAsync(string topic, ReadOnlyMemory<byte> payload, bool retain, CancellationToken cancellationToken)
    {
        if (!_online)
        {
            _metrics.PublishFailures.Add(1, new KeyValuePair<string, object?>("sink", "mqtt"));
            return false;
        }

        var message = new MqttApplicationMessageBuilder()
            .WithTopic(topic)
            .WithPayload(System.Runtime.InteropServices.MemoryMarshal.TryGetArray(payload, out var segment) ? segment : new ArraySegment<byte>(payload.ToArray()))
            .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce)
            .WithRetainFlag(retain)
            .Build();
        try
        {
            var result = await _client.PublishAsync(message, cancellationToken);
            // A QoS 1 publish nobody subscribed to reports NoMatchingSubscribers with success (docs/daemon.md).
            if (result.IsSuccess)
            {
                return true;
            }

            MqttLog.PublishFailed(_logger, topic, result.ReasonCode.ToString());
        }
        catch (Exception e) when (e is MQTTnet.Exceptions.MqttCommunicationException or InvalidOperationException or OperationCanceledException && !cancellationToken.IsCancellationRequested)
        {
            MqttLog.PublishFailed(_logger, topic, e.Message);
        }

        _metrics.PublishFailures.Add(1, new KeyValuePair<string, object?>("sink", "mqtt"));
        return false;
    }

    public Task StartAsync(CancellationToken cancellationToken)
    {
        _stop = new CancellationTokenSource();
        _loop = SuperviseAsync(_stop.Token);
        return Task.CompletedTask;
    }

    public async Task StopAsync(CancellationToken cancellationToken)
    {
        if (_stop is null || _loop is null)
        {
            return;
        }

        await _stop.CancelAsync();
        await _loop;
        if (_client.IsConnected)
        {
            try
            {
                await PublishStatusAsync("offline", cancellationToken);
                await _client.DisconnectAsync(new MqttClientDisconnectOptionsBuilder().WithReason(MqttClientDisconnectOptionsReason.NormalDisconnection).Build(), cancellationToken);
            }
            catch (Exception e) when (e is MQTTnet.Exceptions.MqttCommunicationException or OperationCanceledException)
            {
                MqttLog.PublishFailed(_logger, _topics.Status, e.Message);
            }
        }

        SetOnline(false);
        MqttLog.Closed(_logger, _broker, _topics.Status);
    }

    public async ValueTask DisposeAsync()
    {
        // DI disposes this twice (as itself and as the hosted service it also is).
        if (Interlocked.Exchange(ref _disposed, 1) == 1)
        {
            return;
        }

        _stop?.Cancel();
        if (_loop is not null)
        {
            await _loop;
        }

        _client.Dispose();
        _stop?.Dispose();
    }
}

using System.Buffers;
using System.Collections.Concurrent;
using System.Text;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using MQTTnet;
using MQTTnet.Protocol;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Status;

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
internal sealed class MqttLink : IHostedService, IAsyncDisposable
{
    private const int SubscribeBatch = 200;
    private readonly MqttOptions _options;
    private readonly MqttTopics _topics;
    private readonly DaemonMetrics _metrics;
    private readonly TimeProvider _time;
    private readonly ILogger<MqttLink> _logger;
    private readonly MqttClientFactory _factory = new();
    private readonly IMqttClient _client;
    private readonly ConcurrentDictionary<string, MqttMessageHandler> _handlers = new(StringComparer.Ordinal);
    private readonly ConcurrentDictionary<string, byte> _subscribed = new(StringComparer.Ordinal);
    private readonly string _broker;
    private CancellationTokenSource? _stop;
    private Task? _loop;
    private int _connections;
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
            .WithPayload(payload.ToArray())
            .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce)
            .WithRetainFlag(retain)
            .Build();
        try
        {
            var result = await _client.PublishAsync(message, cancellationToken);
            // A QoS 1 publish nobody subscribed to reports NoMatchingSubscribers with success (INTEGRATION.md).
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

    private async Task SuperviseAsync(CancellationToken stop)
    {
        var delay = _options.ReconnectMinDelay;
        while (!stop.IsCancellationRequested)
        {
            string? failure = await TryConnectAsync(stop);
            if (failure is null)
            {
                delay = _options.ReconnectMinDelay;
                await WatchAsync(stop);
                continue;
            }

            if (stop.IsCancellationRequested)
            {
                break;
            }

            var wait = Jitter(delay);
            MqttLog.ConnectFailed(_logger, _broker, failure, wait);
            if (!await DelayAsync(wait, stop))
            {
                break;
            }

            delay = TimeSpan.FromTicks(Math.Min(delay.Ticks * 2, _options.ReconnectMaxDelay.Ticks));
        }
    }

    /// <summary>Pings until a ping fails or the stop is requested; a failure takes the link down.</summary>
    private async Task WatchAsync(CancellationToken stop)
    {
        while (await DelayAsync(_options.PingInterval, stop))
        {
            if (!_client.IsConnected || !await PingAsync(stop))
            {
                if (stop.IsCancellationRequested)
                {
                    return;
                }

                SetOnline(false);
                MqttLog.Lost(_logger, _broker);
                await DropAsync();
                return;
            }
        }
    }

    /// <summary>Closes a half-open link so that the next connect starts fresh.</summary>
    private async Task DropAsync()
    {
        if (!_client.IsConnected)
        {
            return;
        }

        try
        {
            using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(2));
            await _client.DisconnectAsync(new MqttClientDisconnectOptionsBuilder().Build(), timeout.Token);
        }
        catch (Exception e) when (e is MQTTnet.Exceptions.MqttCommunicationException or InvalidOperationException or OperationCanceledException)
        {
            // The link is already gone; the next connect starts a fresh one.
        }
    }

    private async Task<bool> PingAsync(CancellationToken stop)
    {
        using var timeout = CancellationTokenSource.CreateLinkedTokenSource(stop);
        timeout.CancelAfter(_options.PingInterval * 2);
        try
        {
            await _client.PingAsync(timeout.Token);
            return true;
        }
        catch (Exception e) when (e is MQTTnet.Exceptions.MqttCommunicationException or OperationCanceledException or InvalidOperationException)
        {
            return false;
        }
    }

    private async Task<string?> TryConnectAsync(CancellationToken stop)
    {
        try
        {
            using var timeout = CancellationTokenSource.CreateLinkedTokenSource(stop);
            timeout.CancelAfter(TimeSpan.FromSeconds(10));
            var result = await _client.ConnectAsync(BuildOptions(), timeout.Token);
            // MQTTnet 5 does not throw on a refused CONNACK: check the result code (INTEGRATION.md).
            if (result.ResultCode != MqttClientConnectResultCode.Success)
            {
                MqttLog.Refused(_logger, _broker, result.ResultCode.ToString(), result.ReasonString ?? "");
                return "refused: " + result.ResultCode;
            }

            _subscribed.Clear();
            var subscribed = _handlers.Keys.ToList();
            await SubscribeAsync(subscribed, stop);
            await PublishStatusAsync("online", stop);
            if (Interlocked.Increment(ref _connections) > 1)
            {
                _metrics.Reconnects.Add(1);
            }

            SetOnline(true);

            // Handlers registered while connecting: Subscribe saw the link offline and left them to us.
            var late = _handlers.Keys.Except(subscribed, StringComparer.Ordinal).ToList();
            if (late.Count > 0)
            {
                await SubscribeAsync(late, stop);
            }

            MqttLog.Connected(_logger, _broker, _options.ClientId, _handlers.Count, _topics.Status);
            return null;
        }
        catch (Exception e) when (e is MQTTnet.Exceptions.MqttCommunicationException or OperationCanceledException or InvalidOperationException or System.Net.Sockets.SocketException)
        {
            SetOnline(false);
            await DropAsync();
            return e.Message;
        }
    }

    private async Task SubscribeAsync(IReadOnlyList<string> topics, CancellationToken cancellationToken)
    {
        for (int i = 0; i < topics.Count; i += SubscribeBatch)
        {
            var builder = _factory.CreateSubscribeOptionsBuilder();
            foreach (var t in topics.Skip(i).Take(SubscribeBatch))
            {
                builder.WithTopicFilter(t, MqttQualityOfServiceLevel.AtLeastOnce);
            }

            var result = await _client.SubscribeAsync(builder.Build(), cancellationToken);
            foreach (var item in result.Items)
            {
                if ((int)item.ResultCode > (int)MqttClientSubscribeResultCode.GrantedQoS2)
                {
                    MqttLog.SubscribeRefused(_logger, item.TopicFilter.Topic, item.ResultCode.ToString());
                }
                else
                {
                    _subscribed[item.TopicFilter.Topic] = 0;
                }
            }
        }
    }

    private async Task PublishStatusAsync(string status, CancellationToken cancellationToken)
    {
        var message = new MqttApplicationMessageBuilder()
            .WithTopic(_topics.Status)
            .WithPayload(Encoding.UTF8.GetBytes(status))
            .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce)
            .WithRetainFlag(true)
            .Build();
        await _client.PublishAsync(message, cancellationToken);
    }

    private MqttClientOptions BuildOptions()
    {
        var b = new MqttClientOptionsBuilder()
            .WithTcpServer(_options.Host, _options.Port)
            .WithClientId(_options.ClientId)
            .WithCleanSession(true)
            .WithKeepAlivePeriod(_options.PingInterval * 3)
            .WithTimeout(TimeSpan.FromSeconds(10))
            .WithWillTopic(_topics.Status)
            .WithWillPayload(Encoding.UTF8.GetBytes("offline"))
            .WithWillRetain(true)
            .WithWillQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce);
        if (_options.Username.Length > 0)
        {
            b.WithCredentials(_options.Username, _options.Password);
        }

        if (_options.Tls)
        {
            bool untrusted = _options.TlsAllowUntrusted;
            if (untrusted)
            {
                MqttLog.UntrustedTls(_logger, _broker);
            }

            b.WithTlsOptions(t =>
            {
                t.UseTls();
                if (untrusted)
                {
                    t.WithCertificateValidationHandler(_ => true);
                }
            });
        }

        return b.Build();
    }

    private async Task OnMessageAsync(MqttApplicationMessageReceivedEventArgs e)
    {
        var topic = e.ApplicationMessage.Topic;
        if (_handlers.TryGetValue(topic, out var handler))
        {
            await handler(topic, e.ApplicationMessage.Payload);
        }
    }

    private void SetOnline(bool online)
    {
        if (_online == online)
        {
            return;
        }

        _online = online;
        OnlineChanged?.Invoke(online);
    }

    private async Task<bool> DelayAsync(TimeSpan delay, CancellationToken stop)
    {
        try
        {
            await Task.Delay(delay, _time, stop);
            return true;
        }
        catch (OperationCanceledException)
        {
            return false;
        }
    }

    /// <summary>±20 % jitter, so that many daemons do not reconnect in step after a broker restart.</summary>
    private static TimeSpan Jitter(TimeSpan delay) => delay * (0.8 + 0.4 * Random.Shared.NextDouble());
}

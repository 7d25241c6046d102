using System.Buffers;
using System.Collections.Concurrent;
using System.Text;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;
using MQTTnet;
using MQTTnet.Protocol;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>The connection side of <see cref="MqttLink"/>: the supervising loop, ping watch, connect, subscribe, status and back-off.</summary>
internal sealed partial class MqttLink
{
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

                // A late PINGRESP while messages keep arriving is a busy broker or a full socket, not a dead
                // link: dropping it would lose everything the broker sends until the resubscription is done.
                if (_client.IsConnected && _time.GetElapsedTime(Volatile.Read(ref _lastReceived)) < _options.PingInterval * 2)
                {
                    MqttLog.PingLate(_logger, _broker);
                    continue;
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
            // MQTTnet 5 does not throw on a refused CONNACK: check the result code (docs/daemon.md).
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
            .WithStreamProvider(_streams)
            .WithClientId(_options.ClientId)
            .WithCleanSession(true)
            .WithKeepAlivePeriod(_options.PingInterval * 3)
            .WithTimeout(TimeSpan.FromSeconds(10))
            // One write per packet instead of header and payload apart: half the send calls under load.
            .WithoutPacketFragmentation()
            .WithWillTopic(_topics.Status)
            .WithWillPayload(Encoding.UTF8.GetBytes("offline"))
            .WithWillRetain(true)
            .WithWillQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce);
        if (_options.Username.Length > 0)
        {
            b.WithCredentials(_options.Username, MqttSecrets.Password(_options));
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
                else if (_options.TlsCaFile.Length > 0)
                {
                    var ca = MqttSecrets.LoadCa(_options.TlsCaFile);
                    t.WithCertificateValidationHandler(a => MqttSecrets.ValidateAgainst(ca, a.Certificate, a.SslPolicyErrors));
                }

                if (_options.TlsClientCertificateFile.Length > 0)
                {
                    t.WithClientCertificates([MqttSecrets.LoadClientCertificate(_options.TlsClientCertificateFile, _options.TlsClientKeyFile)]);
                }
            });
        }

        return b.Build();
    }

    private async Task OnMessageAsync(MqttApplicationMessageReceivedEventArgs e)
    {
        Volatile.Write(ref _lastReceived, _time.GetTimestamp());
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

using System.Text;
using System.Threading.Channels;
using MQTTnet;
using MQTTnet.Protocol;

namespace SoftSensor.Daemon.Tests.Fixtures;

/// <summary>An MQTTnet client for tests: publishes text, collects what arrives on its subscriptions.</summary>
internal sealed class TestMqttClient : IAsyncDisposable
{
    private readonly IMqttClient _client = new MqttClientFactory().CreateMqttClient();
    private readonly Channel<(string Topic, string Payload, bool Retained)> _received = Channel.CreateUnbounded<(string, string, bool)>();

    private TestMqttClient()
    {
        _client.ApplicationMessageReceivedAsync += e =>
        {
            _received.Writer.TryWrite((e.ApplicationMessage.Topic, Encoding.UTF8.GetString(e.ApplicationMessage.Payload), e.ApplicationMessage.Retain));
            return Task.CompletedTask;
        };
    }

    public static async Task<TestMqttClient> ConnectAsync(int port, string clientId)
    {
        var c = new TestMqttClient();
        var result = await c._client.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", port).WithClientId(clientId).Build());
        Assert.Equal(MqttClientConnectResultCode.Success, result.ResultCode);
        return c;
    }

    public async Task SubscribeAsync(string filter) =>
        await _client.SubscribeAsync(new MqttClientSubscribeOptionsBuilder().WithTopicFilter(filter, MqttQualityOfServiceLevel.AtLeastOnce).Build());

    public async Task PublishAsync(string topic, string payload, bool retain = false) =>
        await _client.PublishAsync(new MqttApplicationMessageBuilder().WithTopic(topic).WithPayload(payload)
            .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtLeastOnce).WithRetainFlag(retain).Build());

    /// <summary>The first message (from now on) that satisfies <paramref name="match"/>, or a failed assertion after <paramref name="timeout"/>.</summary>
    public async Task<(string Topic, string Payload)> WaitForAsync(Func<string, string, bool> match, TimeSpan timeout, string what)
    {
        using var cts = new CancellationTokenSource(timeout);
        try
        {
            while (true)
            {
                var (topic, payload, _) = await _received.Reader.ReadAsync(cts.Token);
                if (match(topic, payload))
                {
                    return (topic, payload);
                }
            }
        }
        catch (OperationCanceledException)
        {
            Assert.Fail($"no MQTT message within {timeout}: {what}");
            throw;
        }
    }

    /// <summary>Drops what arrived so far.</summary>
    public void Clear()
    {
        while (_received.Reader.TryRead(out _))
        {
        }
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

using System.Diagnostics;
using System.Globalization;
using MQTTnet;
using MQTTnet.Protocol;
using SoftSensor.Simulation;

namespace SoftSensor.LoadTest;

/// <summary>
/// Publishes, every second, a burst of 20 tags per reactor (QoS 0, JSON value and ISO 8601 source
/// timestamp taken just before each publish), the reactors' bursts spread evenly over the second
/// and the trigger tag last in each. Values come from one virtual reactor (invented demo scenario)
/// stepped one second per second and shared by all reactors; the extra roles are constants.
/// </summary>
internal sealed class LoadPublisher(int port, int reactors, IReadOnlyList<string> tags, VirtualReactor sim) : IAsyncDisposable
{
    private readonly IMqttClient _client = new MqttClientFactory().CreateMqttClient();
    private readonly List<double> _lagMs = [];

    /// <summary>Tag messages published (all 20 of each burst).</summary>
    public long Published { get; private set; }

    /// <summary>Messages on mapped topics (19 of 20).</summary>
    public long PublishedMapped { get; private set; }

    /// <summary>How late bursts started against their schedule, ms (the generator keeping up).</summary>
    public IReadOnlyList<double> LagMs => _lagMs;

    public void ClearLag() => _lagMs.Clear();

    public async Task ConnectAsync()
    {
        var r = await _client.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer("127.0.0.1", port).WithClientId("softsensor-load-publisher").WithCleanSession().Build());
        if (r.ResultCode != MqttClientConnectResultCode.Success)
        {
            throw new InvalidOperationException($"publisher: broker refused the connection: {r.ResultCode}");
        }
    }

    /// <summary>Publishes until <paramref name="cancellationToken"/> fires.</summary>
    public async Task RunAsync(CancellationToken cancellationToken)
    {
        var start = Stopwatch.GetTimestamp();
        var values = new Dictionary<string, double>(StringComparer.Ordinal);
        for (long second = 0; !cancellationToken.IsCancellationRequested; second++)
        {
            sim.Step(TimeSpan.FromSeconds(1));
            Fill(values);
            for (int i = 0; i < reactors && !cancellationToken.IsCancellationRequested; i++)
            {
                double dueS = second + (double)i / reactors;
                double nowS = Stopwatch.GetElapsedTime(start).TotalSeconds;
                if (dueS - nowS > 0.001)
                {
                    await Task.Delay(TimeSpan.FromSeconds(dueS - nowS), cancellationToken).ConfigureAwait(false);
                    nowS = Stopwatch.GetElapsedTime(start).TotalSeconds;
                }

                // A burst is never cut short: cancelling a publish half-written would corrupt the MQTT stream.
                _lagMs.Add(Math.Max(0, (nowS - dueS) * 1000));
                await PublishAsync(LoadConfig.Topic(i, LoadConfig.SpareTag), 0).ConfigureAwait(false);
                foreach (var tag in tags)
                {
                    await PublishAsync(LoadConfig.Topic(i, tag), values[tag]).ConfigureAwait(false);
                    PublishedMapped++;
                }
            }
        }
    }

    private void Fill(Dictionary<string, double> values)
    {
        foreach (var (name, v) in sim.ReadTags())
        {
            values[name] = v;
        }

        values["R1.N2.FLOW"] = 0;
        values["R1.CO2.FLOW"] = 0;
        values["R1.ANALYSER.TEMP"] = 30;
        values["R1.ANALYSER.CAL"] = 0;
        values["R1.REMOVED"] = 0;
        values["R1.WEIGHT.KG"] = values["R1.WEIGHT"];
    }

    private async Task PublishAsync(string topic, double value)
    {
        string payload = string.Create(CultureInfo.InvariantCulture, $"{{\"value\":{value:R},\"timestamp\":\"{DateTime.UtcNow:O}\"}}");
        var message = new MqttApplicationMessageBuilder().WithTopic(topic).WithPayload(payload).WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtMostOnce).Build();
        await _client.PublishAsync(message, CancellationToken.None).ConfigureAwait(false);
        Published++;
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

using System.Globalization;
using System.Text;
using MQTTnet;
using MQTTnet.Protocol;
using SoftSensor.Simulation;

namespace SoftSensor.Daemon.Demo;

/// <summary>
/// Drives the virtual reactor on the demo's accelerated clock and publishes its signals to the broker
/// as a plant gateway would: one JSON message per tag of the definition, <c>{"value", "timestamp",
/// "quality"}</c>, on the tag's topic, every scenario output interval of simulated time, retained
/// (as a gateway keeps the last value), so a daemon that subscribes late gets every tag at once.
/// </summary>
internal sealed class DemoPublisher
{
    private readonly VirtualReactor _reactor;
    private readonly TimeProvider _clock;
    private readonly string _clientId;
    private readonly IReadOnlyList<VirtualTagRoute> _routes;

    public DemoPublisher(VirtualReactor reactor, TimeProvider clock, string clientId, IReadOnlyList<VirtualTagRoute> routes)
    {
        _reactor = reactor;
        _clock = clock;
        _clientId = clientId;
        _routes = routes;
    }

    /// <summary>The topic of a simulator tag in the demo definition (R1.AIR.FLOW → demo/r1/air.flow).</summary>
    public static string Topic(string reactorId, string tagName) =>
        $"demo/{reactorId}/{tagName[(tagName.IndexOf('.', StringComparison.Ordinal) + 1)..].ToLowerInvariant()}";

    /// <summary>Publishes until cancelled.</summary>
    public async Task RunAsync(string host, int port, CancellationToken cancellationToken)
    {
        using var client = new MqttClientFactory().CreateMqttClient();
        var result = await client.ConnectAsync(new MqttClientOptionsBuilder().WithTcpServer(host, port).WithClientId(_clientId).Build(), cancellationToken);
        if (result.ResultCode != MqttClientConnectResultCode.Success)
        {
            throw new InvalidOperationException($"the demo broker refused the simulator: {result.ResultCode}");
        }

        var interval = TimeSpan.FromSeconds(_reactor.Scenario.OutputIntervalS);
        var values = new double[_reactor.Tags.Count];
        using var timer = new PeriodicTimer(interval, _clock);
        // The culture is defined up to the scenario's end; a clock past it (the last moments of a run) holds the last state.
        var end = _reactor.Scenario.StartTime + TimeSpan.FromHours(_reactor.Scenario.DurationH);
        do
        {
            var now = _clock.GetUtcNow();
            var lag = (now < end ? now : end) - _reactor.Time;
            if (lag > TimeSpan.Zero)
            {
                _reactor.Step(lag);
            }

            _reactor.ReadTags(values);
            string time = _reactor.Time.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss'Z'", CultureInfo.InvariantCulture);
            foreach (var route in _routes)
            {
                double raw = route.Raw(values);
                string json = string.Create(CultureInfo.InvariantCulture, $$"""{"value":{{raw:R}},"timestamp":"{{time}}","quality":"good"}""");
                var message = new MqttApplicationMessageBuilder().WithTopic(route.Topic).WithPayload(Encoding.UTF8.GetBytes(json))
                    .WithQualityOfServiceLevel(MqttQualityOfServiceLevel.AtMostOnce).WithRetainFlag().Build();
                await client.PublishAsync(message, cancellationToken);
            }
        }
        while (await timer.WaitForNextTickAsync(cancellationToken));
    }
}

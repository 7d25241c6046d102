using System.Buffers;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Options;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Mqtt;

namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// Takes operator commands from MQTT: one command topic per reactor,
/// <c>{prefix}/{site}/{area}/{reactor}/command/alarm</c> (a subtree of its own, docs/daemon.md), JSON
/// as in <see cref="AlarmCommandPayload"/>. The outcome goes to <c>.../command/alarm/result</c>
/// (not retained): applied with the transitions, or refused with the reason.
/// </summary>
internal sealed class AlarmCommandListener(MqttLink link, AlarmService alarms, IOptions<SoftSensorOptions> options, Microsoft.Extensions.Logging.ILogger<AlarmCommandListener> logger) : IHostedService
{
    public static string CommandTopic(SoftSensorOptions o, string reactor) => $"{o.Mqtt.TopicPrefix}/{o.Site}/{o.Area}/{reactor}/command/alarm";

    public Task StartAsync(CancellationToken cancellationToken)
    {
        foreach (var reactor in options.Value.Reactors)
        {
            string topic = CommandTopic(options.Value, reactor.Id);
            link.Subscribe(topic, (t, payload) => HandleAsync(reactor.Id, t, payload));
        }

        return Task.CompletedTask;
    }

    public Task StopAsync(CancellationToken cancellationToken)
    {
        foreach (var reactor in options.Value.Reactors)
        {
            link.Unsubscribe(CommandTopic(options.Value, reactor.Id));
        }

        return Task.CompletedTask;
    }

    private async ValueTask HandleAsync(string reactor, string topic, ReadOnlySequence<byte> payload)
    {
        if (!CommandPayloadLimit.Allows(logger, topic, payload.Length))
        {
            return;
        }

        var result = await alarms.CommandAsync(payload.ToArray(), reactor, CancellationToken.None);
        var reply = new AlarmCommandReply(result.Applied, result.Message,
            [.. result.Transitions.Select(t => new AlarmCommandReplyItem(t.RuleId, Core.Alarms.AlarmStates.Id(t.From), Core.Alarms.AlarmStates.Id(t.To)))]);
        await link.PublishAsync(topic + "/result", AlarmPayloads.Serialize(reply), retain: false, CancellationToken.None);
    }
}

/// <summary>The answer to a command (MQTT result topic and the status page's POST).</summary>
internal sealed record AlarmCommandReply(bool Applied, string Message, IReadOnlyList<AlarmCommandReplyItem> Transitions);

/// <summary>One transition a command caused.</summary>
internal sealed record AlarmCommandReplyItem(string Alarm, string From, string To);

using Microsoft.Extensions.Logging;
using SoftSensor.Daemon.Mqtt;

namespace SoftSensor.Daemon.Alarming;

/// <summary>
/// Publishes alarms on MQTT (docs/daemon.md: retained for latest state, not for event streams;
/// QoS 1): the state of each alarm retained on <c>.../{reactor}/alarm/{id}</c>, each transition on
/// <c>.../{reactor}/alarm/{id}/event</c>. While the broker is down nothing is queued here: the
/// journal has every transition, and the next transition republishes the retained state.
/// </summary>
internal sealed class MqttAlarmPublisher(MqttLink link, MqttTopics topics, ILogger<MqttAlarmPublisher> log) : IAlarmPublisher
{
    public async ValueTask PublishAsync(AlarmStateDocument state, AlarmEventDocument transition, CancellationToken cancellationToken)
    {
        string topic = topics.Alarm(state.Reactor, state.Alarm);
        if (!await link.PublishAsync(topic, AlarmPayloads.Serialize(state), retain: true, cancellationToken))
        {
            AlarmLog.PublishFailed(log, topic);
        }

        if (!await link.PublishAsync(topic + "/event", AlarmPayloads.Serialize(transition), retain: false, cancellationToken))
        {
            AlarmLog.PublishFailed(log, topic + "/event");
        }
    }
}

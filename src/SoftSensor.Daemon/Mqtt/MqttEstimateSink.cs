using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// Publishes every value of a frame to <c>{prefix}/{site}/{area}/{reactor}/estimate/{name}</c> as JSON
/// (<see cref="EstimatePayload"/>), retained, QoS 1, all values of a frame in flight together. While
/// the link is down the publishes are counted as failures and skipped: the next frame after the
/// reconnect replaces the retained values, and the embedded store keeps the history.
/// </summary>
internal sealed class MqttEstimateSink(MqttLink link, MqttTopics topics) : IEstimateSink
{
    public string Name => "mqtt";

    public async ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken)
    {
        var pending = new Task<bool>[frame.Values.Count];
        for (int i = 0; i < pending.Length; i++)
        {
            var v = frame.Values[i];
            pending[i] = link.PublishAsync(topics.Estimate(frame.Reactor, v.Name), EstimatePayload.Encode(v, frame.SourceTime), retain: true, cancellationToken).AsTask();
        }

        await Task.WhenAll(pending);
    }
}

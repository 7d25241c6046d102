using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// Publishes every value of a frame to <c>{prefix}/{site}/{area}/{reactor}/estimate/{name}</c> as JSON
/// (<see cref="EstimatePayload"/>), retained, QoS 1, all values of the frames dispatched together in flight at once. While
/// the link is down the publishes are counted as failures and skipped: the next frame after the
/// reconnect replaces the retained values, and the embedded store keeps the history.
/// </summary>
internal sealed class MqttEstimateSink(MqttLink link, MqttTopics topics) : IEstimateBatchSink
{
    public string Name => "mqtt";

    public ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken) => WriteBatchAsync([frame], cancellationToken);

    /// <summary>Every value of every frame in flight together (QoS 1: the broker acknowledges each).</summary>
    public async ValueTask WriteBatchAsync(IReadOnlyList<EstimateFrame> frames, CancellationToken cancellationToken)
    {
        var pending = new List<Task<bool>>(frames.Count * 32);
        foreach (var frame in frames)
        {
            foreach (var v in frame.Values)
            {
                pending.Add(link.PublishAsync(topics.Estimate(frame.Reactor, v.Name), EstimatePayload.Encode(v, frame.SourceTime), retain: true, cancellationToken).AsTask());
            }
        }

        await Task.WhenAll(pending);
    }
}

using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// Publishes every value of a frame to <c>{prefix}/{site}/{area}/{reactor}/estimate/{name}</c> as JSON
/// (<see cref="EstimatePayload"/>), retained, QoS 1, all values of the frames dispatched together in flight at once. While
/// the link is down the publishes are counted as failures and skipped: the next frame after the
/// reconnect replaces the retained values, and the embedded store keeps the history. The batch and
/// its phase go to the retained <c>.../{reactor}/batch</c> topic (<c>{"batchId":"gly-7","phase":"fed-batch",
/// "timestamp":...}</c>) when they change, and again every <see cref="BatchRepeatFrames"/> frames.
/// </summary>
internal sealed class MqttEstimateSink(MqttLink link, MqttTopics topics) : IEstimateBatchSink
{
    private const int BatchRepeatFrames = 60;
    private readonly Dictionary<string, (string Batch, string Phase, int Frames)> _batches = new(StringComparer.Ordinal);

    public string Name => "mqtt";

    public ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken) => WriteBatchAsync([frame], cancellationToken);

    /// <summary>Every value of every frame in flight together (QoS 1: the broker acknowledges each).</summary>
    public async ValueTask WriteBatchAsync(IReadOnlyList<EstimateFrame> frames, CancellationToken cancellationToken)
    {
        // Frames arrive one batch at a time from the dispatcher: the dictionary needs no lock.
        foreach (var frame in frames)
        {
            bool same = _batches.TryGetValue(frame.Reactor, out var last) && last.Batch == frame.BatchId && last.Phase == frame.Phase;
            if (!same || last.Frames >= BatchRepeatFrames)
            {
                bool sent = await link.PublishAsync(topics.Batch(frame.Reactor), BatchPayload(frame), retain: true, cancellationToken);
                _batches[frame.Reactor] = (frame.BatchId, frame.Phase, sent ? 1 : BatchRepeatFrames);
            }
            else
            {
                _batches[frame.Reactor] = last with { Frames = last.Frames + 1 };
            }
        }

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

    private static byte[] BatchPayload(EstimateFrame frame) => System.Text.Json.JsonSerializer.SerializeToUtf8Bytes(new
    {
        batchId = frame.BatchId,
        phase = frame.Phase,
        timestamp = frame.SourceTime.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", System.Globalization.CultureInfo.InvariantCulture),
    });
}

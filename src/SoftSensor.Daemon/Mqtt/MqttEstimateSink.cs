using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Mqtt;

/// <summary>
/// Publishes every value of a frame to <c>{prefix}/{site}/{area}/{reactor}/estimate/{name}</c> as JSON
/// (<see cref="EstimatePayload"/>), retained, QoS 1. The publishes are pipelined: the call returns once
/// they are handed to the link, and their acknowledgements come back while the dispatcher goes on,
/// with at most <see cref="MaxInFlight"/> unacknowledged (then it waits for the oldest to clear).
/// One connection writes them in call order, so each topic's values reach the broker in cycle order. While
/// the link is down the publishes are counted as failures and skipped: the next frame after the
/// reconnect replaces the retained values, and the embedded store keeps the history. The batch and
/// its phase go to the retained <c>.../{reactor}/batch</c> topic (<c>{"batchId":"gly-7","phase":"fed-batch",
/// "timestamp":...}</c>) when they change, and again every <see cref="BatchRepeatFrames"/> frames.
/// </summary>
internal sealed class MqttEstimateSink(MqttLink link, MqttTopics topics) : IEstimateBatchSink, IPipelinedSink
{
    /// <summary>
    /// Most publishes awaiting their PUBACK. Enough for a round trip at tens of thousands of publishes
    /// a second; small enough that the client's search of its pending acknowledgements stays short.
    /// </summary>
    public const int MaxInFlight = 512;

    private const int BatchRepeatFrames = 60;
    // Not disposed: a late acknowledgement may still release it after the host's disposal (it holds no wait handle).
    private readonly SemaphoreSlim _window = new(MaxInFlight, MaxInFlight);
    private readonly Dictionary<string, (string Batch, string Phase, int Frames)> _batches = new(StringComparer.Ordinal);

    public string Name => "mqtt";

    public ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken) => WriteBatchAsync([frame], cancellationToken);

    /// <summary>
    /// Hands every value of every frame to the link (QoS 1: the broker acknowledges each, later), the
    /// link holding the writes back until all are handed over so that they leave together.
    /// </summary>
    public async ValueTask WriteBatchAsync(IReadOnlyList<EstimateFrame> frames, CancellationToken cancellationToken)
    {
        link.HoldWrites();
        try
        {
            // Frames arrive one batch at a time from the dispatcher: the dictionary needs no lock.
            foreach (var frame in frames)
            {
                bool same = _batches.TryGetValue(frame.Reactor, out var last) && last.Batch == frame.BatchId && last.Phase == frame.Phase;
                if (!same || last.Frames >= BatchRepeatFrames)
                {
                    // Offline shows at once (false, synchronously): then it is sent again with the next frame.
                    bool offline = !await PublishAsync(topics.Batch(frame.Reactor), BatchPayload(frame), cancellationToken);
                    _batches[frame.Reactor] = (frame.BatchId, frame.Phase, offline ? BatchRepeatFrames : 1);
                }
                else
                {
                    _batches[frame.Reactor] = last with { Frames = last.Frames + 1 };
                }
            }

            foreach (var frame in frames)
            {
                foreach (var v in frame.Values)
                {
                    await PublishAsync(topics.Estimate(frame.Reactor, v.Name), EstimatePayload.Encode(v, frame.Time, frame.InputAge), cancellationToken);
                }
            }
        }
        finally
        {
            await link.ReleaseWritesAsync(cancellationToken);
        }
    }

    /// <summary>Hands one publish to the link within the window; false only when it failed at once (offline).</summary>
    private async ValueTask<bool> PublishAsync(string topic, byte[] payload, CancellationToken cancellationToken)
    {
        if (!_window.Wait(0))
        {
            // The window is full: what is held must leave, or no acknowledgement can come back.
            await link.ReleaseWritesAsync(cancellationToken);
            await _window.WaitAsync(cancellationToken);
            link.HoldWrites();
        }

        var publish = link.PublishAsync(topic, payload, retain: true, cancellationToken);
        if (publish.IsCompleted)
        {
            _window.Release();
            return publish.Result;
        }

        _ = ReleaseWhenDoneAsync(publish);
        return true;
    }

    /// <summary>Waits until every publish handed to the link has been acknowledged or failed (failures are counted by the link).</summary>
    public async ValueTask DrainAsync(CancellationToken cancellationToken)
    {
        for (int i = 0; i < MaxInFlight; i++)
        {
            await _window.WaitAsync(cancellationToken);
        }

        _window.Release(MaxInFlight);
    }

    private async Task ReleaseWhenDoneAsync(ValueTask<bool> publish)
    {
        try
        {
            // The link logs and counts a failed publish and returns false; it does not throw.
            await publish;
        }
        finally
        {
            _window.Release();
        }
    }

    private static byte[] BatchPayload(EstimateFrame frame) => System.Text.Json.JsonSerializer.SerializeToUtf8Bytes(new
    {
        batchId = frame.BatchId,
        phase = frame.Phase,
        timestamp = frame.Time.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", System.Globalization.CultureInfo.InvariantCulture),
    });
}

using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Sinks;

namespace SoftSensor.Daemon.Store;

/// <summary>Writes every frame to the embedded store (frames queued together in one transaction). Registered first, so a frame is durable before any network sink sees it.</summary>
internal sealed class SqliteEstimateSink(SqliteStore store) : IEstimateBatchSink
{
    public string Name => "store";

    public async ValueTask WriteAsync(EstimateFrame frame, CancellationToken cancellationToken) =>
        await store.WriteFrameAsync(frame, cancellationToken);

    public async ValueTask WriteBatchAsync(IReadOnlyList<EstimateFrame> frames, CancellationToken cancellationToken) =>
        await store.WriteFramesAsync(frames, cancellationToken);
}

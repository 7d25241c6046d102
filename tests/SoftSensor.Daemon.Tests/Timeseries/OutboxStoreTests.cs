using SoftSensor.Daemon.Timeseries;

namespace SoftSensor.Daemon.Tests.Timeseries;

/// <summary>The SQLite outbox on a real file: order, removal only on acknowledgement, resume, the bound.</summary>
public sealed class OutboxStoreTests : IDisposable
{
    private static readonly DateTimeOffset T = new(2026, 3, 1, 8, 0, 0, TimeSpan.Zero);
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-outbox-").FullName;

    private string Db => Path.Combine(_dir, "softsensor.db");

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void PeekBatch_ReturnsOldestFirstAndMarkSentRemovesOnlyThatBatch()
    {
        using var store = new OutboxStore(Db, 1 << 20);
        for (int i = 0; i < 5; i++)
        {
            Assert.True(store.TryEnqueue($"m f={i} {i}", T.AddSeconds(i)));
        }

        var batch = store.PeekBatch(3);
        Assert.Equal(["m f=0 0", "m f=1 1", "m f=2 2"], batch.Select(e => e.Payload));
        Assert.Equal(5, store.PeekBatch(3).Count + 2); // peeking does not remove
        store.MarkSent(batch);
        Assert.Equal(2, store.Stats.Depth);
        Assert.Equal(T.AddSeconds(3), store.Stats.OldestEnqueued);
        Assert.Equal(["m f=3 3", "m f=4 4"], store.PeekBatch(10).Select(e => e.Payload));
    }

    [Fact]
    public void Open_AfterRestart_ResumesDepthSizeAndOldest()
    {
        using (var store = new OutboxStore(Db, 1 << 20))
        {
            store.TryEnqueue("m f=1 1", T);
            store.TryEnqueue("m f=2 2", T.AddSeconds(1));
            store.RecordAttempt(store.PeekBatch(1));
        }

        using var again = new OutboxStore(Db, 1 << 20);
        Assert.Equal(new OutboxStats(2, 14, T, 1 << 20), again.Stats);
    }

    [Fact]
    public void TryEnqueue_BeyondTheBound_RefusesAndKeepsWhatIsThere()
    {
        using var store = new OutboxStore(Db, 20);
        Assert.True(store.TryEnqueue("0123456789", T));
        Assert.True(store.TryEnqueue("0123456789", T));
        Assert.False(store.TryEnqueue("x", T));
        Assert.Equal(2, store.Stats.Depth);
        Assert.Equal(1.0, store.Stats.Fill);
        store.MarkSent(store.PeekBatch(1));
        Assert.True(store.TryEnqueue("x", T));
    }

    [Fact]
    public void MarkSent_EveryRow_EmptiesStats()
    {
        using var store = new OutboxStore(Db, 1 << 20);
        store.TryEnqueue("a", T);
        store.MarkSent(store.PeekBatch(10));
        Assert.Equal(new OutboxStats(0, 0, null, 1 << 20), store.Stats);
    }
}

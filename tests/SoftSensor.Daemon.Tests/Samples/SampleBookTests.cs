using System.Text;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Time.Testing;
using SoftSensor.Core.Estimation;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Samples;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Samples;

/// <summary>The SQLite book of operator inputs: stored before applied, pending ones survive a restart, a resolution is one transaction.</summary>
public sealed class SampleBookTests : IDisposable
{
    private readonly List<Daemon.Store.SqliteStore> _stores = [];
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-samples-").FullName;
    private readonly FakeTimeProvider _time = new(new DateTimeOffset(2026, 3, 1, 12, 0, 0, TimeSpan.Zero));

    private string Db => Path.Combine(_dir, "store.db");

    public void Dispose()
    {
        _stores.ForEach(s => s.Dispose());
        SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }

    private SampleBook Open()
    {
        var store = new Daemon.Store.SqliteStore(Db, _time);
        _stores.Add(store);
        return new SampleBook(store, _time);
    }

    private SampleEntry Entry(string json) => SamplePayload.Parse(Encoding.UTF8.GetBytes(json), _time.GetUtcNow()).Entry!;

    [Fact]
    public void Enter_pending_survives_a_restart_and_assays_are_recorded_at_once()
    {
        var book = Open();
        var dcw = book.Enter("r1", "b-1", Entry("""{"kind":"dcw","sampledAt":"2026-03-01T09:00:00Z","valueGPerL":4.2,"sigmaGPerL":0.15}"""));
        var glycerol = book.Enter("r1", "b-1", Entry("""{"kind":"substrate","sampledAt":"2026-03-01T09:00:00Z","valueGPerL":2.0,"sigmaGPerL":0.1,"analyte":"glycerol"}"""));
        Assert.Equal(SampleOutcomes.Pending, dcw.Outcome);
        Assert.Equal(SampleOutcomes.Recorded, glycerol.Outcome);

        var reopened = Open();
        var pending = Assert.Single(reopened.Pending("r1"));
        Assert.Equal(dcw.Id, pending.Id);
        Assert.Equal(new DateTimeOffset(2026, 3, 1, 9, 0, 0, TimeSpan.Zero), pending.SampledAt);
        Assert.Equal(_time.GetUtcNow(), pending.EnteredAt);
        Assert.Equal(4.2, pending.ValueGPerL);
        Assert.Equal("glycerol", reopened.Get(glycerol.Id)!.Analyte);
        Assert.Equal(2, reopened.List("r1").Count);
    }

    [Fact]
    public async Task Resolve_writes_outcome_trajectory_and_checkpoint_together()
    {
        var book = Open();
        var dcw = book.Enter("r1", "b-1", Entry("""{"kind":"dcw","sampledAt":"2026-03-01T09:00:00Z","valueGPerL":4.2,"sigmaGPerL":0.15}"""));
        long t0 = dcw.SampledAt.UtcTicks;
        var prior = new TrajectoryPoint(t0, 4.0, 0.3, 4.0, 3.9, 50);
        var correction = new OfflineCorrection(OfflineSampleOutcome.Applied, prior,
            [new TrajectoryPoint(t0, 4.16, 0.134, 4.16, 4.1, 50), new TrajectoryPoint(t0 + TimeSpan.TicksPerMinute, 4.2, 0.14, 4.2, 4.15, 50.1)]);
        var resolved = book.Resolve(dcw, SampleOutcomes.Applied, "ok", correction, new Checkpoint("r1", 42, _time.GetUtcNow(), "STATE", "b-1"));

        Assert.Empty(book.Pending("r1"));
        Assert.Equal(4.0, resolved.PriorGPerL);
        Assert.Equal(4.16, resolved.PosteriorGPerL);
        var stored = Open().Get(dcw.Id)!;
        Assert.Equal(SampleOutcomes.Applied, stored.Outcome);
        Assert.Equal(0.3, stored.PriorSigmaGPerL);
        Assert.Equal(dcw.SampledAt, stored.AppliedAtCycle);
        var points = book.Trajectory("r1", dcw.Id);
        Assert.Equal([4.16, 4.2], points.Select(p => p.BiomassGPerL));
        Assert.Equal(2, book.Latest("r1", dcw.SampledAt, dcw.SampledAt.AddHours(1)).Count);

        using var store = new Daemon.Store.SqliteStore(Db, _time);
        var cp = (await store.LatestCheckpointAsync("r1", default))!;
        Assert.Equal(42, cp.Cycle);
        Assert.Equal("STATE", cp.State);
        Assert.Equal("b-1", cp.Batch);
    }
}

using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Pipeline;
using SoftSensor.Daemon.Store;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Tests.Store;

public sealed class SqliteStoreTests : IDisposable
{
    private static readonly DateTimeOffset T0 = new(2026, 12, 1, 8, 0, 0, TimeSpan.Zero);
    private readonly string _dir = Directory.CreateTempSubdirectory("softsensor-store-").FullName;
    private readonly SqliteStore _store;

    public SqliteStoreTests() => _store = new SqliteStore(Path.Combine(_dir, "s.db"), TimeProvider.System);

    public void Dispose()
    {
        _store.Dispose();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        Directory.Delete(_dir, recursive: true);
    }

    private static EstimateFrame Frame(string reactor, int second, double our) => new(reactor, "b1", T0.AddSeconds(second), SampleQuality.Good,
    [
        new EstimateValue(EstimateNames.Our, our, "mmol/(L·h)", 0.5, SampleQuality.Good, 0),
        new EstimateValue(EstimateNames.Rq, double.NaN, "mol/mol", double.NaN, SampleQuality.Uncertain, 0x40940000),
    ]);

    [Fact]
    public async Task QueryEstimates_by_reactor_name_and_range_returns_the_rows_oldest_first()
    {
        for (int s = 0; s < 10; s++)
        {
            await _store.WriteFrameAsync(Frame("r1", s, 30 + s), default);
            await _store.WriteFrameAsync(Frame("r2", s, 50), default);
        }

        var rows = await _store.QueryEstimatesAsync("r1", EstimateNames.Our, T0.AddSeconds(3), T0.AddSeconds(5), 100, default);

        Assert.Equal([33.0, 34.0, 35.0], rows.Select(r => r.Value));
        Assert.All(rows, r => Assert.Equal("mmol/(L·h)", r.Unit));
        var rq = await _store.QueryEstimatesAsync("r1", EstimateNames.Rq, T0, T0.AddSeconds(1), 100, default);
        Assert.True(double.IsNaN(rq[0].Value));
        Assert.Equal(SampleQuality.Uncertain, rq[0].Quality);
        Assert.Equal(0x40940000u, rq[0].StatusCode);
    }

    [Fact]
    public async Task LatestCheckpoint_returns_the_newest_of_the_reactor()
    {
        await _store.WriteCheckpointAsync(new Checkpoint("r1", 10, T0, "{\"x\":1}"), default);
        await _store.WriteCheckpointAsync(new Checkpoint("r1", 20, T0.AddMinutes(1), "{\"x\":2}"), default);
        await _store.WriteCheckpointAsync(new Checkpoint("r2", 5, T0, "{\"y\":1}"), default);

        var cp = await _store.LatestCheckpointAsync("r1", default);

        Assert.Equal(new Checkpoint("r1", 20, T0.AddMinutes(1), "{\"x\":2}"), cp);
        Assert.Null(await _store.LatestCheckpointAsync("r3", default));
    }

    [Fact]
    public async Task ActiveAlarms_are_the_newest_change_of_each_alarm_when_active()
    {
        await _store.WriteAlarmAsync(new StoredAlarm("r1", "rq_high", T0, "unacknowledged", "high", true, 1.3, "RQ above 1.2"), default);
        await _store.WriteAlarmAsync(new StoredAlarm("r1", "rq_high", T0.AddMinutes(1), "normal", "high", false, 1.0, "RQ back"), default);
        await _store.WriteAlarmAsync(new StoredAlarm("r1", "our_cap", T0.AddMinutes(2), "acknowledged", "medium", true, 90, "OUR near capacity"), default);

        var active = await _store.ActiveAlarmsAsync(default);

        Assert.Equal(["our_cap"], active.Select(a => a.AlarmId));
        Assert.Equal(3, (await _store.QueryAlarmsAsync("r1", T0, T0.AddHours(1), 10, default)).Count);
    }

    [Fact]
    public void Open_sets_write_ahead_logging()
    {
        using var c = new Microsoft.Data.Sqlite.SqliteConnection($"Data Source={_store.Path}");
        c.Open();
        using var cmd = c.CreateCommand();
        cmd.CommandText = "PRAGMA journal_mode";
        Assert.Equal("wal", cmd.ExecuteScalar());
    }
}

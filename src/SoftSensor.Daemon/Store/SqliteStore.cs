using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Configuration;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Store;

/// <summary>
/// The embedded store (SQLite in WAL mode, <see cref="StoreSchema"/>): every estimate frame and alarm
/// change, queryable by reactor, name and time range; and estimator checkpoints (a frame is stored
/// before any network sink sees it). Writes go through one connection, one at a time; reads open their own pooled
/// connections and run beside the writer (WAL). The writer never checkpoints the WAL itself
/// (<c>wal_autocheckpoint=0</c>): a PASSIVE checkpoint runs every second on its own connection, off
/// the dispatch path, so the fsync of a checkpoint never stalls a frame on its way to MQTT.
/// Thread-safe.
/// </summary>
internal sealed partial class SqliteStore : ICheckpointStore, IDisposable
{
    private readonly SemaphoreSlim _writeGate = new(1, 1);
    private readonly SqliteConnection _writer;
    private readonly string _connectionString;
    private readonly TimeProvider _time;
    private readonly ITimer _checkpointer;
    private IFrameCompanion[] _companions = [];

    public SqliteStore(IOptions<SoftSensorOptions> options, TimeProvider time)
        : this(options.Value.Store.Path, time)
    {
    }

    public SqliteStore(string path, TimeProvider time)
    {
        _time = time;
        string full = System.IO.Path.GetFullPath(path);
        Directory.CreateDirectory(System.IO.Path.GetDirectoryName(full)!);
        Path = full;
        _connectionString = new SqliteConnectionStringBuilder { DataSource = full, Pooling = true }.ToString();
        _writer = new SqliteConnection(_connectionString);
        _writer.Open();
        Execute(_writer, "PRAGMA journal_mode=WAL; PRAGMA synchronous=NORMAL; PRAGMA foreign_keys=ON; PRAGMA busy_timeout=5000;");
        Execute(_writer, StoreSchema.Create);
        foreach (var (table, column, sql) in StoreSchema.AddedColumns)
        {
            if (!HasColumn(_writer, table, column))
            {
                Execute(_writer, sql);
            }
        }

        Execute(_writer, $"PRAGMA user_version={StoreSchema.Version};");
        Execute(_writer, "PRAGMA wal_autocheckpoint=0;");
        // Real time, whatever the process clock: this is file maintenance, not part of the process.
        _checkpointer = TimeProvider.System.CreateTimer(_ => CheckpointWal(), null, TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(1));
    }

    private void CheckpointWal()
    {
        try
        {
            using var c = OpenReader();
            Execute(c, "PRAGMA wal_checkpoint(PASSIVE);");
        }
        catch (SqliteException)
        {
            // Busy or closing: the next tick tries again; the WAL only grows meanwhile.
        }
        catch (ObjectDisposedException)
        {
            // Disposed while the timer fired.
        }
    }

    /// <summary>Full path of the database file.</summary>
    public string Path { get; }

    /// <summary>Adds a companion whose rows are committed in the same transaction as each frame (see <see cref="IFrameCompanion"/>).</summary>
    public void Attach(IFrameCompanion companion)
    {
        _writeGate.Wait();
        try
        {
            _companions = [.. _companions, companion];
        }
        finally
        {
            _writeGate.Release();
        }
    }

    /// <summary>Stores a frame with all its values (and the companions' rows) in one transaction; returns the frame's id.</summary>
    public async ValueTask<long> WriteFrameAsync(EstimateFrame frame, CancellationToken cancellationToken) =>
        (await WriteFramesAsync([frame], cancellationToken))[0];

    /// <summary>
    /// Stores frames with all their values (and the companions' rows) in one transaction, in order;
    /// returns their ids. One commit for the frames several reactors finished together.
    /// </summary>
    public async ValueTask<long[]> WriteFramesAsync(IReadOnlyList<EstimateFrame> frames, CancellationToken cancellationToken)
    {
        await _writeGate.WaitAsync(cancellationToken);
        try
        {
            var ids = new long[frames.Count];
            var after = new List<Action>();
            using var tx = _writer.BeginTransaction();
            using var f = _writer.CreateCommand();
            f.Transaction = tx;
            f.CommandText = "INSERT INTO frames (reactor, batch, time_ms, quality, phase) VALUES ($r, $b, $t, $q, $p) RETURNING id";
            var fr = f.Parameters.Add("$r", SqliteType.Text);
            var fb = f.Parameters.Add("$b", SqliteType.Text);
            var ft = f.Parameters.Add("$t", SqliteType.Integer);
            var fq = f.Parameters.Add("$q", SqliteType.Integer);
            var fp = f.Parameters.Add("$p", SqliteType.Text);
            f.Prepare();
            using var e = _writer.CreateCommand();
            e.Transaction = tx;
            e.CommandText = "INSERT INTO estimates (frame_id, reactor, name, time_ms, value, sigma, unit, quality, status_code) VALUES ($f, $r, $n, $t, $v, $s, $u, $q, $c)";
            var pf = e.Parameters.Add("$f", SqliteType.Integer);
            var pr = e.Parameters.Add("$r", SqliteType.Text);
            var pn = e.Parameters.Add("$n", SqliteType.Text);
            var pt = e.Parameters.Add("$t", SqliteType.Integer);
            var pv = e.Parameters.Add("$v", SqliteType.Real);
            var ps = e.Parameters.Add("$s", SqliteType.Real);
            var pu = e.Parameters.Add("$u", SqliteType.Text);
            var pq = e.Parameters.Add("$q", SqliteType.Integer);
            var pc = e.Parameters.Add("$c", SqliteType.Integer);
            e.Prepare();
            for (int k = 0; k < frames.Count; k++)
            {
                var frame = frames[k];
                long ms = frame.SourceTime.ToUnixTimeMilliseconds();
                fr.Value = frame.Reactor;
                fb.Value = frame.BatchId;
                ft.Value = ms;
                fq.Value = (int)frame.Quality;
                fp.Value = frame.Phase;
                long id = (long)f.ExecuteScalar()!;
                ids[k] = id;
                pf.Value = id;
                pr.Value = frame.Reactor;
                pt.Value = ms;
                foreach (var v in frame.Values)
                {
                    pn.Value = v.Name;
                    pv.Value = double.IsFinite(v.Value) ? v.Value : DBNull.Value;
                    ps.Value = double.IsFinite(v.Sigma) ? v.Sigma : DBNull.Value;
                    pu.Value = v.Unit;
                    pq.Value = (int)v.Quality;
                    pc.Value = (long)v.StatusCode;
                    e.ExecuteNonQuery();
                }

                foreach (var companion in _companions)
                {
                    if (companion.Write(frame, _writer, tx) is { } a)
                    {
                        after.Add(a);
                    }
                }
            }

            tx.Commit();
            foreach (var a in after)
            {
                a();
            }

            return ids;
        }
        finally
        {
            _writeGate.Release();
        }
    }

    /// <summary>Stores an alarm state change.</summary>
    public async ValueTask WriteAlarmAsync(StoredAlarm alarm, CancellationToken cancellationToken)
    {
        await _writeGate.WaitAsync(cancellationToken);
        try
        {
            using var c = _writer.CreateCommand();
            c.CommandText = "INSERT INTO alarms (reactor, alarm_id, time_ms, state, priority, active, value, message) VALUES ($r, $a, $t, $s, $p, $x, $v, $m)";
            c.Parameters.AddWithValue("$r", alarm.Reactor);
            c.Parameters.AddWithValue("$a", alarm.AlarmId);
            c.Parameters.AddWithValue("$t", alarm.Time.ToUnixTimeMilliseconds());
            c.Parameters.AddWithValue("$s", alarm.State);
            c.Parameters.AddWithValue("$p", alarm.Priority);
            c.Parameters.AddWithValue("$x", alarm.Active ? 1 : 0);
            c.Parameters.AddWithValue("$v", double.IsFinite(alarm.Value) ? alarm.Value : DBNull.Value);
            c.Parameters.AddWithValue("$m", alarm.Message);
            c.ExecuteNonQuery();
        }
        finally
        {
            _writeGate.Release();
        }
    }

    /// <inheritdoc/>
    public async ValueTask WriteCheckpointAsync(Checkpoint checkpoint, CancellationToken cancellationToken)
    {
        await _writeGate.WaitAsync(cancellationToken);
        try
        {
            using var c = _writer.CreateCommand();
            c.CommandText = "INSERT INTO checkpoints (reactor, cycle, time_ms, state, batch, inputs) VALUES ($r, $c, $t, $s, $b, $i)";
            c.Parameters.AddWithValue("$i", (object?)checkpoint.Inputs ?? DBNull.Value);
            c.Parameters.AddWithValue("$b", (object?)checkpoint.Batch ?? DBNull.Value);
            c.Parameters.AddWithValue("$r", checkpoint.Reactor);
            c.Parameters.AddWithValue("$c", checkpoint.Cycle);
            c.Parameters.AddWithValue("$t", checkpoint.Time.ToUnixTimeMilliseconds());
            c.Parameters.AddWithValue("$s", checkpoint.State);
            c.ExecuteNonQuery();
        }
        finally
        {
            _writeGate.Release();
        }
    }

    public void Dispose()
    {
        _checkpointer.Dispose();
        CheckpointWal();
        _writer.Dispose();
        _writeGate.Dispose();
    }

    private static bool HasColumn(SqliteConnection connection, string table, string column)
    {
        using var c = connection.CreateCommand();
        c.CommandText = $"SELECT COUNT(*) FROM pragma_table_info('{table}') WHERE name = $c";
        c.Parameters.AddWithValue("$c", column);
        return (long)c.ExecuteScalar()! > 0;
    }

    private static void Execute(SqliteConnection connection, string sql)
    {
        using var c = connection.CreateCommand();
        c.CommandText = sql;
        c.ExecuteNonQuery();
    }

    private SqliteConnection OpenReader()
    {
        var c = new SqliteConnection(_connectionString);
        c.Open();
        return c;
    }
}

using System.Collections.Concurrent;
using System.Globalization;
using Microsoft.Data.Sqlite;
using Microsoft.Extensions.Options;
using SoftSensor.Core.Batches;
using SoftSensor.Daemon.Configuration;

namespace SoftSensor.Daemon.Batches;

/// <summary>
/// The batches of every reactor, kept in table <c>batch_runs</c> of the daemon's SQLite file so that a
/// restart in the middle of a batch resumes the same batch id. The open batch of each reactor is
/// cached; a reactor has at most one open batch. Thread-safe.
/// </summary>
internal sealed partial class BatchBook
{
    private const string Schema = """
        CREATE TABLE IF NOT EXISTS batch_runs (
            reactor TEXT NOT NULL, batch_id TEXT NOT NULL, started_ms INTEGER NOT NULL, ended_ms INTEGER,
            volume_l REAL NOT NULL, biomass_g_per_l REAL NOT NULL, biomass_sigma_g_per_l REAL NOT NULL, substrate_g_per_l REAL NOT NULL,
            PRIMARY KEY (reactor, batch_id));
        """;

    private readonly string _connectionString;
    private readonly TimeProvider _time;
    private readonly Lock _gate = new();
    private readonly ConcurrentDictionary<string, BatchRun> _open = new(StringComparer.Ordinal);

    public BatchBook(IOptions<SoftSensorOptions> options, TimeProvider time)
        : this(options.Value.Store.Path, time)
    {
    }

    public BatchBook(string storePath, TimeProvider time)
    {
        _time = time;
        string full = Path.GetFullPath(storePath);
        Directory.CreateDirectory(Path.GetDirectoryName(full)!);
        _connectionString = new SqliteConnectionStringBuilder { DataSource = full, Pooling = true, DefaultTimeout = 5 }.ToString();
        using var c = Open();
        Run(c, Schema + PhaseSchema);
        using var q = c.CreateCommand();
        q.CommandText = "SELECT reactor, batch_id, started_ms, ended_ms, volume_l, biomass_g_per_l, biomass_sigma_g_per_l, substrate_g_per_l FROM batch_runs WHERE ended_ms IS NULL";
        var open = new List<BatchRun>();
        using (var r = q.ExecuteReader())
        {
            while (r.Read())
            {
                open.Add(Read(r));
            }
        }

        foreach (var run in open)
        {
            _open[run.Reactor] = WithPhase(c, run);
        }
    }

    /// <summary>Raised after a batch was started and stored (on the caller's thread).</summary>
    public event Action<BatchRun>? Started;

    /// <summary>Raised after a batch was ended and stored (on the caller's thread): the batch report is written from it.</summary>
    public event Action<BatchRun>? Ended;

    /// <summary>The open batch of a reactor, or null.</summary>
    public BatchRun? Current(string reactor) => _open.TryGetValue(reactor, out var b) ? b : null;

    /// <summary>Starts a batch; the problems (invalid field, a batch still open, an id used before) instead when it cannot.</summary>
    public (BatchRun? Run, IReadOnlyList<string> Problems) Start(string reactor, BatchStart start)
    {
        var problems = start.Problems().ToList();
        BatchRun started;
        lock (_gate)
        {
            if (Current(reactor) is { } open)
            {
                problems.Add($"reactor '{reactor}' has batch '{open.BatchId}' open since {open.StartedAt:O} (expected it ended first)");
            }

            using var c = Open();
            using var exists = c.CreateCommand();
            exists.CommandText = "SELECT COUNT(*) FROM batch_runs WHERE reactor = $r AND batch_id = $b";
            exists.Parameters.AddWithValue("$r", reactor);
            exists.Parameters.AddWithValue("$b", start.BatchId ?? "");
            if (Convert.ToInt64(exists.ExecuteScalar(), CultureInfo.InvariantCulture) > 0)
            {
                problems.Add($"batchId is '{start.BatchId}' (expected an id reactor '{reactor}' has not used before)");
            }

            if (problems.Count > 0)
            {
                return (null, problems);
            }

            var now = _time.GetUtcNow();
            var run = new BatchRun(reactor, start.BatchId!, now, null, start.InitialVolumeL, start.InoculumBiomassGPerL,
                start.InoculumBiomassSigmaGPerL, start.InitialSubstrateGPerL, BatchPhases.Id(BatchPhase.Batch), now);
            using var insert = c.CreateCommand();
            insert.CommandText = "INSERT INTO batch_runs VALUES ($r, $b, $s, NULL, $v, $x, $sx, $su)";
            insert.Parameters.AddWithValue("$r", reactor);
            insert.Parameters.AddWithValue("$b", run.BatchId);
            insert.Parameters.AddWithValue("$s", run.StartedAt.ToUnixTimeMilliseconds());
            insert.Parameters.AddWithValue("$v", run.InitialVolumeL);
            insert.Parameters.AddWithValue("$x", run.InoculumBiomassGPerL);
            insert.Parameters.AddWithValue("$sx", run.InoculumBiomassSigmaGPerL);
            insert.Parameters.AddWithValue("$su", run.InitialSubstrateGPerL);
            insert.ExecuteNonQuery();
            InsertPhase(c, reactor, new PhaseChange(run.BatchId, run.Phase, now, start.Source));
            _open[reactor] = run;
            started = run;
        }

        Started?.Invoke(started);
        return (started, []);
    }

    /// <summary>Ends the open batch of a reactor; the problem instead when none is open.</summary>
    public (BatchRun? Run, string? Problem) End(string reactor)
    {
        BatchRun ended;
        lock (_gate)
        {
            if (Current(reactor) is not { } open)
            {
                return (null, $"reactor '{reactor}' has no open batch (expected a started batch)");
            }

            ended = open with { EndedAt = _time.GetUtcNow() };
            using var c = Open();
            using var update = c.CreateCommand();
            update.CommandText = "UPDATE batch_runs SET ended_ms = $e WHERE reactor = $r AND batch_id = $b";
            update.Parameters.AddWithValue("$e", ended.EndedAt!.Value.ToUnixTimeMilliseconds());
            update.Parameters.AddWithValue("$r", reactor);
            update.Parameters.AddWithValue("$b", open.BatchId);
            update.ExecuteNonQuery();
            _open.TryRemove(reactor, out _);
        }

        Ended?.Invoke(ended);
        return (ended, null);
    }

    /// <summary>The batches of a reactor, newest first (at most <paramref name="limit"/>).</summary>
    public IReadOnlyList<BatchRun> Runs(string reactor, int limit = 200)
    {
        using var c = Open();
        using var q = c.CreateCommand();
        q.CommandText = "SELECT reactor, batch_id, started_ms, ended_ms, volume_l, biomass_g_per_l, biomass_sigma_g_per_l, substrate_g_per_l FROM batch_runs WHERE reactor = $r ORDER BY started_ms DESC LIMIT $l";
        q.Parameters.AddWithValue("$r", reactor);
        q.Parameters.AddWithValue("$l", limit);
        var list = new List<BatchRun>();
        using var r = q.ExecuteReader();
        while (r.Read())
        {
            list.Add(Read(r));
        }

        return list;
    }

    private SqliteConnection Open()
    {
        var c = new SqliteConnection(_connectionString);
        c.Open();
        return c;
    }

    private static void Run(SqliteConnection c, string sql)
    {
        using var cmd = c.CreateCommand();
        cmd.CommandText = sql;
        cmd.ExecuteNonQuery();
    }

    private static BatchRun Read(SqliteDataReader r) => new(
        r.GetString(0), r.GetString(1), DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(2)),
        r.IsDBNull(3) ? null : DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(3)),
        r.GetDouble(4), r.GetDouble(5), r.GetDouble(6), r.GetDouble(7));
}

using Microsoft.Data.Sqlite;

namespace SoftSensor.Daemon.Store;

/// <summary>
/// The store's upkeep (run by <see cref="StoreMaintenance"/>, off the cycle path): older frames and
/// checkpoints deleted in small transactions, free pages given back to the file system with SQLite's
/// incremental vacuum (<c>auto_vacuum=INCREMENTAL</c>, SQLite documentation "PRAGMA auto_vacuum").
/// Each delete holds the write gate for one short transaction, so a frame waits at most that long.
/// </summary>
internal sealed partial class SqliteStore
{
    /// <summary>Makes a new file incremental-vacuum before its first table; converts an older file once (VACUUM).</summary>
    private static void EnsureIncrementalVacuum(SqliteConnection connection)
    {
        using var mode = connection.CreateCommand();
        mode.CommandText = "PRAGMA auto_vacuum";
        if ((long)mode.ExecuteScalar()! == 2)
        {
            return;
        }

        using var tables = connection.CreateCommand();
        tables.CommandText = "SELECT COUNT(*) FROM sqlite_schema";
        bool empty = (long)tables.ExecuteScalar()! == 0;
        // Before any table exists the pragma alone decides; for an existing file it takes effect at the next VACUUM.
        Execute(connection, empty ? "PRAGMA auto_vacuum=INCREMENTAL;" : "PRAGMA auto_vacuum=INCREMENTAL; VACUUM;");
    }

    /// <summary>Bytes the store occupies on disk: the database file and its write-ahead log.</summary>
    public long SizeBytes => FileLength(Path) + FileLength(Path + "-wal");

    /// <summary>Deletes all but the newest <paramref name="keep"/> checkpoints of every reactor; returns how many went.</summary>
    public async ValueTask<int> PruneCheckpointsAsync(int keep, CancellationToken cancellationToken)
    {
        await _writeGate.WaitAsync(cancellationToken);
        try
        {
            using var c = _writer.CreateCommand();
            c.CommandText = """
                DELETE FROM checkpoints WHERE id IN (
                    SELECT id FROM (SELECT id, row_number() OVER (PARTITION BY reactor ORDER BY id DESC) AS n FROM checkpoints) WHERE n > $k)
                """;
            c.Parameters.AddWithValue("$k", keep);
            return c.ExecuteNonQuery();
        }
        finally
        {
            _writeGate.Release();
        }
    }

    /// <summary>Every reactor that has frames (an index seek per reactor, not a scan).</summary>
    public IReadOnlyList<string> StoredReactors()
    {
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = """
            WITH RECURSIVE r(x) AS (
                SELECT min(reactor) FROM frames
                UNION ALL SELECT (SELECT min(reactor) FROM frames WHERE reactor > r.x) FROM r WHERE r.x IS NOT NULL)
            SELECT x FROM r WHERE x IS NOT NULL
            """;
        var list = new List<string>();
        using var rd = c.ExecuteReader();
        while (rd.Read())
        {
            list.Add(rd.GetString(0));
        }

        return list;
    }

    /// <summary>The oldest frame time of a reactor, or null.</summary>
    public DateTimeOffset? OldestFrameTime(string reactor)
    {
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = "SELECT min(time_ms) FROM frames WHERE reactor = $r";
        c.Parameters.AddWithValue("$r", reactor);
        return c.ExecuteScalar() is long ms ? DateTimeOffset.FromUnixTimeMilliseconds(ms) : null;
    }

    /// <summary>
    /// Deletes at most <paramref name="limit"/> of a reactor's oldest frames before <paramref name="cutoff"/>
    /// with their estimates, in one transaction; returns how many frames went (0: nothing older).
    /// </summary>
    public async ValueTask<int> DeleteFramesBeforeAsync(string reactor, DateTimeOffset cutoff, int limit, CancellationToken cancellationToken)
    {
        var ids = new List<long>(limit);
        using (var conn = OpenReader())
        using (var c = conn.CreateCommand())
        {
            c.CommandText = "SELECT id FROM frames WHERE reactor = $r AND time_ms < $c ORDER BY time_ms LIMIT $n";
            c.Parameters.AddWithValue("$r", reactor);
            c.Parameters.AddWithValue("$c", cutoff.ToUnixTimeMilliseconds());
            c.Parameters.AddWithValue("$n", limit);
            using var r = c.ExecuteReader();
            while (r.Read())
            {
                ids.Add(r.GetInt64(0));
            }
        }

        if (ids.Count == 0)
        {
            return 0;
        }

        string list = string.Join(',', ids);
        await _writeGate.WaitAsync(cancellationToken);
        try
        {
            using var tx = _writer.BeginTransaction();
            using var c = _writer.CreateCommand();
            c.Transaction = tx;
            c.CommandText = $"DELETE FROM estimates WHERE frame_id IN ({list}); DELETE FROM frames WHERE id IN ({list});";
            c.ExecuteNonQuery();
            tx.Commit();
            return ids.Count;
        }
        finally
        {
            _writeGate.Release();
        }
    }

    /// <summary>Gives at most <paramref name="pages"/> free pages back to the file system; returns the free pages left.</summary>
    public async ValueTask<long> IncrementalVacuumAsync(int pages, CancellationToken cancellationToken)
    {
        await _writeGate.WaitAsync(cancellationToken);
        try
        {
            using (var c = _writer.CreateCommand())
            {
                c.CommandText = $"PRAGMA incremental_vacuum({pages})";
                using var r = c.ExecuteReader();
                while (r.Read())
                {
                    // The pragma returns one row per page freed; reading them runs it to the end.
                }
            }

            using var f = _writer.CreateCommand();
            f.CommandText = "PRAGMA freelist_count";
            return (long)f.ExecuteScalar()!;
        }
        finally
        {
            _writeGate.Release();
        }
    }

    /// <summary>Runs a TRUNCATE checkpoint of the write-ahead log (after a large delete, so the log's pages do not linger on disk).</summary>
    public void TruncateWal()
    {
        try
        {
            using var c = OpenReader();
            Execute(c, "PRAGMA wal_checkpoint(TRUNCATE);");
        }
        catch (SqliteException)
        {
            // Busy: the next pass tries again.
        }
    }

    /// <summary>The checkpoints stored for a reactor (tests and the soak check that pruning holds).</summary>
    public long CheckpointCount(string reactor)
    {
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = "SELECT COUNT(*) FROM checkpoints WHERE reactor = $r";
        c.Parameters.AddWithValue("$r", reactor);
        return (long)c.ExecuteScalar()!;
    }

    private static long FileLength(string path)
    {
        var info = new FileInfo(path);
        return info.Exists ? info.Length : 0;
    }
}

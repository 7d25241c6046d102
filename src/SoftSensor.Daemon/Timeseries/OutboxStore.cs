using Microsoft.Data.Sqlite;

namespace SoftSensor.Daemon.Timeseries;

/// <summary>One unsent frame: its line-protocol payload and when it was committed.</summary>
internal readonly record struct OutboxEntry(long Id, DateTimeOffset Enqueued, string Payload, int Bytes);

/// <summary>What the outbox holds now.</summary>
internal readonly record struct OutboxStats(long Depth, long Bytes, DateTimeOffset? OldestEnqueued, long LimitBytes)
{
    /// <summary>Fill level of the bound, 0 to 1.</summary>
    public double Fill => LimitBytes > 0 ? (double)Bytes / LimitBytes : 0;
}

/// <summary>
/// The durable outbox: table <c>ts_outbox</c> in a SQLite file (WAL, synchronous FULL, so a row
/// is on disk before <see cref="TryEnqueue"/> returns). Rows are removed only after the database
/// acknowledged them. The unsent payload is bounded; a frame beyond the bound is refused.
/// Threading: every method may be called from any thread (one connection behind a lock).
/// </summary>
internal sealed class OutboxStore : Store.IRetainedRows, IDisposable
{
    private readonly Lock _gate = new();
    private readonly SqliteConnection _db;
    private readonly long _limitBytes;
    private long _depth;
    private long _bytes;
    private long? _oldestMs;

    /// <summary>Opens (creating when needed) the outbox table in <paramref name="path"/>.</summary>
    public OutboxStore(string path, long limitBytes)
    {
        ArgumentOutOfRangeException.ThrowIfLessThanOrEqual(limitBytes, 0);
        _limitBytes = limitBytes;
        string? dir = Path.GetDirectoryName(Path.GetFullPath(path));
        if (!string.IsNullOrEmpty(dir))
        {
            Directory.CreateDirectory(dir);
        }

        _db = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = path, Pooling = false, DefaultTimeout = 30 }.ToString());
        _db.Open();
        Execute("PRAGMA journal_mode=WAL;");
        Execute("PRAGMA synchronous=FULL;");
        Execute("PRAGMA busy_timeout=30000;");
        Execute("""
            CREATE TABLE IF NOT EXISTS ts_outbox(
              id INTEGER PRIMARY KEY AUTOINCREMENT,
              enqueued_ms INTEGER NOT NULL,
              payload TEXT NOT NULL,
              bytes INTEGER NOT NULL,
              attempts INTEGER NOT NULL DEFAULT 0);
            """);
        using var cmd = _db.CreateCommand();
        cmd.CommandText = "SELECT COUNT(*), COALESCE(SUM(bytes), 0), MIN(enqueued_ms) FROM ts_outbox;";
        using var r = cmd.ExecuteReader();
        r.Read();
        _depth = r.GetInt64(0);
        _bytes = r.GetInt64(1);
        _oldestMs = r.IsDBNull(2) ? null : r.GetInt64(2);
    }

    /// <summary>The current depth, payload size and oldest row.</summary>
    public OutboxStats Stats
    {
        get
        {
            lock (_gate)
            {
                return new OutboxStats(_depth, _bytes, _oldestMs is { } ms ? DateTimeOffset.FromUnixTimeMilliseconds(ms) : null, _limitBytes);
            }
        }
    }

    /// <summary>Commits one frame's payload; false (nothing written) when it would pass the bound.</summary>
    public bool TryEnqueue(string payload, DateTimeOffset now)
    {
        int bytes = System.Text.Encoding.UTF8.GetByteCount(payload);
        long ms = now.ToUnixTimeMilliseconds();
        lock (_gate)
        {
            if (_bytes + bytes > _limitBytes)
            {
                return false;
            }

            using var cmd = _db.CreateCommand();
            cmd.CommandText = "INSERT INTO ts_outbox(enqueued_ms, payload, bytes) VALUES ($t, $p, $b);";
            cmd.Parameters.AddWithValue("$t", ms);
            cmd.Parameters.AddWithValue("$p", payload);
            cmd.Parameters.AddWithValue("$b", bytes);
            cmd.ExecuteNonQuery();
            _depth++;
            _bytes += bytes;
            _oldestMs ??= ms;
            return true;
        }
    }

    /// <summary>Full path of the SQLite file that holds the outbox table.</summary>
    public string FullPath => System.IO.Path.GetFullPath(_db.DataSource);

    /// <summary>
    /// Inserts one frame's payload through another connection to the same file inside its open
    /// transaction (the store's frame transaction); returns the bookkeeping to run after commit, or
    /// null (nothing written) when the payload would pass the bound.
    /// </summary>
    public Action? EnqueueWithin(string payload, DateTimeOffset now, SqliteConnection connection, SqliteTransaction transaction)
    {
        int bytes = System.Text.Encoding.UTF8.GetByteCount(payload);
        long ms = now.ToUnixTimeMilliseconds();
        lock (_gate)
        {
            if (_bytes + bytes > _limitBytes)
            {
                return null;
            }
        }

        using var cmd = connection.CreateCommand();
        cmd.Transaction = transaction;
        cmd.CommandText = "INSERT INTO ts_outbox(enqueued_ms, payload, bytes) VALUES ($t, $p, $b);";
        cmd.Parameters.AddWithValue("$t", ms);
        cmd.Parameters.AddWithValue("$p", payload);
        cmd.Parameters.AddWithValue("$b", bytes);
        cmd.ExecuteNonQuery();
        return () =>
        {
            lock (_gate)
            {
                _depth++;
                _bytes += bytes;
                _oldestMs ??= ms;
            }
        };
    }

    /// <summary>The oldest unsent rows, at most <paramref name="max"/>.</summary>
    public IReadOnlyList<OutboxEntry> PeekBatch(int max)
    {
        lock (_gate)
        {
            using var cmd = _db.CreateCommand();
            cmd.CommandText = "SELECT id, enqueued_ms, payload, bytes FROM ts_outbox ORDER BY id LIMIT $n;";
            cmd.Parameters.AddWithValue("$n", max);
            using var r = cmd.ExecuteReader();
            var list = new List<OutboxEntry>();
            while (r.Read())
            {
                list.Add(new OutboxEntry(r.GetInt64(0), DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(1)), r.GetString(2), r.GetInt32(3)));
            }

            return list;
        }
    }

    /// <summary>Removes rows the database acknowledged (the batch returned by <see cref="PeekBatch"/>).</summary>
    public void MarkSent(IReadOnlyList<OutboxEntry> batch)
    {
        if (batch.Count == 0)
        {
            return;
        }

        lock (_gate)
        {
            using var tx = _db.BeginTransaction();
            using var cmd = _db.CreateCommand();
            cmd.Transaction = tx;
            cmd.CommandText = "DELETE FROM ts_outbox WHERE id BETWEEN $a AND $b;";
            cmd.Parameters.AddWithValue("$a", batch[0].Id);
            cmd.Parameters.AddWithValue("$b", batch[^1].Id);
            int removed = cmd.ExecuteNonQuery();
            tx.Commit();
            _depth -= removed;
            _bytes -= batch.Sum(e => (long)e.Bytes);
            RefreshOldest();
        }
    }

    /// <summary>
    /// Retention (<c>store:retention</c>): removes at most <paramref name="limit"/> of the oldest unsent
    /// rows committed before <paramref name="cutoff"/>, in one short transaction; returns how many.
    /// </summary>
    public int DropOlderThan(DateTimeOffset cutoff, int limit)
    {
        lock (_gate)
        {
            if (_oldestMs is not { } oldest || oldest >= cutoff.ToUnixTimeMilliseconds())
            {
                return 0;
            }

            using var tx = _db.BeginTransaction();
            using var cmd = _db.CreateCommand();
            cmd.Transaction = tx;
            cmd.CommandText = "DELETE FROM ts_outbox WHERE id IN (SELECT id FROM ts_outbox WHERE enqueued_ms < $c ORDER BY id LIMIT $n) RETURNING bytes;";
            cmd.Parameters.AddWithValue("$c", cutoff.ToUnixTimeMilliseconds());
            cmd.Parameters.AddWithValue("$n", limit);
            int removed = 0;
            long bytes = 0;
            using (var r = cmd.ExecuteReader())
            {
                while (r.Read())
                {
                    removed++;
                    bytes += r.GetInt64(0);
                }
            }

            tx.Commit();
            _depth -= removed;
            _bytes -= bytes;
            RefreshOldest();
            return removed;
        }
    }

    /// <summary>Counts a failed attempt on a batch (kept for diagnosis).</summary>
    public void RecordAttempt(IReadOnlyList<OutboxEntry> batch)
    {
        if (batch.Count == 0)
        {
            return;
        }

        lock (_gate)
        {
            using var cmd = _db.CreateCommand();
            cmd.CommandText = "UPDATE ts_outbox SET attempts = attempts + 1 WHERE id BETWEEN $a AND $b;";
            cmd.Parameters.AddWithValue("$a", batch[0].Id);
            cmd.Parameters.AddWithValue("$b", batch[^1].Id);
            cmd.ExecuteNonQuery();
        }
    }

    public void Dispose()
    {
        lock (_gate)
        {
            _db.Dispose();
        }
    }

    private void RefreshOldest()
    {
        using var cmd = _db.CreateCommand();
        cmd.CommandText = "SELECT MIN(enqueued_ms) FROM ts_outbox;";
        object? v = cmd.ExecuteScalar();
        _oldestMs = v is long ms ? ms : null;
        if (_oldestMs is null)
        {
            _depth = 0;
            _bytes = 0;
        }
    }

    private void Execute(string sql)
    {
        using var cmd = _db.CreateCommand();
        cmd.CommandText = sql;
        cmd.ExecuteNonQuery();
    }
}

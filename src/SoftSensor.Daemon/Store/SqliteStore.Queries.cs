using Microsoft.Data.Sqlite;
using SoftSensor.Core.Signals;
using SoftSensor.Daemon.Contracts;

namespace SoftSensor.Daemon.Store;

/// <summary>The store's read side: each query on its own pooled connection (WAL readers do not block the writer).</summary>
internal sealed partial class SqliteStore
{
    /// <summary>
    /// Estimates of a reactor in [<paramref name="from"/>, <paramref name="to"/>], oldest first, at most
    /// <paramref name="limit"/> rows; <paramref name="name"/> null for every name.
    /// </summary>
    public ValueTask<IReadOnlyList<StoredEstimate>> QueryEstimatesAsync(string reactor, string? name, DateTimeOffset from, DateTimeOffset to, int limit, CancellationToken cancellationToken)
    {
        cancellationToken.ThrowIfCancellationRequested();
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = """
            SELECT e.frame_id, e.reactor, e.name, e.time_ms, e.value, e.sigma, e.unit, e.quality, e.status_code
            FROM frames f JOIN estimates e ON e.frame_id = f.id
            WHERE f.reactor = $r AND f.time_ms BETWEEN $a AND $b AND ($n IS NULL OR e.name = $n)
            ORDER BY f.time_ms, f.id LIMIT $l
            """;
        c.Parameters.AddWithValue("$r", reactor);
        c.Parameters.AddWithValue("$n", (object?)name ?? DBNull.Value);
        c.Parameters.AddWithValue("$a", from.ToUnixTimeMilliseconds());
        c.Parameters.AddWithValue("$b", to.ToUnixTimeMilliseconds());
        c.Parameters.AddWithValue("$l", limit);
        var list = new List<StoredEstimate>();
        using var r = c.ExecuteReader();
        while (r.Read())
        {
            list.Add(ReadEstimate(r));
        }

        return ValueTask.FromResult<IReadOnlyList<StoredEstimate>>(list);
    }

    /// <summary>Source time of the newest frame of a reactor, or null.</summary>
    public ValueTask<DateTimeOffset?> LatestFrameTimeAsync(string reactor, CancellationToken cancellationToken)
    {
        cancellationToken.ThrowIfCancellationRequested();
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = "SELECT max(time_ms) FROM frames WHERE reactor = $r";
        c.Parameters.AddWithValue("$r", reactor);
        object? v = c.ExecuteScalar();
        DateTimeOffset? t = v is long ms ? DateTimeOffset.FromUnixTimeMilliseconds(ms) : null;
        return ValueTask.FromResult(t);
    }

    /// <summary>Alarm changes of a reactor in a time range, oldest first.</summary>
    public ValueTask<IReadOnlyList<StoredAlarm>> QueryAlarmsAsync(string reactor, DateTimeOffset from, DateTimeOffset to, int limit, CancellationToken cancellationToken)
    {
        cancellationToken.ThrowIfCancellationRequested();
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = """
            SELECT reactor, alarm_id, time_ms, state, priority, active, value, message FROM alarms
            WHERE reactor = $r AND time_ms BETWEEN $a AND $b ORDER BY time_ms, id LIMIT $l
            """;
        c.Parameters.AddWithValue("$r", reactor);
        c.Parameters.AddWithValue("$a", from.ToUnixTimeMilliseconds());
        c.Parameters.AddWithValue("$b", to.ToUnixTimeMilliseconds());
        c.Parameters.AddWithValue("$l", limit);
        return ValueTask.FromResult(ReadAlarms(c));
    }

    /// <summary>The active alarms (newest change per alarm with active set), of every reactor.</summary>
    public ValueTask<IReadOnlyList<StoredAlarm>> ActiveAlarmsAsync(CancellationToken cancellationToken)
    {
        cancellationToken.ThrowIfCancellationRequested();
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = """
            SELECT a.reactor, a.alarm_id, a.time_ms, a.state, a.priority, a.active, a.value, a.message FROM alarms a
            JOIN (SELECT reactor, alarm_id, max(id) AS id FROM alarms GROUP BY reactor, alarm_id) n ON n.id = a.id
            WHERE a.active = 1 ORDER BY a.reactor, a.time_ms
            """;
        return ValueTask.FromResult(ReadAlarms(c));
    }

    /// <inheritdoc/>
    public ValueTask<Checkpoint?> LatestCheckpointAsync(string reactor, CancellationToken cancellationToken)
    {
        cancellationToken.ThrowIfCancellationRequested();
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = "SELECT cycle, time_ms, state, batch, inputs FROM checkpoints WHERE reactor = $r ORDER BY id DESC LIMIT 1";
        c.Parameters.AddWithValue("$r", reactor);
        using var r = c.ExecuteReader();
        Checkpoint? cp = r.Read()
            ? new Checkpoint(reactor, r.GetInt64(0), DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(1)), r.GetString(2), r.IsDBNull(3) ? null : r.GetString(3))
            {
                Inputs = r.IsDBNull(4) ? null : r.GetString(4),
            }
            : null;
        return ValueTask.FromResult(cp);
    }

    /// <summary>Every frame of one batch of a reactor with its values by name, oldest first (the batch report's data).</summary>
    public ValueTask<IReadOnlyList<StoredFrameValues>> BatchFramesAsync(string reactor, string batch, CancellationToken cancellationToken)
    {
        cancellationToken.ThrowIfCancellationRequested();
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = """
            SELECT f.id, f.time_ms, f.quality, e.name, e.value, e.sigma, e.unit, e.quality, e.status_code
            FROM frames f JOIN estimates e ON e.frame_id = f.id
            WHERE f.reactor = $r AND f.batch = $b ORDER BY f.id
            """;
        c.Parameters.AddWithValue("$r", reactor);
        c.Parameters.AddWithValue("$b", batch);
        var list = new List<StoredFrameValues>();
        Dictionary<string, EstimateValue>? values = null;
        using var r = c.ExecuteReader();
        long current = -1;
        while (r.Read())
        {
            long id = r.GetInt64(0);
            if (id != current || values is null)
            {
                current = id;
                values = new Dictionary<string, EstimateValue>(StringComparer.Ordinal);
                list.Add(new StoredFrameValues(DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(1)), (SampleQuality)r.GetInt32(2), values));
            }

            string name = r.GetString(3);
            values[name] = new EstimateValue(name, r.IsDBNull(4) ? double.NaN : r.GetDouble(4), r.GetString(6),
                r.IsDBNull(5) ? double.NaN : r.GetDouble(5), (SampleQuality)r.GetInt32(7), (uint)r.GetInt64(8));
        }

        return ValueTask.FromResult<IReadOnlyList<StoredFrameValues>>(list);
    }

    /// <summary>The batch id of the newest stored frame of a reactor, or null.</summary>
    public ValueTask<string?> LatestBatchAsync(string reactor, CancellationToken cancellationToken)
    {
        cancellationToken.ThrowIfCancellationRequested();
        using var conn = OpenReader();
        using var c = conn.CreateCommand();
        c.CommandText = "SELECT batch FROM frames WHERE reactor = $r ORDER BY id DESC LIMIT 1";
        c.Parameters.AddWithValue("$r", reactor);
        return ValueTask.FromResult(c.ExecuteScalar() as string);
    }

    private static StoredEstimate ReadEstimate(SqliteDataReader r) => new(
        r.GetInt64(0),
        r.GetString(1),
        r.GetString(2),
        DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(3)),
        r.IsDBNull(4) ? double.NaN : r.GetDouble(4),
        r.IsDBNull(5) ? double.NaN : r.GetDouble(5),
        r.GetString(6),
        (SampleQuality)r.GetInt32(7),
        (uint)r.GetInt64(8));

    private static IReadOnlyList<StoredAlarm> ReadAlarms(SqliteCommand c)
    {
        var list = new List<StoredAlarm>();
        using var r = c.ExecuteReader();
        while (r.Read())
        {
            list.Add(new StoredAlarm(
                r.GetString(0),
                r.GetString(1),
                DateTimeOffset.FromUnixTimeMilliseconds(r.GetInt64(2)),
                r.GetString(3),
                r.GetString(4),
                r.GetInt32(5) != 0,
                r.IsDBNull(6) ? double.NaN : r.GetDouble(6),
                r.GetString(7)));
        }

        return list;
    }
}
